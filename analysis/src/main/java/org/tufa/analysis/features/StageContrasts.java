package org.tufa.analysis.features;

import java.util.Arrays;

/**
 * The offsets of a staged fan's stages on a coil's response, learnt only from what separates the stages within
 * the same day: the within estimator of a model with one level per day (fixed day effects),
 * {@code response = c1 v + c2 v^2 + offset(stage) + level(day)}. Each day's weighted mean is removed from the
 * response and from every regressor, and the demeaned response is regressed on the demeaned regressors; by the
 * Frisch-Waugh-Lovell theorem (Frisch and Waugh, Econometrica 1(4), 1933; Lovell, JASA 58(304), 1963) the
 * coefficients are those of the model with the day levels fitted. Huber weights ({@link HuberWeights}) keep a minority of odd samples from moving the offsets; the weights enter
 * the day means too, so each round is an exact weighted within fit.
 *
 * <p>Why the day levels: whatever holds a whole day (a fault that lasts, the day's water temperature, a sensor's
 * bias) moves every stage that runs that day alike and goes into the day's level, not into a stage's offset, even
 * when the fault is what made the fan run at that stage.
 */
final class StageContrasts {

    private static final int ITERATIONS = 20;
    /** Samples a stage needs on a day for the day to show it beside another stage (an hour at 15 minutes). */
    static final int MIN_SAMPLES_PER_DAY = 4;

    private StageContrasts() {
    }

    /**
     * The offset of each stage relative to stage 0 (offsets[0] = 0); 0 for a stage that shares fewer than
     * {@code minSharedDays} days with another stage, and all 0 when the within fit is singular.
     *
     * @param v      valve fraction per sample, 0..1
     * @param y      response per sample
     * @param stage  stage per sample, 0..levels-1
     * @param day    block of time per sample (any integers)
     */
    static double[] offsets(double[] v, double[] y, int[] stage, int[] day, int levels, int minSharedDays) {
        return offsets(v, y, stage, day, levels, minSharedDays, ITERATIONS);
    }

    /** The same with at most {@code iterations} Huber rounds: 1 is the ordinary least-squares within fit. */
    static double[] offsets(double[] v, double[] y, int[] stage, int[] day, int levels, int minSharedDays,
                            int iterations) {
        int n = v.length;
        int[] dayIndex = compact(day);
        int days = n == 0 ? 0 : Arrays.stream(dayIndex).max().getAsInt() + 1;
        int[][] count = new int[days][levels];
        for (int i = 0; i < n; i++) {
            count[dayIndex[i]][stage[i]]++;
        }
        int[] column = new int[levels];
        int k = 2;
        for (int s = 1; s < levels; s++) {
            int shared = 0;
            for (int d = 0; d < days; d++) {
                if (count[d][s] >= MIN_SAMPLES_PER_DAY && othersRan(count[d], s)) {
                    shared++;
                }
            }
            column[s] = shared >= minSharedDays ? k++ : -1;
        }
        double[] offsets = new double[levels];
        if (k == 2) {
            return offsets;
        }
        // The curve held non-decreasing as CoilResponse holds it (a coil never does less as its valve opens), so
        // that the offsets belong to the curve they will be used with: free quadratic; else flat at the end
        // whose slope would be negative; else no curve.
        double[] free = robustWithinFit(v, y, stage, dayIndex, days, column, k, CurveBasis.FREE, iterations);
        if (free == null) {
            return offsets;
        }
        double[] beta = free;
        if (free[0] < 0 || free[0] + 2 * free[1] < 0) {
            CurveBasis basis = free[0] + 2 * free[1] < 0 ? CurveBasis.FLAT_TOP : CurveBasis.FLAT_BOTTOM;
            double[] constrained = robustWithinFit(v, y, stage, dayIndex, days, column, k - 1, basis, iterations);
            boolean rises = constrained != null && (basis == CurveBasis.FLAT_TOP ? constrained[0] <= 0
                    : constrained[0] >= 0);
            beta = rises ? constrained : robustWithinFit(v, y, stage, dayIndex, days, column, k - 2, CurveBasis.NONE,
                    iterations);
            if (beta == null) {
                return offsets;
            }
        }
        int curveColumns = beta.length - (k - 2);
        for (int s = 1; s < levels; s++) {
            offsets[s] = column[s] >= 0 ? beta[curveColumns + column[s] - 2] : 0;
        }
        return offsets;
    }

