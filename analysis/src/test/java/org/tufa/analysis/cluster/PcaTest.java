package org.tufa.analysis.cluster;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * PCA against scikit-learn 1.2.1 (PCA, StandardScaler) on the iris data (Fisher 1936, as shipped with scikit-learn;
 * fixtures by make_fixtures.py), and against the worked correlation-matrix cases of the field notes (section 6).
 */
class PcaTest {

    private static final double[] U = {1, 1, -1, -1};
    private static final double[] V = {1, -1, 1, -1};
    private static final double[] W = {1, -1, -1, 1};

    private static double[][] iris() {
        Fixtures.Table t = Fixtures.read("iris.csv");
        double[][] x = new double[t.size()][4];
        String[] names = {"sepal_length", "sepal_width", "petal_length", "petal_width"};
        for (int j = 0; j < 4; j++) {
            double[] col = t.doubles(names[j]);
            for (int i = 0; i < col.length; i++) {
                x[i][j] = col[i];
            }
        }
        return x;
    }

    private static void assertMatchesScikitLearn(PcaResult pca, String fixture, int n) {
        Fixtures.Table t = Fixtures.read(fixture);
        assertArrayEquals(t.doubles("ratio"), pca.explainedVarianceRatio(), 1e-9);
        double[] ev = t.doubles("explained_variance");
        double[][] components = t.matrix("component_x"); // rows = components
        double[][] loadings = pca.loadings();
        for (int c = 0; c < pca.componentCount(); c++) {
            // scikit-learn's explained_variance_ divides by n - 1, ours by n
            assertEquals(ev[c], pca.eigenvalues()[c] * n / (n - 1), 1e-9);
            double sign = Math.signum(components[c][0]) * Math.signum(loadings[0][c]);
            for (int f = 0; f < loadings.length; f++) {
                assertEquals(components[c][f], sign * loadings[f][c], 1e-9, "component " + c + " feature " + f);
            }
        }
    }

    @Test
    void irisStandardisedMatchesScikitLearn() {
        double[][] x = iris();
        PcaResult pca = Pca.fit(x, ComponentRule.fixed(4));
        assertMatchesScikitLearn(pca, "pca_iris_standardised.csv", x.length);
        Fixtures.Table scaler = Fixtures.read("pca_iris_scaler.csv");
        assertArrayEquals(scaler.doubles("mean"), pca.means(), 1e-12);
        assertArrayEquals(scaler.doubles("scale"), pca.scales(), 1e-12);
    }

    @Test
    void irisCentredMatchesScikitLearn() {
        double[][] x = iris();
        PcaResult pca = Pca.fit(x, ComponentRule.fixed(4), Pca.Scaling.CENTRE_ONLY);
        assertMatchesScikitLearn(pca, "pca_iris_centred.csv", x.length);
        assertArrayEquals(new double[] {1, 1, 1, 1}, pca.scales());
    }

    @Test
    void defaultRuleOnIrisTakesTwoComponents() {
        // scikit-learn ratios 0.7296 + 0.2285 = 0.958 >= 0.90 at k = 2
        PcaResult pca = Pca.fit(iris(), ComponentRule.DEFAULT);
        assertEquals(2, pca.componentCount());
        assertEquals(150, pca.scores().length);
        assertEquals(2, pca.scores()[0].length);
    }

    // Field notes section 6: two standardised variables with correlation 0.8 give eigenvalues 1.8 and 0.2,
    // PC1 explains 90 %, loadings +-1/sqrt(2).
    @Test
    void twoVariablesWithCorrelationPointEight() {
        double[][] x = new double[4][2];
        for (int i = 0; i < 4; i++) {
            x[i][0] = U[i];
            x[i][1] = 0.8 * U[i] + 0.6 * V[i];
        }
        PcaResult pca = Pca.fit(x, ComponentRule.DEFAULT);
        assertArrayEquals(new double[] {1.8, 0.2}, pca.eigenvalues(), 1e-12);
        assertEquals(0.9, pca.explainedVarianceRatio()[0], 1e-12);
        assertEquals(2, pca.componentCount(), "at least 2 components");
        double h = 1 / Math.sqrt(2);
        assertEquals(h, pca.loadings()[0][0], 1e-12);
        assertEquals(h, pca.loadings()[1][0], 1e-12);
        assertEquals(h, Math.abs(pca.loadings()[0][1]), 1e-12);
    }

