package org.tufa.analysis.coverage;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.coverage.bench.CoverageBenchmark;

/** The benchmark's generated fleet is what its comment says (a small one; timing stays in the benchmark). */
class CoverageBenchmarkFleetTest {
    @Test
    void generatedFleetHasTwelvePointsPerUnitAndTheIntendedGaps(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("fleet.ttl");
        CoverageBenchmark.writeFleet(file, 60, 7L);
        String text = Files.readString(file);
        long withoutDat = text.lines().filter(l -> l.contains(" a brick:Return_Air_Temperature_Sensor ")).count();
        long points = text.lines().filter(l -> l.contains(" brick:isPointOf ")).count();
        assertEquals(60 * 12, points);
        Vocabulary v = Vocabulary.standard();
        FleetCoverage c = Coverage.assess(ModelLoader.load(file), v, v.profiles().profile("fcu-modes"), Set.of());
        assertEquals(60, c.units().size());
        assertEquals(60 - withoutDat, c.analyzableCount());
        assertEquals(60 - withoutDat, c.modeCount("heating"));
        assertEquals(Set.of("discharge_air_temperature"), c.unavailableRoleCounts().keySet());
    }
}
