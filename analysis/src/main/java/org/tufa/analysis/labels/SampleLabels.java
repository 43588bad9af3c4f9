package org.tufa.analysis.labels;

import java.time.Instant;
import java.util.List;
import java.util.Set;
import org.tufa.analysis.review.Verdict;

/**
 * The label of each clustered sample of one unit's mode, from the analyst's verdicts and the detection's normal
 * reference. Pure. A verdict covers the samples of its unit whose start lies in its period, in its mode (a verdict
 * of mode "any" covers every mode). In order of precedence:
 * <ol>
 *   <li>a confirmed verdict: {@code fault}, with the verdict's cause, source {@code review};</li>
 *   <li>a rejected verdict: {@code normal}, source {@code review} (the analyst called the period normal);</li>
 *   <li>a not-sure verdict, or a listed finding without a verdict: {@code unlabelled} (source {@code not_sure} or
 *       {@code none}: nobody has decided);</li>
 *   <li>a sample of the mode's normal reference (the largest cluster and the regimes that agree with it): {@code
 *       normal}, source {@code detection} (the unsupervised detection's, not a person's);</li>
 *   <li>anything else (noise, candidate clusters without a finding): {@code unlabelled}.</li>
 * </ol>
 */
public final class SampleLabels {

    public static final String NORMAL = "normal";
    public static final String FAULT = "fault";
    public static final String UNLABELLED = "unlabelled";

    public static final String REVIEW = "review";
    public static final String DETECTION = "detection";
    public static final String SPREADING = "spreading";
    public static final String NOT_SURE = "not_sure";
    public static final String NONE = "none";

    /** A confirmed verdict without a cause gets this one. */
    public static final String NO_CAUSE = "cause not given";

    /**
     * Per sample: label, cause (empty unless fault), source, and the review-file line of the verdict that gave it
     * (0 when none).
     */
    public record Labels(String[] label, String[] cause, String[] source, long[] verdictLine) {
        public int size() {
            return label.length;
        }
    }

    private SampleLabels() {
    }

    /**
     * @param mode           the samples' mode
     * @param times          each sample's start
     * @param cluster        each sample's cluster
     * @param normalClusters the normal reference's clusters
     * @param verdicts       the unit's verdicts
     * @param findings       the unit's listed findings
     */
    public static Labels assign(String mode, Instant[] times, int[] cluster, Set<Integer> normalClusters,
                                List<Verdict> verdicts, List<AnalysisFolder.Listed> findings) {
        int n = times.length;
        String[] label = new String[n];
        String[] cause = new String[n];
        String[] source = new String[n];
        long[] line = new long[n];
        for (int i = 0; i < n; i++) {
            Instant t = times[i];
            Verdict confirmed = null;
            Verdict rejected = null;
            Verdict unsure = null;
            for (Verdict v : verdicts) {
                if (!(v.mode().equals(mode) || v.mode().equals("any")) || t.isBefore(v.start()) || !t.isBefore(v.end())) {
                    continue;
                }
                switch (v.decision()) {
                    case CONFIRMED -> confirmed = confirmed == null ? v : confirmed;
                    case REJECTED -> rejected = rejected == null ? v : rejected;
                    default -> unsure = unsure == null ? v : unsure;
                }
            }
            boolean inFinding = false;
            for (AnalysisFolder.Listed f : findings) {
                if ((f.mode().equals(mode) || f.mode().equals("any")) && !t.isBefore(f.start()) && t.isBefore(f.end())) {
                    inFinding = true;
                    break;
                }
            }
            cause[i] = "";
            if (confirmed != null) {
                set(label, source, line, i, FAULT, REVIEW, confirmed.line());
                cause[i] = confirmed.cause().isEmpty() ? NO_CAUSE : confirmed.cause();
            } else if (rejected != null) {
                set(label, source, line, i, NORMAL, REVIEW, rejected.line());
            } else if (unsure != null) {
                set(label, source, line, i, UNLABELLED, NOT_SURE, unsure.line());
            } else if (inFinding) {
                set(label, source, line, i, UNLABELLED, NONE, 0);
            } else if (normalClusters.contains(cluster[i])) {
                set(label, source, line, i, NORMAL, DETECTION, 0);
            } else {
                set(label, source, line, i, UNLABELLED, NONE, 0);
            }
        }
        return new Labels(label, cause, source, line);
    }

    private static void set(String[] label, String[] source, long[] line, int i, String l, String s, long at) {
        label[i] = l;
        source[i] = s;
        line[i] = at;
    }
}
