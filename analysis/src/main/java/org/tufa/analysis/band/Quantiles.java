package org.tufa.analysis.band;

import java.util.Arrays;

/**
 * Sample quantiles by linear interpolation between order statistics: definition 7 of Hyndman and Fan, "Sample
 * quantiles in statistical packages", The American Statistician 50(4):361-365 (1996), which is the default of
 * NumPy ({@code numpy.quantile(..., method="linear")}) and R ({@code quantile(type = 7)}).
 *
 * <p>For sorted x_1..x_n and probability p: h = (n - 1) p, Q(p) = x_floor(h) + (h - floor(h)) (x_floor(h)+1 -
 * x_floor(h)) with 0-based indices. NaN values are ignored.
 */
public final class Quantiles {

    private Quantiles() {
    }

    /** Type-7 quantiles of the finite values for each probability in [0, 1]; NaN for all if no finite value. */
    public static double[] linear(double[] values, double... probabilities) {
        double[] sorted = finiteSorted(values);
        double[] out = new double[probabilities.length];
        for (int i = 0; i < probabilities.length; i++) {
            out[i] = linearOfSorted(sorted, probabilities[i]);
        }
        return out;
    }

    /** Type-7 quantile of already sorted, finite values. */
    public static double linearOfSorted(double[] sorted, double p) {
        if (!(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException("probability must be in [0, 1]: " + p);
        }
        int n = sorted.length;
        if (n == 0) {
            return Double.NaN;
        }
        double h = (n - 1) * p;
        int lo = (int) Math.floor(h);
        int hi = Math.min(lo + 1, n - 1);
        double fraction = h - lo;
        return sorted[lo] + fraction * (sorted[hi] - sorted[lo]);
    }

    /** The median (type 7, i.e. the usual median) of the finite values. */
    public static double median(double[] values) {
        return linear(values, 0.5)[0];
    }

    /** The finite values, sorted ascending. */
    public static double[] finiteSorted(double[] values) {
        double[] finite = Arrays.stream(values).filter(Double::isFinite).toArray();
        Arrays.sort(finite);
        return finite;
    }
}
