package org.tufa.analysis.cluster;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;

/** Test helpers: label comparison and the exact replay of an OPTICS ordering. */
final class ClusterChecks {

    private ClusterChecks() {}

    /**
     * Adjusted Rand index, Hubert &amp; Arabie, "Comparing partitions", Journal of Classification 2(1), 1985,
     * pp. 193-218: (index - expected) / (max - expected) over the pair counts of the contingency table. Every
     * label, -1 included, is one class (as scikit-learn's adjusted_rand_score).
     */
    static double adjustedRand(int[] a, int[] b) {
        int n = a.length;
        Map<Long, Integer> cells = new HashMap<>();
        Map<Integer, Integer> rowsA = new HashMap<>();
        Map<Integer, Integer> colsB = new HashMap<>();
        for (int i = 0; i < n; i++) {
            cells.merge(((long) a[i] << 32) ^ (b[i] & 0xffffffffL), 1, Integer::sum);
            rowsA.merge(a[i], 1, Integer::sum);
            colsB.merge(b[i], 1, Integer::sum);
        }
        double index = cells.values().stream().mapToDouble(ClusterChecks::pairs).sum();
        double sumA = rowsA.values().stream().mapToDouble(ClusterChecks::pairs).sum();
        double sumB = colsB.values().stream().mapToDouble(ClusterChecks::pairs).sum();
        double expected = sumA * sumB / pairs(n);
        double max = (sumA + sumB) / 2;
        if (max == expected) {
            return 1.0; // both partitions trivial and equal in structure
        }
        return (index - expected) / (max - expected);
    }

    private static double pairs(int k) {
        return k * (k - 1) / 2.0;
    }

    /** True when the labellings are identical up to renaming, noise (-1) mapped to noise. */
    static boolean sameUpToRenaming(int[] a, int[] b) {
        if (a.length != b.length) {
            return false;
        }
        Map<Integer, Integer> ab = new HashMap<>();
        Map<Integer, Integer> ba = new HashMap<>();
        for (int i = 0; i < a.length; i++) {
            if ((a[i] == -1) != (b[i] == -1)) {
                return false;
            }
            Integer seenB = ab.putIfAbsent(a[i], b[i]);
            Integer seenA = ba.putIfAbsent(b[i], a[i]);
            if ((seenB != null && seenB != b[i]) || (seenA != null && seenA != a[i])) {
                return false;
            }
        }
        return true;
    }

    /**
     * Replays an ordering with exact distances ({@link Optics#distance}): every chosen point must have the minimal
     * current reachability among the unprocessed (within tol), its reported reachability must equal the replayed
     * one (within tol), and the core distances must be the exact MinPts-th neighbour distances (brute force).
     */
    static void assertValidOrdering(double[][] x, OpticsResult r, double tol) {
        int n = x.length;
        int dim = x[0].length;
        double[] flat = new double[n * dim];
        for (int i = 0; i < n; i++) {
            System.arraycopy(x[i], 0, flat, i * dim, dim);
        }
        double[] core = new double[n];
        double[] row = new double[n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                row[j] = Optics.distance(flat, dim, i, j);
            }
            Arrays.sort(row);
            core[i] = row[r.minPts() - 1] <= r.maxEps() ? row[r.minPts() - 1] : Double.POSITIVE_INFINITY;
            assertEquals(core[i], r.coreDistanceOf(i), tol, "core distance of sample " + i);
        }
        double[] reach = new double[n];
        Arrays.fill(reach, Double.POSITIVE_INFINITY);
        boolean[] done = new boolean[n];
        for (int step = 0; step < n; step++) {
            int p = r.sampleAt(step);
            double min = Double.POSITIVE_INFINITY;
            for (int j = 0; j < n; j++) {
                if (!done[j]) {
                    min = Math.min(min, reach[j]);
                }
            }
            assertTrue(!done[p], "sample " + p + " processed twice");
            if (min == Double.POSITIVE_INFINITY) {
                assertEquals(Double.POSITIVE_INFINITY, reach[p], "step " + step);
            } else {
                assertTrue(reach[p] <= min + tol, "step " + step + ": chose " + p + " at " + reach[p]
                        + " while the minimum is " + min);
                assertEquals(reach[p], r.reachabilityOf(p), tol, "reachability of sample " + p);
            }
            done[p] = true;
            if (core[p] != Double.POSITIVE_INFINITY) {
                for (int j = 0; j < n; j++) {
                    double d = Optics.distance(flat, dim, p, j);
                    if (!done[j] && d <= r.maxEps()) {
                        reach[j] = Math.min(reach[j], Math.max(core[p], d));
                    }
                }
            }
        }
    }
}
