package org.tufa.analysis.cluster;

import java.util.Arrays;

/**
 * Label spreading (Zhou, Bousquet, Lal, Weston and Schoelkopf, "Learning with local and global consistency", NIPS
 * 2003): labels given to a few samples flow to their neighbours over a similarity graph, until every sample has a
 * distribution over the classes. With the graph's affinities W (zero diagonal) and D the diagonal of their sums, the
 * normalised graph S = D^-1/2 W D^-1/2 is iterated as F(t+1) = alpha S F(t) + (1 - alpha) Y from F(0) = Y (Y: one row
 * per sample, 1 in the column of its given class, zeros for unlabelled samples), and each row of the last F is
 * normalised to sum to 1.
 *
 * <p>Two graphs, as scikit-learn's {@code LabelSpreading} builds them (1.2.1; the test checks the distributions
 * against it within 1e-9):
 * <ul>
 *   <li>{@link Kernel#RBF}: W_ij = exp(-gamma |x_i - x_j|^2), dense (n x n doubles, so at most {@link #MAX_DENSE}
 *       samples);</li>
 *   <li>{@link Kernel#KNN}: W_ij = 1 when x_j is one of the k nearest samples of x_i, the sample itself counted first
 *       (so k - 1 others); not symmetric. D holds the column sums (how many samples have j among their neighbours),
 *       1 where that is 0; sparse, O(n k) memory.</li>
 * </ul>
 * The iteration stops before a step when the summed absolute change of F over the last step is below {@code tol},
 * or after {@code maxIter} steps. Equal distances in the neighbour search are broken by the lower sample index
 * (scikit-learn leaves that order to its tree); data without equal distances gives the same graph.
 *
 * <p>Pure and deterministic: arrays in, an immutable result out. A sample no label reaches (no path in the graph
 * to a labelled sample) keeps an all-zero distribution and label -1.
 */
public final class LabelSpreading {

    /** The similarity graph. */
    public enum Kernel {
        RBF, KNN
    }

    /**
     * The parameters; {@link #DEFAULTS} are scikit-learn's (kernel rbf, gamma 20, 7 neighbours, alpha 0.2, 30
     * iterations, tolerance 1e-3).
     *
     * @param kernel     the graph
     * @param gamma      RBF width: affinity exp(-gamma d^2)
     * @param neighbours k of the kNN graph, the sample itself included
     * @param alpha      the share of a sample's distribution taken from its neighbours at each step, in (0, 1)
     * @param maxIter    most steps
     * @param tol        convergence threshold on the summed absolute change of a step
     */
    public record Parameters(Kernel kernel, double gamma, int neighbours, double alpha, int maxIter, double tol) {
        public static final Parameters DEFAULTS = new Parameters(Kernel.RBF, 20, 7, 0.2, 30, 1e-3);

        public Parameters {
            if (!(alpha > 0 && alpha < 1)) {
                throw new IllegalArgumentException("alpha must be in (0, 1), got " + alpha);
            }
            if (!(gamma > 0) || neighbours < 1 || maxIter < 1 || !(tol >= 0)) {
                throw new IllegalArgumentException("gamma > 0, neighbours >= 1, maxIter >= 1 and tol >= 0 needed");
            }
        }
    }

    /** Most samples of the dense RBF graph (128 MB of affinities). */
    public static final int MAX_DENSE = 4096;

    private LabelSpreading() {
    }

    /**
     * @param x       n samples by d features, finite
     * @param labels  per sample its class in 0..classes-1, or -1 when unlabelled
     * @param classes number of classes
     */
    public static LabelSpreadingResult fit(double[][] x, int[] labels, int classes, Parameters p) {
        int n = x.length;
        if (labels.length != n) {
            throw new IllegalArgumentException("labels and samples differ in number");
        }
        for (int l : labels) {
            if (l < -1 || l >= classes) {
                throw new IllegalArgumentException("label " + l + " outside -1.." + (classes - 1));
            }
        }
        double[][] y = new double[n][classes];
        for (int i = 0; i < n; i++) {
            if (labels[i] >= 0) {
                y[i][labels[i]] = 1;
            }
        }
        Graph g = n == 0 ? new Sparse(new int[1], new int[0], new double[0])
                : p.kernel() == Kernel.RBF ? Dense.rbf(x, p.gamma()) : Sparse.knn(x, Math.min(p.neighbours(), n));
        double[][] f = new double[n][];
        double[][] previous = new double[n][classes];
        for (int i = 0; i < n; i++) {
            f[i] = y[i].clone();
        }
        int iterations = 0;
        boolean converged = false;
        for (; iterations < p.maxIter(); iterations++) {
            double change = 0;
            for (int i = 0; i < n; i++) {
                for (int c = 0; c < classes; c++) {
                    change += Math.abs(f[i][c] - previous[i][c]);
                }
            }
            if (change < p.tol()) {
                converged = true;
                break;
            }
            previous = f;
            f = g.times(previous, classes);
            for (int i = 0; i < n; i++) {
                for (int c = 0; c < classes; c++) {
                    f[i][c] = p.alpha() * f[i][c] + (1 - p.alpha()) * y[i][c];
                }
            }
        }
        int[] out = new int[n];
        for (int i = 0; i < n; i++) {
            double sum = 0;
            for (double v : f[i]) {
                sum += v;
            }
            int best = -1;
            for (int c = 0; c < classes; c++) {
                if (sum != 0) {
                    f[i][c] /= sum;
                }
                if (f[i][c] > 0 && (best < 0 || f[i][c] > f[i][best])) {
                    best = c;
                }
            }
            out[i] = best;
        }
        return new LabelSpreadingResult(f, out, iterations, converged);
    }

