package org.tufa.analysis.significance;

import java.util.Arrays;
import java.util.Comparator;
import java.util.stream.IntStream;

/**
 * False-discovery-rate control over many tests: the step-up procedure of Benjamini and Hochberg, "Controlling the
 * false discovery rate: a practical and powerful approach to multiple testing", Journal of the Royal Statistical
 * Society B 57(1):289-300 (1995). With the m p-values sorted, p(1) <= ... <= p(m), the hypotheses of the k smallest
 * are rejected for the largest k with p(k) <= k q / m; the expected share of false rejections among all rejections
 * is then at most q (for independent or positively dependent tests).
 *
 * <p>{@link #adjust} gives each test the smallest q at which it would be rejected (the BH-adjusted p-value, or
 * q-value): q_(k) = min over j >= k of min(1, m p(j) / j), the same numbers as statsmodels'
 * {@code multipletests(method="fdr_bh")} and R's {@code p.adjust(method="BH")}.
 */
public final class BenjaminiHochberg {

    private BenjaminiHochberg() {
    }

    /**
     * @param p p-values in [0, 1] (NaN not allowed)
     * @return the adjusted p-values, in the order of {@code p}
     */
    public static double[] adjust(double[] p) {
        int m = p.length;
        for (double v : p) {
            if (!(v >= 0 && v <= 1)) {
                throw new IllegalArgumentException("p-values must lie in [0, 1], got " + v);
            }
        }
        // Ties keep their input order, so the result does not depend on sorting details.
        Integer[] order = IntStream.range(0, m).boxed().toArray(Integer[]::new);
        Arrays.sort(order, Comparator.comparingDouble((Integer i) -> p[i]).thenComparingInt(i -> i));
        double[] q = new double[m];
        double running = 1.0;
        for (int rank = m; rank >= 1; rank--) {
            int i = order[rank - 1];
            running = Math.min(running, Math.min(1.0, p[i] * m / rank));
            q[i] = running;
        }
        return q;
    }

    /** Which hypotheses the procedure rejects at false-discovery rate {@code q}. */
    public static boolean[] reject(double[] p, double q) {
        double[] adjusted = adjust(p);
        boolean[] out = new boolean[p.length];
        for (int i = 0; i < p.length; i++) {
            out[i] = adjusted[i] <= q;
        }
        return out;
    }
}
