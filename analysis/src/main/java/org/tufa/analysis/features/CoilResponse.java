package org.tufa.analysis.features;

import java.util.Arrays;

/**
 * How much a coil changes the air temperature at each valve opening, learned from the unit's own data, and the
 * residual of each sample against it: the physically informed feature that separates a coil or sensor fault
 * from normal operation at the same valve position.
 *
 * <p>Energy balance of a water coil (ASHRAE Handbook Fundamentals; the APAR rules of Schein, Bushby, Castro and
 * House, Energy and Buildings 38(12), 2006, use the same balances): the air temperature change across the coil is
 * the coil effectiveness times the entering temperature difference between air and water, and the effectiveness
 * grows with the valve opening. When the supply-water temperature is known the response is learned as
 * effectiveness {@code e = dT_air / (T_zone - T_water)}, else as the air temperature change itself.
 *
 * <p>The response is a quadratic in the valve fraction, {@code c0 + c1 v + c2 v^2}, fitted by iteratively
 * reweighted least squares with Huber weights (Huber, "Robust estimation of a location parameter", Annals of
 * Mathematical Statistics 35(1), 1964; tuning constant 1.345 with the MAD scale, as in Holland and Welsch,
 * Communications in Statistics A6(9), 1977), started from the per-band medians. A smooth curve over all valve
 * openings keeps a fault that fills one band (a failed fan keeps the valve wide open for days) from redefining
 * "normal" in that band outright, and the robust weights keep a minority of faulty samples from bending it. The
 * curve is held non-decreasing over the valve range (a coil never does less as its valve opens): where the free
 * fit would fall at either end, that end's slope is fixed at zero and the fit repeated. Limit: Huber weights cap
 * the pull of a large residual but not the leverage of many samples piled at one end of the valve range
 * (Rousseeuw and Leroy, Robust Regression and Outlier Detection, 1987); from about a quarter of the samples at
 * full opening the curve bends toward them, so the fault's residual shrinks (it still passes the gate) and healthy
 * samples near full opening pick up a positive residual ({@code CoilResponseFitTest} measures it).
 *
 * <p>A multi-speed fan moves less air at its lower stages, and a coil passing less air changes its temperature
 * more: the effectiveness rises as the heat capacity rate of the air falls (the effectiveness-NTU relations of
 * Kays and London, Compact Heat Exchangers, 3rd ed., 1984; ASHRAE Handbook Fundamentals, ch. 4). Staged fans
 * step up with the load, so one curve in the valve opening alone jumps where the stage changes, and the samples
 * of each stage sit on either side of it: normal operation then splits by fan stage into clusters that look like
 * too little or too much airflow. When the samples' fan stages are given, each stage but the first gets an offset
 * on the shared curve, learnt from days on which both it and the stage below ran ({@link FanStages} finds the
 * stages; {@link #fit(double[], double[], double[], int[], int, int[])} says why within days).
 *
 * @param coefficients         c0, c1, c2 of the response against the valve fraction (0..1)
 * @param usesWaterTemperature whether the response is an effectiveness against the supply-water temperature
 * @param stageOffsets         per fan stage, what the response adds to the curve (0 for the first stage); empty
 *                             without stages
 */
public record CoilResponse(double[] coefficients, boolean usesWaterTemperature, double[] stageOffsets) {

    private static final int ITERATIONS = 20;
    private static final double[] BAND_EDGES = {0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0001};

    public CoilResponse {
        coefficients = coefficients.clone();
        stageOffsets = stageOffsets.clone();
    }

    /** A response without fan stages. */
    public CoilResponse(double[] coefficients, boolean usesWaterTemperature) {
        this(coefficients, usesWaterTemperature, new double[0]);
    }

    @Override
    public double[] coefficients() {
        return coefficients.clone();
    }

    @Override
    public double[] stageOffsets() {
        return stageOffsets.clone();
    }

