package org.tufa.analysis.cluster;

import java.util.Arrays;

/**
 * The k nearest neighbours of every sample, on the k-d tree and neighbour lists of the OPTICS pass
 * ({@link PointTree}, {@link NeighbourLists}), so runs of equal samples (smoothed operating data holds many) cost
 * one search per distinct point. Euclidean distance; equal distances go to the lower sample index.
 */
final class KnnGraph {

    private KnnGraph() {
    }

    /**
     * Per sample the k - 1 nearest other samples, nearest first: its k nearest with itself counted first, as
     * scikit-learn's {@code kneighbors_graph} of a fitted set counts it. Needs 1 <= k <= n.
     */
    static int[][] others(double[][] x, int k) {
        int n = x.length;
        int dim = x[0].length;
        double[] flat = new double[n * dim];
        for (int i = 0; i < n; i++) {
            System.arraycopy(x[i], 0, flat, i * dim, dim);
        }
        PointTree tree = new PointTree(flat, n, dim);
        NeighbourLists lists = NeighbourLists.build(tree, k, k, Double.POSITIVE_INFINITY);
        int[][] out = new int[n][];
        int want = k - 1;
        double[] candSquared = new double[16];
        int[] candIndex = new int[16];
        for (int s = 0; s < n; s++) {
            int pos = tree.positionOf[s];
            int count = 0;
            for (int e = lists.start[pos]; e < lists.start[pos + 1]; e++) {
                int p = lists.entries[e];
                double sq = 0;
                for (int d = 0; d < dim; d++) {
                    double diff = flat[s * dim + d] - tree.coords[p * dim + d];
                    sq += diff * diff;
                }
                int taken = 0;
                // Members of one position are equally far: only the lowest-indexed ones can be among the nearest.
                for (int m = tree.memberStart[p]; m < tree.memberStart[p + 1] && taken < want; m++) {
                    int member = tree.members[m];
                    if (member == s) {
                        continue;
                    }
                    if (count == candIndex.length) {
                        candIndex = Arrays.copyOf(candIndex, count * 2);
                        candSquared = Arrays.copyOf(candSquared, count * 2);
                    }
                    candIndex[count] = member;
                    candSquared[count++] = sq;
                    taken++;
                }
            }
            Integer[] order = new Integer[count];
            for (int i = 0; i < count; i++) {
                order[i] = i;
            }
            final double[] cs = candSquared;
            final int[] ci = candIndex;
            Arrays.sort(order, (a, b) -> cs[a] != cs[b] ? Double.compare(cs[a], cs[b]) : Integer.compare(ci[a], ci[b]));
            int[] row = new int[Math.min(want, count)];
            for (int i = 0; i < row.length; i++) {
                row[i] = candIndex[order[i]];
            }
            out[s] = row;
        }
        return out;
    }
}
