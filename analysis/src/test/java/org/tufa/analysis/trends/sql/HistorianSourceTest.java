package org.tufa.analysis.trends.sql;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.postgresql.PGConnection;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.fleet.FleetAnalysis;
import org.tufa.analysis.fleet.FleetOutputs;
import org.tufa.analysis.fleet.UnitFiles;
import org.tufa.analysis.fleet.bench.FanCoilFleetModel;
import org.tufa.analysis.simulate.DemoTargets;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.FaultEpisode;
import org.tufa.analysis.simulate.FaultType;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.trends.ResampledSeries;
import org.tufa.analysis.trends.SeriesKind;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.analysis.trends.TrendSource;
import org.tufa.analysis.trends.TrendStore;

/**
 * The same simulated fleet read from a long CSV file and from a real PostgreSQL server (long table, and one table
 * per series): every output file is the same bytes. The reference is tufa's own file reader, which the trends tests
 * check against java.time's zone rules and hand-worked resampling examples.
 */
class HistorianSourceTest {

    static final ZoneId ZONE = Season.DEMO_ZONE;
    static final String BASE = "urn:example:quarrybank#";
    static TestDatabase db;
    static Path trendsFile;
    static FleetCoverage coverage;

    @BeforeAll
    static void load(@TempDir Path dir) throws Exception {
        db = TestDatabase.connectOrSkip("PostgreSQL historian tests");
        List<FanCoilFleetModel.Unit> units = new ArrayList<>();
        for (int u = 1; u <= 3; u++) {
            String id = String.format("FCU-%02d", u);
            units.add(new FanCoilFleetModel.Unit(id, id, u == 2 ? "DEG_F" : "DEG_C", u == 3));
        }
        Model model = FanCoilFleetModel.build(BASE, "Quarry Bank Annex", "", units);
        Vocabulary v = Vocabulary.standard();
        coverage = Coverage.assess(model, v, v.profiles().profile("fcu-modes"), Set.of(Coverage.TERMINAL_UNIT));
        Season season = new Season(LocalDate.of(2031, 6, 1), LocalDate.of(2031, 6, 29), ZONE);
        Instant start = LocalDate.of(2031, 6, 12).atStartOfDay(ZONE).toInstant();
        FaultEpisode fault = new FaultEpisode(BASE + "FCU-02", FaultType.STUCK_COOLING_VALVE, start,
                start.plus(Duration.ofDays(6)), 0.8);
        SimulationPlan plan = new SimulationPlan(DemoTargets.from(coverage).units(),
                DemoTargets.from(coverage).building(), season, 11L, List.of(fault));
        trendsFile = dir.resolve("trends.csv");
        DemoTrends.writeLong(trendsFile, Simulator.run(plan));

        db.execute("CREATE TABLE trend_samples (series_id text NOT NULL, ts timestamptz NOT NULL, "
                + "value double precision, PRIMARY KEY (series_id, ts))");
        try (Reader in = Files.newBufferedReader(trendsFile, StandardCharsets.UTF_8)) {
            db.admin().unwrap(PGConnection.class).getCopyAPI().copyIn(
                    "COPY trend_samples (ts, series_id, value) FROM STDIN WITH (FORMAT csv, HEADER true)", in);
        }
        // The same rows as one table per series, named trend_<series id>.
        List<String> ids = new ArrayList<>();
        try (Statement s = db.admin().createStatement();
             ResultSet rs = s.executeQuery("SELECT DISTINCT series_id FROM trend_samples ORDER BY 1")) {
            while (rs.next()) {
                ids.add(rs.getString(1));
            }
        }
        for (String id : ids) {
            String table = HistorianSource.quote("trend_" + id);
            db.execute("CREATE TABLE " + table + " (ts timestamptz PRIMARY KEY, value double precision)");
            try (var ps = db.admin().prepareStatement("INSERT INTO " + table
                    + " SELECT ts, value FROM trend_samples WHERE series_id = ?")) {
                ps.setString(1, id);
                ps.executeUpdate();
            }
        }
    }

    @AfterAll
    static void drop() throws SQLException {
        if (db != null) {
            db.close();
        }
    }

    private static HistorianSettings longTable() {
        return HistorianSettings.defaults(db.schemaUrl());
    }

    private static HistorianSettings perSeries() {
        return new HistorianSettings(db.schemaUrl(), HistorianSettings.Layout.PER_SERIES, "trend_{series}", null,
                "ts", "value", null, "test");
    }

