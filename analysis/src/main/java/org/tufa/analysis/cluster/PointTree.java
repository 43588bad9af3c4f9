package org.tufa.analysis.cluster;

import java.util.Arrays;

/**
 * The samples of one {@link Optics} fit in a k-d tree (Bentley, "Multidimensional binary search trees used for
 * associative searching", Communications of the ACM 18(9), 1975), with the bookkeeping of which samples the ordering
 * has not processed yet.
 *
 * <p><b>Distinct points.</b> Samples with equal coordinates (smoothed operating data has long runs of them) are
 * stored once, as a distinct point with its members, the sample indices in ascending order. Equal coordinates give
 * equal distances to everything, so the members are interchangeable for OPTICS except for their indices. The tree
 * holds the distinct points ("positions", in tree order); coordinates are copied into one flat array in that order so
 * that a leaf is contiguous memory. A value of -0.0 and 0.0 count as equal: they give the same squared differences.
 *
 * <p><b>Unprocessed state.</b> Per position, a cursor to its next unprocessed member; per node, the smallest
 * unprocessed sample index below it ({@link #NONE} when none) and the bounding box of the positions that still have
 * unprocessed members (empty boxes are never read: nodes without unprocessed samples are skipped first). Processing
 * a sample updates one leaf and the path to the root, stopping where nothing changes.
 *
 * <p><b>Exactness.</b> Every distance is {@link Optics#distance}'s formula: the square root of the sum, in dimension
 * order, of squared coordinate differences. A box bound uses the same sequence of operations on the per-dimension
 * gap between a point and a box (0 inside), and each floating-point step is monotone (a larger exact argument never
 * gives a smaller rounded result), so the computed bound never exceeds the computed distance to any point in the box.
 * Pruning on it is exact, with no safety margin.
 *
 * <p>Not thread-safe; one tree per fit.
 */
final class PointTree {

    /** Largest number of positions in a leaf. */
    static final int LEAF_SIZE = 8;
    /** No sample: larger than every sample index. */
    static final int NONE = Integer.MAX_VALUE;

    final int dim;
    /** Number of samples. */
    final int samples;
    /** Number of distinct points (positions). */
    final int size;
    /** Coordinates of position i at {@code coords[i * dim .. i * dim + dim - 1]}. */
    final double[] coords;
    /** Members of position i: {@code members[memberStart[i] .. memberStart[i + 1] - 1]}, ascending. */
    final int[] memberStart;
    final int[] members;
    /** Position of each sample. */
    final int[] positionOf;
    private final int[] cursor;

    /** Nodes of an implicit balanced tree: the children of node k are 2k + 1 and 2k + 2. */
    final int nodeCount;
    final int[] lo;
    final int[] hi;
    final boolean[] leaf;
    /** Bounding boxes of all positions below a node (for the neighbour lists). */
    final double[] boxLo;
    final double[] boxHi;
    private final double[] liveLo;
    private final double[] liveHi;
    private final int[] firstUnprocessed;
    final int[] leafOf;

