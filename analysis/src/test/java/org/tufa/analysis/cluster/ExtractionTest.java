package org.tufa.analysis.cluster;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Threshold and xi extraction against scikit-learn 1.2.1's cluster_optics_dbscan and cluster_optics_xi (fixtures by
 * make_fixtures.py, with the predecessor correction of Schubert &amp; Gertz 2018 as fixed in scikit-learn 1.3), the
 * worked examples of the field notes (section 5), and ground truth of the generated sets.
 */
class ExtractionTest {

    private static final double[][] LINE = {{0}, {1}, {2}, {10}, {11}, {12}, {30}};

    /** scikit-learn's OPTICS result from a fixture, as our record. */
    private static OpticsResult theirs(Fixtures.OpticsCase c) {
        return new OpticsResult(c.ordering(), c.samples().doubles("reach"), c.samples().doubles("core"),
                c.samples().ints("pred"), c.minPts(), Double.POSITIVE_INFINITY);
    }

    private static XiParameters sklearnXi(Fixtures.OpticsCase c) {
        return XiParameters.of(c.xi(), c.minClusterSize()).with(XiParameters.TrailingPoint.ABSORB_LIKE_SCIKIT_LEARN);
    }

    private static List<int[]> sklearnClusters(Fixtures.OpticsCase c) {
        int[] starts = c.clusters().ints("start");
        int[] ends = c.clusters().ints("end");
        List<int[]> out = new ArrayList<>();
        for (int i = 0; i < starts.length; i++) {
            int s = starts[i];
            int e = ends[i];
            if (out.stream().noneMatch(u -> u[0] == s && u[1] == e)) {
                out.add(new int[] {s, e});
            }
        }
        return out;
    }

    // Field notes section 5: threshold 3 on the line gives [0, 0, 0, 1, 1, 1, -1].
    @Test
    void thresholdOnLine() {
        assertArrayEquals(new int[] {0, 0, 0, 1, 1, 1, -1}, Extraction.threshold(Optics.fit(LINE, 2), 3.0));
    }

    // Our threshold cut applied to scikit-learn's own OPTICS result must give cluster_optics_dbscan's labels
    // exactly; applied to our OPTICS result, the same labels up to renaming.
    @ParameterizedTest
    @ValueSource(strings = {"line_minpts2", "line_minpts3", "grid", "blobs2d", "operating3d"})
    void thresholdMatchesScikitLearn(String name) {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load(name);
        int[] expected = c.samples().ints("threshold");
        assertArrayEquals(expected, Extraction.threshold(theirs(c), c.eps()));
        int[] ours = Extraction.threshold(Optics.fit(c.x(), c.minPts()), c.eps());
        assertTrue(ClusterChecks.sameUpToRenaming(expected, ours), name);
    }

    // Our xi extraction applied to scikit-learn's OPTICS result must give cluster_optics_xi's clusters (same
    // intervals, same order) and labels exactly, with the scikit-learn trailing point rule.
    @ParameterizedTest
    @ValueSource(strings = {"line_minpts2", "line_minpts3", "grid", "blobs2d", "operating3d"})
    void xiOnScikitLearnOrderingMatchesExactly(String name) {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load(name);
        XiClusters xi = Extraction.xi(theirs(c), sklearnXi(c));
        List<int[]> expected = sklearnClusters(c);
        assertEquals(expected.size(), xi.clusters().size(), name);
        for (int i = 0; i < expected.size(); i++) {
            assertEquals(expected.get(i)[0], xi.clusters().get(i).start(), name + " cluster " + i);
            assertEquals(expected.get(i)[1], xi.clusters().get(i).end(), name + " cluster " + i);
        }
        assertArrayEquals(c.samples().ints("xi"), xi.leafLabels());
    }

    // On our own OPTICS result the leaf labels agree up to renaming, or (where a near-tie moves a border point)
    // with adjusted Rand index >= 0.95.
    @ParameterizedTest
    @ValueSource(strings = {"line_minpts2", "line_minpts3", "grid", "blobs2d", "operating3d"})
    void xiOnOurOrderingAgreesWithScikitLearn(String name) {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load(name);
        int[] ours = Extraction.xi(Optics.fit(c.x(), c.minPts()), sklearnXi(c)).leafLabels();
        int[] expected = c.samples().ints("xi");
        assertTrue(ClusterChecks.sameUpToRenaming(expected, ours)
                || ClusterChecks.adjustedRand(expected, ours) >= 0.95, name);
    }

