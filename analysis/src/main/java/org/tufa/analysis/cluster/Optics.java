package org.tufa.analysis.cluster;

/**
 * OPTICS, exact: Ankerst, Breunig, Kriegel, Sander, "OPTICS: Ordering Points To Identify the Clustering
 * Structure", Proc. ACM SIGMOD 1999, pp. 49-60.
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
 * Unrolled, the definitions say: when p is chosen, its reachability is the minimum over the points processed
 * before it of w(o, p) = max(core(o), d(o, p)), and its predecessor is the earliest processed o that attains that
 * minimum. The ordering is Prim's algorithm on the directed weights w, with ties broken by (w, sample index of p,
 * processing step of o).
 *
 * <p>Distances are computed with one formula everywhere, {@link #distance}: sqrt of the sum of squared coordinate
 * differences in dimension order (no dot-product expansion, no FMA), so an ordering can be replayed bit-exactly.
 *
 * <p><b>Implementation: lazy Prim with a k-d tree.</b> The classic pass updates every unprocessed point after each
 * processed one (n^2/2 distances with unbounded maxEps). Here the work goes the other way: each processed point
 * keeps only a lower bound of the best it can still offer, and is asked for its exact best when that bound is the
 * smallest of all. This is Prim's algorithm with nearest-neighbour queries on a k-d tree in the manner of Bentley
 * and Friedman, "Fast algorithms for constructing minimal spanning trees in coordinate spaces", IEEE Transactions
 * on Computers C-27(2), 1978, adapted to the asymmetric weights w and to OPTICS's tie rules; the neighbour lists and
 * the lifted bounds below are ours.
 * <ol>
 *   <li>{@link PointTree}: equal samples become one distinct point with its members (ascending indices); a k-d tree
 *       over the distinct points tracks, per node, the smallest unprocessed sample and the box of the points that
 *       still have unprocessed members.
 *   <li>{@link NeighbourLists}: per distinct point the core distance and the list of its nearest distinct points
 *       holding at least 1.5 x MinPts samples, closed: everything unlisted is strictly farther than the list's
 *       last distance ({@code bound}).
 *   <li>{@link OpticsOrdering}: a min-heap with one entry per processed distinct point u (for its first processed
 *       member). Its key is (r, s, step): s the candidate sample, or a bound marker that sorts before every real
 *       sample of the same r. Let best(u) be the smallest (w(u, p), p) over unprocessed samples p with
 *       d(u, p) <= maxEps. <b>Invariant: key(u) <= best(u), with equality when the key names a sample.</b>
 * </ol>
 *
 * <p><b>Why the result is the definition's, bit for bit.</b>
 * <ul>
 *   <li><i>Keys only rise.</i> best(u) can only grow as samples are processed, so a key that was exact stays a lower
 *       bound; an entry whose candidate has been processed is "stale" and is refreshed when it reaches the top.
 *   <li><i>Selection.</i> If the top entry names an unprocessed sample s, then key(top) = best(top) <= key(v) <=
 *       best(v) for every other entry v: s has the smallest reachability, the lowest index among equals, and (with
 *       the step as last key) the earliest processed predecessor among all that attain it. Any other top is
 *       refreshed (a higher bound, the exact best, or removed when it has nothing within maxEps), so every pop makes
 *       progress. An empty heap means every unprocessed sample is unreachable: the lowest index starts a new
 *       component.
 *   <li><i>Duplicates.</i> Members of a distinct point are at distance 0 from each other and equally far from
 *       everything else, so they always share their reachability and are chosen in index order; a later member
 *       offers exactly what the first one offers, and loses every tie on the step, so it needs no entry.
 *   <li><i>Keys from the list.</i> Listed points within the core distance all offer w = core(u); past it w = d. The
 *       smallest (w, next member) over listed points with unprocessed members is best(u), because every unlisted
 *       point is strictly farther than the bound. When the list is exhausted, nextUp(bound) is a lower bound; when
 *       that bound reaches the top, a branch-and-bound search on the tree gives the exact best. Box bounds use the
 *       same floating-point operations as point distances, and each step is monotone, so the computed box bound
 *       never exceeds a computed distance: the pruning is exact.
 *   <li><i>Lifted bounds.</i> After a search finds that the nearest unprocessed sample is delta from u (delta &gt;
 *       core(u); or none within maxEps, delta = maxEps), every unprocessed p has d(v, p) >= delta - d(u, v) for
 *       every v (triangle inequality), and w(v, p) >= d(v, p). So the key of every listed neighbour v of u whose key
 *       is not an exact unprocessed candidate may rise to delta - d(u, v), less a slack of 1e-12 (delta + d(u, v))
 *       that covers the rounding of the three computed distances and the subtraction many times over. One search
 *       so stops the refreshes of a whole neighbourhood while the unprocessed samples stay far: without it, when the
 *       reachability rises from a dense region to a sparse one, every processed point of the dense region would be
 *       refreshed, one search each.
 * </ul>
 *
 * <p>Cost: the searches are O(log n) expected for low-dimensional data and the neighbour lists O(n log n); for
 * 1-3 dimensions the measured cost grows close to n log n (OpticsBenchmark in the benchmarks module). There is no
 * n x n matrix; memory is O(n * MinPts) for the lists. Single-threaded by design: callers run many fits in
 * parallel.
 */
