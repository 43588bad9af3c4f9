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
 * @param coefficients         c0, c1, c2 of the response against the valve fraction (0..1)
 * @param usesWaterTemperature whether the response is an effectiveness against the supply-water temperature
 */
public record CoilResponse(double[] coefficients, boolean usesWaterTemperature) {

    /** Huber's tuning constant for 95 % efficiency at the normal distribution (Holland and Welsch 1977). */
    private static final double HUBER_K = 1.345;
    private static final int ITERATIONS = 20;
    private static final double[] BAND_EDGES = {0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0001};

    public CoilResponse {
        coefficients = coefficients.clone();
    }

    @Override
    public double[] coefficients() {
        return coefficients.clone();
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
        boolean useWater = waterDeltaT != null;
        int n = valvePercent.length;
        double[] v = new double[n];
        double[] y = new double[n];
        int m = 0;
        for (int i = 0; i < n; i++) {
            double r = response(airDeltaT[i], useWater ? waterDeltaT[i] : Double.NaN, useWater);
            if (Double.isNaN(r) || Double.isNaN(valvePercent[i])) {
                continue;
            }
            v[m] = Math.min(1.0, Math.max(0.0, valvePercent[i] / 100.0));
            y[m++] = r;
        }
        v = Arrays.copyOf(v, m);
        y = Arrays.copyOf(y, m);
        if (m < 3) {
            return new CoilResponse(new double[] {m == 0 ? 0 : median(y), 0, 0}, useWater);
        }
        double[] c = startFromBandMedians(v, y);
        double[] w = new double[m];
        double[] res = new double[m];
        for (int it = 0; it < ITERATIONS; it++) {
            for (int i = 0; i < m; i++) {
                res[i] = y[i] - eval(c, v[i]);
            }
            double scale = 1.4826 * median(abs(res));
            if (scale < 1e-9) {
                break;
            }
            for (int i = 0; i < m; i++) {
                double u = Math.abs(res[i]) / (HUBER_K * scale);
                w[i] = u <= 1 ? 1 : 1 / u;
            }
            double[] next = monotone(v, y, w);
            if (next == null) {
                break;
            }
            c = next;
        }
        return new CoilResponse(c, useWater);
    }

    /**
     * Residual of one sample in kelvin: the measured air temperature change minus the change expected at this
     * valve opening. Negative = the coil did less than usual (warm discharge in cooling), positive = more.
     */
    public double residual(double valvePercent, double airDeltaT, double waterDeltaT) {
        if (Double.isNaN(valvePercent) || Double.isNaN(airDeltaT)) {
            return Double.NaN;
        }
        double expected = eval(coefficients, Math.min(1.0, Math.max(0.0, valvePercent / 100.0)));
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
        // Gaussian elimination with partial pivoting.
        for (int col = 0; col < 3; col++) {
            int pivot = col;
            for (int r = col + 1; r < 3; r++) {
                if (Math.abs(a[r][col]) > Math.abs(a[pivot][col])) {
                    pivot = r;
                }
            }
            if (Math.abs(a[pivot][col]) < 1e-12) {
                // Too few distinct valve openings for a curve: fall back to a weighted constant.
                return constant(y, w);
            }
            double[] t = a[col];
            a[col] = a[pivot];
            a[pivot] = t;
            for (int r = 0; r < 3; r++) {
                if (r != col) {
                    double f = a[r][col] / a[col][col];
                    for (int s = col; s < 4; s++) {
                        a[r][s] -= f * a[col][s];
                    }
                }
            }
        }
        return new double[] {a[0][3] / a[0][0], a[1][3] / a[1][1], a[2][3] / a[2][2]};
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

    private static double[] abs(double[] r) {
        double[] a = new double[r.length];
        for (int i = 0; i < r.length; i++) {
            a[i] = Math.abs(r[i]);
        }
        return a;
    }

    private static double median(double[] v) {
        return org.tufa.analysis.band.Quantiles.medianInPlace(v.clone(), v.length);
    }
}
