package org.tufa.analysis.cluster;

import smile.math.blas.UPLO;
import smile.math.matrix.Matrix;

/**
 * Principal component analysis by the eigen decomposition of the covariance matrix (Jolliffe, Principal Component
 * Analysis, 2nd ed., Springer 2002, chapters 1-3), of standardised features by default.
 *
 * <p>Conventions:
 * <ul>
 *   <li>standardisation uses the population standard deviation (divide by n, ddof = 0), as scikit-learn 1.2.1's
 *       StandardScaler; the covariance matrix is also divided by n, so on standardised data it is the correlation
 *       matrix and its eigenvalues sum to the number of kept features (scikit-learn's PCA explained_variance_ uses
 *       n - 1: multiply our eigenvalues by n / (n - 1) to compare; the ratios are the same);
 *   <li>a constant column (max == min) has no variance to standardise or explain: it is dropped and reported in
 *       {@link PcaResult#droppedColumns()}, never divided by;
 *   <li>loadings are the unit eigenvectors (scikit-learn's components_, transposed); the sign of each component is
 *       fixed so that its largest-magnitude loading is positive (on near-ties within 1e-12 the lowest feature
 *       index wins), which makes results deterministic across LAPACK builds;
 *   <li>the symmetric eigen problem is solved by Smile 3.1.1's Matrix.eigen (LAPACK dsyevd through OpenBLAS).
 * </ul>
 */
public final class Pca {

    private Pca() {}

    /** Whether features are scaled to unit variance after centring. */
    public enum Scaling {
        /** z-scores with the population standard deviation (PCA of the correlation matrix). */
        STANDARDISE,
        /** centring only (PCA of the covariance matrix), for features already in comparable units. */
        CENTRE_ONLY
    }

    /** PCA of standardised features. */
    public static PcaResult fit(double[][] x, ComponentRule rule) {
        return fit(x, rule, Scaling.STANDARDISE);
    }

    /**
     * PCA of the rows of {@code x}.
     *
     * @throws IllegalArgumentException (one line, fit for a per-unit report) for no samples, ragged rows, non-finite
     *     values, fewer than 2 samples, or no non-constant column
     */
    public static PcaResult fit(double[][] x, ComponentRule rule, Scaling scaling) {
        if (x == null || x.length == 0) {
            throw new IllegalArgumentException("PCA needs samples, got none");
        }
        int n = x.length;
        if (n < 2) {
            throw new IllegalArgumentException("PCA needs at least 2 samples, got " + n);
        }
        int p = x[0] == null ? 0 : x[0].length;
        if (p == 0) {
            throw new IllegalArgumentException("PCA needs at least one feature, row 0 has none");
        }
        for (int i = 0; i < n; i++) {
            if (x[i] == null || x[i].length != p) {
                throw new IllegalArgumentException("PCA needs rows of equal length: row " + i + " has "
                        + (x[i] == null ? 0 : x[i].length) + " values, row 0 has " + p);
            }
            for (int j = 0; j < p; j++) {
                if (!Double.isFinite(x[i][j])) {
                    throw new IllegalArgumentException(
                            "PCA needs finite values: row " + i + ", column " + j + " is " + x[i][j]);
                }
            }
        }
        // Keep the non-constant columns.
        int[] keptTmp = new int[p];
        int[] droppedTmp = new int[p];
        int kept = 0;
        int dropped = 0;
        for (int j = 0; j < p; j++) {
            double min = x[0][j];
            double max = x[0][j];
            for (int i = 1; i < n; i++) {
                min = Math.min(min, x[i][j]);
                max = Math.max(max, x[i][j]);
            }
            if (max > min) {
                keptTmp[kept++] = j;
            } else {
                droppedTmp[dropped++] = j;
            }
        }
        if (kept == 0) {
            throw new IllegalArgumentException("PCA needs a non-constant column, all " + p + " are constant");
        }
        int[] keptColumns = java.util.Arrays.copyOf(keptTmp, kept);
        int[] droppedColumns = java.util.Arrays.copyOf(droppedTmp, dropped);

        // Means and population standard deviations, two-pass for accuracy.
        double[] mean = new double[kept];
        double[] scale = new double[kept];
        for (int c = 0; c < kept; c++) {
            int j = keptColumns[c];
            double sum = 0;
            for (int i = 0; i < n; i++) {
                sum += x[i][j];
            }
            mean[c] = sum / n;
            if (scaling == Scaling.STANDARDISE) {
                double ss = 0;
                for (int i = 0; i < n; i++) {
                    double d = x[i][j] - mean[c];
                    ss += d * d;
                }
                scale[c] = Math.sqrt(ss / n);
            } else {
                scale[c] = 1.0;
            }
        }
        double[][] z = new double[n][kept];
        for (int i = 0; i < n; i++) {
            for (int c = 0; c < kept; c++) {
                z[i][c] = (x[i][keptColumns[c]] - mean[c]) / scale[c];
            }
        }
        double[][] cov = new double[kept][kept];
        for (int a = 0; a < kept; a++) {
            for (int b = 0; b <= a; b++) {
                double s = 0;
                for (int i = 0; i < n; i++) {
                    s += z[i][a] * z[i][b];
                }
                cov[a][b] = s / n;
                cov[b][a] = cov[a][b];
            }
        }
        Matrix.EVD evd = Matrix.of(cov).uplo(UPLO.LOWER).eigen(false, true, true).sort();
        double[] eigenvalues = new double[kept];
        double[][] vectors = new double[kept][kept]; // [feature][component]
        double total = 0;
        for (int c = 0; c < kept; c++) {
            eigenvalues[c] = Math.max(0.0, evd.wr[c]); // rounding can leave -1e-17 for a zero eigenvalue
            total += eigenvalues[c];
            double[] v = evd.Vr.col(c);
            int lead = 0;
            double leadAbs = 0;
            for (int f = 0; f < kept; f++) {
                leadAbs = Math.max(leadAbs, Math.abs(v[f]));
            }
            for (int f = 0; f < kept; f++) {
                if (Math.abs(v[f]) >= leadAbs - 1e-12) {
                    lead = f;
                    break;
                }
            }
            double sign = v[lead] < 0 ? -1 : 1;
            for (int f = 0; f < kept; f++) {
                vectors[f][c] = sign * v[f];
            }
        }
        double[] ratio = new double[kept];
        for (int c = 0; c < kept; c++) {
            ratio[c] = eigenvalues[c] / total;
        }
        int k = components(rule, ratio, kept);
        double[][] loadings = new double[kept][k];
        for (int f = 0; f < kept; f++) {
            System.arraycopy(vectors[f], 0, loadings[f], 0, k);
        }
        double[][] scores = new double[n][k];
        for (int i = 0; i < n; i++) {
            for (int c = 0; c < k; c++) {
                double s = 0;
                for (int f = 0; f < kept; f++) {
                    s += z[i][f] * loadings[f][c];
                }
                scores[i][c] = s;
            }
        }
        return new PcaResult(scores, loadings, eigenvalues, ratio, mean, scale, keptColumns, droppedColumns, p,
                scaling);
    }

    private static int components(ComponentRule rule, double[] ratio, int kept) {
        if (rule instanceof ComponentRule.Fixed fixed) {
            return Math.min(fixed.k(), kept);
        }
        double target = ((ComponentRule.CumulativeVariance) rule).target();
        double cumulative = 0;
        int k = kept;
        for (int c = 0; c < kept; c++) {
            cumulative += ratio[c];
            if (cumulative >= target - 1e-12) {
                k = c + 1;
                break;
            }
        }
        return Math.min(Math.max(k, 2), kept);
    }
}
