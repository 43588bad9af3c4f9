package org.tufa.analysis.cluster;

import java.util.Arrays;

/**
 * Per distinct point of a {@link PointTree}: its OPTICS core distance and its list of nearest distinct points.
 *
 * <p>The list of position u holds the nearest positions (u itself first, at distance 0) until their members number
 * at least {@code listSamples}, plus every position exactly as far as the last one, sorted by distance. So the list
 * is closed: every position not in it is strictly farther than {@link #bound} (the distance of the last entry), or
 * the list holds every position and the bound is {@code +inf}. The leading {@link #inBall} entries are at distance
 * &lt;= the core distance (the MinPts-th nearest sample, members counted, u's own included).
 *
 * <p>Branch-and-bound search on squared sums from u's leaf upwards with a max-heap of the current nearest
 * (multiplicities counted). Two different squared sums can have the same correctly rounded square root; such a tie
 * differs by less than 2^-51 relative, so candidates and boxes within {@link #TIE_MARGIN} of the current limit are
 * compared as distances, and equal ones are kept beside the heap. Distances are {@link Optics#distance}'s formula, so
 * the core distances are bit-identical to a brute-force computation.
 */
final class NeighbourLists {

    /** Squared sums beyond limit * TIE_MARGIN (plus the smallest normal double) cannot tie with the limit's root. */
    private static final double TIE_MARGIN = 1 + 1e-15;

    /** Core distance per position; {@code +inf} beyond maxEps. */
    final double[] core;
    /** List of position u: {@code entries[start[u] .. start[u + 1] - 1]}, positions by ascending distance. */
    final int[] start;
    final int[] entries;
    /** Number of leading list entries within the core distance. */
    final int[] inBall;
    /** Every position not in the list is strictly farther than this; {@code +inf} when the list holds all. */
    final double[] bound;

    private NeighbourLists(double[] core, int[] start, int[] entries, int[] inBall, double[] bound) {
        this.core = core;
        this.start = start;
        this.entries = entries;
        this.inBall = inBall;
        this.bound = bound;
    }

    /**
     * @param listSamples members to collect per list, at least minPts
     */
    static NeighbourLists build(PointTree tree, int minPts, int listSamples, double maxEps) {
        int m = tree.size;
        double[] core = new double[m];
        int[] start = new int[m + 1];
        int[] inBall = new int[m];
        double[] bound = new double[m];
        int[] entries = new int[(int) Math.min(Integer.MAX_VALUE - 8, (long) m * Math.min(listSamples, 64))];
        Search search = new Search(tree, listSamples);
        int used = 0;
        for (int u = 0; u < m; u++) {
            search.run(u);
            int count = search.sortedCount();
            if (used + count > entries.length) {
                entries = Arrays.copyOf(entries, (int) Math.min(Integer.MAX_VALUE - 8,
                        Math.max((long) entries.length * 3 / 2, (long) used + count)));
            }
            start[u] = used;
            double coreSquared = Double.NaN;
            int members = 0;
            for (int i = 0; i < count; i++) {
                entries[used + i] = search.sortedPosition[i];
                members += tree.weight(search.sortedPosition[i]);
                if (members >= minPts && Double.isNaN(coreSquared)) {
                    coreSquared = search.sortedSquared[i];
                }
            }
            double c = Math.sqrt(coreSquared);
            core[u] = c <= maxEps ? c : Double.POSITIVE_INFINITY;
            int ball = 0;
            while (ball < count && Math.sqrt(search.sortedSquared[ball]) <= c) {
                ball++;
            }
            inBall[u] = ball;
            bound[u] = search.full() ? Math.sqrt(search.sortedSquared[count - 1]) : Double.POSITIVE_INFINITY;
            used += count;
        }
        start[m] = used;
        return new NeighbourLists(core, start, entries, inBall, bound);
    }

    /** One reusable k-nearest search over the tree (members counted). */
    private static final class Search {
        private final PointTree tree;
        private final int target;
        private double[] heapSquared = new double[64];
        private int[] heapPosition = new int[64];
        private int heapSize;
        private int heapWeight;
        private double[] tieSquared = new double[8];
        private int[] tiePosition = new int[8];
        private int ties;
        private double tieDistance;
        private int query;
        double[] sortedSquared = new double[64];
        int[] sortedPosition = new int[64];

        Search(PointTree tree, int target) {
            this.tree = tree;
            this.target = target;
        }

        boolean full() {
            return heapWeight >= target;
        }

        void run(int u) {
            heapSize = 0;
            heapWeight = 0;
            ties = 0;
            query = u * tree.dim;
            int node = tree.leafOf[u];
            scan(node);
            while (node > 0) {
                int sibling = (node & 1) == 1 ? node + 1 : node - 1;
                visit(sibling, tree.boxSquaredSum(query, tree.boxLo, tree.boxHi, sibling));
                node = (node - 1) >>> 1;
            }
        }

        private boolean beyond(double squared) {
            return full() && squared > heapSquared[0] * TIE_MARGIN + Double.MIN_NORMAL;
        }

        /** Visits a node whose box is {@code squared} from the query (squared-sum lower bound). */
        private void visit(int node, double squared) {
            if (beyond(squared)) {
                return;
            }
            if (tree.leaf[node]) {
                scan(node);
                return;
            }
            int a = 2 * node + 1;
            int b = a + 1;
            double sa = tree.boxSquaredSum(query, tree.boxLo, tree.boxHi, a);
            double sb = tree.boxSquaredSum(query, tree.boxLo, tree.boxHi, b);
            if (sa <= sb) {
                visit(a, sa);
                visit(b, sb);
            } else {
                visit(b, sb);
                visit(a, sa);
            }
        }

