package org.tufa.analysis.labels;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.Instant;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.review.Verdict;

/** The labels of samples from verdicts, findings and the normal reference: a worked example computed by hand. */
class SampleLabelsTest {

    static final String U = "https://example.org/unit/1";
    static final Instant T0 = Instant.parse("2031-07-01T00:00:00Z");

    static Instant at(int hour) {
        return T0.plusSeconds(3600L * hour);
    }

    static Verdict verdict(long line, String mode, int from, int to, Verdict.Decision d, String cause) {
        return new Verdict(line, U, mode, "fault_cluster", at(from), at(to), "", d, cause, "", "", null);
    }

    @Test
    void precedenceConfirmedRejectedNotSureFindingReferenceRest() {
        // Ten hourly samples; clusters: 0 normal reference, 1 regime in the reference, 2 candidate, -1 noise.
        Instant[] times = new Instant[10];
        for (int i = 0; i < 10; i++) {
            times[i] = at(i);
        }
        int[] cluster = {0, 0, 2, 2, 2, 1, -1, 2, 0, 0};
        List<Verdict> verdicts = List.of(
                verdict(2, "cooling", 2, 4, Verdict.Decision.CONFIRMED, "stuck valve"), // samples 2, 3
                verdict(3, "cooling", 3, 6, Verdict.Decision.REJECTED, ""), // 3 (confirmed wins), 4, 5
                verdict(4, "heating", 0, 10, Verdict.Decision.CONFIRMED, "other mode"), // no sample of cooling
                verdict(5, "any", 7, 8, Verdict.Decision.NOT_SURE, "")); // sample 7
        List<AnalysisFolder.Listed> findings = List.of(new AnalysisFolder.Listed(U, "cooling", "fault_cluster",
                at(8), at(9), List.of(), 0.99, "", "")); // sample 8
        SampleLabels.Labels l = SampleLabels.assign("cooling", times, cluster, Set.of(0, 1), verdicts, findings);
        assertEquals(List.of("normal", "normal", "fault", "fault", "normal", "normal", "unlabelled", "unlabelled",
                "unlabelled", "normal"), List.of(l.label()));
        assertEquals(List.of("detection", "detection", "review", "review", "review", "review", "none", "not_sure",
                "none", "detection"), List.of(l.source()));
        assertEquals(List.of("", "", "stuck valve", "stuck valve", "", "", "", "", "", ""), List.of(l.cause()));
        assertEquals(List.of(0L, 0L, 2L, 2L, 3L, 3L, 0L, 5L, 0L, 0L), java.util.Arrays.stream(l.verdictLine())
                .boxed().toList());
    }
}