    /** The normalised graph S, applied to a matrix. */
    private interface Graph {
        double[][] times(double[][] m, int columns);
    }

    /** Dense S for the RBF kernel. */
    private record Dense(int n, double[] s) implements Graph {
        static Dense rbf(double[][] x, double gamma) {
            int n = x.length;
            if (n > MAX_DENSE) {
                throw new IllegalArgumentException("the RBF graph is dense: " + n + " samples, at most " + MAX_DENSE);
            }
            double[] w = new double[n * n];
            for (int i = 0; i < n; i++) {
                for (int j = i + 1; j < n; j++) {
                    double v = Math.exp(-gamma * squared(x[i], x[j]));
                    w[i * n + j] = v;
                    w[j * n + i] = v;
                }
            }
            double[] scale = new double[n];
            for (int j = 0; j < n; j++) {
                double sum = 0;
                for (int i = 0; i < n; i++) {
                    sum += w[i * n + j];
                }
                scale[j] = sum == 0 ? 1 : Math.sqrt(sum);
            }
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    w[i * n + j] = w[i * n + j] / scale[j] / scale[i];
                }
            }
            return new Dense(n, w);
        }

        @Override
        public double[][] times(double[][] m, int columns) {
            double[][] out = new double[n][columns];
            for (int i = 0; i < n; i++) {
                double[] o = out[i];
                int row = i * n;
                for (int j = 0; j < n; j++) {
                    double v = s[row + j];
                    if (v != 0) {
                        double[] mj = m[j];
                        for (int c = 0; c < columns; c++) {
                            o[c] += v * mj[c];
                        }
                    }
                }
            }
            return out;
        }
    }

    /** Sparse S (compressed rows) for the kNN kernel. */
    private record Sparse(int[] rowStart, int[] column, double[] value) implements Graph {

        static Sparse knn(double[][] x, int k) {
            int n = x.length;
            int[][] neighbours = KnnGraph.others(x, k);
            int[] inDegree = new int[n];
            for (int i = 0; i < n; i++) {
                for (int j : neighbours[i]) {
                    inDegree[j]++;
                }
            }
            double[] scale = new double[n];
            for (int j = 0; j < n; j++) {
                scale[j] = inDegree[j] == 0 ? 1 : Math.sqrt(inDegree[j]);
            }
            int[] rowStart = new int[n + 1];
            for (int i = 0; i < n; i++) {
                rowStart[i + 1] = rowStart[i] + neighbours[i].length;
            }
            int[] column = new int[rowStart[n]];
            double[] value = new double[rowStart[n]];
            for (int i = 0; i < n; i++) {
                int[] row = neighbours[i].clone();
                Arrays.sort(row);
                for (int e = 0; e < row.length; e++) {
                    column[rowStart[i] + e] = row[e];
                    value[rowStart[i] + e] = 1.0 / scale[i] / scale[row[e]];
                }
            }
            return new Sparse(rowStart, column, value);
        }

        @Override
        public double[][] times(double[][] m, int columns) {
            int n = rowStart.length - 1;
            double[][] out = new double[n][columns];
            for (int i = 0; i < n; i++) {
                double[] o = out[i];
                for (int e = rowStart[i]; e < rowStart[i + 1]; e++) {
                    double v = value[e];
                    double[] mj = m[column[e]];
                    for (int c = 0; c < columns; c++) {
                        o[c] += v * mj[c];
                    }
                }
            }
            return out;
        }
    }

    static double squared(double[] a, double[] b) {
        double s = 0;
        for (int d = 0; d < a.length; d++) {
            double diff = a[d] - b[d];
            s += diff * diff;
        }
        return s;
    }
}