    /**
     * Learns the response from samples in one mode.
     *
     * @param valvePercent valve command of the active coil, percent
     * @param airDeltaT    air temperature change across the coil in the direction of the mode, kelvin
     *                     (zone - discharge in cooling, discharge - zone in heating)
     * @param waterDeltaT  entering temperature difference between air and water in the same direction
     *                     (zone - chilled water, hot water - zone), or null when the water temperature is unknown
     */
    public static CoilResponse fit(double[] valvePercent, double[] airDeltaT, double[] waterDeltaT) {
        return fit(valvePercent, airDeltaT, waterDeltaT, null, 0, null);
    }

    /**
     * Learns the response with an offset per fan stage, the offsets from contrasts inside a block of time.
     *
     * <p>Why inside blocks: a fault that costs capacity (a leaking heating valve, a fouled coil) raises the load, so
     * a staged fan runs at its higher stages more while the fault lasts, and the high stage's samples can be mostly
     * faulty. An offset fitted to all of a stage's samples would then learn the fault. Within one day, though, a
     * fault acts on every stage that runs, so what separates two stages on the same day is the stage effect
     * whatever the day's condition. The offsets are therefore the coefficients of the stage indicators in a model
     * with one level per day (fixed day effects), see {@link StageContrasts}. The day levels are not kept: the
     * curve itself is then the robust monotone fit of the responses less their stage's offset, so a fault still
     * leaves its residual. A stage that shares fewer than {@link #MIN_STAGE_DAYS} days with another stage has no
     * within-day contrast and keeps offset 0 (it is judged on the first stage's curve).
     *
     * @param stage  per sample, its fan stage 0..stages-1 (-1 or out of range: stage 0), or null for none
     * @param stages the number of stages; below 2 the fit is the one without stages
     * @param block  per sample, its block of time (a day number), or null for none (then no stage offsets)
     */
    public static CoilResponse fit(double[] valvePercent, double[] airDeltaT, double[] waterDeltaT, int[] stage,
                                   int stages, int[] block) {
        boolean useWater = waterDeltaT != null;
        int n = valvePercent.length;
        int levels = stage == null || block == null || stages < 2 ? 1 : stages;
        double[] v = new double[n];
        double[] y = new double[n];
        int[] g = new int[n];
        int[] day = new int[n];
        int m = 0;
        for (int i = 0; i < n; i++) {
            double r = response(airDeltaT[i], useWater ? waterDeltaT[i] : Double.NaN, useWater);
            if (Double.isNaN(r) || Double.isNaN(valvePercent[i])) {
                continue;
            }
            v[m] = Math.min(1.0, Math.max(0.0, valvePercent[i] / 100.0));
            g[m] = levels == 1 || stage[i] < 0 || stage[i] >= levels ? 0 : stage[i];
            day[m] = levels == 1 ? 0 : block[i];
            y[m++] = r;
        }
        v = Arrays.copyOf(v, m);
        y = Arrays.copyOf(y, m);
        if (levels == 1) {
            return new CoilResponse(robustCurve(v, y), useWater, new double[0]);
        }
        g = Arrays.copyOf(g, m);
        day = Arrays.copyOf(day, m);
        double[] offsets = StageContrasts.offsets(v, y, g, day, levels, MIN_STAGE_DAYS);
        double[] adjusted = new double[m];
        for (int i = 0; i < m; i++) {
            adjusted[i] = y[i] - offsets[g[i]];
        }
        return new CoilResponse(robustCurve(v, adjusted), useWater, offsets);
    }

    /** Days a stage must share with another stage for its offset to be learnt. */
    public static final int MIN_STAGE_DAYS = 3;