    PointTree(double[] data, int n, int dim) {
        this.dim = dim;
        this.samples = n;
        int[] idOf = new int[n];
        int[] firstSample = new int[n];
        int distinct = distinctPoints(data, n, dim, idOf, firstSample);
        this.size = distinct;
        double[] byId = new double[distinct * dim];
        for (int id = 0; id < distinct; id++) {
            System.arraycopy(data, firstSample[id] * dim, byId, id * dim, dim);
        }
        int leaves = 1;
        while ((long) leaves * LEAF_SIZE < distinct) {
            leaves <<= 1;
        }
        nodeCount = 2 * leaves - 1;
        lo = new int[nodeCount];
        hi = new int[nodeCount];
        leaf = new boolean[nodeCount];
        boxLo = new double[nodeCount * dim];
        boxHi = new double[nodeCount * dim];
        leafOf = new int[distinct];
        int[] idAt = new int[distinct];
        for (int i = 0; i < distinct; i++) {
            idAt[i] = i;
        }
        build(byId, idAt, 0, 0, distinct);
        coords = new double[distinct * dim];
        int[] positionOfId = new int[distinct];
        for (int pos = 0; pos < distinct; pos++) {
            System.arraycopy(byId, idAt[pos] * dim, coords, pos * dim, dim);
            positionOfId[idAt[pos]] = pos;
        }
        memberStart = new int[distinct + 1];
        for (int i = 0; i < n; i++) {
            memberStart[positionOfId[idOf[i]] + 1]++;
        }
        for (int pos = 0; pos < distinct; pos++) {
            memberStart[pos + 1] += memberStart[pos];
        }
        members = new int[n];
        positionOf = new int[n];
        int[] fill = Arrays.copyOf(memberStart, distinct);
        for (int i = 0; i < n; i++) { // ascending i: members come out sorted
            int pos = positionOfId[idOf[i]];
            members[fill[pos]++] = i;
            positionOf[i] = pos;
        }
        cursor = Arrays.copyOf(memberStart, distinct);
        liveLo = boxLo.clone();
        liveHi = boxHi.clone();
        firstUnprocessed = new int[nodeCount];
        for (int node = nodeCount - 1; node >= 0; node--) {
            if (leaf[node]) {
                int first = NONE;
                for (int pos = lo[node]; pos < hi[node]; pos++) {
                    first = Math.min(first, members[memberStart[pos]]);
                }
                firstUnprocessed[node] = first;
            } else if (hi[node] > lo[node]) {
                firstUnprocessed[node] = Math.min(firstUnprocessed[2 * node + 1], firstUnprocessed[2 * node + 2]);
            } else {
                firstUnprocessed[node] = NONE; // not part of the tree
            }
        }
    }

    /** Groups equal rows with an open-addressing hash table; ids in order of first appearance. */
    private static int distinctPoints(double[] data, int n, int dim, int[] idOf, int[] firstSample) {
        int capacity = Integer.highestOneBit(Math.max(2, n)) << 2;
        int[] table = new int[capacity];
        Arrays.fill(table, -1);
        int count = 0;
        for (int i = 0; i < n; i++) {
            int slot = hash(data, i * dim, dim) & (capacity - 1);
            while (true) {
                int id = table[slot];
                if (id < 0) {
                    table[slot] = count;
                    firstSample[count] = i;
                    idOf[i] = count++;
                    break;
                }
                if (equalRows(data, firstSample[id] * dim, i * dim, dim)) {
                    idOf[i] = id;
                    break;
                }
                slot = (slot + 1) & (capacity - 1);
            }
        }
        return count;
    }

    private static int hash(double[] data, int offset, int dim) {
        long h = 0x9E3779B97F4A7C15L;
        for (int d = 0; d < dim; d++) {
            double v = data[offset + d] + 0.0; // -0.0 + 0.0 is 0.0
            h = (h ^ Double.doubleToLongBits(v)) * 0xBF58476D1CE4E5B9L;
            h ^= h >>> 31;
        }
        return (int) (h ^ (h >>> 32));
    }

    private static boolean equalRows(double[] data, int a, int b, int dim) {
        for (int d = 0; d < dim; d++) {
            if (data[a + d] != data[b + d]) {
                return false;
            }
        }
        return true;
    }

    /** Splits at the median of the dimension of largest spread, as {@code KdTree} did. */
    private void build(double[] byId, int[] idAt, int node, int from, int to) {
        lo[node] = from;
        hi[node] = to;
        int widest = 0;
        double widestSpread = -1;
        for (int d = 0; d < dim; d++) {
            double min = Double.POSITIVE_INFINITY;
            double max = Double.NEGATIVE_INFINITY;
            for (int i = from; i < to; i++) {
                double v = byId[idAt[i] * dim + d];
                min = Math.min(min, v);
                max = Math.max(max, v);
            }
            boxLo[node * dim + d] = min;
            boxHi[node * dim + d] = max;
            if (max - min > widestSpread) {
                widestSpread = max - min;
                widest = d;
            }
        }
        if (to - from <= LEAF_SIZE || 2 * node + 2 >= nodeCount) {
            leaf[node] = true;
            for (int i = from; i < to; i++) {
                leafOf[i] = node;
            }
            return;
        }
        int mid = (from + to) >>> 1;
        select(byId, idAt, from, to - 1, mid, widest);
        build(byId, idAt, 2 * node + 1, from, mid);
        build(byId, idAt, 2 * node + 2, mid, to);
    }

