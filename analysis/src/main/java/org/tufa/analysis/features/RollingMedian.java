package org.tufa.analysis.features;

import java.util.Arrays;

/**
 * A centred rolling median over a regular grid, skipping missing samples. It keeps a level shift that lasts (a
 * fault) and removes what lasts one or two samples (a spike, a transient after a valve move): the temporal
 * persistence a fault signature needs (Tukey, Exploratory Data Analysis, 1977, running medians).
 */
public final class RollingMedian {

    private RollingMedian() {
    }

    /**
     * @param values     one value per grid sample, NaN where missing
     * @param halfWindow samples on each side
     * @return the median of the valid values in each window, NaN where fewer than {@code halfWindow + 1} are valid
     */
    public static double[] of(double[] values, int halfWindow) {
        int n = values.length;
        double[] out = new double[n];
        double[] window = new double[2 * halfWindow + 1];
        for (int i = 0; i < n; i++) {
            if (Double.isNaN(values[i])) {
                out[i] = Double.NaN;
                continue;
            }
            int k = 0;
            for (int j = Math.max(0, i - halfWindow); j <= Math.min(n - 1, i + halfWindow); j++) {
                if (!Double.isNaN(values[j])) {
                    window[k++] = values[j];
                }
            }
            if (k < halfWindow + 1) {
                out[i] = Double.NaN;
                continue;
            }
            Arrays.sort(window, 0, k);
            out[i] = k % 2 == 1 ? window[k / 2] : 0.5 * (window[k / 2 - 1] + window[k / 2]);
        }
        return out;
    }
}
