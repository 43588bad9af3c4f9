package org.tufa.analysis.report;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.features.FeatureMatrix;

/**
 * The arrows of the PCA biplot, computed apart from drawing. Pure functions on arrays.
 *
 * <ul>
 *   <li>Loading arrows: row f of the loadings (the unit eigenvector's components for feature f), the classic
 *       biplot of Gabriel, "The biplot graphic display of matrices with application to principal component
 *       analysis", Biometrika 58(3), 1971; scaled by one common factor so the longest reaches 80 % of the score
 *       cloud's extent (arrow directions and relative lengths are kept; the factor is printed in the legend).</li>
 *   <li>Actual shift: from the median scores of the normal cluster to those of a fault cluster (medians, like the
 *       feature shifts the findings report, so a few outliers do not move the arrow).</li>
 *   <li>Expected shift: the change of the scores if the coil delivered 1 K less and nothing else changed,
 *       {@code ds_c = sum_f (dx_f / scale_f) * loading[f][c]} over the kept features (a PCA score is linear in the
 *       standardised features; Jolliffe, Principal Component Analysis, 2nd ed., 2002, section 1.1).</li>
 * </ul>
 */
final class BiplotGeometry {

    private BiplotGeometry() {
    }

    /**
     * The feature change of "the coil does less", in engineering units (kelvin), or empty where no such direction
     * is defined (ventilation). Cooling: discharge 1 K warmer, coil residual 1 K lower. Heating: discharge 1 K
     * cooler, coil residual 1 K lower (the residual is signed in the direction of the mode; see CoilResponse).
     */
    static Map<String, Double> coilDoesLess(String mode) {
        Map<String, Double> m = new LinkedHashMap<>();
        switch (mode) {
            case "cooling" -> {
                m.put("discharge_air_temperature", 1.0);
                m.put("coil_residual", -1.0);
            }
            case "heating" -> {
                m.put("discharge_air_temperature", -1.0);
                m.put("coil_residual", -1.0);
            }
            default -> {
                // ventilation: no coil at work, no expected direction
            }
        }
        return m;
    }

    /**
     * Names of the PCA's input columns: the health features when the PCA was fitted on those alone (as the
     * detection does), else all features.
     */
    static List<String> pcaInputNames(PcaResult pca, FeatureMatrix features) {
        if (pca.inputWidth() == features.width()) {
            return features.names();
        }
        List<String> health = features.healthNames();
        if (pca.inputWidth() == health.size()) {
            return health;
        }
        throw new IllegalArgumentException("PCA input width " + pca.inputWidth() + " matches neither the "
                + features.width() + " features nor the " + health.size() + " health features");
    }

    /** The part of a feature change the PCA can see (features among its kept inputs), in the change's order. */
    static Map<String, Double> visible(PcaResult pca, FeatureMatrix features, Map<String, Double> change) {
        List<String> names = pcaInputNames(pca, features);
        Map<String, Double> out = new LinkedHashMap<>();
        change.forEach((name, dx) -> {
            int j = names.indexOf(name);
            if (j >= 0 && java.util.Arrays.stream(pca.keptColumns()).anyMatch(c -> c == j)) {
                out.put(name, dx);
            }
        });
        return out;
    }

    /**
     * Score change (all kept components) of a feature change given in engineering units; features not among the
     * PCA's inputs or dropped as constant contribute nothing.
     */
    static double[] scoreChange(PcaResult pca, FeatureMatrix features, Map<String, Double> change) {
        int k = pca.componentCount();
        double[] out = new double[k];
        int[] kept = pca.keptColumns();
        double[][] loadings = pca.loadings();
        double[] scales = pca.scales();
        List<String> names = pcaInputNames(pca, features);
        for (int f = 0; f < kept.length; f++) {
            Double dx = change.get(names.get(kept[f]));
            if (dx == null) {
                continue;
            }
            double dz = dx / scales[f];
            for (int c = 0; c < k; c++) {
                out[c] += dz * loadings[f][c];
            }
        }
        return out;
    }

    /** Median of each score column over the rows with the given label; NaN columns when the label has no rows. */
    static double[] medianScores(double[][] scores, int[] labels, int label) {
        int k = scores.length == 0 ? 0 : scores[0].length;
        int n = 0;
        for (int l : labels) {
            n += l == label ? 1 : 0;
        }
        double[] out = new double[k];
        for (int c = 0; c < k; c++) {
            if (n == 0) {
                out[c] = Double.NaN;
                continue;
            }
            double[] v = new double[n];
            int j = 0;
            for (int i = 0; i < labels.length; i++) {
                if (labels[i] == label) {
                    v[j++] = scores[i][c];
                }
            }
            Arrays.sort(v);
            out[c] = n % 2 == 1 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
        }
        return out;
    }

    /** Cosine of the angle between two vectors; NaN when either is zero. */
    static double cosine(double[] a, double[] b) {
        double ab = 0;
        double aa = 0;
        double bb = 0;
        for (int i = 0; i < a.length; i++) {
            ab += a[i] * b[i];
            aa += a[i] * a[i];
            bb += b[i] * b[i];
        }
        return aa == 0 || bb == 0 ? Double.NaN : ab / Math.sqrt(aa * bb);
    }

    /**
     * Half-width of the biplot frame: the 99th percentile, over clustered (non-noise) samples, of the larger of
     * |PC1| and |PC2|, so a few far outliers do not shrink the clusters to a dot (common practice, no source).
     * Falls back to all samples when every sample is noise; 1 when there are none.
     */
    static double frame(double[][] scores, int[] labels) {
        int n = 0;
        for (int l : labels) {
            n += l >= 0 ? 1 : 0;
        }
        boolean all = n == 0;
        double[] r = new double[all ? scores.length : n];
        int j = 0;
        for (int i = 0; i < scores.length; i++) {
            if (all || labels[i] >= 0) {
                r[j++] = Math.max(Math.abs(scores[i][0]), scores[i].length > 1 ? Math.abs(scores[i][1]) : 0);
            }
        }
        if (r.length == 0) {
            return 1;
        }
        Arrays.sort(r);
        double p = r[(int) Math.floor(0.99 * (r.length - 1))];
        return p > 0 ? p : 1;
    }

    /**
     * The common factor for loading arrows on PC1/PC2: 0.8 times the frame's half-width ({@link #frame}),
     * divided by the longest loading arrow in the plane (1 when there is nothing to scale).
     */
    static double loadingScale(double extent, double[][] loadings) {
        double longest = 0;
        for (double[] l : loadings) {
            longest = Math.max(longest, Math.hypot(l[0], l.length > 1 ? l[1] : 0));
        }
        return extent == 0 || longest == 0 ? 1 : 0.8 * extent / longest;
    }
}