public final class Optics {

    private Optics() {}

    /** OPTICS with unbounded maxEps. */
    public static OpticsResult fit(double[][] x, int minPts) {
        return fit(x, minPts, Double.POSITIVE_INFINITY);
    }

    /**
     * OPTICS of the rows of {@code x}.
     *
     * @param x samples as rows; at least minPts rows, all of the same positive length, all values finite
     * @param minPts MinPts >= 1, the sample itself counting
     * @param maxEps neighbourhood radius >= 0, or {@link Double#POSITIVE_INFINITY} for unbounded
     * @throws IllegalArgumentException with a one-line reason fit for a per-unit report
     */
    public static OpticsResult fit(double[][] x, int minPts, double maxEps) {
        if (x == null || x.length == 0) {
            throw new IllegalArgumentException("OPTICS needs samples, got none");
        }
        int n = x.length;
        if (x[0] == null || x[0].length == 0) {
            throw new IllegalArgumentException("OPTICS needs at least one feature per sample, row 0 has none");
        }
        int dim = x[0].length;
        double[] flat = new double[n * dim];
        for (int i = 0; i < n; i++) {
            if (x[i] == null || x[i].length != dim) {
                throw new IllegalArgumentException("OPTICS needs rows of equal length: row " + i + " has "
                        + (x[i] == null ? 0 : x[i].length) + " values, row 0 has " + dim);
            }
            System.arraycopy(x[i], 0, flat, i * dim, dim);
        }
        return fitFlat(flat, n, dim, minPts, maxEps);
    }

    /**
     * OPTICS of n samples stored row-major in {@code data} (sample i at data[i*dim .. i*dim+dim-1]). The array is
     * copied, not modified.
     */
    public static OpticsResult fit(double[] data, int n, int dim, int minPts, double maxEps) {
        if (n <= 0) {
            throw new IllegalArgumentException("OPTICS needs samples, got none");
        }
        if (dim <= 0) {
            throw new IllegalArgumentException("OPTICS needs at least one feature per sample, got " + dim);
        }
        if (data.length != (long) n * dim) {
            throw new IllegalArgumentException(
                    "OPTICS data length " + data.length + " is not " + n + " samples x " + dim + " features");
        }
        return fitFlat(data.clone(), n, dim, minPts, maxEps);
    }

    private static OpticsResult fitFlat(double[] flat, int n, int dim, int minPts, double maxEps) {
        if (minPts < 1) {
            throw new IllegalArgumentException("OPTICS MinPts must be at least 1, got " + minPts);
        }
        if (n < minPts) {
            throw new IllegalArgumentException(
                    "OPTICS needs at least MinPts = " + minPts + " samples, got " + n);
        }
        if (Double.isNaN(maxEps) || maxEps < 0) {
            throw new IllegalArgumentException("OPTICS maxEps must be >= 0 or +infinity, got " + maxEps);
        }
        for (int i = 0; i < flat.length; i++) {
            if (!Double.isFinite(flat[i])) {
                throw new IllegalArgumentException("OPTICS needs finite values: sample " + (i / dim)
                        + ", feature " + (i % dim) + " is " + flat[i]);
            }
        }
        PointTree tree = new PointTree(flat, n, dim);
        NeighbourLists lists = NeighbourLists.build(tree, minPts, listSamples(minPts, n), maxEps);
        double[] core = new double[n];
        for (int i = 0; i < n; i++) {
            core[i] = lists.core[tree.positionOf[i]];
        }
        int[] ordering = new int[n];
        double[] reach = new double[n];
        int[] pred = new int[n];
        OpticsOrdering.run(tree, lists, maxEps, ordering, reach, pred);
        return new OpticsResult(ordering, reach, core, pred, minPts, maxEps);
    }

    /**
     * Samples per neighbour list: 1.5 x MinPts, at least 8, at most n. A longer list answers more candidates without
     * a tree search and lifts more neighbours per search, but costs more to build: on 35,040 operating-like 3-D
     * samples with MinPts 20, 1.5 x was a little faster than 1 x and 2 x, and 3 x clearly slower (OpticsBenchmark).
     */
    static int listSamples(int minPts, int n) {
        return (int) Math.min(n, Math.max(8L, (3L * minPts + 1) / 2));
    }

    /** The distance used everywhere: sqrt of the sum over dimensions, in order, of squared differences. */
    static double distance(double[] data, int dim, int a, int b) {
        int ao = a * dim;
        int bo = b * dim;
        double sum = 0.0;
        for (int d = 0; d < dim; d++) {
            double diff = data[ao + d] - data[bo + d];
            sum += diff * diff;
        }
        return Math.sqrt(sum);
    }
}
