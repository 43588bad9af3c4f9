package org.tufa.analysis.cluster;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/**
 * Label spreading against scikit-learn 1.2.1's {@code LabelSpreading} (fixtures from make_label_spreading_fixtures.py
 * beside the test resources): same label distributions within 1e-9, same labels, same number of iterations, for the
 * RBF and the kNN graph, defaults and other gamma, k, alpha, tolerance, and a run stopped by max_iter (which leaves
 * samples no label has reached yet).
 */
class LabelSpreadingTest {

    @ParameterizedTest
    @ValueSource(strings = {"blobs2d_rbf", "blobs2d_knn", "blobs3d_rbf", "blobs3d_knn", "moons_knn",
        "moons_knn_short"})
    void sameDistributionsAsScikitLearn(String name) {
        Fixtures.Table data = Fixtures.read("spreading_" + name + ".csv");
        Fixtures.Table params = Fixtures.read("spreading_" + name + "_params.csv");
        String[] p = params.rows().get(0);
        LabelSpreading.Parameters parameters = new LabelSpreading.Parameters(
                p[params.column("kernel")].equals("rbf") ? LabelSpreading.Kernel.RBF : LabelSpreading.Kernel.KNN,
                Double.parseDouble(p[params.column("gamma")]), Integer.parseInt(p[params.column("n_neighbors")]),
                Double.parseDouble(p[params.column("alpha")]), Integer.parseInt(p[params.column("max_iter")]),
                Double.parseDouble(p[params.column("tol")]));
        int classes = Integer.parseInt(p[params.column("classes")]);
        LabelSpreadingResult r = LabelSpreading.fit(data.matrix("x"), data.ints("y"), classes, parameters);
        double[][] expected = data.matrix("p");
        for (int i = 0; i < data.size(); i++) {
            assertArrayEquals(expected[i], r.distributions()[i], 1e-9, name + " sample " + i);
        }
        // scikit-learn labels a sample no label reached (all-zero distribution) with the first class; tufa with -1.
        int[] labels = data.ints("label");
        for (int i = 0; i < labels.length; i++) {
            boolean reached = java.util.Arrays.stream(expected[i]).sum() > 0;
            assertEquals(reached ? labels[i] : -1, r.labels()[i], name + " label of sample " + i);
        }
        assertEquals(Integer.parseInt(p[params.column("n_iter")]), r.iterations(), name + " iterations");
        assertEquals(!name.endsWith("_short"), r.converged(), name + " converged");
    }

    /** Worked example, computed by hand: three points on a line, kNN with k = 2 (each point and its nearest). */
    @Test
    void workedChain() {
        // x = 0, 1, 3: nearest others are 1 -> 0 (tie 0 and 3? no: |1-0| = 1 < |3-1| = 2), 0 -> 1, 3 -> 1.
        // W: 0->1, 1->0, 2->1. In-degrees: d0 = 1, d1 = 2, d2 = 0 (taken as 1).
        // S01 = 1/(1*sqrt2), S10 = 1/(sqrt2*1), S21 = 1/(1*sqrt2). Label 0 on sample 0, alpha 0.5, one step:
        // F1 = 0.5 S Y + 0.5 Y: sample 0: 0.5*0 + 0.5 = 0.5; sample 1: 0.5/sqrt2; sample 2: 0.
        LabelSpreadingResult r = LabelSpreading.fit(new double[][] {{0}, {1}, {3}}, new int[] {0, -1, -1}, 2,
                new LabelSpreading.Parameters(LabelSpreading.Kernel.KNN, 1, 2, 0.5, 1, 0));
        assertEquals(1, r.iterations());
        assertArrayEquals(new double[] {1, 0}, r.distributions()[0], 1e-15);
        assertArrayEquals(new double[] {1, 0}, r.distributions()[1], 1e-15, "normalised 0.5/sqrt2 -> 1");
        assertArrayEquals(new double[] {0, 0}, r.distributions()[2], 0, "not reached after one step");
        assertEquals(-1, r.labels()[2]);
        assertEquals(0, r.confidence(2));
        // A second step reaches it through sample 1.
        LabelSpreadingResult two = LabelSpreading.fit(new double[][] {{0}, {1}, {3}}, new int[] {0, -1, -1}, 2,
                new LabelSpreading.Parameters(LabelSpreading.Kernel.KNN, 1, 2, 0.5, 2, 0));
        assertEquals(0, two.labels()[2]);
    }

    @Test
    void equalSamplesAndTiesAreDeterministic() {
        double[][] x = new double[40][];
        int[] y = new int[40];
        for (int i = 0; i < 40; i++) {
            x[i] = new double[] {i % 4, i % 4 == 3 ? 1 : 0};
            y[i] = i == 0 ? 0 : i == 3 ? 1 : -1;
        }
        LabelSpreading.Parameters p = new LabelSpreading.Parameters(LabelSpreading.Kernel.KNN, 1, 5, 0.9, 100, 1e-9);
        LabelSpreadingResult a = LabelSpreading.fit(x, y, 2, p);
        LabelSpreadingResult b = LabelSpreading.fit(x.clone(), y.clone(), 2, p);
        for (int i = 0; i < 40; i++) {
            assertArrayEquals(a.distributions()[i], b.distributions()[i], 0);
        }
        // Runs of ten equal samples: each equal to sample 0 gets its label, each equal to sample 3 the other.
        assertEquals(0, a.labels()[4]);
        assertEquals(1, a.labels()[7]);
    }

    @Test
    void refusesWhatItCannotDo() {
        assertThrows(IllegalArgumentException.class, () -> new LabelSpreading.Parameters(
                LabelSpreading.Kernel.RBF, 20, 7, 1.0, 30, 1e-3));
        assertThrows(IllegalArgumentException.class, () -> LabelSpreading.fit(new double[][] {{0}}, new int[] {2}, 2,
                LabelSpreading.Parameters.DEFAULTS));
        double[][] big = new double[LabelSpreading.MAX_DENSE + 1][] ;
        for (int i = 0; i < big.length; i++) {
            big[i] = new double[] {i};
        }
        int[] none = new int[big.length];
        java.util.Arrays.fill(none, -1);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> LabelSpreading.fit(big, none,
                1, LabelSpreading.Parameters.DEFAULTS));
        assertTrue(e.getMessage().contains("dense"), e.getMessage());
    }
}
