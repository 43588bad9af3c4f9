package org.tufa.analysis.significance;

/**
 * The scan statistic of a day series: the largest standardised sum over a run of consecutive values,
 * max over windows of sum(z) / sqrt(L) for window lengths L = 1..maxLength (the sum of L independent standard
 * normal values divided by sqrt(L) is standard normal again). Used on the day-by-day deviations of one unit from
 * its own normal days: a fault lasting days gives a large value, one odd day a small one. The scan over all
 * windows is what makes the maximum need a null of its own ({@link GumbelNull}): Glaz, Naus and Wallenstein, Scan
 * Statistics (2001), ch. 1.
 */
public final class ScanStatistic {

    /** Largest value a day contributes, in day-to-day spreads (common practice, no source). */
    public static final double CLIP = 6.0;

    private ScanStatistic() {
    }

    /**
     * @param z         values in order (NaN values break no window: they count as 0, an uninformative day)
     * @param from      first index (inclusive)
     * @param to        last index (exclusive)
     * @param maxLength longest window
     * @return the largest windowed statistic, or NaN when the range is empty
     */
    public static double max(double[] z, int from, int to, int maxLength) {
        if (maxLength < 1) {
            throw new IllegalArgumentException("window length must be at least 1");
        }
        double best = Double.NaN;
        for (int start = from; start < to; start++) {
            double sum = 0;
            for (int len = 1; len <= maxLength && start + len <= to; len++) {
                double v = z[start + len - 1];
                sum += Double.isNaN(v) ? 0 : Math.min(v, CLIP);
                double s = sum / Math.sqrt(len);
                if (Double.isNaN(best) || s > best) {
                    best = s;
                }
            }
        }
        return best;
    }

    /** {@link #max(double[], int, int, int)} over the whole series. */
    public static double max(double[] z, int maxLength) {
        return max(z, 0, z.length, maxLength);
    }
}