    /** Quickselect: afterwards idAt[from..k) <= idAt[k] <= idAt(k..to] in coordinate d. */
    private void select(double[] byId, int[] idAt, int from, int to, int k, int d) {
        while (to > from) {
            double pivot = byId[idAt[(from + to) >>> 1] * dim + d];
            int i = from;
            int j = to;
            while (i <= j) {
                while (byId[idAt[i] * dim + d] < pivot) {
                    i++;
                }
                while (byId[idAt[j] * dim + d] > pivot) {
                    j--;
                }
                if (i <= j) {
                    int t = idAt[i];
                    idAt[i] = idAt[j];
                    idAt[j] = t;
                    i++;
                    j--;
                }
            }
            if (k <= j) {
                to = j;
            } else if (k >= i) {
                from = i;
            } else {
                return;
            }
        }
    }

    /** Number of members of a position. */
    int weight(int pos) {
        return memberStart[pos + 1] - memberStart[pos];
    }

    /** The next unprocessed member of a position, {@link #NONE} when all are processed. */
    int nextMember(int pos) {
        int c = cursor[pos];
        return c < memberStart[pos + 1] ? members[c] : NONE;
    }

    /** True while sample s is unprocessed. Members are processed in index order, so s is unprocessed iff it is at or after the cursor. */
    boolean unprocessed(int s) {
        int pos = positionOf[s];
        int c = cursor[pos];
        return c < memberStart[pos + 1] && members[c] <= s;
    }

    /** The smallest unprocessed sample index, {@link #NONE} when all are processed. */
    int firstUnprocessed() {
        return firstUnprocessed[0];
    }

    /** The distance between two positions (the formula of {@link Optics#distance}). */
    double distance(int a, int b) {
        int ao = a * dim;
        int bo = b * dim;
        double sum = 0.0;
        for (int d = 0; d < dim; d++) {
            double diff = coords[ao + d] - coords[bo + d];
            sum += diff * diff;
        }
        return Math.sqrt(sum);
    }

    /**
     * Marks the next unprocessed member of position {@code pos} processed (the ordering processes the members of a
     * position in index order, because they always share their reachability).
     */
    void process(int pos) {
        cursor[pos]++;
        boolean exhausted = cursor[pos] == memberStart[pos + 1];
        int node = leafOf[pos];
        int first = NONE;
        for (int p = lo[node]; p < hi[node]; p++) {
            first = Math.min(first, nextMember(p));
        }
        firstUnprocessed[node] = first;
        if (exhausted) {
            shrinkLeafBox(node);
        }
        while (node > 0) {
            node = (node - 1) >>> 1;
            int a = 2 * node + 1;
            int b = a + 1;
            int merged = Math.min(firstUnprocessed[a], firstUnprocessed[b]);
            boolean changed = firstUnprocessed[node] != merged;
            firstUnprocessed[node] = merged;
            if (exhausted) {
                changed |= unionBox(node, a, b);
            }
            if (!changed) {
                return;
            }
        }
    }

    private void shrinkLeafBox(int node) {
        int b = node * dim;
        Arrays.fill(liveLo, b, b + dim, Double.POSITIVE_INFINITY);
        Arrays.fill(liveHi, b, b + dim, Double.NEGATIVE_INFINITY);
        for (int pos = lo[node]; pos < hi[node]; pos++) {
            if (cursor[pos] < memberStart[pos + 1]) {
                for (int d = 0; d < dim; d++) {
                    double v = coords[pos * dim + d];
                    liveLo[b + d] = Math.min(liveLo[b + d], v);
                    liveHi[b + d] = Math.max(liveHi[b + d], v);
                }
            }
        }
    }

    private boolean unionBox(int node, int a, int b) {
        boolean liveA = firstUnprocessed[a] != NONE;
        boolean liveB = firstUnprocessed[b] != NONE;
        boolean changed = false;
        for (int d = 0; d < dim; d++) {
            double l;
            double h;
            if (liveA && liveB) {
                l = Math.min(liveLo[a * dim + d], liveLo[b * dim + d]);
                h = Math.max(liveHi[a * dim + d], liveHi[b * dim + d]);
            } else if (liveA || liveB) {
                int c = liveA ? a : b;
                l = liveLo[c * dim + d];
                h = liveHi[c * dim + d];
            } else {
                l = Double.POSITIVE_INFINITY;
                h = Double.NEGATIVE_INFINITY;
            }
            if (l != liveLo[node * dim + d] || h != liveHi[node * dim + d]) {
                liveLo[node * dim + d] = l;
                liveHi[node * dim + d] = h;
                changed = true;
            }
        }
        return changed;
    }

