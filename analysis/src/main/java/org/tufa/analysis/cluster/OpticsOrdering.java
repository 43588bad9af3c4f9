package org.tufa.analysis.cluster;

import java.util.Arrays;

/**
 * The OPTICS ordering of {@link Optics}, as a lazy form of Prim's algorithm; the argument that it is exact is in
 * {@link Optics}'s class comment. Per processed position (its first processed member) one entry in an indexed
 * min-heap; an entry's key is a lower bound of the best (reachability, sample) that position can still offer, or
 * that best itself.
 */
final class OpticsOrdering {

    /** Key sample of a lower bound: sorts before every real candidate with the same reachability. */
    private static final int BOUND = -1;
    /** Relative slack of a lifted bound: far above the rounding of three distances and two subtractions. */
    private static final double LIFT_SLACK = 1e-12;

    private static final byte FROM_LIST = 0;
    private static final byte FROM_SEARCH = 1;

    private final PointTree tree;
    private final NeighbourLists lists;
    private final double maxEps;

    // per position; valid once its first member is processed
    private final int[] stepOf;
    private final int[] representative;
    private final byte[] source;
    private final int[] ballEnd;     // end of the not yet exhausted part of the in-ball prefix
    private final int[] beyond;      // first list entry past the ball not known to be exhausted
    // entry keys: (reach, sample, step); sample BOUND marks a lower bound
    private final double[] keyReach;
    private final int[] keySample;
    private final int[] heap;
    private final int[] heapIndex;
    private int heapSize;

    private OpticsOrdering(PointTree tree, NeighbourLists lists, double maxEps) {
        this.tree = tree;
        this.lists = lists;
        this.maxEps = maxEps;
        int m = tree.size;
        stepOf = new int[m];
        representative = new int[m];
        Arrays.fill(representative, -1);
        source = new byte[m];
        ballEnd = new int[m];
        beyond = new int[m];
        for (int u = 0; u < m; u++) {
            ballEnd[u] = lists.start[u] + lists.inBall[u];
            beyond[u] = ballEnd[u];
        }
        keyReach = new double[m];
        keySample = new int[m];
        heap = new int[m];
        heapIndex = new int[m];
        Arrays.fill(heapIndex, -1);
    }

    /** Fills ordering, reachability and predecessor (by sample) for the tree's samples. */
    static void run(PointTree tree, NeighbourLists lists, double maxEps, int[] ordering, double[] reach, int[] pred) {
        new OpticsOrdering(tree, lists, maxEps).order(ordering, reach, pred);
    }

    private void order(int[] ordering, double[] reach, int[] pred) {
        int n = tree.samples;
        for (int step = 0; step < n; step++) {
            int sample;
            double r;
            int p;
            while (true) {
                if (heapSize == 0) { // a new component: the lowest unprocessed index, unreachable
                    sample = tree.firstUnprocessed();
                    r = Double.POSITIVE_INFINITY;
                    p = -1;
                    break;
                }
                int top = heap[0];
                int candidate = keySample[top];
                if (candidate != BOUND && tree.unprocessed(candidate)) {
                    sample = candidate;
                    r = keyReach[top];
                    p = representative[top];
                    break;
                }
                refresh(top, candidate == BOUND);
            }
            ordering[step] = sample;
            reach[sample] = r;
            pred[sample] = p;
            int pos = tree.positionOf[sample];
            tree.process(pos);
            if (representative[pos] < 0) {
                // Only the first member of a position gets an entry: a later one offers the same reachabilities
                // to everyone, and on a tie the earlier predecessor wins.
                representative[pos] = sample;
                stepOf[pos] = step;
                if (lists.core[pos] != Double.POSITIVE_INFINITY) {
                    source[pos] = FROM_LIST;
                    keyReach[pos] = Double.NEGATIVE_INFINITY;
                    keySample[pos] = BOUND;
                    if (fromList(pos, true)) {
                        insert(pos);
                    }
                }
            }
        }
    }

    /** Brings the top entry's key up to date: a tighter bound, the exact best, or removal. */
    private void refresh(int u, boolean wasBound) {
        boolean alive;
        if (source[u] == FROM_LIST) {
            alive = fromList(u, wasBound);
        } else {
            alive = fromSearch(u);
        }
        if (alive) {
            siftDown(heapIndex[u]);
        } else {
            remove(u);
        }
    }

