package org.tufa.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.fleet.FleetAnalysis;
import org.tufa.analysis.fleet.UnitOutcome;
import org.tufa.analysis.fleet.UnitSummary;
import org.tufa.analysis.tables.SampleFormat;
import org.tufa.cli.UnitSinks;

/**
 * The driver's check that it sees the per-unit files the executors wrote (an --out on each executor's own disk
 * would otherwise leave the tables scattered over the cluster, unsaid). Common practice, no source.
 */
class UnitFilesSeenTest {

    private static FleetAnalysis.Kept kept(String folder, boolean analysed) {
        UnitSummary summary = analysed ? new UnitSummary(Instant.EPOCH, Duration.ofMinutes(15), 4,
                org.tufa.analysis.modes.ModeSplit.FAN_COIL_LABELS, new int[7],
                false, List.of()) : null;
        UnitOutcome o = new UnitOutcome(folder, folder, folder, analysed ? UnitOutcome.ANALYZED : UnitOutcome.SKIPPED,
                "", List.of(), null, summary, List.of(), 0,
                new UnitOutcome.Totals("", 0, 0, 0, 0, 0));
        return new FleetAnalysis.Kept(o, null, null);
    }

    @Test
    void aMissingTableOfAnAnalysedUnitIsNamed(@TempDir Path out) throws Exception {
        UnitSinks sinks = new UnitSinks(out.toString(), ZoneOffset.UTC, SampleFormat.PARQUET, false);
        Files.createDirectories(out.resolve("units/a"));
        Files.writeString(out.resolve("units/a/modes.parquet"), "x");
        List<FleetAnalysis.Kept> kept = List.of(kept("a", true), kept("s", false), kept("b", true));
        assertEquals(out.resolve("units/b/modes.parquet"), SparkUnitEngine.missingUnitFile(kept, sinks));
        Files.createDirectories(out.resolve("units/b"));
        Files.writeString(out.resolve("units/b/modes.parquet"), "x");
        assertNull(SparkUnitEngine.missingUnitFile(kept, sinks), "a skipped unit without tables is fine");
    }
}
