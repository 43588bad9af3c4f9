package org.tufa.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The bad-input catalogue of issue 13 through the command line: each case exits with the code README.md's table
 * gives (never 70) and a one-line message naming the place and what to do. The model is Pellow Row, one fan coil
 * unit written by hand in the style of the published Brick examples.
 */
class HardeningCatalogueTest {
    @TempDir
    Path dir;

    private record Run(int code, String out, String err) {
        String firstErrorLine() {
            return err.lines().filter(l -> l.startsWith("tufa:")).findFirst().orElse("");
        }
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Tufa.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Run(code, out.toString(), err.toString());
    }

    private Path model() throws Exception {
        Path m = dir.resolve("pellow-row.ttl");
        if (!Files.exists(m)) {
            Files.copy(Path.of(getClass().getResource("pellow-row.ttl").toURI()), m);
        }
        return m;
    }

    /** Three days of every Pellow Row series every 15 minutes, long layout. */
    private Path trends(String name) throws Exception {
        StringBuilder b = new StringBuilder("timestamp,point,value\n");
        Instant t0 = Instant.parse("2031-07-01T00:00:00Z");
        String[] ids = {"FCU-1.ZN-T", "FCU-1.DA-T", "FCU-1.FAN-S", "FCU-1.CLG-VLV", "FCU-1.HTG-VLV", "CHWS-T",
            "HWS-T", "OA-T"};
        for (int i = 0; i < 3 * 96; i++) {
            Instant t = t0.plusSeconds(900L * i);
            double cool = (i % 96) > 30 && (i % 96) < 80 ? 60 : 0;
            double[] v = {74 + cool / 30, 74 - cool / 4, 1, cool, 0, 6.5, 60, 25};
            for (int k = 0; k < ids.length; k++) {
                b.append(t).append(',').append(ids[k]).append(',').append(v[k]).append('\n');
            }
        }
        Path f = dir.resolve(name);
        Files.writeString(f, b);
        return f;
    }

    private static void assertOneLine(Run r, int code, String contains) {
        assertEquals(code, r.code(), r.err());
        assertTrue(r.firstErrorLine().contains(contains), r.err());
        assertFalse(r.err().contains("internal error") || r.err().contains("Exception"), r.err());
        assertFalse(r.err().contains("Usage:"), "no usage text: " + r.err());
    }

    @Test
    void mapRefusesOutputsThatWouldDestroyAnInputOrEachOther() throws Exception {
        Path points = dir.resolve("points.csv");
        Files.writeString(points, "Point Name\nFCU1 T\n");
        Path rules = dir.resolve("r.tufa");
        Files.writeString(rules, "building B\n");
        assertOneLine(run("map", "--points", points.toString(), "--rules", rules.toString(), "--out",
                dir.resolve("o.ttl").toString(), "--report", dir.resolve("o.ttl").toString()), 1,
                "--report and --out name the same file");
        assertFalse(Files.exists(dir.resolve("o.ttl")));
        assertOneLine(run("map", "--points", points.toString(), "--rules", rules.toString(), "--out",
                points.toString()), 1, "--out names the same file as --points");
        assertEquals("Point Name\nFCU1 T\n", Files.readString(points));
        assertOneLine(run("map", "--points", points.toString(), "--rules", rules.toString(), "--out",
                rules.toString()), 1, "--out names the same file as --rules");
        Assumptions.assumeTrue(Files.isDirectory(Path.of("/proc/self")), "no /proc on this system");
        assertOneLine(run("map", "--points", points.toString(), "--rules", rules.toString(), "--out",
                "/proc/tufa-test.ttl"), 1, "/proc/tufa-test.ttl: cannot write");
    }

    @Test
    void optionValuesAreCheckedWithOneLine() throws Exception {
        Path t = trends("t.csv");
        String m = model().toString();
        for (String n : List.of("0", "-3", "10000")) {
            assertOneLine(run("analyze", "--model", m, "--trends", t.toString(), "--out", dir.resolve("a").toString(),
                    "--threads", n), 1, "--threads " + n + ": give 1 to 256");
        }
        assertOneLine(run("analyze", "--model", m, "--trends", t.toString(), "--out", dir.resolve("a").toString(),
                "--interval", "15 parsecs"), 2, "'15 parsecs' is not a duration");
        assertOneLine(run("coverage", "--model", m, "--out", dir.resolve("c").toString(), "--list", "-5"), 1,
                "--list -5");
        Path plain = dir.resolve("plain");
        Files.writeString(plain, "x");
        assertOneLine(run("analyze", "--model", m, "--trends", t.toString(), "--out", plain.toString()), 1,
                "--out names a file, not a folder");
        assertOneLine(run("coverage", "--model", m, "--out", plain.toString()), 1, "--out names a file");
        // A trend file called fleet.csv inside --out, and one under --out/units, would be overwritten.
        Path named = trends("fleet.csv");
        assertOneLine(run("analyze", "--model", m, "--trends", named.toString(), "--out", dir.toString()), 1,
                "--out (fleet.csv) names the same file as --trends");
        Path below = Files.createDirectories(dir.resolve("o").resolve("units"));
        Files.copy(t, below.resolve("t.csv"));
        assertOneLine(run("analyze", "--model", m, "--trends", below.resolve("t.csv").toString(), "--out",
                dir.resolve("o").toString()), 1, "which the run rewrites");
        assertOneLine(run("evaluate", "--findings", dir.toString(), "--truth",
                dir.resolve("evaluation.csv").toString()), 1, "--findings (evaluation.csv) names the same file as --truth");
    }