    /**
     * The key from u's neighbour list: exact when an unprocessed listed sample remains, else the list bound.
     * A bound that already stood as the key gives way to a tree search. Returns false when u has nothing left.
     */
    private boolean fromList(int u, boolean boundStood) {
        int[] entries = lists.entries;
        double core = lists.core[u];
        // in-ball entries: all at reachability core; compact away exhausted positions
        int ballStart = lists.start[u];
        int end = ballEnd[u];
        int best = PointTree.NONE;
        for (int i = ballStart; i < end; ) {
            int next = tree.nextMember(entries[i]);
            if (next == PointTree.NONE) {
                int t = entries[i];
                entries[i] = entries[end - 1];
                entries[end - 1] = t;
                end--;
            } else {
                best = Math.min(best, next);
                i++;
            }
        }
        ballEnd[u] = end;
        if (best != PointTree.NONE) {
            keyReach[u] = core;
            keySample[u] = best;
            return true;
        }
        // past the ball: ascending distance, reachability = distance; a group of equal distances at a time
        int listEnd = lists.start[u + 1];
        int c = beyond[u];
        while (c < listEnd && tree.nextMember(entries[c]) == PointTree.NONE) {
            c++;
        }
        beyond[u] = c;
        if (c < listEnd) {
            double d = tree.distance(u, entries[c]);
            if (d > maxEps) {
                return false; // the list is sorted and closed: nothing within maxEps is left
            }
            for (int i = c; i < listEnd; i++) {
                int v = entries[i];
                if (tree.distance(u, v) != d) {
                    break;
                }
                best = Math.min(best, tree.nextMember(v));
            }
            keyReach[u] = Math.max(core, d);
            keySample[u] = best;
            return true;
        }
        double bound = lists.bound[u];
        if (bound >= maxEps) {
            return false; // everything unlisted is farther than the list bound, so beyond maxEps
        }
        if (boundStood && keySample[u] == BOUND) {
            source[u] = FROM_SEARCH;
            return fromSearch(u);
        }
        // unlisted samples are strictly farther than the bound: reachability >= nextUp(bound)
        keyReach[u] = Math.max(keyReach[u], Math.nextUp(bound));
        keySample[u] = BOUND;
        return true;
    }

    /** The exact key by a tree search; then lifts the bounds of u's listed neighbours. */
    private boolean fromSearch(int u) {
        double core = lists.core[u];
        tree.searchBest(u, core, maxEps);
        if (tree.bestSample() == PointTree.NONE) {
            lift(u, maxEps);
            return false;
        }
        keyReach[u] = tree.bestReach();
        keySample[u] = tree.bestSample();
        if (tree.bestReach() > core) {
            lift(u, tree.bestReach()); // the nearest unprocessed sample is exactly that far
        }
        return true;
    }

    /**
     * Every unprocessed sample is at least {@code nearest} from u (or beyond maxEps from u, when nearest is maxEps),
     * so by the triangle inequality at least nearest - d(u, v) from any v: a lower bound of all v can still offer.
     * Applied to u's listed neighbours whose key is not an exact, still unprocessed candidate.
     */
    private void lift(int u, double nearest) {
        if (nearest == Double.POSITIVE_INFINITY) {
            return; // nothing is left to bound
        }
        int[] entries = lists.entries;
        for (int i = lists.start[u], end = lists.start[u + 1]; i < end; i++) {
            int v = entries[i];
            if (v == u || heapIndex[v] < 0) {
                continue;
            }
            int s = keySample[v];
            if (s != BOUND && tree.unprocessed(s)) {
                continue;
            }
            double d = tree.distance(u, v);
            double lifted = nearest - d - LIFT_SLACK * (nearest + d);
            if (lifted > keyReach[v]) {
                keyReach[v] = lifted;
                keySample[v] = BOUND;
                siftDown(heapIndex[v]);
            }
        }
    }

    // ---------------------------------------------------------------- indexed binary min-heap by (reach, sample, step)

    private boolean less(int a, int b) {
        if (keyReach[a] != keyReach[b]) {
            return keyReach[a] < keyReach[b];
        }
        if (keySample[a] != keySample[b]) {
            return keySample[a] < keySample[b];
        }
        return stepOf[a] < stepOf[b];
    }

    private void insert(int u) {
        heap[heapSize] = u;
        heapIndex[u] = heapSize;
        siftUp(heapSize++);
    }

    private void remove(int u) {
        int i = heapIndex[u];
        heapIndex[u] = -1;
        heapSize--;
        if (i == heapSize) {
            return;
        }
        int last = heap[heapSize];
        heap[i] = last;
        heapIndex[last] = i;
        siftDown(i);
        siftUp(heapIndex[last]);
    }

    private void siftUp(int i) {
        int item = heap[i];
        while (i > 0) {
            int parent = (i - 1) >>> 1;
            if (!less(item, heap[parent])) {
                break;
            }
            heap[i] = heap[parent];
            heapIndex[heap[i]] = i;
            i = parent;
        }
        heap[i] = item;
        heapIndex[item] = i;
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
            heapIndex[heap[i]] = i;
            i = c;
        }
        heap[i] = item;
        heapIndex[item] = i;
    }
}
