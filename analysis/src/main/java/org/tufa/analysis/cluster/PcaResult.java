package org.tufa.analysis.cluster;

import java.util.Arrays;

/**
 * Result of {@link Pca#fit}. Immutable: arrays are copied in and out.
 *
 * @param scores n x k component scores of the training samples
 * @param loadings p' x k unit eigenvectors, row f for kept feature {@code keptColumns[f]} (an arrow on a biplot is
 *     row f; multiply column c by sqrt(eigenvalues[c]) for feature-component correlations on standardised data)
 * @param eigenvalues all p' eigenvalues of the covariance matrix (divided by n), descending
 * @param explainedVarianceRatio all p' ratios eigenvalue / sum of eigenvalues
 * @param means p' means of the kept features
 * @param scales p' population standard deviations of the kept features (1 when not standardised)
 * @param keptColumns input column index of each kept feature, ascending
 * @param droppedColumns input column indices of constant columns, ascending
 * @param inputWidth number of input columns p
 * @param scaling the scaling used
 */
public record PcaResult(
        double[][] scores,
        double[][] loadings,
        double[] eigenvalues,
        double[] explainedVarianceRatio,
        double[] means,
        double[] scales,
        int[] keptColumns,
        int[] droppedColumns,
        int inputWidth,
        Pca.Scaling scaling) {

    public PcaResult {
        scores = deepCopy(scores);
        loadings = deepCopy(loadings);
        eigenvalues = eigenvalues.clone();
        explainedVarianceRatio = explainedVarianceRatio.clone();
        means = means.clone();
        scales = scales.clone();
        keptColumns = keptColumns.clone();
        droppedColumns = droppedColumns.clone();
    }

    /** Number of components k. */
    public int componentCount() {
        return loadings.length == 0 ? 0 : loadings[0].length;
    }

    /** Cumulative explained variance ratio of the k kept components. */
    public double explainedVariance() {
        double s = 0;
        for (int c = 0; c < componentCount(); c++) {
            s += explainedVarianceRatio[c];
        }
        return s;
    }

    /**
     * Scores of a new sample given in the input's column layout (all {@link #inputWidth()} columns; dropped columns
     * are ignored), with the training means, scales and loadings.
     */
    public double[] project(double[] sample) {
        if (sample.length != inputWidth) {
            throw new IllegalArgumentException(
                    "sample has " + sample.length + " values, the PCA was fitted on " + inputWidth);
        }
        int k = componentCount();
        double[] out = new double[k];
        for (int f = 0; f < keptColumns.length; f++) {
            double z = (sample[keptColumns[f]] - means[f]) / scales[f];
            for (int c = 0; c < k; c++) {
                out[c] += z * loadings[f][c];
            }
        }
        return out;
    }

    /** One training sample's scores. */
    public double[] scoresOf(int sample) {
        return scores[sample].clone();
    }

    @Override
    public double[][] scores() {
        return deepCopy(scores);
    }

    @Override
    public double[][] loadings() {
        return deepCopy(loadings);
    }

    @Override
    public double[] eigenvalues() {
        return eigenvalues.clone();
    }

    @Override
    public double[] explainedVarianceRatio() {
        return explainedVarianceRatio.clone();
    }

    @Override
    public double[] means() {
        return means.clone();
    }

    @Override
    public double[] scales() {
        return scales.clone();
    }

    @Override
    public int[] keptColumns() {
        return keptColumns.clone();
    }

    @Override
    public int[] droppedColumns() {
        return droppedColumns.clone();
    }

    private static double[][] deepCopy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof PcaResult r
                && Arrays.deepEquals(scores, r.scores)
                && Arrays.deepEquals(loadings, r.loadings)
                && Arrays.equals(eigenvalues, r.eigenvalues)
                && Arrays.equals(means, r.means)
                && Arrays.equals(scales, r.scales)
                && Arrays.equals(keptColumns, r.keptColumns)
                && Arrays.equals(droppedColumns, r.droppedColumns)
                && inputWidth == r.inputWidth
                && scaling == r.scaling;
    }

    @Override
    public int hashCode() {
        return Arrays.deepHashCode(loadings) * 31 + Arrays.hashCode(eigenvalues);
    }

    @Override
    public String toString() {
        return "PcaResult[k=" + componentCount() + ", kept=" + Arrays.toString(keptColumns) + ", dropped="
                + Arrays.toString(droppedColumns) + ", ratio=" + Arrays.toString(explainedVarianceRatio) + "]";
    }
}
