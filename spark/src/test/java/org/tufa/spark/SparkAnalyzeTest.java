package org.tufa.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.apache.spark.SparkConf;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.Season;
import org.tufa.cli.DemoCommand;
import org.tufa.cli.Tufa;

/**
 * The Spark job against the local engine on the bundled demo (its point list mapped to a model, its summer
 * simulated, as {@code tufa demo} does): the job on {@code local[2]} must write the same bytes as
 * {@code tufa analyze} on the same input, for the fleet files and for every per-unit file. The reference is the
 * local engine, itself checked against outside sources in the analysis module's tests.
 */
class SparkAnalyzeTest {

    static Path demo;
    static Path model;
    static Path trends;
    static Path local;
    static String zone;

    @BeforeAll
    static void demoInputAndLocalRun(@TempDir Path dir) throws IOException {
        demo = dir;
        Path input = Files.createDirectories(dir.resolve("input"));
        for (String name : List.of("points.csv", "rules.tufa")) {
            try (InputStream in = DemoCommand.class.getClassLoader().getResourceAsStream("org/tufa/demo/" + name)) {
                Files.copy(in, input.resolve(name));
            }
        }
        model = dir.resolve("model.ttl");
        assertEquals(0, tufa("map", "--points", input.resolve("points.csv").toString(), "--rules",
                input.resolve("rules.tufa").toString(), "--out", model.toString()).code());
        Season season = Season.summer(2031);
        zone = season.zone().getId();
        DemoCommand.simulateDemo(model, season, dir.resolve("trends"));
        trends = dir.resolve("trends").resolve(DemoTrends.TRENDS_FILE);
        local = dir.resolve("local");
        List<String> args = new ArrayList<>(List.of("analyze"));
        args.addAll(List.of(analyzeArgs(local, "--threads", "2")));
        Run r = tufa(args.toArray(String[]::new));
        assertEquals(0, r.code(), r.err());
    }

    static String[] analyzeArgs(Path out, String... more) {
        List<String> a = new ArrayList<>(List.of("--model", model.toString(), "--trends", trends.toString(),
                "--out", out.toString(), "--timezone", zone));
        a.addAll(List.of(more));
        return a.toArray(String[]::new);
    }

    record Run(int code, String out, String err) {
    }

    static Run tufa(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Tufa.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Run(code, out.toString(), err.toString());
    }

    static Run spark(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        SparkConf conf = new SparkConf().setMaster("local[2]").set("spark.ui.enabled", "false");
        int code = SparkAnalyze.run(args, new PrintWriter(out, true), new PrintWriter(err, true), conf);
        return new Run(code, out.toString(), err.toString());
    }

    @Test
    void sparkOnLocalTwoWritesTheLocalEnginesBytes(@TempDir Path out) throws IOException {
        // Three partitions on two cores: parts of unequal size, finishing in any order.
        Run r = spark(analyzeArgs(out, "--partitions", "3"));
        assertEquals(0, r.code(), r.err());
        for (String f : List.of("fleet.csv", "findings.csv", "fleet_findings.csv", "ranking.csv", "coverage.csv",
                "coverage.json")) {
            assertArrayEquals(Files.readAllBytes(local.resolve(f)), Files.readAllBytes(out.resolve(f)), f);
        }
        // The demo has faults to find: the comparison is not between two empty tables.
        long findings = Files.readAllLines(local.resolve("findings.csv")).size() - 1;
        assertTrue(findings >= 10, findings + " findings");
        // Per-unit files (Parquet tables, summaries) written on the executors, and the report: unit pages written
        // on the driver with the charts drawn on the executors.
        for (String tree : List.of("units", "report")) {
            List<Path> expected = files(local.resolve(tree));
            assertEquals(expected, files(out.resolve(tree)), "the same files under " + tree);
            for (Path p : expected) {
                assertArrayEquals(Files.readAllBytes(local.resolve(tree).resolve(p)),
                        Files.readAllBytes(out.resolve(tree).resolve(p)), tree + "/" + p);
            }
        }
        assertTrue(files(out.resolve("units")).stream().anyMatch(p -> p.toString().endsWith(".parquet")),
                "per-unit Parquet");
        assertTrue(files(out.resolve("report")).stream().anyMatch(p -> p.toString().endsWith("reachability.png")),
                "charts");
        // run.json is the same but for the engine it names.
        String sparkRun = Files.readString(out.resolve("run.json"), StandardCharsets.UTF_8);
        assertTrue(sparkRun.contains("\"engine\": \"spark\""), sparkRun);
        assertEquals(withoutEngine(Files.readString(local.resolve("run.json"), StandardCharsets.UTF_8)),
                withoutEngine(sparkRun.replace(out.toString(), local.toString())));
        assertTrue(r.out().contains("Outputs: "), r.out());
    }

    private static String withoutEngine(String runJson) {
        return String.join("\n", runJson.lines().filter(l -> !l.contains("\"engine\"")
                && !l.contains("\"spark_partitions\"")).toList());
    }

    private static List<Path> files(Path root) throws IOException {
        try (Stream<Path> s = Files.walk(root)) {
            return s.filter(Files::isRegularFile).map(root::relativize).sorted().toList();
        }
    }

    @Test
    void aMissingTrendFileIsOneLineNamingIt(@TempDir Path out) {
        Path missing = demo.resolve("no-such-trends.csv");
        Run r = spark("--model", model.toString(), "--trends", missing.toString(), "--out", out.toString(),
                "--timezone", zone);
        assertEquals(1, r.code(), "input error");
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().startsWith("tufa: ") && r.err().contains(missing.toString()), r.err());
        assertFalse(Files.exists(out.resolve("fleet.csv")));
    }

    @Test
    void badOptionsAreOneLineErrors(@TempDir Path out) {
        Run partitions = spark(analyzeArgs(out, "--partitions", "0"));
        assertEquals(1, partitions.code());
        assertEquals("tufa: --partitions 0: give 1 or more", partitions.err().strip());
        Run database = spark("--model", model.toString(), "--trends", "jdbc:postgresql://localhost:1/none",
                "--out", out.toString());
        assertEquals(1, database.code(), database.err());
        assertEquals(1, database.err().strip().lines().count(), database.err());
        assertTrue(database.err().contains("localhost:1"), database.err());
        Run unknown = spark(analyzeArgs(out, "--no-such-option"));
        assertEquals(2, unknown.code(), "usage error");
        assertEquals(1, unknown.err().strip().lines().count(), unknown.err());
        assertTrue(unknown.err().contains("tufa-spark --help"), unknown.err());
    }
}