    /** The robust, monotone quadratic of the responses against the valve fraction (Huber IRLS, see the class). */
    private static double[] robustCurve(double[] v, double[] y) {
        int m = v.length;
        if (m < 3) {
            return new double[] {m == 0 ? 0 : median(y), 0, 0};
        }
        double[] c = startFromBandMedians(v, y);
        double[] w = new double[m];
        double[] res = new double[m];
        for (int it = 0; it < ITERATIONS; it++) {
            for (int i = 0; i < m; i++) {
                res[i] = y[i] - eval(c, v[i]);
            }
            if (!HuberWeights.reweight(res, w, 1e-9)) {
                break;
            }
            double[] next = monotone(v, y, w);
            if (next == null) {
                break;
            }
            c = next;
        }
        return c;
    }

    /**
     * Residual of one sample in kelvin: the measured air temperature change minus the change expected at this
     * valve opening. Negative = the coil did less than usual (warm discharge in cooling), positive = more.
     */
    public double residual(double valvePercent, double airDeltaT, double waterDeltaT) {
        return residual(valvePercent, airDeltaT, waterDeltaT, 0);
    }

    /** The residual of a sample at the given fan stage (0 when the response has no stages). */
    public double residual(double valvePercent, double airDeltaT, double waterDeltaT, int stage) {
        if (Double.isNaN(valvePercent) || Double.isNaN(airDeltaT)) {
            return Double.NaN;
        }
        double offset = stageOffsets.length == 0 ? 0
                : stageOffsets[Math.max(0, Math.min(stageOffsets.length - 1, stage))];
        double expected = eval(coefficients, Math.min(1.0, Math.max(0.0, valvePercent / 100.0))) + offset;
        if (usesWaterTemperature) {
            if (Double.isNaN(waterDeltaT)) {
                return Double.NaN;
            }
            return airDeltaT - expected * waterDeltaT;
        }
        return airDeltaT - expected;
    }

    private static double eval(double[] c, double v) {
        return c[0] + c[1] * v + c[2] * v * v;
    }

    private static double response(double airDeltaT, double waterDeltaT, boolean useWater) {
        if (!useWater) {
            return airDeltaT;
        }
        // An effectiveness needs a real driving difference; below 2 K the ratio is dominated by sensor error.
        if (Double.isNaN(waterDeltaT) || waterDeltaT < 2.0) {
            return Double.NaN;
        }
        return airDeltaT / waterDeltaT;
    }

    /** Quadratic through the per-band medians, weighted by band counts: a robust starting curve. */
    private static double[] startFromBandMedians(double[] v, double[] y) {
        int bands = BAND_EDGES.length;
        double[] centre = new double[bands];
        double[] med = new double[bands];
        double[] count = new double[bands];
        for (int b = 0; b < bands; b++) {
            double lo = b == 0 ? 0 : BAND_EDGES[b - 1];
            double[] in = new double[v.length];
            double sum = 0;
            int k = 0;
            for (int i = 0; i < v.length; i++) {
                if (v[i] >= lo && v[i] < BAND_EDGES[b]) {
                    in[k++] = y[i];
                    sum += v[i];
                }
            }
            count[b] = k;
            centre[b] = k == 0 ? 0 : sum / k;
            med[b] = k == 0 ? 0 : median(Arrays.copyOf(in, k));
        }
        double[] c = monotone(centre, med, count);
        return c != null ? c : new double[] {median(y), 0, 0};
    }

