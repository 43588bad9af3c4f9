package org.tufa.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

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
 * The whole demo, run once. The fan coil units' findings and fleet rows are byte for byte those recorded before
 * the per-unit analysis moved behind {@code org.tufa.analysis.kinds.UnitKind} (recorded with the jar of main at
 * ebe735b, again after merging the review loop with the jar of main at 2b8b3f9, and again when samples outside the
 * load band began to count as coil-residual evidence, which moved five fan coil findings, and again when episodes
 * began to bridge weekend days without a fault, which joined pieces of one fault into one finding (73 findings of
 * the demo became 62): {@code tufa demo --out X}, the rows of the FCU-* units of findings.csv and fleet.csv). A
 * change that
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

    /**
     * The VAV wing against the detection targets, the same as for fan coil units: every VAV episode
     * detected and at least 70 % of the VAV fault hours flagged (evaluation.csv, scope all_vav_faults), and at most
     * 5 % of the healthy boxes (no episode in truth.csv) with any finding.
     */
    @Test
    void vavWingMeetsTheFaultHourAndHealthyBoxTargets() throws IOException {
        List<String> evaluation = Files.readAllLines(out.resolve("evaluation.csv"), StandardCharsets.UTF_8);
        List<String> header = List.of(evaluation.get(0).split(","));
        String[] vav = evaluation.stream().filter(l -> l.startsWith("all_vav_faults,")).findFirst().orElseThrow()
                .split(",");
        double share = Double.parseDouble(vav[header.indexOf("flagged_share")]);
        assertTrue(share >= 0.70, "VAV fault hours flagged: " + share);
        assertEquals(vav[header.indexOf("episodes")], vav[header.indexOf("detected")], "every VAV episode detected");
        java.util.Set<String> faulty = new java.util.HashSet<>();
        for (String l : Files.readAllLines(out.resolve("trends-summer").resolve("truth.csv"))) {
            faulty.add(l.split(",")[0]);
        }
        java.util.Set<String> boxes = new java.util.TreeSet<>();
        java.util.Set<String> healthyWithFindings = new java.util.TreeSet<>();
        for (String l : Files.readAllLines(out.resolve("fleet.csv"))) {
            String unit = l.split(",")[0];
            if (unit.contains("/equipment/RW-VAV-") && l.contains(",analyzed,") && !faulty.contains(unit)) {
                boxes.add(unit);
            }
        }
        for (String l : Files.readAllLines(out.resolve("findings.csv"))) {
            String unit = l.split(",")[0];
            if (boxes.contains(unit)) {
                healthyWithFindings.add(unit);
            }
        }
        assertTrue(boxes.size() >= 20, "healthy analysed boxes: " + boxes.size());
        assertTrue(healthyWithFindings.size() <= 0.05 * boxes.size(), "healthy boxes with findings: "
                + healthyWithFindings);
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
