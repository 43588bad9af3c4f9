package org.tufa.analysis.cluster;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/**
 * OPTICS against scikit-learn 1.2.1 (fixtures by make_fixtures.py) and against the worked values of Ankerst et al.
 * 1999 definitions computed by hand in the field notes (section 5).
 */
class OpticsTest {

    private static final double INF = Double.POSITIVE_INFINITY;
    private static final double[][] LINE = {{0}, {1}, {2}, {10}, {11}, {12}, {30}};

    // Hand-computed from the definitions (field notes section 5), and equal to scikit-learn 1.2.1's output.
    @Test
    void lineWithMinPts2MatchesWorkedExample() {
        OpticsResult r = Optics.fit(LINE, 2);
        assertArrayEquals(new int[] {0, 1, 2, 3, 4, 5, 6}, r.ordering());
        assertArrayEquals(new double[] {INF, 1, 1, 8, 1, 1, 18}, r.reachability());
        assertArrayEquals(new double[] {1, 1, 1, 1, 1, 1, 18}, r.coreDistance());
        assertArrayEquals(new int[] {-1, 0, 1, 2, 3, 4, 5}, r.predecessor());
    }

    @Test
    void lineWithMinPts3MatchesWorkedExample() {
        OpticsResult r = Optics.fit(LINE, 3);
        assertArrayEquals(new int[] {0, 1, 2, 3, 4, 5, 6}, r.ordering());
        assertArrayEquals(new double[] {INF, 2, 1, 8, 2, 1, 18}, r.reachability());
        assertArrayEquals(new double[] {2, 1, 2, 2, 1, 2, 19}, r.coreDistance());
    }

    // scikit-learn 1.2.1 (optics_<name>.csv): exact equality of ordering, reachability, core distance and
    // predecessor on the 1-D sets, whose distances are exact integers.
    @ParameterizedTest
    @ValueSource(strings = {"line_minpts2", "line_minpts3"})
    void smallSetsEqualScikitLearnExactly(String name) {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load(name);
        OpticsResult r = Optics.fit(c.x(), c.minPts());
        assertArrayEquals(c.ordering(), r.ordering());
        assertArrayEquals(c.samples().ints("pred"), r.predecessor());
        assertArrayEquals(c.samples().doubles("core"), r.coreDistance(), 1e-12);
        assertArrayEquals(c.samples().doubles("reach"), r.reachability(), 1e-12);
    }

    // Field notes section 5: jump reachabilities 2.2627 into the fault grid and 3.4409 for the two noise points.
    @Test
    void gridJumpReachabilities() {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load("grid");
        OpticsResult r = Optics.fit(c.x(), 4);
        double[] plot = r.reachabilityPlot();
        assertEquals(2.2627, plot[25], 1e-4);
        assertEquals(3.4409, plot[34], 1e-4);
        assertEquals(3.4409, plot[35], 1e-4);
    }

    // Other sets: near-ties make the exact order implementation-dependent (scikit-learn rounds to 15 decimals and
    // uses a dot-product distance; on the 0.1-spaced grid 0.1 and 0.30000000000000004 - 0.2 tie only after its
    // rounding), so compare core distances to 1e-12 and check the order by exact replay. lattice3d (1,500 points on
    // a 0.5 lattice, most of them duplicates) and walk1d (1,200 values rounded to 0.1) are the tie-heavy sets.
    @ParameterizedTest
    @ValueSource(strings = {"grid", "blobs2d", "operating3d", "lattice3d", "walk1d"})
    void largerSetsAgreeWithScikitLearnAndReplayExactly(String name) {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load(name);
        OpticsResult r = Optics.fit(c.x(), c.minPts());
        assertArrayEquals(c.samples().doubles("core"), r.coreDistance(), 1e-12);
        ClusterChecks.assertValidOrdering(c.x(), r, 0.0);
        // scikit-learn's own order is valid under our exact replay too, within its rounding.
        OpticsResult theirs = new OpticsResult(c.ordering(), c.samples().doubles("reach"),
                c.samples().doubles("core"), c.samples().ints("pred"), c.minPts(), INF);
        ClusterChecks.assertValidOrdering(c.x(), theirs, 1e-12);
    }

    @Test
    void minPtsOneGivesZeroCoreDistances() {
        OpticsResult r = Optics.fit(LINE, 1);
        for (int i = 0; i < LINE.length; i++) {
            assertEquals(0.0, r.coreDistanceOf(i));
        }
        assertArrayEquals(new double[] {INF, 1, 1, 8, 1, 1, 18}, r.reachability());
    }

    @Test
    void boundedEpsLeavesDistantPointsUnreachable() {
        OpticsResult r = Optics.fit(LINE, 2, 5.0);
        assertArrayEquals(new int[] {0, 1, 2, 3, 4, 5, 6}, r.ordering());
        // 10 starts a new component, 30 has no neighbour within 5: no core distance, no reachability.
        assertArrayEquals(new double[] {INF, 1, 1, INF, 1, 1, INF}, r.reachability());
        assertArrayEquals(new double[] {1, 1, 1, 1, 1, 1, INF}, r.coreDistance());
        assertArrayEquals(new int[] {-1, 0, 1, -1, 3, 4, -1}, r.predecessor());
    }

