package org.tufa.analysis.cluster;

import java.util.Arrays;

/**
 * The reference OPTICS pass the new {@link Optics} is tested against: the implementation tufa shipped before the
 * k-d tree ordering, kept unchanged apart from its name (it is O(n^2) in distance evaluations for unbounded maxEps).
 * Ankerst, Breunig, Kriegel, Sander, "OPTICS: Ordering Points To Identify the Clustering Structure", Proc. ACM
 * SIGMOD 1999, pp. 49-60. Public for the benchmarks module, which times it beside the new pass.
 *
 * <p>Definitions (Euclidean distance, the neighbourhood of p includes p itself, as in the paper):
 * <ul>
 *   <li>core distance of p = distance to its MinPts-th nearest neighbour, p counting as the first (so MinPts = 1
 *       gives 0); undefined ({@code +inf}) when that distance exceeds maxEps;
 *   <li>reachability of p from a processed core point o = max(core(o), d(o, p)) for d(o, p) <= maxEps; a point's
 *       reachability is lowered only by a strictly smaller value, and the o that lowered it last becomes its
 *       predecessor;
 *   <li>ordering: the next point is the unprocessed one of smallest reachability, ties to the lowest sample index;
 *       when every unprocessed point is unreachable ({@code +inf}) the lowest unprocessed index starts a new
 *       component (so the first point is sample 0). This is the tie rule of scikit-learn 1.2.1's OPTICS.
 * </ul>
 *
 * <p>Distances are computed with one formula everywhere, {@link Optics#distance}: sqrt of the sum of squared coordinate
 * differences in dimension order (no dot-product expansion, no FMA), so an ordering can be replayed bit-exactly.
 *
 * <p>Implementation. The data are copied into one flat row-major array. Core distances come from k-nearest-neighbour
 * queries on a small k-d tree ({@link KdTree}). With unbounded maxEps every processed point must update every
 * unprocessed one (the n^2/2 floor of exact OPTICS); per processed point, one pass over a compacted array of the
 * unprocessed points (coordinates, sample index, reachability, predecessor) updates reachabilities and a second
 * scan finds the next point; no n x n matrix, no boxing, no allocation in the loop.
 * With a finite maxEps the k-d tree's radius query and an indexed binary heap of seeds are used instead. Both
 * paths give identical results. Single-threaded by design: callers run many fits in parallel.
 */
public final class ReferenceOptics {

    private ReferenceOptics() {}

    /**
     * Skipping sqrt in the hot loop: a point can only improve when max(core(o), sqrt(sq)) < r, so when
     * sq >= r*r*(1 + 1e-15) there is nothing to do. The margin exceeds the rounding of r*r and of the product
     * (each at most 2^-53 relative), so sq beyond it means the true sqrt(sq) exceeds r and the correctly rounded
     * sqrt is >= r: the shortcut never skips an update, and every update still uses the exact sqrt.
     */
    private static final double SQUARE_MARGIN = 1 + 1e-15;

    /** OPTICS with unbounded maxEps. */
    public static OpticsResult fit(double[][] x, int minPts) {
        return fit(x, minPts, Double.POSITIVE_INFINITY);
    }

    /** OPTICS of the rows of {@code x} (valid input: the tests and the benchmark pass what {@link Optics} accepts). */
    static OpticsResult fit(double[][] x, int minPts, double maxEps) {
        int n = x.length;
        int dim = x[0].length;
        double[] flat = new double[n * dim];
        for (int i = 0; i < n; i++) {
            System.arraycopy(x[i], 0, flat, i * dim, dim);
        }
        KdTree tree = new KdTree(flat, n, dim);
        double[] core = new double[n];
        for (int i = 0; i < n; i++) {
            double c = Math.sqrt(tree.kthSquaredDistance(i, minPts));
            core[i] = c <= maxEps ? c : Double.POSITIVE_INFINITY;
        }
        int[] ordering = new int[n];
        double[] reach = new double[n];
        int[] pred = new int[n];
        if (maxEps == Double.POSITIVE_INFINITY) {
            orderUnbounded(flat, n, dim, core, ordering, reach, pred);
        } else {
            new BoundedOrdering(n, core, maxEps, tree, reach, pred).run(ordering);
        }
        return new OpticsResult(ordering, reach, core, pred, minPts, maxEps);
    }