    /** Squared-sum lower bound from the point at offset {@code q} of {@link #coords} to a box (0 inside). */
    double boxSquaredSum(int q, double[] lowCorner, double[] highCorner, int node) {
        int b = node * dim;
        double sum = 0.0;
        for (int d = 0; d < dim; d++) {
            double x = coords[q + d];
            double gap;
            if (x < lowCorner[b + d]) {
                gap = lowCorner[b + d] - x;
            } else if (x > highCorner[b + d]) {
                gap = x - highCorner[b + d];
            } else {
                gap = 0.0;
            }
            sum += gap * gap;
        }
        return sum;
    }

    // ---------------------------------------------------------------- nearest unprocessed sample

    private double searchCore;
    private double searchEps;
    private int searchOffset;
    private double bestReach;
    private int bestSample;

    /**
     * The best unprocessed sample for a processed position u with core distance {@code core}: the smallest
     * reachability max(core, d) over unprocessed samples within {@code maxEps}, ties to the lowest sample index.
     * Branch and bound from u's leaf upwards; read the answer with {@link #bestReach()} and {@link #bestSample()}
     * ({@link #NONE} when there is none).
     */
    void searchBest(int u, double core, double maxEps) {
        searchCore = core;
        searchEps = maxEps;
        searchOffset = u * dim;
        bestReach = Double.POSITIVE_INFINITY;
        bestSample = NONE;
        int node = leafOf[u];
        if (firstUnprocessed[node] != NONE) {
            visit(node, boxSquaredSum(searchOffset, liveLo, liveHi, node));
        }
        while (node > 0) {
            int sibling = (node & 1) == 1 ? node + 1 : node - 1;
            if (firstUnprocessed[sibling] != NONE) {
                visit(sibling, boxSquaredSum(searchOffset, liveLo, liveHi, sibling));
            }
            node = (node - 1) >>> 1;
        }
    }

    double bestReach() {
        return bestReach;
    }

    int bestSample() {
        return bestSample;
    }

    /** Visits a node with unprocessed samples whose live box is {@code squared} (squared-sum bound) away. */
    private void visit(int node, double squared) {
        int first = firstUnprocessed[node];
        double near = Math.sqrt(squared);
        if (near > searchEps) {
            return;
        }
        double bound = Math.max(searchCore, near);
        if (bound > bestReach || (bound == bestReach && first >= bestSample)) {
            return; // nothing below can beat the best: larger reachability, or equal with no lower index
        }
        if (leaf[node]) {
            for (int pos = lo[node], end = hi[node]; pos < end; pos++) {
                int c = cursor[pos];
                if (c == memberStart[pos + 1]) {
                    continue;
                }
                int po = pos * dim;
                double sum = 0.0;
                for (int d = 0; d < dim; d++) {
                    double diff = coords[searchOffset + d] - coords[po + d];
                    sum += diff * diff;
                }
                double dist = Math.sqrt(sum);
                if (dist > searchEps) {
                    continue;
                }
                double reach = Math.max(searchCore, dist);
                int s = members[c];
                if (reach < bestReach || (reach == bestReach && s < bestSample)) {
                    bestReach = reach;
                    bestSample = s;
                }
            }
            return;
        }
        int a = 2 * node + 1;
        int b = a + 1;
        if (firstUnprocessed[b] == NONE) {
            visit(a, boxSquaredSum(searchOffset, liveLo, liveHi, a));
        } else if (firstUnprocessed[a] == NONE) {
            visit(b, boxSquaredSum(searchOffset, liveLo, liveHi, b));
        } else {
            double sa = boxSquaredSum(searchOffset, liveLo, liveHi, a);
            double sb = boxSquaredSum(searchOffset, liveLo, liveHi, b);
            if (sa <= sb) {
                visit(a, sa);
                visit(b, sb);
            } else {
                visit(b, sb);
                visit(a, sa);
            }
        }
    }
}