    // Field notes section 5: scikit-learn's appended infinity absorbs the trailing outlier 30 into the last
    // cluster; our default rule keeps it as noise. With a flat end both rules agree.
    @Test
    void trailingPointConvention() {
        OpticsResult r = Optics.fit(LINE, 2);
        XiParameters ours = XiParameters.of(0.05, 2);
        assertArrayEquals(new int[] {0, 0, 0, 1, 1, 1, -1}, Extraction.xi(r, ours).leafLabels());
        assertArrayEquals(new int[] {0, 0, 0, 1, 1, 1, 1},
                Extraction.xi(r, ours.with(XiParameters.TrailingPoint.ABSORB_LIKE_SCIKIT_LEARN)).leafLabels());

        OpticsResult flatEnd = Optics.fit(Arrays.copyOf(LINE, 6), 2);
        for (XiParameters.TrailingPoint rule : XiParameters.TrailingPoint.values()) {
            assertArrayEquals(new int[] {0, 0, 0, 1, 1, 1}, Extraction.xi(flatEnd, ours.with(rule)).leafLabels());
        }
    }

    // Field notes section 5: on the grid example, threshold 0.5 gives 25 + 9 + 2 noise; xi 0.05 absorbs (5, 0).
    @Test
    void gridExampleLabels() {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load("grid");
        OpticsResult r = Optics.fit(c.x(), 4);
        int[] threshold = Extraction.threshold(r, 0.5);
        assertEquals(25, count(threshold, threshold[0]));
        assertEquals(9, count(threshold, threshold[25]));
        assertEquals(2, count(threshold, -1));
        int[] sk = Extraction.xi(r, XiParameters.of(0.05, 4)
                .with(XiParameters.TrailingPoint.ABSORB_LIKE_SCIKIT_LEARN)).leafLabels();
        assertEquals(sk[25], sk[34], "(5, 0) absorbed into the fault grid's cluster, as scikit-learn");
        int[] ours = Extraction.xi(r, XiParameters.of(0.05, 4)).leafLabels();
        assertEquals(-1, ours[r.sampleAt(35)], "the trailing outlier stays noise under our rule");
        assertEquals(10, count(ours, ours[25]), "fault grid plus the noise point processed inside it");
    }

    @Test
    void hierarchyLinksNestedClusters() {
        XiClusters xi = Extraction.xi(Optics.fit(LINE, 2),
                XiParameters.of(0.05, 2).with(XiParameters.TrailingPoint.ABSORB_LIKE_SCIKIT_LEARN));
        // scikit-learn: [0, 2], [3, 6], [0, 6]
        assertEquals(3, xi.clusters().size());
        XiCluster whole = xi.clusters().get(2);
        assertEquals(0, whole.start());
        assertEquals(6, whole.end());
        assertEquals(-1, whole.parent());
        assertEquals(List.of(0, 1), whole.children());
        assertEquals(2, xi.clusters().get(0).parent());
        assertEquals(2, xi.clusters().get(1).parent());
        assertEquals(List.of(whole), xi.roots());
        // literal outermost clusters: everything in one cluster; with merge coverage the two real clusters
        assertArrayEquals(new int[] {0, 0, 0, 0, 0, 0, 0}, xi.labelsOf(xi.topLevel(Double.POSITIVE_INFINITY)));
        // numbered by decreasing size: [3, 6] (4 points) is 0
        assertArrayEquals(new int[] {1, 1, 1, 0, 0, 0, 0}, xi.labelsOf(xi.topLevel(0.8)));
    }

    @ParameterizedTest
    @ValueSource(strings = {"blobs2d", "operating3d"})
    void hierarchyIsLaminar(String name) {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load(name);
        XiClusters xi = Extraction.xi(Optics.fit(c.x(), c.minPts()), XiParameters.of(c.xi(), c.minClusterSize()));
        for (XiCluster a : xi.clusters()) {
            for (XiCluster b : xi.clusters()) {
                boolean disjoint = a.end() < b.start() || b.end() < a.start();
                assertTrue(disjoint || a.isInside(b) || b.isInside(a), a + " overlaps " + b);
            }
            if (a.parent() >= 0) {
                assertTrue(a.isInside(xi.clusters().get(a.parent())));
                assertTrue(xi.clusters().get(a.parent()).children().contains(a.id()));
            }
        }
    }