    /**
     * The n^2/2 ordering for unbounded maxEps. The unprocessed points live in compacted arrays (removal swaps the
     * last one in), so each pass reads contiguous memory; ties are broken by sample index explicitly, so the
     * compaction order does not matter. Per processed point one tight loop updates reachabilities (rarely taking
     * the branch) and a second finds the next point; measured faster than one fused loop, whose extra compare
     * chain defeats the CPU's pipelining.
     */
    private static void orderUnbounded(
            double[] data, int n, int dim, double[] core, int[] ordering, double[] reach, int[] pred) {
        double[] coords = data.clone();
        int[] sample = new int[n];
        double[] cReach = new double[n];
        int[] cPred = new int[n];
        for (int i = 0; i < n; i++) {
            sample[i] = i;
        }
        Arrays.fill(cReach, Double.POSITIVE_INFINITY);
        Arrays.fill(cPred, -1);
        double[] origin = new double[dim];
        int m = n;
        int next = 0; // compacted position of the next point; sample 0 starts
        for (int step = 0; step < n; step++) {
            int o = sample[next];
            ordering[step] = o;
            reach[o] = cReach[next];
            pred[o] = cPred[next];
            // remove position `next`
            m--;
            sample[next] = sample[m];
            cReach[next] = cReach[m];
            cPred[next] = cPred[m];
            System.arraycopy(coords, m * dim, coords, next * dim, dim);
            if (m == 0) {
                break;
            }
            System.arraycopy(data, o * dim, origin, 0, dim);
            double co = core[o];
            if (dim == 2) {
                next = pass2(coords, sample, cReach, cPred, m, origin[0], origin[1], co, o);
            } else if (dim == 3) {
                next = pass3(coords, sample, cReach, cPred, m, origin[0], origin[1], origin[2], co, o);
            } else {
                next = passAny(coords, dim, sample, cReach, cPred, m, origin, co, o);
            }
        }
    }

    private static int pass2(
            double[] c, int[] sample, double[] r, int[] p, int m, double x0, double x1, double co, int o) {
        int best = 0;
        double bestR = Double.POSITIVE_INFINITY;
        int bestSample = Integer.MAX_VALUE;
        for (int j = 0; j < m; j++) {
            double rj = r[j];
            if (co < rj) { // else max(co, d) >= co >= rj: no strict improvement possible, skip the distance
                double d0 = x0 - c[2 * j];
                double d1 = x1 - c[2 * j + 1];
                double sq = d0 * d0 + d1 * d1;
                if (sq < rj * rj * SQUARE_MARGIN) {
                    double nr = Math.max(co, Math.sqrt(sq));
                    if (nr < rj) {
                        rj = nr;
                        r[j] = nr;
                        p[j] = o;
                    }
                }
            }
            if (rj <= bestR && (rj < bestR || sample[j] < bestSample)) {
                best = j;
                bestR = rj;
                bestSample = sample[j];
            }
        }
        return best;
    }

    private static int pass3(
            double[] c, int[] sample, double[] r, int[] p, int m, double x0, double x1, double x2, double co,
            int o) {
        // One pass updates reachability and finds the next point (smallest reachability, ties to the lowest
        // sample index), so each element is touched once.
        int best = 0;
        double bestR = Double.POSITIVE_INFINITY;
        int bestSample = Integer.MAX_VALUE;
        for (int j = 0; j < m; j++) {
            double rj = r[j];
            if (co < rj) {
                int k = 3 * j;
                double d0 = x0 - c[k];
                double d1 = x1 - c[k + 1];
                double d2 = x2 - c[k + 2];
                double sq = d0 * d0 + d1 * d1 + d2 * d2;
                if (sq < rj * rj * SQUARE_MARGIN) {
                    double nr = Math.max(co, Math.sqrt(sq));
                    if (nr < rj) {
                        rj = nr;
                        r[j] = nr;
                        p[j] = o;
                    }
                }
            }
            if (rj <= bestR && (rj < bestR || sample[j] < bestSample)) {
                best = j;
                bestR = rj;
                bestSample = sample[j];
            }
        }
        return best;
    }