    /**
     * Weighted quadratic fit held non-decreasing on [0, 1]. The slope c1 + 2 c2 v is linear in v, so the curve is
     * monotone exactly when both end slopes are >= 0; a negative end slope is fixed at zero: slope 0 at v = 1 means
     * c1 = -2 c2 (basis 1, v^2 - 2v), slope 0 at v = 0 means c1 = 0 (basis 1, v^2).
     */
    private static double[] monotone(double[] v, double[] y, double[] w) {
        double[] c = weightedQuadratic(v, y, w);
        if (c == null || (c[1] >= 0 && c[1] + 2 * c[2] >= 0)) {
            return c;
        }
        boolean flatTop = c[1] + 2 * c[2] < 0;
        double[] z = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            z[i] = flatTop ? v[i] * v[i] - 2 * v[i] : v[i] * v[i];
        }
        double[] line = weightedLine(z, y, w);
        if (line == null) {
            return constant(y, w);
        }
        double[] constrained = flatTop ? new double[] {line[0], -2 * line[1], line[1]}
                : new double[] {line[0], 0, line[1]};
        // The constrained curve must itself rise: a negative c2 in either basis means the data fall throughout,
        // and the best non-decreasing quadratic is then a constant.
        boolean rises = flatTop ? line[1] <= 0 : line[1] >= 0;
        return rises ? constrained : constant(y, w);
    }

    /**
     * Solves the augmented system {@code a} (k x k+1, overwritten) by Gauss-Jordan elimination with partial
     * pivoting; null when a pivot is below 1e-12 (singular).
     */
    static double[] solve(double[][] a) {
        int k = a.length;
        for (int col = 0; col < k; col++) {
            int pivot = col;
            for (int r = col + 1; r < k; r++) {
                if (Math.abs(a[r][col]) > Math.abs(a[pivot][col])) {
                    pivot = r;
                }
            }
            if (Math.abs(a[pivot][col]) < 1e-12) {
                return null;
            }
            double[] t = a[col];
            a[col] = a[pivot];
            a[pivot] = t;
            for (int r = 0; r < k; r++) {
                if (r != col) {
                    double f = a[r][col] / a[col][col];
                    for (int s = col; s <= k; s++) {
                        a[r][s] -= f * a[col][s];
                    }
                }
            }
        }
        double[] b = new double[k];
        for (int r = 0; r < k; r++) {
            b[r] = a[r][k] / a[r][r];
        }
        return b;
    }

    /** Weighted least squares for y = a + b z, or null when z does not vary. */
    private static double[] weightedLine(double[] z, double[] y, double[] w) {
        double sw = 0;
        double sz = 0;
        double sy = 0;
        for (int i = 0; i < z.length; i++) {
            sw += w[i];
            sz += w[i] * z[i];
            sy += w[i] * y[i];
        }
        if (sw == 0) {
            return null;
        }
        double mz = sz / sw;
        double my = sy / sw;
        double szz = 0;
        double szy = 0;
        for (int i = 0; i < z.length; i++) {
            szz += w[i] * (z[i] - mz) * (z[i] - mz);
            szy += w[i] * (z[i] - mz) * (y[i] - my);
        }
        if (szz < 1e-15) {
            return null;
        }
        double b = szy / szz;
        return new double[] {my - b * mz, b};
    }

    /** Weighted least squares for y = c0 + c1 v + c2 v^2 (normal equations, 3 x 3), or null when singular. */
    private static double[] weightedQuadratic(double[] v, double[] y, double[] w) {
        double[][] a = new double[3][4];
        for (int i = 0; i < v.length; i++) {
            if (w[i] == 0) {
                continue;
            }
            double[] x = {1, v[i], v[i] * v[i]};
            for (int r = 0; r < 3; r++) {
                for (int s = 0; s < 3; s++) {
                    a[r][s] += w[i] * x[r] * x[s];
                }
                a[r][3] += w[i] * x[r] * y[i];
            }
        }
        double[] c = solve(a);
        // Too few distinct valve openings for a curve: fall back to a weighted constant.
        return c != null ? c : constant(y, w);
    }

    private static double[] constant(double[] y, double[] w) {
        double sw = 0;
        double sy = 0;
        for (int i = 0; i < y.length; i++) {
            sw += w[i];
            sy += w[i] * y[i];
        }
        return sw == 0 ? null : new double[] {sy / sw, 0, 0};
    }

    private static double median(double[] v) {
        return org.tufa.analysis.band.Quantiles.medianInPlace(v.clone(), v.length);
    }
}