    // scikit-learn's leaf labelling turns the big blob into noise when it holds small sub-clusters; the top-level
    // labelling keeps it whole. Generated truth of blobs2d: blob 0 (900 points at the origin).
    @Test
    void topLevelKeepsTheBigClusterThatLeafLabellingBreaks() {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load("blobs2d");
        int[] truth = c.samples().ints("truth");
        int[] leaf = c.samples().ints("xi");
        int bigAsNoise = 0;
        for (int i = 0; i < truth.length; i++) {
            if (truth[i] == 0 && leaf[i] == -1) {
                bigAsNoise++;
            }
        }
        assertTrue(bigAsNoise > 300, "scikit-learn leaf labels leave " + bigAsNoise + " of 900 as noise");
        AutoClusters auto = Extraction.auto(Optics.fit(c.x(), c.minPts()));
        assertEquals(3, auto.clusterCount());
        assertTrue(ClusterChecks.adjustedRand(truth, auto.labels()) >= 0.9,
                "ARI " + ClusterChecks.adjustedRand(truth, auto.labels()));
        int[] labels = auto.labels();
        assertEquals(0, majority(labels, truth, 0), "the largest blob is label 0");
    }

    // The operating-like set: normal blob (truth 0, 1600), fault blobs (truth 1: 120, truth 2: 60), 70 noise.
    @Test
    void autoFindsNormalAndFaultsInOperatingData() {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load("operating3d");
        int[] truth = c.samples().ints("truth");
        AutoClusters auto = Extraction.auto(Optics.fit(c.x(), c.minPts()));
        int[] labels = auto.labels();
        assertEquals(3, auto.clusterCount());
        assertEquals(0, majority(labels, truth, 0), "normal operation is the largest cluster");
        assertEquals(1, majority(labels, truth, 1));
        assertEquals(2, majority(labels, truth, 2));
        double ari = ClusterChecks.adjustedRand(truth, labels);
        assertTrue(ari >= 0.95, "ARI " + ari);
        assertTrue(auto.clusters().get(0).size() >= auto.clusters().get(1).size());
    }

    @Test
    void autoIsDeterministic() {
        Fixtures.OpticsCase c = Fixtures.OpticsCase.load("operating3d");
        assertEquals(Extraction.auto(Optics.fit(c.x(), c.minPts())), Extraction.auto(Optics.fit(c.x(), c.minPts())));
    }

    @Test
    void adjustedRandMatchesScikitLearn() {
        Fixtures.Table t = Fixtures.read("ari_example.csv");
        assertEquals(t.doubles("ari")[0], ClusterChecks.adjustedRand(t.ints("a"), t.ints("b")), 1e-12);
        assertEquals(1.0, ClusterChecks.adjustedRand(t.ints("a"), t.ints("a")), 1e-12);
    }

    @Test
    void invalidParametersAreRejected() {
        assertThrows(IllegalArgumentException.class, () -> XiParameters.of(0, 5));
        assertThrows(IllegalArgumentException.class, () -> XiParameters.of(1, 5));
        assertThrows(IllegalArgumentException.class, () -> XiParameters.of(0.05, 1));
        assertThrows(IllegalArgumentException.class, () -> new AutoParameters(0.05, 1.5, 0.8));
        assertThrows(IllegalArgumentException.class, () -> Extraction.threshold(Optics.fit(LINE, 2), Double.NaN));
    }

    private static int count(int[] labels, int label) {
        return (int) Arrays.stream(labels).filter(l -> l == label).count();
    }

    /** The label most of the samples of a truth class carry. */
    private static int majority(int[] labels, int[] truth, int truthClass) {
        int[] votes = new int[labels.length + 1];
        for (int i = 0; i < labels.length; i++) {
            if (truth[i] == truthClass) {
                votes[labels[i] + 1]++;
            }
        }
        int best = 0;
        for (int l = 1; l < votes.length; l++) {
            if (votes[l] > votes[best]) {
                best = l;
            }
        }
        return best - 1;
    }
}