    /** The curve's regressors: v and v^2; v^2 - 2v (slope 0 at full opening); v^2 (slope 0 shut); none. */
    private enum CurveBasis { FREE, FLAT_TOP, FLAT_BOTTOM, NONE }

    /**
     * The Huber-weighted within fit of the response on the curve's regressors in {@code basis} and the stage
     * indicators ({@code column[s] - 2} counts from the first indicator); null when singular.
     */
    private static double[] robustWithinFit(double[] v, double[] y, int[] stage, int[] dayIndex, int days,
                                            int[] column, int k, CurveBasis basis, int iterations) {
        int n = v.length;
        int curveColumns = switch (basis) {
            case FREE -> 2;
            case FLAT_TOP, FLAT_BOTTOM -> 1;
            case NONE -> 0;
        };
        double[][] x = new double[n][k];
        for (int i = 0; i < n; i++) {
            switch (basis) {
                case FREE -> {
                    x[i][0] = v[i];
                    x[i][1] = v[i] * v[i];
                }
                case FLAT_TOP -> x[i][0] = v[i] * v[i] - 2 * v[i];
                case FLAT_BOTTOM -> x[i][0] = v[i] * v[i];
                case NONE -> { }
            }
            if (stage[i] > 0 && column[stage[i]] >= 0) {
                x[i][curveColumns + column[stage[i]] - 2] = 1;
            }
        }
        double[] w = new double[n];
        Arrays.fill(w, 1);
        double[] beta = null;
        double[] residual = new double[n];
        for (int it = 0; it < iterations; it++) {
            double[] next = withinFit(x, y, w, dayIndex, days, k, residual);
            if (next == null) {
                break;
            }
            beta = next;
            if (!HuberWeights.reweight(residual, w, 1e-12)) {
                break;
            }
        }
        return beta;
    }

    private static boolean othersRan(int[] countsOfDay, int stage) {
        for (int s = 0; s < countsOfDay.length; s++) {
            if (s != stage && countsOfDay[s] >= MIN_SAMPLES_PER_DAY) {
                return true;
            }
        }
        return false;
    }

    /**
     * One weighted within fit: day means removed with weights {@code w}, normal equations solved; fills
     * {@code residual} (demeaned response less the fit) and returns the coefficients, or null when singular.
     */
    private static double[] withinFit(double[][] x, double[] y, double[] w, int[] dayIndex, int days, int k,
                                      double[] residual) {
        int n = y.length;
        double[] dayWeight = new double[days];
        double[] meanY = new double[days];
        double[][] meanX = new double[days][k];
        for (int i = 0; i < n; i++) {
            int d = dayIndex[i];
            dayWeight[d] += w[i];
            meanY[d] += w[i] * y[i];
            for (int j = 0; j < k; j++) {
                meanX[d][j] += w[i] * x[i][j];
            }
        }
        for (int d = 0; d < days; d++) {
            if (dayWeight[d] > 0) {
                meanY[d] /= dayWeight[d];
                for (int j = 0; j < k; j++) {
                    meanX[d][j] /= dayWeight[d];
                }
            }
        }
        double[][] a = new double[k][k + 1];
        double[] xi = new double[k];
        for (int i = 0; i < n; i++) {
            int d = dayIndex[i];
            for (int j = 0; j < k; j++) {
                xi[j] = x[i][j] - meanX[d][j];
            }
            double yi = y[i] - meanY[d];
            for (int r = 0; r < k; r++) {
                for (int c = 0; c < k; c++) {
                    a[r][c] += w[i] * xi[r] * xi[c];
                }
                a[r][k] += w[i] * xi[r] * yi;
            }
        }
        double[] beta = CoilResponse.solve(a);
        if (beta == null) {
            return null;
        }
        for (int i = 0; i < n; i++) {
            int d = dayIndex[i];
            double fit = 0;
            for (int j = 0; j < k; j++) {
                fit += beta[j] * (x[i][j] - meanX[d][j]);
            }
            residual[i] = y[i] - meanY[d] - fit;
        }
        return beta;
    }

    /** The values renumbered 0.. in ascending order. */
    private static int[] compact(int[] values) {
        int[] sorted = Arrays.stream(values).distinct().sorted().toArray();
        int[] out = new int[values.length];
        for (int i = 0; i < values.length; i++) {
            out[i] = Arrays.binarySearch(sorted, values[i]);
        }
        return out;
    }
}
