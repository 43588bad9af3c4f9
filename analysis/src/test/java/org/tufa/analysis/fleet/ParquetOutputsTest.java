package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.ResultSetMetaData;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.simulate.DemoTargets;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.FaultEpisode;
import org.tufa.analysis.simulate.FaultType;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.tables.SampleFormat;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.cli.Tufa;

/**
 * The per-sample Parquet files read back by DuckDB (its own C++ Parquet reader, not parquet-java, through its JDBC
 * driver): the same column names in the same order as the CSV files of the same run, and the same values: times as
 * instants, doubles and single-precision floats bit for bit (nan and inf included), whole numbers, flags with their
 * empty cells. And tufa
 * evaluate scores a Parquet run exactly as the CSV run.
 */
class ParquetOutputsTest {

    static final ZoneId ZONE = Season.DEMO_ZONE;
    static Path csvRun;
    static Path parquetRun;
    static Path truth;
    static FleetCoverage coverage;
    static Path trendsFile;

    @BeforeAll
    static void runBoth(@TempDir Path dir) throws Exception {
        Model model = SmallFleet.model(3, true);
        Vocabulary v = Vocabulary.standard();
        coverage = Coverage.assess(model, v, v.profiles().profile("fcu-modes"),
                Set.of(Coverage.TERMINAL_UNIT));
        Season season = new Season(LocalDate.of(2031, 6, 1), LocalDate.of(2031, 6, 29), ZONE);
        Instant start = LocalDate.of(2031, 6, 10).atStartOfDay(ZONE).toInstant();
        FaultEpisode fault = new FaultEpisode(SmallFleet.unitIris(3).get(0), FaultType.DISCHARGE_SENSOR_BIAS, start,
                start.plus(Duration.ofDays(8)), 0.8);
        DemoTargets targets = DemoTargets.from(coverage);
        Path trends = dir.resolve("trends");
        DemoTrends.write(trends, Simulator.run(new SimulationPlan(targets.units(), targets.building(), season, 3L,
                List.of(fault))), DemoTrends.Layout.WIDE);
        truth = trends.resolve(DemoTrends.TRUTH_FILE);
        trendsFile = trends.resolve(DemoTrends.TRENDS_FILE);
        csvRun = dir.resolve("csv");
        parquetRun = dir.resolve("parquet");
        for (SampleFormat format : SampleFormat.values()) {
            Path out = format == SampleFormat.CSV ? csvRun : parquetRun;
            FleetAnalysis.Result r = FleetAnalysis.run(coverage, List.of(trendsFile),
                    TimeOptions.defaults(ZONE), AnalysisSettings.defaults(), 2,
                    List.of(new UnitFiles(out, ZONE, format)), (d, t) -> { });
            FleetOutputs.write(out, r, ZONE, java.util.Map.of(), List.of());
        }
    }

    private static List<Path> csvTables() throws Exception {
        try (Stream<Path> s = Files.walk(csvRun.resolve("units"))) {
            return s.filter(p -> p.toString().endsWith(".csv")).sorted().toList();
        }
    }

    @Test
    void everyCsvTableHasAParquetTwinWithTheSameColumnsAndValues() throws Exception {
        List<Path> tables = csvTables();
        assertTrue(tables.stream().anyMatch(p -> p.endsWith("reachability.csv")), "some mode was clustered");
        assertTrue(tables.stream().anyMatch(p -> p.endsWith("modes.csv")));
        try (Connection duck = DriverManager.getConnection("jdbc:duckdb:")) {
            for (Path csv : tables) {
                Path rel = csvRun.relativize(csv);
                Path parquet = parquetRun.resolve(rel.toString().replaceAll("\\.csv$", ".parquet"));
                assertTrue(Files.isRegularFile(parquet), parquet.toString());
                assertFalse(Files.exists(parquetRun.resolve(rel)), "no CSV beside the Parquet file: " + rel);
                compare(duck, csv, parquet);
            }
        }
    }