        private void scan(int node) {
            double[] c = tree.coords;
            int dim = tree.dim;
            for (int pos = tree.lo[node], end = tree.hi[node]; pos < end; pos++) {
                int po = pos * dim;
                double sum = 0.0;
                for (int d = 0; d < dim; d++) {
                    double diff = c[query + d] - c[po + d];
                    sum += diff * diff;
                }
                offer(pos, sum);
            }
        }

        private void offer(int pos, double squared) {
            if (full() && squared < heapSquared[0]
                    && heapWeight + tree.weight(pos) - tree.weight(heapPosition[0]) >= target) {
                replaceTop(pos, squared); // the common case, one sift instead of a push and a pop
                trim();
            } else if (!full() || squared < heapSquared[0]) {
                push(pos, squared);
                trim();
            } else if (!beyond(squared) && Math.sqrt(squared) == Math.sqrt(heapSquared[0])) {
                addTie(pos, squared, Math.sqrt(heapSquared[0]));
            }
        }

        /** Drops the farthest entries while the others still hold the target; equal-distance ones become ties. */
        private void trim() {
            while (heapSize > 1 && heapWeight - tree.weight(heapPosition[0]) >= target) {
                int pos = heapPosition[0];
                double squared = heapSquared[0];
                heapWeight -= tree.weight(pos);
                popTop();
                keepIfTie(pos, squared);
            }
        }

        /** Replaces the farthest entry by a nearer one; the dropped entry is kept as a tie if still at the limit. */
        private void replaceTop(int pos, double squared) {
            int dropped = heapPosition[0];
            double droppedSquared = heapSquared[0];
            heapWeight += tree.weight(pos) - tree.weight(dropped);
            siftDownFromTop(pos, squared);
            keepIfTie(dropped, droppedSquared);
        }

        /** After the limit moved down: forget ties farther than it, keep the dropped entry if it is at it. */
        private void keepIfTie(int dropped, double droppedSquared) {
            boolean mayTie = droppedSquared <= heapSquared[0] * TIE_MARGIN + Double.MIN_NORMAL;
            if (ties == 0 && !mayTie) {
                return;
            }
            double limit = Math.sqrt(heapSquared[0]);
            if (ties > 0 && tieDistance != limit) {
                ties = 0;
            }
            if (mayTie && Math.sqrt(droppedSquared) == limit) {
                addTie(dropped, droppedSquared, limit);
            }
        }

        private void addTie(int pos, double squared, double distance) {
            if (ties == tiePosition.length) {
                tiePosition = Arrays.copyOf(tiePosition, ties * 2);
                tieSquared = Arrays.copyOf(tieSquared, ties * 2);
            }
            tiePosition[ties] = pos;
            tieSquared[ties++] = squared;
            tieDistance = distance;
        }

        private void push(int pos, double squared) {
            if (heapSize == heapSquared.length) {
                heapSquared = Arrays.copyOf(heapSquared, heapSize * 2);
                heapPosition = Arrays.copyOf(heapPosition, heapSize * 2);
            }
            int i = heapSize++;
            while (i > 0) {
                int parent = (i - 1) >>> 1;
                if (heapSquared[parent] >= squared) {
                    break;
                }
                heapSquared[i] = heapSquared[parent];
                heapPosition[i] = heapPosition[parent];
                i = parent;
            }
            heapSquared[i] = squared;
            heapPosition[i] = pos;
            heapWeight += tree.weight(pos);
        }

        private void popTop() {
            heapSize--;
            siftDownFromTop(heapPosition[heapSize], heapSquared[heapSize]);
        }

        /** Puts an entry at the top of the max-heap and sifts it down to its place. */
        private void siftDownFromTop(int pos, double squared) {
            int i = 0;
            while (true) {
                int l = 2 * i + 1;
                if (l >= heapSize) {
                    break;
                }
                int c = l + 1 < heapSize && heapSquared[l + 1] > heapSquared[l] ? l + 1 : l;
                if (heapSquared[c] <= squared) {
                    break;
                }
                heapSquared[i] = heapSquared[c];
                heapPosition[i] = heapPosition[c];
                i = c;
            }
            heapSquared[i] = squared;
            heapPosition[i] = pos;
        }

        /** Empties heap and ties into {@link #sortedSquared}/{@link #sortedPosition}, ascending; returns the count. */
        int sortedCount() {
            int tieCount = ties > 0 && tieDistance == Math.sqrt(heapSquared[0]) ? ties : 0;
            int count = heapSize + tieCount;
            if (sortedSquared.length < count) {
                sortedSquared = new double[count * 2];
                sortedPosition = new int[count * 2];
            }
            for (int i = heapSize - 1; i >= 0; i--) {
                sortedSquared[i] = heapSquared[0];
                sortedPosition[i] = heapPosition[0];
                popTop();
            }
            int base = count - tieCount;
            for (int i = 0; i < tieCount; i++) {
                sortedSquared[base + i] = tieSquared[i];
                sortedPosition[base + i] = tiePosition[i];
            }
            return count;
        }
    }
}