    // Property checks on random data with a fixed seed: unbounded and bounded maxEps, all dimensions, duplicates
    // included; the ordering is replayed against the definitions (brute force, ClusterChecks).
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 5})
    void randomDataReplaysExactlyAndPathsAgree(int dim) {
        SplittableRandom random = new SplittableRandom(42 + dim);
        double[][] x = new double[400][dim];
        for (int i = 0; i < x.length; i++) {
            for (int j = 0; j < dim; j++) {
                // coarse grid: many exact ties and duplicates
                x[i][j] = i % 7 == 0 && i > 0 ? x[i - 1][j] : Math.round(random.nextDouble(0, 20)) / 2.0;
            }
        }
        for (int minPts : new int[] {1, 4, 10}) {
            OpticsResult unbounded = Optics.fit(x, minPts);
            ClusterChecks.assertValidOrdering(x, unbounded, 0.0);
            // a radius larger than the data's diameter must reproduce the unbounded result exactly
            OpticsResult wide = Optics.fit(x, minPts, 1e6);
            assertArrayEquals(unbounded.ordering(), wide.ordering());
            assertArrayEquals(unbounded.reachability(), wide.reachability());
            assertArrayEquals(unbounded.coreDistance(), wide.coreDistance());
            assertArrayEquals(unbounded.predecessor(), wide.predecessor());
            OpticsResult bounded = Optics.fit(x, minPts, 1.5);
            ClusterChecks.assertValidOrdering(x, bounded, 0.0);
        }
    }

    // The pass tufa used before the k-d tree ordering (ReferenceOptics, O(n^2)) against the new one: identical
    // ordering, reachability, core distances and predecessors, bit for bit, on data shaped like the pipeline's
    // (blobs with noise, smoothed trajectories with plateaus, rounded values with long runs of duplicates, exact
    // lattice ties) and with finite maxEps. Seeded data; the reference itself is checked against scikit-learn by the
    // fixture tests above and by the replay.
    @ParameterizedTest
    @ValueSource(strings = {"blobs", "trajectory", "rounded", "lattice", "line", "clumps"})
    void newPassEqualsReferencePass(String shape) {
        for (int dim : new int[] {1, 2, 3, 4}) {
            for (int n : new int[] {30, 700, 3000}) {
                double[][] x = Shapes.of(shape, n, dim, 1000L * dim + n);
                for (int minPts : new int[] {1, 3, 20}) {
                    for (double maxEps : new double[] {INF, 0.3, 2.0}) {
                        String what = shape + " n=" + n + " dim=" + dim + " minPts=" + minPts + " maxEps=" + maxEps;
                        OpticsResult expected = ReferenceOptics.fit(x, minPts, maxEps);
                        OpticsResult actual = Optics.fit(x, minPts, maxEps);
                        assertArrayEquals(expected.coreDistance(), actual.coreDistance(), what);
                        assertArrayEquals(expected.ordering(), actual.ordering(), what);
                        assertArrayEquals(expected.reachability(), actual.reachability(), what);
                        assertArrayEquals(expected.predecessor(), actual.predecessor(), what);
                    }
                }
            }
        }
    }

    // The exact replay of the definitions (ClusterChecks) at growing sizes of grid data, where almost every
    // distance ties with many others and most samples are duplicates.
    @ParameterizedTest
    @ValueSource(ints = {50, 400, 1500})
    void gridDataWithTiesReplaysAtSeveralSizes(int n) {
        for (int dim : new int[] {1, 2, 3}) {
            double[][] x = Shapes.of("lattice", n, dim, n + dim);
            for (int minPts : new int[] {2, 5, 20}) {
                ClusterChecks.assertValidOrdering(x, Optics.fit(x, minPts), 0.0);
            }
        }
    }

    @Test
    void flatOverloadEqualsRowOverload() {
        double[] flat = {0, 0, 1, 0, 0, 1, 5, 5, 5, 6};
        double[][] rows = {{0, 0}, {1, 0}, {0, 1}, {5, 5}, {5, 6}};
        assertEquals(Optics.fit(rows, 2), Optics.fit(flat, 5, 2, 2, INF));
    }

    @Test
    void resultIsImmutable() {
        OpticsResult r = Optics.fit(LINE, 2);
        r.reachability()[1] = 99;
        r.ordering()[0] = 6;
        assertEquals(1.0, r.reachabilityOf(1));
        assertEquals(0, r.sampleAt(0));
    }

    @Test
    void invalidInputIsRejectedWithAReason() {
        assertMessage("at least MinPts = 8 samples, got 7", () -> Optics.fit(LINE, 8));
        assertMessage("MinPts must be at least 1", () -> Optics.fit(LINE, 0));
        assertMessage("got none", () -> Optics.fit(new double[0][], 2));
        assertMessage("row 1 has 1 values, row 0 has 2", () -> Optics.fit(new double[][] {{1, 2}, {3}}, 1));
        assertMessage("sample 1, feature 0 is NaN", () -> Optics.fit(new double[][] {{1}, {Double.NaN}}, 1));
        assertMessage("is Infinity", () -> Optics.fit(new double[][] {{1}, {INF}}, 1));
        assertMessage("maxEps must be", () -> Optics.fit(LINE, 2, -1));
        assertMessage("at least one feature", () -> Optics.fit(new double[][] {{}, {}}, 1));
    }

    private static void assertMessage(String fragment, org.junit.jupiter.api.function.Executable call) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call);
        assertTrue(e.getMessage().contains(fragment), e.getMessage());
        assertTrue(!e.getMessage().contains("\n"), "one line");
    }

    @Test
    void orderingIsAPermutation() {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load("blobs2d");
        int[] ordering = Optics.fit(c.x(), c.minPts()).ordering();
        Arrays.sort(ordering);
        for (int i = 0; i < ordering.length; i++) {
            assertEquals(i, ordering[i]);
        }
    }
}
