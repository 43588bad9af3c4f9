package org.tufa.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.InputStream;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.SQLException;
import java.time.LocalDate;
import java.util.List;
import java.util.Set;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.riot.RDFDataMgr;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.postgresql.PGConnection;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.simulate.DemoTargets;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.trends.sql.TestDatabase;
import org.tufa.cli.DemoCommand;

/**
 * The Spark job reading its trends from a PostgreSQL historian: the demo's fan coil units, ten days simulated and
 * loaded into a long table, analysed by {@code tufa analyze --trends jdbc:postgresql://...} (the local engine,
 * itself checked byte for byte against the same data as CSV in the analysis module's {@code HistorianCommandTest})
 * and by the job on {@code local[2]}: the fleet files must be the same bytes, and run.json the same but for the
 * engine (its ingest counts come from the executors' reads). The server is the historian tests' ({@link
 * TestDatabase}): skipped with a message without one, except in CI, where it fails.
 */
class SparkHistorianTest {

    static TestDatabase db;
    static Path model;
    static Path login;
    static Path local;
    static final String ZONE = Season.DEMO_ZONE.getId();

    @BeforeAll
    static void loadTheHistorianAndRunTheLocalEngine(@TempDir Path dir) throws Exception {
        db = TestDatabase.connectOrSkip("Spark historian test");
        Path input = Files.createDirectories(dir.resolve("input"));
        for (String name : List.of("points.csv", "rules.tufa")) {
            try (InputStream in = DemoCommand.class.getClassLoader().getResourceAsStream("org/tufa/demo/" + name)) {
                Files.copy(in, input.resolve(name));
            }
        }
        model = dir.resolve("model.ttl");
        assertEquals(0, SparkAnalyzeTest.tufa("map", "--points", input.resolve("points.csv").toString(), "--rules",
                input.resolve("rules.tufa").toString(), "--out", model.toString()).code());
        Model m = RDFDataMgr.loadModel(model.toString());
        Vocabulary v = Vocabulary.standard();
        DemoTargets targets = DemoTargets.from(Coverage.assess(m, v, v.profiles().profile("fcu-modes"),
                Set.of(Coverage.TERMINAL_UNIT)));
        Season season = new Season(LocalDate.of(2031, 7, 1), LocalDate.of(2031, 7, 10), Season.DEMO_ZONE);
        Path trends = dir.resolve("trends.csv");
        DemoTrends.writeLong(trends, Simulator.run(new SimulationPlan(targets.units(), targets.building(), season,
                2031L, List.of())));
        db.execute("CREATE TABLE trend_samples (series_id text, ts timestamptz, value double precision)");
        try (Reader in = Files.newBufferedReader(trends, StandardCharsets.UTF_8)) {
            db.admin().unwrap(PGConnection.class).getCopyAPI().copyIn(
                    "COPY trend_samples (ts, series_id, value) FROM STDIN WITH (FORMAT csv, HEADER true)", in);
        }
        db.execute("CREATE INDEX ON trend_samples (series_id, ts)");
        login = dir.resolve("login.properties");
        Files.writeString(login, "user = " + db.user + "\npassword = " + db.password + "\n");
        local = dir.resolve("local");
        SparkAnalyzeTest.Run r = SparkAnalyzeTest.tufa(analyzeArgs(local, "analyze", "--threads", "2"));
        assertEquals(0, r.code(), r.err());
    }

    @AfterAll
    static void dropTheSchema() throws SQLException {
        if (db != null) {
            db.close();
        }
    }

    /** The analyze options of both runs; {@code first} goes before them (the command name, or nothing). */
    private static String[] analyzeArgs(Path out, String first, String... more) {
        List<String> a = new java.util.ArrayList<>();
        if (!first.isEmpty()) {
            a.add(first);
        }
        a.addAll(List.of("--model", model.toString(), "--trends", db.schemaUrl(), "--db-login", login.toString(),
                "--out", out.toString(), "--timezone", ZONE, "--no-report"));
        a.addAll(List.of(more));
        return a.toArray(String[]::new);
    }

    @Test
    void sparkFromTheHistorianWritesTheLocalEnginesBytes(@TempDir Path out) throws Exception {
        SparkAnalyzeTest.Run r = SparkAnalyzeTest.spark(analyzeArgs(out, "", "--partitions", "3"));
        assertEquals(0, r.code(), r.err());
        for (String f : List.of("fleet.csv", "findings.csv", "fleet_findings.csv", "ranking.csv")) {
            assertArrayEquals(Files.readAllBytes(local.resolve(f)), Files.readAllBytes(out.resolve(f)), f);
        }
        List<String> fleet = Files.readAllLines(out.resolve("fleet.csv"));
        assertTrue(fleet.stream().filter(l -> l.contains(",analyzed,")).count() >= 100, "fan coil units analysed");
        // The ingest counts were read on the executors and reported by the driver as the local engine reports them.
        String sparkRun = Files.readString(out.resolve("run.json"), StandardCharsets.UTF_8);
        String localRun = Files.readString(local.resolve("run.json"), StandardCharsets.UTF_8);
        assertEquals(withoutEngine(localRun), withoutEngine(sparkRun.replace(out.toString(), local.toString())));
        assertTrue(sparkRun.contains("\"engine\": \"spark\""), sparkRun);
        assertFalse(sparkRun.contains("password") || sparkRun.contains(db.password), "no login in run.json");
    }

    private static String withoutEngine(String runJson) {
        return String.join("\n", runJson.lines().filter(l -> !l.contains("\"engine\"")
                && !l.contains("\"spark_partitions\"")).toList());
    }
}
