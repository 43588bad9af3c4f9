package org.tufa.analysis.features;

import java.util.Arrays;

/**
 * A centred rolling median over a series, skipping missing samples. It keeps a level shift that lasts (a
 * fault) and removes what lasts one or two samples (a spike, a transient after a valve move): the temporal
 * persistence a fault signature needs (Tukey, Exploratory Data Analysis, 1977, running medians).
 */
public final class RollingMedian {

    private RollingMedian() {
    }

    /**
     * @param values     a series (one value per grid sample, or per sample of one mode), NaN where missing
     * @param halfWindow samples on each side
     * @return the median of the valid values in each window, NaN where fewer than {@code halfWindow + 1} are valid
     */
    public static double[] of(double[] values, int halfWindow) {
        // The window's valid values are kept sorted as it slides: one value leaves and one comes in per sample,
        // each placed by binary search, instead of sorting the whole window again at every sample. The sorted
        // window is the same array Arrays.sort would give (both order by Double.compare), so the medians are the
        // same to the bit.
        int n = values.length;
        double[] out = new double[n];
        double[] sorted = new double[2 * halfWindow + 1];
        int k = 0;
        int lo = 0;
        int hi = -1;
        for (int i = 0; i < n; i++) {
            int newLo = Math.max(0, i - halfWindow);
            int newHi = Math.min(n - 1, i + halfWindow);
            for (; lo < newLo; lo++) {
                if (!Double.isNaN(values[lo])) {
                    int at = Arrays.binarySearch(sorted, 0, k, values[lo]);
                    System.arraycopy(sorted, at + 1, sorted, at, k - at - 1);
                    k--;
                }
            }
            while (hi < newHi) {
                hi++;
                if (!Double.isNaN(values[hi])) {
                    int at = Arrays.binarySearch(sorted, 0, k, values[hi]);
                    int insert = at >= 0 ? at : -at - 1;
                    System.arraycopy(sorted, insert, sorted, insert + 1, k - insert);
                    sorted[insert] = values[hi];
                    k++;
                }
            }
            if (Double.isNaN(values[i]) || k < halfWindow + 1) {
                out[i] = Double.NaN;
                continue;
            }
            out[i] = k % 2 == 1 ? sorted[k / 2] : 0.5 * (sorted[k / 2 - 1] + sorted[k / 2]);
        }
        return out;
    }
}