    // Field notes section 6: three variables with pairwise correlation 0.5 give 2, 0.5, 0.5; two components explain
    // 83.3 %, so a 90 % (or 85 %) rule needs all three and an 80 % rule two.
    @Test
    void threeVariablesWithPairwiseCorrelationHalf() {
        double l32 = 0.25 / Math.sqrt(0.75);
        double l33 = Math.sqrt(1 - 0.25 - l32 * l32);
        double[][] x = new double[4][3];
        for (int i = 0; i < 4; i++) {
            x[i][0] = U[i];
            x[i][1] = 0.5 * U[i] + Math.sqrt(0.75) * V[i];
            x[i][2] = 0.5 * U[i] + l32 * V[i] + l33 * W[i];
        }
        PcaResult pca = Pca.fit(x, ComponentRule.DEFAULT);
        assertArrayEquals(new double[] {2, 0.5, 0.5}, pca.eigenvalues(), 1e-12);
        assertEquals(3, pca.componentCount());
        assertEquals(3, Pca.fit(x, ComponentRule.cumulativeVariance(0.85)).componentCount());
        assertEquals(2, Pca.fit(x, ComponentRule.cumulativeVariance(0.80)).componentCount());
        assertEquals(5.0 / 6, Pca.fit(x, ComponentRule.cumulativeVariance(0.80)).explainedVariance(), 1e-12);
    }

    @Test
    void constantColumnIsDroppedAndReported() {
        double[][] iris = iris();
        double[][] x = new double[iris.length][5];
        for (int i = 0; i < iris.length; i++) {
            x[i] = new double[] {iris[i][0], iris[i][1], 21.5, iris[i][2], iris[i][3]};
        }
        PcaResult pca = Pca.fit(x, ComponentRule.fixed(4));
        assertArrayEquals(new int[] {2}, pca.droppedColumns());
        assertArrayEquals(new int[] {0, 1, 3, 4}, pca.keptColumns());
        assertMatchesScikitLearn(pca, "pca_iris_standardised.csv", x.length);
        for (double v : pca.scores()[7]) {
            assertTrue(Double.isFinite(v));
        }
    }

    @Test
    void projectReproducesTrainingScores() {
        double[][] x = iris();
        PcaResult pca = Pca.fit(x, ComponentRule.DEFAULT);
        for (int i = 0; i < x.length; i += 13) {
            assertArrayEquals(pca.scoresOf(i), pca.project(x[i]), 1e-12);
        }
        assertThrows(IllegalArgumentException.class, () -> pca.project(new double[3]));
    }

    @Test
    void largestLoadingOfEachComponentIsPositive() {
        PcaResult pca = Pca.fit(iris(), ComponentRule.fixed(4));
        double[][] l = pca.loadings();
        for (int c = 0; c < 4; c++) {
            int lead = 0;
            for (int f = 1; f < l.length; f++) {
                if (Math.abs(l[f][c]) > Math.abs(l[lead][c])) {
                    lead = f;
                }
            }
            assertTrue(l[lead][c] > 0, "component " + c);
        }
    }

    @Test
    void fixedRuleIsCappedAtKeptFeatures() {
        assertEquals(1, Pca.fit(iris(), ComponentRule.fixed(1)).componentCount());
        assertEquals(4, Pca.fit(iris(), ComponentRule.fixed(9)).componentCount());
    }

    @Test
    void invalidInputIsRejectedWithAReason() {
        assertMessage("at least 2 samples", () -> Pca.fit(new double[][] {{1, 2}}, ComponentRule.DEFAULT));
        assertMessage("all 2 are constant",
                () -> Pca.fit(new double[][] {{1, 2}, {1, 2}, {1, 2}}, ComponentRule.DEFAULT));
        assertMessage("row 1, column 0 is NaN",
                () -> Pca.fit(new double[][] {{1, 2}, {Double.NaN, 2}}, ComponentRule.DEFAULT));
        assertMessage("row 1 has 1 values", () -> Pca.fit(new double[][] {{1, 2}, {3}}, ComponentRule.DEFAULT));
        assertThrows(IllegalArgumentException.class, () -> ComponentRule.cumulativeVariance(1.5));
        assertThrows(IllegalArgumentException.class, () -> ComponentRule.fixed(0));
    }

    private static void assertMessage(String fragment, org.junit.jupiter.api.function.Executable call) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call);
        assertTrue(e.getMessage().contains(fragment), e.getMessage());
    }
}
