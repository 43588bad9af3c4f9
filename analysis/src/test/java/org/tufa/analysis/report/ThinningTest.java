package org.tufa.analysis.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;

/**
 * Display thinning: block means and reachability columns worked by hand; the scatter subset keeps small clusters and
 * is deterministic.
 */
class ThinningTest {

    @Test
    void blockMeansIgnoreMissingValues() {
        double[] v = {1, 2, 3, Double.NaN, 5, Double.NaN, Double.NaN, Double.NaN, 9};
        // blocks of 4: (1+2+3)/3 = 2; (5)/1 = 5; (9)/1 = 9 (short last block)
        assertArrayEquals(new double[] {2, 5, 9}, Thinning.blockMeans(v, 4), 1e-12);
        double[] withEmpty = Thinning.blockMeans(v, 2);
        assertEquals(5, withEmpty.length);
        assertTrue(Double.isNaN(withEmpty[3]), "a block without values stays NaN: a gap, not a zero");
        assertArrayEquals(v, Thinning.blockMeans(v, 1), 0);
    }

    @Test
    void subsetKeepsEverythingWhenSmall() {
        int[] labels = {0, 0, 1, -1};
        assertArrayEquals(new int[] {0, 1, 2, 3}, Thinning.subset(labels, 10));
    }

    @Test
    void subsetKeepsSmallClustersAndStaysNearTheBudget() {
        int n = 20_000;
        int[] labels = new int[n];
        for (int i = 0; i < n; i++) {
            labels[i] = i % 100 == 7 ? 1 : i % 500 == 3 ? -1 : 0; // 200 fault, 40 noise, the rest normal
        }
        int[] pick = Thinning.subset(labels, 2000);
        int[] perLabel = new int[3];
        for (int i : pick) {
            perLabel[labels[i] + 1]++;
        }
        assertEquals(40, perLabel[0], "noise below the per-label floor is kept whole");
        assertEquals(200, perLabel[2], "the small fault cluster is kept whole (floor max/10 = 200)");
        assertTrue(perLabel[1] >= 1900 && perLabel[1] <= 2000, "normal thinned to its share: " + perLabel[1]);
        for (int k = 1; k < pick.length; k++) {
            assertTrue(pick[k] > pick[k - 1], "ascending, no repeats");
        }
        assertArrayEquals(pick, Thinning.subset(labels.clone(), 2000), "deterministic");
        assertTrue(Arrays.stream(pick).allMatch(i -> i >= 0 && i < n));
    }

    @Test
    void reachabilityColumnsKeepTheTallestBarPerClusterAndColumn() {
        // Worked by hand: 7 positions in columns of 3 -> [0,3), [3,6), [6,7); centres 1, 4, 7 (all columns share one
        // width, so the short last one reaches past the axis end, which clips it).
        double[] plot = {Double.POSITIVE_INFINITY, 0.5, 0.7, 0.2, 0.9, 0.3, 0.4};
        int[] labels = {0, 0, 0, 1, -1, 1, 1};
        Thinning.Bars b = Thinning.reachabilityColumns(plot, labels, 3);
        assertEquals(3.0, b.width());
        assertArrayEquals(new double[] {1, 4, 4, 7}, b.x(), 0);
        assertArrayEquals(new int[] {0, -1, 1, 1}, b.label());
        assertArrayEquals(new double[] {Double.POSITIVE_INFINITY, 0.9, 0.3, 0.4}, b.height(), 0);
    }

    @Test
    void reachabilityColumnsAreTheSamplesWhenFew() {
        double[] plot = {1, 2, 3};
        int[] labels = {-1, 0, 0};
        Thinning.Bars b = Thinning.reachabilityColumns(plot, labels, 3);
        assertEquals(1.0, b.width());
        assertArrayEquals(new double[] {0, 1, 2}, b.x(), 0);
        assertArrayEquals(plot, b.height(), 0);
        assertArrayEquals(labels, b.label());
    }

    @Test
    void reachabilityColumnsBoundTheBarCount() {
        int n = 200_000;
        double[] plot = new double[n];
        int[] labels = new int[n];
        for (int i = 0; i < n; i++) {
            plot[i] = (i * 7919) % 1000 / 100.0;
            labels[i] = i < 150_000 ? 0 : i < 190_000 ? 1 : -1;
        }
        Thinning.Bars b = Thinning.reachabilityColumns(plot, labels, 1440);
        assertTrue(b.size() <= 1440 + 2, "one bar per column, plus one where a cluster boundary splits a column");
        double max = Arrays.stream(plot).max().orElseThrow();
        assertEquals(max, Arrays.stream(b.height()).max().orElseThrow(), 0, "the tallest bar survives");
    }
}