    private static Map<String, byte[]> analyse(TrendSource.Opener opener, Path out, TimeOptions time, int threads)
            throws Exception {
        FleetAnalysis.Result r = FleetAnalysis.run(coverage, opener, time, AnalysisSettings.defaults(), threads,
                List.of(new UnitFiles(out, ZONE)), (d, t) -> { });
        FleetOutputs.write(out, r, ZONE, Map.of("k", "v"), List.of());
        Map<String, byte[]> files = new TreeMap<>();
        try (Stream<Path> s = Files.walk(out)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                files.put(out.relativize(p).toString(), Files.readAllBytes(p));
            }
        }
        return files;
    }

    /**
     * @param windowed whether the run had a window: the database is asked for the rows in it only, so it reads and
     *     counts no rows outside it
     */
    private static void assertSameFiles(Map<String, byte[]> expected, Map<String, byte[]> actual, boolean windowed) {
        assertEquals(expected.keySet(), actual.keySet());
        assertTrue(expected.keySet().stream().anyMatch(k -> k.endsWith("reachability.csv")), "units were clustered");
        assertTrue(new String(expected.get("findings.csv"), StandardCharsets.UTF_8).lines().count() > 1,
                "the fault gives findings to compare");
        for (String k : expected.keySet()) {
            if (k.equals("run.json")) {
                // The same counts of every kind; only the source's name differs (the file, or the database).
                assertEquals(withoutSourceNames(expected.get(k), windowed), withoutSourceNames(actual.get(k), windowed),
                        k);
                continue;
            }
            assertArrayEquals(expected.get(k), actual.get(k), k);
        }
    }

    /** run.json without the path of each trend source, and with a window without the rows read outside it. */
    private static com.google.gson.JsonElement withoutSourceNames(byte[] runJson, boolean windowed) {
        com.google.gson.JsonObject run = com.google.gson.JsonParser.parseString(
                new String(runJson, StandardCharsets.UTF_8)).getAsJsonObject();
        com.google.gson.JsonObject ingest = run.getAsJsonObject("ingest");
        com.google.gson.JsonArray files = ingest.getAsJsonArray("files");
        assertEquals(1, files.size());
        com.google.gson.JsonObject source = files.get(0).getAsJsonObject();
        assertTrue(source.remove("path") != null);
        if (windowed) {
            for (com.google.gson.JsonObject o : List.of(ingest, source)) {
                assertTrue(o.remove("rows") != null && o.remove("outside_window") != null);
            }
        }
        return run;
    }

    @Test
    void longTableGivesTheSameOutputsAsTheCsvFile(@TempDir Path a, @TempDir Path b) throws Exception {
        TimeOptions time = TimeOptions.defaults(ZONE);
        Map<String, byte[]> fromFile = analyse(TrendStore.opener(List.of(trendsFile)), a, time, 2);
        Map<String, byte[]> fromDb = analyse((w, r, o) -> HistorianSource.open(longTable(), db.login(), w, r, Set.of(), o),
                b, time, 2);
        assertSameFiles(fromFile, fromDb, false);
    }

    @Test
    void tablePerSeriesGivesTheSameOutputsAsTheCsvFileInAWindow(@TempDir Path a, @TempDir Path b) throws Exception {
        // A window inside the data: the grid comes from the options, and rows outside it are left in the database.
        TimeOptions time = TimeOptions.defaults(ZONE).withWindow(LocalDate.of(2031, 6, 3).atStartOfDay(ZONE)
                .toInstant(), LocalDate.of(2031, 6, 27).atStartOfDay(ZONE).toInstant());
        Map<String, byte[]> fromFile = analyse(TrendStore.opener(List.of(trendsFile)), a, time, 1);
        Map<String, byte[]> fromDb = analyse((w, r, o) -> HistorianSource.open(perSeries(), db.login(), w, r, Set.of(), o),
                b, time, 2);
        assertSameFiles(fromFile, fromDb, true);
    }

    @Test
    void theReportCountsEachSeriesOnceAndNamesTheMissingOnes() {
        Map<String, SeriesKind> wanted = new TreeMap<>(Map.of("FCU-01.ZN-T", SeriesKind.ANALOG, "OA-T",
                SeriesKind.ANALOG, "NOT-THERE", SeriesKind.ANALOG));
        try (TrendStore file = TrendStore.ingest(List.of(trendsFile), wanted, TimeOptions.defaults(ZONE));
             HistorianSource source = HistorianSource.open(longTable(), db.login(), wanted, Map.of(), Set.of(),
                     TimeOptions.defaults(ZONE))) {
            // OA-T is read twice, as two units sharing the outdoor sensor would.
            source.read(List.of("FCU-01.ZN-T", "OA-T", "NOT-THERE"));
            Map<String, ResampledSeries> again = source.read(List.of("OA-T"));
            assertEquals(file.report().samplesKept(), source.report().samplesKept());
            assertEquals(file.report().seriesSpans(), source.report().seriesSpans());
            assertEquals(List.of("NOT-THERE"), source.report().seriesNeverSeen());
            assertArrayEquals(file.series("OA-T").values(), again.get("OA-T").values());
        }
    }

    /**
     * A logger's sentinel (-9999), a value far past anything a room sensor reads (1e308), NaN, a NULL (an empty
     * field in the CSV) and two values at one time: the database source counts each as the file reader counts it
     * on the same rows, keeps the same samples, and in strict mode refuses the first, as the file reader does. The
     * plausible range of degrees Celsius: absolute zero, -273.15 (NIST SP 811, from memory), to 1000 (common
     * practice, no source), as {@link org.tufa.analysis.trends.PlausibleRange} gives it.
     */
    @Test
    void implausibleAndNonFiniteValuesAreCountedAsTheFileReaderCountsThem(@TempDir Path dir) throws Exception {
        String csv = "timestamp,point,value\n"
                + "2031-06-01T00:00:00Z,CHK-T,21.5\n"
                + "2031-06-01T00:15:00Z,CHK-T,-9999\n"
                + "2031-06-01T00:30:00Z,CHK-T,\n"
                + "2031-06-01T00:45:00Z,CHK-T,NaN\n"
                + "2031-06-01T01:00:00Z,CHK-T,1e308\n"
                + "2031-06-01T01:15:00Z,CHK-T,22.0\n"
                + "2031-06-01T01:15:00Z,CHK-T,22.5\n"
                + "2031-06-01T01:30:00Z,CHK-T,23.0\n";
        Path file = dir.resolve("checks.csv");
        Files.writeString(file, csv);
        db.execute("CREATE TABLE trend_checks (series_id text NOT NULL, ts timestamptz NOT NULL, "
                + "value double precision)");
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            db.admin().unwrap(PGConnection.class).getCopyAPI().copyIn(
                    "COPY trend_checks (ts, series_id, value) FROM STDIN WITH (FORMAT csv, HEADER true)", in);
        }
        HistorianSettings table = new HistorianSettings(db.schemaUrl(), HistorianSettings.Layout.LONG,
                "trend_checks", "series_id", "ts", "value", null, "test");
        Map<String, SeriesKind> wanted = Map.of("CHK-T", SeriesKind.ANALOG);
        Map<String, org.tufa.analysis.trends.PlausibleRange> ranges = Map.of("CHK-T",
                org.tufa.analysis.trends.PlausibleRange.forUnit("DEG_C").orElseThrow());
        TimeOptions time = TimeOptions.defaults(ZONE);
        try (TrendStore fromFile = TrendStore.ingest(List.of(file), wanted, ranges, time, dir);
             HistorianSource fromDb = HistorianSource.open(table, db.login(), wanted, ranges, Set.of(), time)) {
            ResampledSeries dbSeries = fromDb.read(List.of("CHK-T")).get("CHK-T");
            var f = fromFile.report();
            var d = fromDb.report();
            assertEquals(8, d.rows());
            assertEquals(List.of(f.rows(), f.samplesKept(), f.emptyValues(), f.nonFiniteValues(), f.implausibleValues(),
                    f.duplicateSamples(), f.conflictingDuplicates()), List.of(d.rows(), d.samplesKept(),
                    d.emptyValues(), d.nonFiniteValues(), d.implausibleValues(), d.duplicateSamples(),
                    d.conflictingDuplicates()));
            assertEquals(List.of(8L, 4L, 1L, 1L, 2L, 0L, 1L), List.of(d.rows(), d.samplesKept(), d.emptyValues(),
                    d.nonFiniteValues(), d.implausibleValues(), d.duplicateSamples(), d.conflictingDuplicates()));
            assertEquals(d.rows(), d.files().get(0).accounted(), "every row in one bucket");
            assertArrayEquals(fromFile.series("CHK-T").values(), dbSeries.values());
        }
        TimeOptions strict = new TimeOptions(ZONE, time.interval(), time.maxGap(), null, null, true);
        org.tufa.common.InputException fileRefusal = org.junit.jupiter.api.Assertions.assertThrows(
                org.tufa.common.InputException.class, () -> TrendStore.ingest(List.of(file), wanted, ranges, strict,
                        dir).close());
        org.tufa.common.InputException dbRefusal = org.junit.jupiter.api.Assertions.assertThrows(
                org.tufa.common.InputException.class, () -> {
                    try (HistorianSource s = HistorianSource.open(table, db.login(), wanted, ranges, Set.of(),
                            strict)) {
                        s.read(List.of("CHK-T"));
                    }
                });
        assertTrue(fileRefusal.getMessage().contains("-9999") && fileRefusal.getMessage().contains("plausible range"),
                fileRefusal.getMessage());
        assertTrue(dbRefusal.getMessage().contains("-9999") && dbRefusal.getMessage().contains("plausible range")
                && dbRefusal.getMessage().contains("trend_checks"), dbRefusal.getMessage());
    }
}
