package org.tufa.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.fleet.FleetPlan;
import org.tufa.analysis.fleet.UnitInputs;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.tables.SampleFormat;
import org.tufa.analysis.trends.SeriesKind;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.analysis.trends.TrendGrid;
import org.tufa.cli.UnitSinks;

/**
 * A task whose executor cannot read the trends hands the one-line error back as data (the driver prints it as
 * {@code tufa analyze} would), rather than failing inside Spark with a remote stack trace. Common practice, no source.
 */
class AnalysePartTest {

    @Test
    void anUnreadableTrendFileComesBackAsItsOneLineError(@TempDir Path dir) {
        Path missing = dir.resolve("not-on-this-executor.csv");
        PointRef zat = new PointRef("u#zat", "zat", "u-zat", null, "Zone_Air_Temperature_Sensor");
        UnitInputs in = new UnitInputs("u", "u", "fan_coil", Map.of("zone_air_temperature", zat), FanSignal.NONE, 0.1, false);
        FleetPlan part = new FleetPlan(List.of(new FleetPlan.Unit(in, "u", null)), Map.of("u-zat", SeriesKind.ANALOG),
                Map.of());
        SparkUnitEngine.AnalysePart task = new SparkUnitEngine.AnalysePart(List.of(missing.toString()), null,
                TimeOptions.defaults(ZoneOffset.UTC), new TrendGrid(0, 900, 96), AnalysisSettings.defaults(),
                new UnitSinks(dir.resolve("out").toString(), ZoneOffset.UTC, SampleFormat.PARQUET, false));
        SparkUnitEngine.PartResult r = task.call(part);
        assertTrue(r.kept().isEmpty());
        assertTrue(r.error().contains(missing.toString()), r.error());
        assertEquals(1, r.error().lines().count(), r.error());
    }
}
