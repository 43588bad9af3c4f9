package org.tufa.analysis.findings;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;

class CauseTableTest {

    @Test
    void warmDischargeInCoolingPointsAtLowWaterFlowOrSensorHigh() {
        CauseTable t = CauseTable.standard();
        List<String> causes = t.causes("cooling",
                List.of(new Shift("coil_residual", "K", -3.0), new Shift("cooling_valve_command", "%", 20)), null);
        assertEquals(2, causes.size());
        assertTrue(causes.get(0).contains("low chilled-water flow"));
        assertTrue(causes.get(1).contains("reading high"));
    }

    @Test
    void smallShiftsBelowTheSensorUncertaintyGiveNoCause() {
        assertEquals(List.of(), CauseTable.standard().causes("cooling",
                List.of(new Shift("coil_residual", "K", -0.5)), DirectionCheck.Outcome.AS_EXPECTED));
    }

    @Test
    void failedDirectionCheckPointsAtTheValve() {
        List<String> causes = CauseTable.standard().causes("cooling", List.of(), DirectionCheck.Outcome.FAILS);
        assertEquals(1, causes.size());
        assertTrue(causes.get(0).contains("stuck valve"));
    }

    @Test
    void badLineNamesFileAndLine(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("causes.txt");
        Files.writeString(f, "# header\ncooling\tcoil_residual\tsideways\t1\tsomething\n");
        InputException e = assertThrows(InputException.class, () -> CauseTable.load(f));
        assertTrue(e.getMessage().startsWith(f + ":2: direction must be"), e.getMessage());
    }
}
