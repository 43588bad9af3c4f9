package org.tufa.analysis.report;

import java.util.Arrays;

/**
 * Reductions for display only (the analysis always uses every sample): block means for time-series strips and a
 * deterministic, cluster-aware subset of points for scatter plots. Pure functions.
 */
final class Thinning {

    private Thinning() {
    }

    /**
     * Means of consecutive blocks of {@code factor} samples, ignoring NaN; a block without any value is NaN. The
     * last block may be shorter.
     */
    static double[] blockMeans(double[] values, int factor) {
        if (factor < 1) {
            throw new IllegalArgumentException("factor must be at least 1: " + factor);
        }
        int blocks = (values.length + factor - 1) / factor;
        double[] out = new double[blocks];
        for (int b = 0; b < blocks; b++) {
            double sum = 0;
            int count = 0;
            for (int i = b * factor; i < Math.min(values.length, (b + 1) * factor); i++) {
                if (!Double.isNaN(values[i])) {
                    sum += values[i];
                    count++;
                }
            }
            out[b] = count == 0 ? Double.NaN : sum / count;
        }
        return out;
    }

    /**
     * Indices of at most about {@code max} points, chosen deterministically: every label keeps a share of the
     * budget proportional to its size but at least {@code min(size, max / 10)}, so a small fault cluster is never
     * thinned away; inside a label, points are taken at an even stride in index order. Ascending.
     */
    static int[] subset(int[] labels, int max) {
        int n = labels.length;
        if (n <= max) {
            int[] all = new int[n];
            Arrays.setAll(all, i -> i);
            return all;
        }
        int lo = Arrays.stream(labels).min().orElse(0);
        int hi = Arrays.stream(labels).max().orElse(0);
        int[] size = new int[hi - lo + 1];
        for (int l : labels) {
            size[l - lo]++;
        }
        int[] seen = new int[size.length];
        double[] stride = new double[size.length];
        for (int g = 0; g < size.length; g++) {
            if (size[g] > 0) {
                int quota = Math.min(size[g], Math.max((int) ((long) max * size[g] / n), max / 10));
                stride[g] = (double) size[g] / quota;
            }
        }
        int[] out = new int[n];
        int m = 0;
        double[] next = new double[size.length];
        for (int i = 0; i < n; i++) {
            int g = labels[i] - lo;
            if (seen[g] >= next[g]) {
                out[m++] = i;
                next[g] += stride[g];
            }
            seen[g]++;
        }
        return Arrays.copyOf(out, m);
    }
}
