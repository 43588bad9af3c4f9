package org.tufa.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The commands end to end: exit codes, one-line errors, files written. */
class CoverageAndQueryCommandTest {
    private record Run(int code, String out, String err) {
    }

    private static Run tufa(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Tufa.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Run(code, out.toString(), err.toString());
    }

    private static String model() throws URISyntaxException {
        return Path.of(CoverageAndQueryCommandTest.class.getResource("/org/tufa/analysis/coverage/quillmoor-hall.ttl")
                .toURI()).toString();
    }

    @Test
    void coverageWritesCsvAndJsonAndSummarises(@TempDir Path dir) throws Exception {
        Run r = tufa("coverage", "--model", model(), "--out", dir.toString(), "--list", "2");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("Terminal units found: 6"), r.out());
        assertTrue(r.out().contains("Analysable (at least one mode): 2 of 6 (33.3 %)"), r.out());
        assertTrue(r.out().contains("Profile fcu-modes: 5 units, 2 analysable (40.0 %)"), r.out());
        assertTrue(r.out().contains("Profile vav-hot-water-reheat: 1 unit, 0 analysable (0.0 %)"), r.out());
        assertTrue(r.out().contains("  ... and 2 more"), r.out());
        assertTrue(Files.readString(dir.resolve("coverage.csv")).startsWith("unit,label,unit_class,profile,unit_kind,"));
        String json = Files.readString(dir.resolve("coverage.json"));
        assertTrue(json.contains("\"profile\": \"fcu-modes\""), json);
        assertTrue(json.contains("\"profile\": \"vav-hot-water-reheat\""), json);
    }

    @Test
    void fleetWithoutTerminalUnitsExitsThree(@TempDir Path dir) throws IOException {
        Path empty = dir.resolve("plant-only.ttl");
        Files.writeString(empty, "@prefix brick: <https://brickschema.org/schema/Brick#> .\n<urn:ch1> a brick:Chiller .\n");
        Run r = tufa("coverage", "--model", empty.toString(), "--out", dir.resolve("out").toString());
        assertEquals(ExitCodes.CHECK_FAILED, r.code());
        assertTrue(r.out().contains("No terminal units found."), r.out());
        assertTrue(Files.notExists(dir.resolve("out")));
    }

    @Test
    void badInputIsOneLineAndExitOne(@TempDir Path dir) throws Exception {
        Run missing = tufa("coverage", "--model", dir.resolve("none.ttl").toString(), "--out", dir.toString());
        assertEquals(ExitCodes.INPUT_ERROR, missing.code());
        assertEquals("tufa: " + dir.resolve("none.ttl") + ": no such file; check the path", missing.err().strip());

        Run profile = tufa("coverage", "--model", model(), "--profile", "nope", "--out", dir.toString());
        assertEquals(ExitCodes.INPUT_ERROR, profile.code());
        assertTrue(profile.err().startsWith("tufa: unknown profile 'nope'; known profiles: cooling-only, fcu-modes"),
                profile.err());

        Run unitClass = tufa("coverage", "--model", model(), "--unit-class", "brick:Fan_Coil", "--out", dir.toString());
        assertEquals(ExitCodes.INPUT_ERROR, unitClass.code());
        assertTrue(unitClass.err().contains("nearest: brick:Fan_Coil_Unit"), unitClass.err());
        assertEquals(1, unitClass.err().strip().lines().count());
    }

    @Test
    void queryFromTextAndFile(@TempDir Path dir) throws Exception {
        Run r = tufa("query", "--model", model(), "--format", "csv",
                "-e", "SELECT (COUNT(?u) AS ?n) WHERE { ?u a/rdfs:subClassOf* brick:Fan_Coil_Unit }");
        assertEquals(0, r.code(), r.err());
        // Fan_Coil_Unit has no subclass in the subset, and brick:FCU is only equivalent: 4 of the 5 fan coils.
        assertEquals("n\r\n4\r\n", r.out());

        Path rq = dir.resolve("bad.rq");
        Files.writeString(rq, "SELECT ?u\nWHERE { ?u a brick:FCU \n");
        Run bad = tufa("query", "--model", model(), rq.toString());
        assertEquals(ExitCodes.INPUT_ERROR, bad.code());
        assertTrue(bad.err().startsWith("tufa: " + rq + ":"), bad.err());
        assertEquals(1, bad.err().strip().lines().count(), bad.err());
    }
}
