package org.tufa.analysis.review;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.IndexRange;

/**
 * The review step on hand-made findings (worked examples, computed by hand): which findings a verdict is the own
 * verdict of, what a rejection takes out, what overlaps are shown, and that every verdict is accounted for.
 */
class ReviewStepTest {

    static final String U1 = ReviewFileTest.U1;
    static final String U2 = ReviewFileTest.U2;
    static final Instant DAY = Instant.parse("2031-07-01T04:00:00Z");

    static Finding finding(String mode, String kind, int fromDay, int days, double confidence) {
        Instant s = DAY.plusSeconds(86_400L * fromDay);
        Instant e = s.plusSeconds(86_400L * days);
        return new Finding(mode, kind, kind.equals("fault_cluster") ? 1 : -1, new IndexRange(fromDay * 96,
                (fromDay + days) * 96), s, e, days * 24.0, 1.0, List.of(), List.of("cause a", "cause b"))
                .decided("evidence", 1 - confidence, confidence);
    }

    static Verdict verdict(String unit, Finding f, Verdict.Decision d, boolean withId, long line) {
        return new Verdict(line, unit, f.mode(), f.kind(), f.start(), f.end(), withId ? FindingIds.of(unit, f) : "",
                d, "", "", "", null);
    }

    @Test
    void rejectedIsTakenOutConfirmedKeptOverlapsShownUnmatchedNamed() {
        Finding cluster = finding("cooling", "fault_cluster", 0, 10, 0.99);
        Finding band = finding("cooling", "out_of_band_high", 2, 1, 0.95);
        Finding hunting = finding("any", "mode_hunting", 20, 3, 0.5);
        Finding other = finding("cooling", "fault_cluster", 40, 5, 0.97);
        Map<String, List<Finding>> decided = new LinkedHashMap<>();
        decided.put(U1, List.of(cluster, band, hunting, other));
        decided.put(U2, List.of());
        // A re-run moved the band finding's start by half a day: the verdict still overlaps it (no id match needed).
        Verdict rejectBand = new Verdict(2, U1, "cooling", "out_of_band_high", band.start().minusSeconds(43_200),
                band.end().minusSeconds(43_200), "", Verdict.Decision.REJECTED, "", "", "", null);
        Verdict confirmHunting = verdict(U1, hunting, Verdict.Decision.CONFIRMED, true, 3);
        Verdict unsureCluster = verdict(U1, cluster, Verdict.Decision.NOT_SURE, true, 4);
        Verdict nowhere = new Verdict(5, U1, "heating", "fault_cluster", DAY, DAY.plusSeconds(3600), "",
                Verdict.Decision.REJECTED, "", "", "", null);
        Verdict otherUnit = verdict(U2, cluster, Verdict.Decision.CONFIRMED, false, 6);
        ReviewStep.Result r = ReviewStep.apply(decided, List.of(rejectBand, confirmHunting, unsureCluster, nowhere,
                otherUnit));
        ReviewStep.UnitReview u1 = r.units().get(U1);
        assertEquals(List.of(cluster, hunting, other), u1.findings(), "the rejected band finding is taken out");
        assertEquals(1, u1.suppressed().size());
        assertEquals(rejectBand, u1.suppressed().get(0).verdict());
        assertTrue(u1.confirmed(FindingIds.of(U1, hunting)));
        ReviewStep.Mark clusterMark = u1.mark(FindingIds.of(U1, cluster));
        assertEquals(Verdict.Decision.NOT_SURE, clusterMark.own().decision());
        assertEquals(List.of(rejectBand, nowhere), clusterMark.overlapping(), "the cooling cluster finding overlaps "
                + "the rejected band period and the heating verdict's hour: shown with both");
        assertNull(u1.mark(FindingIds.of(U1, other)).own());
        assertEquals("", u1.mark(FindingIds.of(U1, other)).status());
        assertEquals(List.of(rejectBand, confirmHunting, unsureCluster), r.applied());
        assertEquals(List.of(nowhere, otherUnit), r.unmatched().stream().map(ReviewStep.Unmatched::verdict).toList());
        assertEquals(1, r.suppressedCount());
        assertTrue(u1.notes().get(0).startsWith("1 finding(s) not listed"), u1.notes().toString());
        assertTrue(u1.notes().get(0).contains("line 2"), u1.notes().toString());
    }

    @Test
    void theVerdictNamingTheIdDecidesThenAConfirmation() {
        Finding f = finding("heating", "fault_cluster", 0, 4, 0.99);
        Verdict rejectById = verdict(U1, f, Verdict.Decision.REJECTED, true, 2);
        Verdict confirmByOverlap = new Verdict(3, U1, "heating", "fault_cluster", f.start().plusSeconds(3600),
                f.end(), "", Verdict.Decision.CONFIRMED, "", "", "", null);
        ReviewStep.Result byId = ReviewStep.apply(Map.of(U1, List.of(f)), List.of(confirmByOverlap, rejectById));
        assertTrue(byId.units().get(U1).findings().isEmpty(), "the id's own verdict (rejected) decides");
        ReviewStep.Result byOverlap = ReviewStep.apply(Map.of(U1, List.of(f)), List.of(confirmByOverlap,
                new Verdict(4, U1, "heating", "fault_cluster", f.start(), f.start().plusSeconds(60), "",
                        Verdict.Decision.REJECTED, "", "", "", null)));
        assertEquals(List.of(f), byOverlap.units().get(U1).findings(), "a confirmation beats a rejection");
        assertEquals(2, byOverlap.applied().size(), "both are the finding's own: applied");
    }

    @Test
    void withoutVerdictsNothingChanges() {
        Finding f = finding("cooling", "fault_cluster", 0, 4, 0.5);
        ReviewStep.Result r = ReviewStep.apply(Map.of(U1, List.of(f)), List.of());
        assertEquals(List.of(f), r.units().get(U1).findings());
        assertTrue(r.units().get(U1).marks().isEmpty());
        assertTrue(!r.any() && r.unmatched().isEmpty());
    }
}