    @Test
    void shortDurationsAreReadAndTheRunAccountsForItsRowsInRunJson() throws Exception {
        Path t = trends("t.csv");
        Files.writeString(t, "2031-07-01T00:00:00Z,FCU-1.ZN-T,\n2031-07-01T00:00:00Z,SPARE-9,1\n"
                + "2031-07-01T00:05:00Z,FCU-1.ZN-T,1e308\n", java.nio.file.StandardOpenOption.APPEND);
        Path out = dir.resolve("out");
        Run r = run("analyze", "--model", model().toString(), "--trends", t.toString(), "--out", out.toString(),
                "--interval", "15min", "--no-report", "--threads", "1");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("1 of 1 series no analysed unit reads (SPARE-9)"), r.out());
        assertTrue(r.out().contains("1 empty values") && r.out().contains("1 values implausible for their unit"),
                r.out());
        String json = Files.readString(out.resolve("run.json"));
        assertTrue(json.contains("\"empty_values\": 1") && json.contains("\"implausible_values\": 1")
                && json.contains("\"SPARE-9\""), json);
        assertTrue(json.contains("\"interval\": \"PT15M\""), json);
    }

    @Test
    void nothingKeptIsBlamedOnItsRealCause() throws Exception {
        String m = model().toString();
        Path epoch = dir.resolve("epoch.csv");
        Files.writeString(epoch, "timestamp,point,value\n1938000000,FCU-1.ZN-T,75\n1938000900,FCU-1.ZN-T,75\n");
        assertOneLine(run("analyze", "--model", m, "--trends", epoch.toString(), "--out",
                dir.resolve("e").toString(), "--no-report"), 1, "looks like a Unix epoch time");
        Path t = trends("t.csv");
        Run window = run("analyze", "--model", m, "--trends", t.toString(), "--out", dir.resolve("w").toString(),
                "--from", "2035-01-01", "--no-report");
        assertOneLine(window, 1, "lie outside the window --from 2035-01-01T00:00:00Z");
        assertTrue(window.firstErrorLine().contains("the trends run from 2031-07-01T00:00:00Z"), window.err());
        Path foreign = dir.resolve("foreign.csv");
        Files.writeString(foreign, "timestamp,point,value\n2031-07-01T00:00:00Z,ROOM-7,21\n");
        assertOneLine(run("analyze", "--model", m, "--trends", foreign.toString(), "--out",
                dir.resolve("f").toString(), "--no-report"), 3, "no trend sample belongs to a point of the model");
        Path fine = dir.resolve("fine.csv");
        Files.writeString(fine, "timestamp,point,value\n2031-07-01T00:00:00Z,FCU-1.ZN-T,75\n");
        assertOneLine(run("analyze", "--model", m, "--trends", fine.toString(), "--out", dir.resolve("p").toString(),
                "--interval", "PT1S", "--to", "2031-07-06", "--no-report"), 1, "grid cells per series");
    }

    @Test
    void queriesThatReachOutAreInputErrorsNotBugs() throws Exception {
        String m = model().toString();
        List<String> queries = new ArrayList<>(List.of(
                "SELECT * WHERE { SERVICE SILENT <http://127.0.0.1:9/sparql> { ?s ?p ?o } }",
                "SELECT * WHERE { SERVICE <file:///etc/passwd> { ?s ?p ?o } }",
                "SELECT * FROM <file:///etc/hostname> WHERE { ?s ?p ?o }",
                "INSERT DATA { <urn:a> <urn:b> <urn:c> }"));
        for (String q : queries) {
            Run r = run("query", "--model", m, "-e", q);
            assertEquals(1, r.code(), q + ": " + r.err());
            assertEquals(1, r.err().lines().count(), r.err());
        }
        assertOneLine(run("query", "--model", m, "--allow-service", "file:///etc/passwd", "-e", "ASK {}"), 1,
                "--allow-service");
        assertEquals(0, run("query", "--model", m, "-e", "ASK { ?u a brick:Fan_Coil_Unit }").code());
    }
}
