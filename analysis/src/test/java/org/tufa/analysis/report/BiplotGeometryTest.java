package org.tufa.analysis.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.cluster.ComponentRule;
import org.tufa.analysis.cluster.Pca;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.features.FeatureMatrix;

/**
 * The biplot's arrows. The expected-shift arrow must equal the change of the projected scores (PcaResult.project,
 * itself checked against scikit-learn 1.2.1 in PcaTest): a PCA score is linear in the standardised features
 * (Jolliffe, Principal Component Analysis, 2nd ed., 2002, section 1.1).
 */
class BiplotGeometryTest {

    private static FeatureMatrix features() {
        double[][] rows = new double[60][];
        int[] index = new int[60];
        for (int i = 0; i < rows.length; i++) {
            double t = i / 7.0;
            rows[i] = new double[] {Math.sin(t) * 2, 14 + Math.cos(t * 1.3) + 0.1 * i, 24 + 0.02 * i, 5.0,
                40 + 30 * Math.sin(t * 0.7)};
            index[i] = i;
        }
        return new FeatureMatrix(List.of("coil_residual", "discharge_air_temperature", "zone_air_temperature",
                "constant", "cooling_valve_command"), List.of("K", "degC", "degC", "K", "%"),
                new boolean[] {true, false, false, false, false}, rows, index);
    }

    @Test
    void expectedShiftEqualsTheChangeOfProjectedScores() {
        FeatureMatrix f = features();
        PcaResult pca = Pca.fit(f.rows(), ComponentRule.cumulativeVariance(0.99));
        Map<String, Double> less = BiplotGeometry.coilDoesLess("cooling");
        double[] x = f.rows()[10].clone();
        double[] moved = x.clone();
        moved[0] += less.get("coil_residual");
        moved[1] += less.get("discharge_air_temperature");
        double[] a = pca.project(x);
        double[] b = pca.project(moved);
        double[] expected = new double[a.length];
        for (int c = 0; c < a.length; c++) {
            expected[c] = b[c] - a[c];
        }
        assertArrayEquals(expected, BiplotGeometry.scoreChange(pca, f, less), 1e-12);
        assertEquals(1, pca.droppedColumns().length, "the constant column is dropped and contributes nothing");
    }

    @Test
    void healthOnlyPcaMapsColumnsToHealthNames() {
        FeatureMatrix f = features();
        PcaResult pca = Pca.fit(f.healthRows(), ComponentRule.cumulativeVariance(0.99));
        assertEquals(List.of("coil_residual"), BiplotGeometry.pcaInputNames(pca, f));
        Map<String, Double> seen = BiplotGeometry.visible(pca, f, BiplotGeometry.coilDoesLess("cooling"));
        assertEquals(Map.of("coil_residual", -1.0), seen, "discharge temperature is not a PCA input here");
        double[] a = pca.project(new double[] {0.5});
        double[] b = pca.project(new double[] {-0.5});
        assertEquals(b[0] - a[0], BiplotGeometry.scoreChange(pca, f, seen)[0], 1e-12);
    }

    @Test
    void coilDoesLessDirections() {
        assertEquals(Map.of("discharge_air_temperature", 1.0, "coil_residual", -1.0),
                BiplotGeometry.coilDoesLess("cooling"));
        assertEquals(Map.of("discharge_air_temperature", -1.0, "coil_residual", -1.0),
                BiplotGeometry.coilDoesLess("heating"));
        assertTrue(BiplotGeometry.coilDoesLess("ventilation").isEmpty());
    }

    @Test
    void mediansCosinesAndFrame() {
        double[][] scores = {{1, 10}, {3, 30}, {2, 20}, {100, -100}, {4, 40}};
        int[] labels = {0, 0, 0, -1, 1};
        assertArrayEquals(new double[] {2, 20}, BiplotGeometry.medianScores(scores, labels, 0), 0);
        assertArrayEquals(new double[] {4, 40}, BiplotGeometry.medianScores(scores, labels, 1), 0);
        assertEquals(-1, BiplotGeometry.cosine(new double[] {1, 2}, new double[] {-2, -4}), 1e-12);
        assertEquals(0, BiplotGeometry.cosine(new double[] {1, 0}, new double[] {0, 3}), 1e-12);
        assertTrue(Double.isNaN(BiplotGeometry.cosine(new double[] {0, 0}, new double[] {1, 1})));
        // Frame from clustered samples only (the noise point at 100 is left out): of 10, 20, 30, 40 the value at
        // rank floor(0.99 * 3) = 2, i.e. 30 (worked by hand).
        assertEquals(30, BiplotGeometry.frame(scores, labels), 0);
        assertEquals(0.8 * 40 / 5, BiplotGeometry.loadingScale(40, new double[][] {{3, 4}, {1, 0}}), 1e-12);
    }
}
