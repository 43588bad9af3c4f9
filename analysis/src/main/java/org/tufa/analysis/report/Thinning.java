package org.tufa.analysis.report;

import java.util.Arrays;

/**
 * Reductions for display only (the analysis always uses every sample): block means for time-series strips, a
 * deterministic, cluster-aware subset of points for scatter plots, and column maxima for reachability plots. Pure
 * functions.
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

    /**
     * Bars of a reachability plot: bar k spans ordering positions [x[k] - width / 2, x[k] + width / 2) and has the
     * given height and cluster label. All bars share the width; a short last column reaches past the last position
     * (the chart's axis ends there).
     */
    record Bars(double[] x, double[] height, int[] label, double width) {
        int size() {
            return x.length;
        }
    }

    /**
     * A reachability plot in at most {@code maxColumns} columns of equal width (consecutive ordering positions), one
     * bar per cluster label present in a column, as tall as that label's largest reachability there. Bars rise from
     * zero, so at this resolution the tallest bar of a column is all the full plot shows of it: the outline of
     * peaks and valleys is kept exactly, only bars hidden behind taller neighbours are dropped. Up to maxColumns
     * samples every sample keeps its own bar. Undefined (infinite) reachabilities stay infinite.
     *
     * @param plot   reachability in ordering order
     * @param labels cluster label in ordering order (-1 noise)
     */
    static Bars reachabilityColumns(double[] plot, int[] labels, int maxColumns) {
        if (maxColumns < 1) {
            throw new IllegalArgumentException("maxColumns must be at least 1: " + maxColumns);
        }
        int n = plot.length;
        int width = Math.max(1, (n + maxColumns - 1) / maxColumns);
        int lo = Arrays.stream(labels).min().orElse(0);
        int hi = Arrays.stream(labels).max().orElse(0);
        double[] tallest = new double[hi - lo + 1];
        Arrays.fill(tallest, Double.NaN);
        double[] x = new double[n];
        double[] height = new double[n];
        int[] label = new int[n];
        int bars = 0;
        for (int from = 0; from < n; from += width) {
            int to = Math.min(n, from + width);
            for (int i = from; i < to; i++) {
                int g = labels[i] - lo;
                tallest[g] = Double.isNaN(tallest[g]) ? plot[i] : Math.max(tallest[g], plot[i]);
            }
            for (int g = 0; g < tallest.length; g++) {
                if (!Double.isNaN(tallest[g])) {
                    x[bars] = from + (width - 1) / 2.0;
                    height[bars] = tallest[g];
                    label[bars++] = g + lo;
                    tallest[g] = Double.NaN;
                }
            }
        }
        return new Bars(Arrays.copyOf(x, bars), Arrays.copyOf(height, bars), Arrays.copyOf(label, bars), width);
    }
}