    private static int passAny(
            double[] c, int dim, int[] sample, double[] r, int[] p, int m, double[] x, double co, int o) {
        for (int j = 0; j < m; j++) {
            if (co >= r[j]) {
                continue; // max(co, d) >= co >= r[j]: no strict improvement possible, skip the distance
            }
            int k = dim * j;
            double sum = 0.0;
            for (int d = 0; d < dim; d++) {
                double diff = x[d] - c[k + d];
                sum += diff * diff;
            }
            double rj = r[j];
            if (sum < rj * rj * SQUARE_MARGIN) {
                double nr = Math.max(co, Math.sqrt(sum));
                if (nr < rj) {
                    r[j] = nr;
                    p[j] = o;
                }
            }
        }
        return argMin(r, sample, m);
    }

    /** Compacted position of the smallest reachability, ties to the lowest sample index. */
    private static int argMin(double[] r, int[] sample, int m) {
        int best = 0;
        double bestR = Double.POSITIVE_INFINITY;
        int bestSample = Integer.MAX_VALUE;
        for (int j = 0; j < m; j++) {
            double rj = r[j];
            if (rj <= bestR && (rj < bestR || sample[j] < bestSample)) {
                best = j;
                bestR = rj;
                bestSample = sample[j];
            }
        }
        return best;
    }

    /** The ordering for finite maxEps: radius queries and an indexed min-heap of seeds keyed (reach, sample). */
    private static final class BoundedOrdering implements KdTree.NeighbourVisitor {
        private final int n;
        private final double[] core;
        private final double maxEps;
        private final KdTree tree;
        private final double[] reach;
        private final int[] pred;
        private final boolean[] processed;
        private final int[] heap;
        private final int[] heapPos;
        private int heapSize;
        private int current;
        private double currentCore;

        BoundedOrdering(int n, double[] core, double maxEps, KdTree tree, double[] reach, int[] pred) {
            this.n = n;
            this.core = core;
            this.maxEps = maxEps;
            this.tree = tree;
            this.reach = reach;
            this.pred = pred;
            this.processed = new boolean[n];
            this.heap = new int[n];
            this.heapPos = new int[n];
            Arrays.fill(heapPos, -1);
            Arrays.fill(reach, Double.POSITIVE_INFINITY);
            Arrays.fill(pred, -1);
        }

        void run(int[] ordering) {
            int scan = 0;
            for (int step = 0; step < n; step++) {
                int o;
                if (heapSize == 0) {
                    while (processed[scan]) {
                        scan++;
                    }
                    o = scan;
                } else {
                    o = pop();
                }
                processed[o] = true;
                ordering[step] = o;
                if (core[o] != Double.POSITIVE_INFINITY) {
                    current = o;
                    currentCore = core[o];
                    tree.radius(o, maxEps, this);
                }
            }
        }

        @Override
        public void visit(int p, double d) {
            if (processed[p]) {
                return;
            }
            double nr = Math.max(currentCore, d);
            if (nr < reach[p]) {
                reach[p] = nr;
                pred[p] = current;
                if (heapPos[p] < 0) {
                    heap[heapSize] = p;
                    heapPos[p] = heapSize;
                    heapSize++;
                }
                siftUp(heapPos[p]);
            }
        }

        private boolean less(int a, int b) {
            return reach[a] < reach[b] || (reach[a] == reach[b] && a < b);
        }

        private int pop() {
            int top = heap[0];
            heapPos[top] = -1;
            heapSize--;
            if (heapSize > 0) {
                heap[0] = heap[heapSize];
                heapPos[heap[0]] = 0;
                siftDown(0);
            }
            return top;
        }

        private void siftUp(int i) {
            int item = heap[i];
            while (i > 0) {
                int parent = (i - 1) >>> 1;
                if (!less(item, heap[parent])) {
                    break;
                }
                heap[i] = heap[parent];
                heapPos[heap[i]] = i;
                i = parent;
            }
            heap[i] = item;
            heapPos[item] = i;
        }

        private void siftDown(int i) {
            int item = heap[i];
            while (true) {
                int l = 2 * i + 1;
                if (l >= heapSize) {
                    break;
                }
                int c = l + 1 < heapSize && less(heap[l + 1], heap[l]) ? l + 1 : l;
                if (!less(heap[c], item)) {
                    break;
                }
                heap[i] = heap[c];
                heapPos[heap[i]] = i;
                i = c;
            }
            heap[i] = item;
            heapPos[item] = i;
        }
    }
}
