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
        double[] finite = Arrays.stream(values).filter(Double::isFinite).toArray();
        int n = finite.length;
        if (n == 0) {
            return Double.NaN;
        }
        // linearOfSorted(sorted, 0.5) without the sort: the same two order statistics and the same arithmetic.
        int k = (n - 1) / 2;
        select(finite, n, k);
        double lower = finite[k];
        double upper = k + 1 < n ? leastAfter(finite, n, k) : lower;
        return lower + ((n - 1) * 0.5 - k) * (upper - lower);
    }

    /**
     * The median of {@code v[0..n)} (the middle value, or the mean of the two middle values), reordering them: by
     * selection (Hoare, "Algorithm 65: FIND", CACM 4(7), 1961)
     * with a three-way partition, so that a series of many equal values (a valve at 0 %) stays linear, instead
     * of sorting. The same value as sorting gives, to the bit: both order by {@link Double#compare}. NaN for
     * {@code n == 0}.
     */
    public static double medianInPlace(double[] v, int n) {
        if (n == 0) {
            return Double.NaN;
        }
        int k = (n - 1) / 2;
        select(v, n, k);
        if (n % 2 == 1) {
            return v[k];
        }
        return 0.5 * (v[k] + leastAfter(v, n, k));
    }

    /** After {@link #select} put order statistic k at v[k], the next one: the least of v[k+1..n). */
    private static double leastAfter(double[] v, int n, int k) {
        double least = v[k + 1];
        for (int i = k + 2; i < n; i++) {
            if (Double.compare(v[i], least) < 0) {
                least = v[i];
            }
        }
        return least;
    }

    /** Reorders v[0..n) so that v[k] holds the value sorting would put there, smaller ones before, larger after. */
    private static void select(double[] v, int n, int k) {
        int lo = 0;
        int hi = n - 1;
        while (lo < hi) {
            double pivot = medianOfThree(v[lo], v[lo + (hi - lo) / 2], v[hi]);
            // Three-way partition: [lo, lt) < pivot, [lt, i) == pivot, (gt, hi] > pivot.
            int lt = lo;
            int gt = hi;
            int i = lo;
            while (i <= gt) {
                int c = Double.compare(v[i], pivot);
                if (c < 0) {
                    swap(v, lt++, i++);
                } else if (c > 0) {
                    swap(v, i, gt--);
                } else {
                    i++;
                }
            }
            if (k < lt) {
                hi = lt - 1;
            } else if (k > gt) {
                lo = gt + 1;
            } else {
                return;
            }
        }
    }

    private static double medianOfThree(double a, double b, double c) {
        if (Double.compare(a, b) > 0) {
            double t = a;
            a = b;
            b = t;
        }
        if (Double.compare(b, c) > 0) {
            b = c;
        }
        return Double.compare(a, b) > 0 ? a : b;
    }

    private static void swap(double[] v, int i, int j) {
        double t = v[i];
        v[i] = v[j];
        v[j] = t;
    }

    /** The finite values, sorted ascending. */
    public static double[] finiteSorted(double[] values) {
        double[] finite = Arrays.stream(values).filter(Double::isFinite).toArray();
        Arrays.sort(finite);
        return finite;
    }
}
