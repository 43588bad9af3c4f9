package org.tufa.analysis.cluster;

/**
 * A small k-d tree (Bentley, "Multidimensional binary search trees used for associative searching",
 * Communications of the ACM 18(9), 1975) over a flat row-major coordinate array, for the k-nearest-neighbour
 * and fixed-radius queries of {@link ReferenceOptics}, the pass the new {@link Optics} is tested against.
 *
 * <p>Everything is primitive arrays: a permutation of the sample indices, and per node the index range, split
 * dimension and split value. Leaves hold up to {@link #LEAF_SIZE} points. Distances use exactly the formula of
 * {@link Optics#distance}, sqrt of the sum of squared coordinate differences taken in dimension order, so a value
 * found here is bit-identical to the same distance computed anywhere else in the package.
 *
 * <p>Not thread-safe for queries (it owns a scratch heap); one tree per {@code ReferenceOptics.fit} call.
 */
final class KdTree {

    static final int LEAF_SIZE = 16;

    private final double[] data;
    private final int dim;
    private final int[] perm;
    // Node arrays; children of node i are 2i+1 and 2i+2 (a balanced implicit tree).
    private final int[] nodeLo;
    private final int[] nodeHi;
    private final int[] splitDim;
    private final double[] splitValue;
    private final boolean[] leaf;

    // k-NN scratch: a max-heap of squared distances, reused between queries.
    private double[] heap = new double[0];
    private int heapSize;

    KdTree(double[] data, int n, int dim) {
        this.data = data;
        this.dim = dim;
        this.perm = new int[n];
        for (int i = 0; i < n; i++) {
            perm[i] = i;
        }
        int leaves = 1;
        while ((long) leaves * LEAF_SIZE < n) {
            leaves <<= 1;
        }
        int nodes = 2 * leaves - 1;
        nodeLo = new int[nodes];
        nodeHi = new int[nodes];
        splitDim = new int[nodes];
        splitValue = new double[nodes];
        leaf = new boolean[nodes];
        build(0, 0, n);
    }

    private void build(int node, int lo, int hi) {
        nodeLo[node] = lo;
        nodeHi[node] = hi;
        if (hi - lo <= LEAF_SIZE || 2 * node + 2 >= leaf.length) {
            leaf[node] = true;
            return;
        }
        // Split on the dimension of largest spread, at the median.
        int best = 0;
        double bestSpread = -1;
        for (int d = 0; d < dim; d++) {
            double min = Double.POSITIVE_INFINITY;
            double max = Double.NEGATIVE_INFINITY;
            for (int i = lo; i < hi; i++) {
                double v = data[perm[i] * dim + d];
                if (v < min) {
                    min = v;
                }
                if (v > max) {
                    max = v;
                }
            }
            if (max - min > bestSpread) {
                bestSpread = max - min;
                best = d;
            }
        }
        int mid = (lo + hi) >>> 1;
        select(lo, hi - 1, mid, best);
        splitDim[node] = best;
        splitValue[node] = data[perm[mid] * dim + best];
        build(2 * node + 1, lo, mid);
        build(2 * node + 2, mid, hi);
    }

    /** Quickselect: afterwards perm[lo..k) <= perm[k] <= perm(k..hi] in coordinate d. */
    private void select(int lo, int hi, int k, int d) {
        while (hi > lo) {
            double pivot = data[perm[(lo + hi) >>> 1] * dim + d];
            int i = lo;
            int j = hi;
            while (i <= j) {
                while (data[perm[i] * dim + d] < pivot) {
                    i++;
                }
                while (data[perm[j] * dim + d] > pivot) {
                    j--;
                }
                if (i <= j) {
                    int t = perm[i];
                    perm[i] = perm[j];
                    perm[j] = t;
                    i++;
                    j--;
                }
            }
            if (k <= j) {
                hi = j;
            } else if (k >= i) {
                lo = i;
            } else {
                return;
            }
        }
    }

    /**
     * The k-th smallest squared distance from sample {@code q} to all samples, q itself included (so k = 1
     * gives 0). Squared distances are compared because sqrt is monotone; the caller takes sqrt of the result,
     * which equals the k-th smallest distance exactly.
     */
    double kthSquaredDistance(int q, int k) {
        if (heap.length < k) {
            heap = new double[k];
        }
        heapSize = 0;
        knn(0, q, k);
        return heap[0];
    }

    private void knn(int node, int q, int k) {
        if (leaf[node]) {
            int qo = q * dim;
            for (int i = nodeLo[node], hi = nodeHi[node]; i < hi; i++) {
                int po = perm[i] * dim;
                double sum = 0.0;
                for (int d = 0; d < dim; d++) {
                    double diff = data[qo + d] - data[po + d];
                    sum += diff * diff;
                }
                offer(sum, k);
            }
            return;
        }
        double diff = data[q * dim + splitDim[node]] - splitValue[node];
        int near = diff < 0 ? 2 * node + 1 : 2 * node + 2;
        int far = diff < 0 ? 2 * node + 2 : 2 * node + 1;
        knn(near, q, k);
        // Every point on the far side differs by at least |diff| in this coordinate. Rounding of the squared
        // sums can only shrink a true distance by a few ulps, so the margin keeps the pruning exact.
        if (heapSize < k || diff * diff <= heap[0] * (1 + 1e-12)) {
            knn(far, q, k);
        }
    }

    private void offer(double v, int k) {
        if (heapSize < k) {
            int i = heapSize++;
            heap[i] = v;
            while (i > 0) {
                int parent = (i - 1) >>> 1;
                if (heap[parent] >= heap[i]) {
                    break;
                }
                double t = heap[parent];
                heap[parent] = heap[i];
                heap[i] = t;
                i = parent;
            }
        } else if (v < heap[0]) {
            heap[0] = v;
            int i = 0;
            while (true) {
                int l = 2 * i + 1;
                if (l >= heapSize) {
                    break;
                }
                int r = l + 1;
                int c = r < heapSize && heap[r] > heap[l] ? r : l;
                if (heap[c] <= heap[i]) {
                    break;
                }
                double t = heap[c];
                heap[c] = heap[i];
                heap[i] = t;
                i = c;
            }
        }
    }

    /**
     * Calls {@code visitor} for every sample p with distance(q, p) <= eps (q itself included), passing p and
     * the exact distance.
     */
    void radius(int q, double eps, NeighbourVisitor visitor) {
        radius(0, q, eps, visitor);
    }

    private void radius(int node, int q, double eps, NeighbourVisitor visitor) {
        if (leaf[node]) {
            for (int i = nodeLo[node], hi = nodeHi[node]; i < hi; i++) {
                int p = perm[i];
                double d = Optics.distance(data, dim, q, p);
                if (d <= eps) {
                    visitor.visit(p, d);
                }
            }
            return;
        }
        double diff = data[q * dim + splitDim[node]] - splitValue[node];
        int near = diff < 0 ? 2 * node + 1 : 2 * node + 2;
        int far = diff < 0 ? 2 * node + 2 : 2 * node + 1;
        radius(near, q, eps, visitor);
        if (Math.abs(diff) <= eps * (1 + 1e-12)) {
            radius(far, q, eps, visitor);
        }
    }

    /** Receives the neighbours of a radius query. */
    interface NeighbourVisitor {
        void visit(int sample, double distance);
    }
}
