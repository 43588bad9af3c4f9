package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.Duration;
import java.time.Instant;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.IndexRange;
import org.tufa.analysis.modes.ModeSplit;
import org.tufa.analysis.modes.OperatingMode;

class UnitOutcomeTest {

    static final Instant START = Instant.parse("2031-06-02T00:00:00Z");
    static final Duration STEP = Duration.ofMinutes(15);

    /** A result of {@code n} samples with the given load, all in cooling. */
    static UnitAnalysis.Result result(double[] loadKw, List<Finding> findings) {
        int n = loadKw.length;
        byte[] codes = new byte[n];
        Arrays.fill(codes, OperatingMode.COOLING.code());
        int[] counts = new int[OperatingMode.values().length];
        counts[OperatingMode.COOLING.code()] = n;
        return new UnitAnalysis.Result(START, STEP, new ModeSplit(codes, counts, false), loadKw, new byte[n],
                List.of(), findings, List.of());
    }

    static Finding finding(String kind, int from, int to) {
        Instant s = START.plus(STEP.multipliedBy(from));
        Instant e = START.plus(STEP.multipliedBy(to));
        return new Finding("cooling", kind, -1, new IndexRange(from, to), s, e, (to - from) * 0.25, Double.NaN,
                List.of(), List.of());
    }

    /**
     * Worked example, computed by hand: 20 samples of 15 minutes; findings over samples [2, 6), [4, 10) and
     * [15, 17). Summed, they last 1 + 1.5 + 0.5 = 3 h; covered samples are 2..9 and 15..16, 10 samples = 2.5 h.
     * Load 2 kW everywhere but NaN at sample 5: energy over the 9 covered samples with a load = 9 * 0.25 * 2
     * = 4.5 kWh.
     */
    @Test
    void overlappingFindingsAreCountedOnce() {
        double[] load = new double[20];
        Arrays.fill(load, -2.0); // cooling load is negative; energy counts |Q|
        load[5] = Double.NaN;
        List<Finding> findings = List.of(finding("fault_cluster", 2, 6), finding("cooling_without_cooling", 4, 10),
                finding("out_of_band_low", 15, 17));
        UnitOutcome u = new UnitOutcome("urn:example:u1", "FCU-1", "FCU-1", UnitOutcome.ANALYZED, "", List.of(),
                result(load, findings)).withoutDetail().decided(findings, 0, List.of(), load);
        assertEquals(2.5, u.faultHours(), 1e-12);
        assertEquals(4.5, u.faultEnergyKwh(), 1e-12);
        assertEquals(3.0, findings.stream().mapToDouble(Finding::hours).sum(), 1e-12, "the naive sum differs");
    }

    /** Many models carry no rdfs:label (the 500-unit benchmark fleet's do not): the console and report name such
     * a unit by its IRI, not by an empty string. */
    @Test
    void aUnitWithoutALabelIsNamedByItsIri() {
        UnitOutcome unlabelled = new UnitOutcome("urn:bench:fleet#fcu_001", "", "fcu_001", UnitOutcome.SKIPPED,
                "no data", List.of(), null);
        assertEquals("urn:bench:fleet#fcu_001", unlabelled.displayName());
        UnitOutcome labelled = new UnitOutcome("urn:bench:fleet#fcu_002", "FCU 2 (room 12)", "fcu_002",
                UnitOutcome.SKIPPED, "no data", List.of(), null);
        assertEquals("FCU 2 (room 12)", labelled.displayName());
    }

    @Test
    void unitWithoutFindingsOrResultHasNoFaultHours() {
        double[] load = new double[8];
        UnitOutcome none = new UnitOutcome("u", "u", "u", UnitOutcome.ANALYZED, "", List.of(),
                result(load, List.of())).withoutDetail().decided(List.of(), 0, List.of(), null);
        UnitOutcome skipped = new UnitOutcome("u", "u", "u", UnitOutcome.SKIPPED, "no data", List.of(), null);
        assertEquals(0.0, none.faultHours());
        assertEquals(0.0, skipped.faultHours());
    }
}