    private static void compare(Connection duck, Path csv, Path parquet) throws Exception {
        List<String> lines = Files.readAllLines(csv);
        List<String> header = List.of(lines.get(0).split(","));
        try (PreparedStatement ps = duck.prepareStatement("SELECT * FROM read_parquet(?)")) {
            ps.setString(1, parquet.toString());
            try (ResultSet rs = ps.executeQuery()) {
                ResultSetMetaData md = rs.getMetaData();
                List<String> names = new ArrayList<>();
                for (int c = 1; c <= md.getColumnCount(); c++) {
                    names.add(md.getColumnName(c));
                }
                assertEquals(header, names, parquet + ": columns");
                int row = 1;
                while (rs.next()) {
                    assertTrue(row < lines.size(), parquet + ": more rows than the CSV");
                    String[] cells = lines.get(row).split(",", -1);
                    for (int c = 0; c < cells.length; c++) {
                        String where = parquet + " row " + row + " column " + header.get(c);
                        String cell = cells[c];
                        String type = md.getColumnTypeName(c + 1);
                        if (header.get(c).equals("timestamp")) {
                            assertEquals("TIMESTAMP WITH TIME ZONE", type, where);
                            OffsetDateTime t = rs.getObject(c + 1, OffsetDateTime.class);
                            assertEquals(OffsetDateTime.parse(cell).toInstant(), t.toInstant(), where);
                        } else if (type.equals("DOUBLE")) {
                            double expected = switch (cell) {
                                case "nan" -> Double.NaN;
                                case "inf" -> Double.POSITIVE_INFINITY;
                                case "-inf" -> Double.NEGATIVE_INFINITY;
                                default -> Double.parseDouble(cell);
                            };
                            assertEquals(Double.doubleToLongBits(expected), Double.doubleToLongBits(rs.getDouble(c + 1)),
                                    where);
                        } else if (type.equals("FLOAT")) {
                            float expected = switch (cell) {
                                case "nan" -> Float.NaN;
                                case "inf" -> Float.POSITIVE_INFINITY;
                                case "-inf" -> Float.NEGATIVE_INFINITY;
                                default -> Float.parseFloat(cell);
                            };
                            assertEquals(Float.floatToIntBits(expected), Float.floatToIntBits(rs.getFloat(c + 1)),
                                    where);
                        } else if (type.equals("INTEGER")) {
                            assertEquals(Integer.parseInt(cell), rs.getInt(c + 1), where);
                        } else if (type.equals("BOOLEAN")) {
                            Object b = rs.getObject(c + 1);
                            assertEquals(cell.isEmpty() ? null : Boolean.valueOf(cell), b, where);
                        } else {
                            assertEquals("VARCHAR", type, where);
                            assertEquals(cell, rs.getString(c + 1), where);
                        }
                    }
                    row++;
                }
                assertEquals(lines.size(), row, parquet + ": rows");
            }
        }
    }

    @Test
    void aBooleanColumnKeepsItsEmptyCells() throws Exception {
        // The band state is empty where a sample is not judged (off, no data): Parquet keeps those as nulls.
        try (Connection duck = DriverManager.getConnection("jdbc:duckdb:");
             PreparedStatement ps = duck.prepareStatement(
                     "SELECT count(*) FILTER (WHERE in_band IS NULL), count(*) FILTER (WHERE in_band) FROM "
                             + "read_parquet(?)")) {
            Path modes;
            try (Stream<Path> s = Files.walk(parquetRun.resolve("units"))) {
                modes = s.filter(p -> p.endsWith("modes.parquet")).sorted().findFirst().orElseThrow();
            }
            ps.setString(1, modes.toString());
            try (ResultSet rs = ps.executeQuery()) {
                rs.next();
                assertTrue(rs.getLong(1) > 0 && rs.getLong(2) > 0, "both empty and true cells");
            }
        }
    }

    @Test
    void evaluateScoresTheParquetRunAsTheCsvRun(@TempDir Path dir) throws Exception {
        String[] scored = new String[2];
        int k = 0;
        for (Path run : List.of(csvRun, parquetRun)) {
            StringWriter out = new StringWriter();
            StringWriter err = new StringWriter();
            int code = Tufa.execute(new String[] {"evaluate", "--findings", run.toString(), "--truth",
                truth.toString()}, new PrintWriter(out, true), new PrintWriter(err, true));
            assertEquals(0, code, err.toString());
            scored[k++] = Files.readString(run.resolve("evaluation.csv"));
        }
        assertEquals(scored[0], scored[1]);
        assertTrue(scored[0].contains("discharge_sensor_bias"), scored[0]);
    }

    @Test
    void sameParquetBytesWithOneOrTwoThreads(@TempDir Path again) throws Exception {
        // Determinism: nothing in the files depends on time or threads (gzip headers carry no time).
        FleetAnalysis.run(coverage, List.of(trendsFile), TimeOptions.defaults(ZONE), AnalysisSettings.defaults(), 1,
                List.of(new UnitFiles(again, ZONE, SampleFormat.PARQUET)), (d, t) -> { });
        List<Path> files;
        try (Stream<Path> s = Files.walk(parquetRun.resolve("units"))) {
            files = s.filter(p -> p.toString().endsWith(".parquet")).sorted().toList();
        }
        assertFalse(files.isEmpty());
        for (Path f : files) {
            assertArrayEquals(Files.readAllBytes(f), Files.readAllBytes(again.resolve(parquetRun.relativize(f))),
                    f.toString());
        }
    }

    @Test
    void aRunInTheOtherFormatLeavesNoTableOfTheEarlierRun(@TempDir Path dir) throws Exception {
        // A Parquet run, then a CSV run into the same folder: the Parquet tables would otherwise be read back (by
        // evaluate, which prefers them) as the second run's.
        for (SampleFormat format : List.of(SampleFormat.PARQUET, SampleFormat.CSV)) {
            FleetAnalysis.run(coverage, List.of(trendsFile), TimeOptions.defaults(ZONE), AnalysisSettings.defaults(),
                    1, List.of(new UnitFiles(dir, ZONE, format)), (d, t) -> { });
        }
        List<String> names;
        try (Stream<Path> s = Files.walk(dir.resolve("units"))) {
            names = s.filter(Files::isRegularFile).map(p -> dir.relativize(p).toString()).sorted().toList();
        }
        assertTrue(names.stream().noneMatch(n -> n.endsWith(".parquet")), names.toString());
        assertEquals(csvTables().stream().map(p -> csvRun.relativize(p).toString()).toList(),
                names.stream().filter(n -> n.endsWith(".csv")).toList());
    }
}
