package org.tufa.analysis.findings;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import org.tufa.analysis.features.FeatureMatrix;

/**
 * The normal operation of one unit in one mode, chosen among its OPTICS clusters: the group of clusters whose health
 * features agree with one another that covers the most days.
 *
 * <p>The published method takes the largest cluster as normal. On smoothed health features two things break that:
 * normal operation often splits into many small clusters that differ by a fraction of the sensor tolerance (one
 * per few days), and a fault that keeps the unit running around the clock (a failed fan) gives its days more
 * samples than normal days get. So clusters are merged first and counted in days second: two clusters agree when
 * the medians of every health feature differ by less than that feature's engineering gate; each cluster, as a
 * seed, gathers the clusters that agree with it; the seed whose group covers most days (each day of operation
 * weighs one, shared among its samples) is normal, and its group is the normal reference. Merging clusters whose
 * health features agree is the rule for "other regimes of normal operation": clusters that differ in load or
 * weather but not in how the unit behaves.
 *
 * @param labels         the clusters relabelled: 0 is the seed, then the other clusters of the reference, then the
 *                       rest, each part by decreasing days; noise stays -1
 * @param referenceCount clusters 0 .. referenceCount-1 form the reference
 * @param reference      per row: in the reference
 */
public record NormalReference(int[] labels, int referenceCount, boolean[] reference) {

    /**
     * @param f      the mode's feature rows (health columns are compared)
     * @param labels cluster label per row, -1 for noise
     * @param count  number of clusters
     * @param weight per row: its share of its day (1 / rows that day), so that each day weighs one
     * @param gates  per feature column: the engineering gate (only health columns are read)
     */
    public static NormalReference fit(FeatureMatrix f, int[] labels, int count, double[] weight, double[] gates) {
        if (count == 0) {
            return new NormalReference(labels.clone(), 0, new boolean[labels.length]);
        }
        double[] days = new double[count];
        int[] size = new int[count];
        for (int k = 0; k < labels.length; k++) {
            if (labels[k] >= 0) {
                days[labels[k]] += weight[k];
                size[labels[k]]++;
            }
        }
        double[][] median = new double[count][];
        for (int c = 0; c < count; c++) {
            median[c] = medians(f, labels, c);
        }
        boolean[][] agree = new boolean[count][count];
        for (int a = 0; a < count; a++) {
            for (int b = 0; b < count; b++) {
                agree[a][b] = agrees(f, median[a], median[b], gates);
            }
        }
        double[] gathered = new double[count];
        for (int c = 0; c < count; c++) {
            for (int d = 0; d < count; d++) {
                gathered[c] += agree[c][d] ? days[d] : 0;
            }
        }
        // The seed gathering most days; ties by more days of its own, more samples, the lower label.
        int seed = java.util.stream.IntStream.range(0, count).boxed()
                .min(Comparator.comparingDouble((Integer c) -> -gathered[c])
                        .thenComparingDouble(c -> -days[c]).thenComparingInt(c -> -size[c])
                        .thenComparingInt(c -> c))
                .orElseThrow();
        final int s = seed;
        List<Integer> order = new ArrayList<>();
        for (int c = 0; c < count; c++) {
            order.add(c);
        }
        Comparator<Integer> byDays = Comparator.comparingDouble((Integer c) -> -days[c]).thenComparingInt(c -> c);
        order.sort(Comparator.comparingInt((Integer c) -> c == s ? 0 : agree[s][c] ? 1 : 2).thenComparing(byDays));
        int[] newLabel = new int[count];
        int referenceCount = 0;
        for (int rank = 0; rank < count; rank++) {
            newLabel[order.get(rank)] = rank;
            referenceCount += agree[s][order.get(rank)] ? 1 : 0;
        }
        int[] out = new int[labels.length];
        boolean[] reference = new boolean[labels.length];
        for (int k = 0; k < labels.length; k++) {
            out[k] = labels[k] < 0 ? -1 : newLabel[labels[k]];
            reference[k] = out[k] >= 0 && out[k] < referenceCount;
        }
        return new NormalReference(out, referenceCount, reference);
    }

    private static boolean agrees(FeatureMatrix f, double[] a, double[] b, double[] gates) {
        for (int j = 0; j < f.width(); j++) {
            if (f.health()[j] && !(Math.abs(a[j] - b[j]) < gates[j])) {
                return false;
            }
        }
        return true;
    }

    private static double[] medians(FeatureMatrix f, int[] labels, int cluster) {
        double[] out = new double[f.width()];
        double[] v = new double[labels.length];
        for (int j = 0; j < f.width(); j++) {
            int n = 0;
            for (int k = 0; k < labels.length; k++) {
                if (labels[k] == cluster) {
                    v[n++] = f.rows()[k][j];
                }
            }
            Arrays.sort(v, 0, n);
            out[j] = n == 0 ? Double.NaN : n % 2 == 1 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
        }
        return out;
    }

    /** Rows in the reference. */
    @Override
    public boolean[] reference() {
        return reference.clone();
    }

    @Override
    public int[] labels() {
        return labels.clone();
    }
}
