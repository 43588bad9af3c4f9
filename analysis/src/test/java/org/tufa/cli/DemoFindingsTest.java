package org.tufa.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The whole demo, run once: the fan coil units' findings and fleet rows are byte for byte those recorded before
 * the per-unit analysis moved behind {@code org.tufa.analysis.kinds.UnitKind} (recorded with the jar of main at
 * ebe735b: {@code tufa demo --out X}, the rows of the FCU-* units of findings.csv and fleet.csv). A change that
 * moves a fan coil finding has to say so by re-recording them.
 */
class DemoFindingsTest {

    @TempDir
    static Path dir;
    static Path out;

    @BeforeAll
    static void runDemo() {
        out = dir.resolve("demo");
        StringWriter stdout = new StringWriter();
        StringWriter stderr = new StringWriter();
        int code = Tufa.execute(new String[] {"demo", "--out", out.toString(), "--threads", "2"},
                new PrintWriter(stdout, true), new PrintWriter(stderr, true));
        assertEquals(0, code, stderr.toString());
    }

    private static List<String> fanCoilRows(Path csv) throws IOException {
        List<String> lines = Files.readAllLines(csv, StandardCharsets.UTF_8);
        return java.util.stream.Stream.concat(lines.stream().limit(1),
                lines.stream().skip(1).filter(l -> l.contains("/equipment/FCU-"))).toList();
    }

    private static List<String> recorded(String name) throws IOException {
        try (var in = Objects.requireNonNull(DemoFindingsTest.class.getResourceAsStream(name), name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8).lines().toList();
        }
    }

    @Test
    void fanCoilFindingsAreThoseRecordedBeforeTheKindsRefactor() throws IOException {
        assertEquals(recorded("demo-fan-coil-findings.csv"), fanCoilRows(out.resolve("findings.csv")));
    }

    @Test
    void fanCoilFleetRowsAreThoseRecordedBeforeTheKindsRefactor() throws IOException {
        assertEquals(recorded("demo-fan-coil-fleet.csv"), fanCoilRows(out.resolve("fleet.csv")));
    }
}
