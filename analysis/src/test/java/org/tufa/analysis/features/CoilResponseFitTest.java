package org.tufa.analysis.features;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The robust, monotone quadratic coil response of {@link CoilResponse}. */
class CoilResponseFitTest {

    /** Entering air-to-water difference: zone 24 C, chilled water 7 C (as in {@link CoilResponseTest}). */
    private static final double WATER_DT = 17.0;

    /**
     * A fault that fills the top valve band: a failed fan keeps the valve at 100 % for days while the air
     * temperature change collapses. 60 % healthy samples spread over all openings with effectiveness
     * e(v) = 0.6 v, 40 % of all samples at 100 % with an air change of 2 K instead of 0.6 * 17 = 10.2 K (worked
     * example, computed by hand: true residual -8.2 K). An unconstrained quadratic bends down at v = 1 to follow
     * the majority of that band and hides the fault; held non-decreasing, the curve cannot fall towards the
     * faulty samples, so they keep a negative residual past twice the 1.1 K gate.
     *
     * <p>Measured, not asserted as desired: the Huber fit still bends part of the way (residual about -2.5 K, and
     * healthy samples near full opening read about +5 K). Forty percent of the samples at one end of the valve
     * range are high-leverage points, and Huber M-regression bounds the influence of large residuals but not of
     * leverage (Rousseeuw and Leroy, Robust Regression and Outlier Detection, Wiley 1987, ch. 1).
     */
    @Test
    void faultFillingTheTopBandStaysNegativeBecauseTheCurveCannotFall() {
        int healthy = 600;
        int faulty = 400;
        double[] valve = new double[healthy + faulty];
        double[] air = new double[valve.length];
        double[] water = new double[valve.length];
        for (int i = 0; i < healthy; i++) {
            valve[i] = (i * 37 % 100) + 0.5;
            air[i] = 0.6 * valve[i] / 100 * WATER_DT;
            water[i] = WATER_DT;
        }
        for (int i = healthy; i < valve.length; i++) {
            valve[i] = 100;
            air[i] = 2.0;
            water[i] = WATER_DT;
        }
        CoilResponse r = CoilResponse.fit(valve, air, water);
        double[] c = r.coefficients();
        // Non-decreasing on [0, 1]: both end slopes >= 0 (the slope c1 + 2 c2 v is linear in v).
        assertTrue(c[1] >= -1e-12 && c[1] + 2 * c[2] >= -1e-12, java.util.Arrays.toString(c));
        double atFull = r.residual(100, 2.0, WATER_DT);
        assertTrue(atFull < -2.2, "residual of the failed-fan samples at 100 %: " + atFull);
        // Contrast, computed in this test: an ordinary least-squares quadratic on the same data bends down to the
        // fault at v = 1 and hides much more of it, which is why the constraint exists.
        double[] ols = leastSquaresQuadratic(fractions(valve), ratio(air, water), ones(valve.length));
        double olsResidual = 2.0 - (ols[0] + ols[1] + ols[2]) * WATER_DT;
        // Measured: OLS leaves about -1.2 K, at the edge of the 1.1 K gate; the monotone fit about -2.5 K.
        assertTrue(olsResidual > atFull + 1.0, "OLS residual " + olsResidual + " vs monotone " + atFull);
    }

    /**
     * A quadratic with known coefficients and no noise is recovered exactly (worked example, computed by hand:
     * e(v) = 0.05 + 0.9 v - 0.3 v^2 rises on [0, 1], end slopes 0.9 and 0.3). The air change is e(v) times an
     * entering difference that varies between samples, so the fit must divide by it.
     */
    @Test
    void noiseFreeQuadraticIsRecovered() {
        int n = 404;
        double[] valve = new double[n];
        double[] air = new double[n];
        double[] water = new double[n];
        for (int i = 0; i < n; i++) {
            valve[i] = i % 101;
            double v = valve[i] / 100;
            water[i] = 10 + i % 7;
            air[i] = (0.05 + 0.9 * v - 0.3 * v * v) * water[i];
        }
        CoilResponse r = CoilResponse.fit(valve, air, water);
        assertTrue(r.usesWaterTemperature());
        assertArrayEquals(new double[] {0.05, 0.9, -0.3}, r.coefficients(), 1e-9);
        // And the same without water temperature: the response is the air change itself.
        double[] direct = new double[n];
        for (int i = 0; i < n; i++) {
            double v = valve[i] / 100;
            direct[i] = 1.0 + 8.0 * v + 2.0 * v * v;
        }
        assertArrayEquals(new double[] {1.0, 8.0, 2.0}, CoilResponse.fit(valve, direct, null).coefficients(), 1e-9);
    }

    /**
     * A staged fan: the same curve shape with an offset per stage, no noise (worked example, computed by hand:
     * e(v) = 0.1 + 0.8 v - 0.2 v^2 at the low stage, +0.0 / -0.06 / -0.11 at low, medium and high; a lower stage
     * passes less air, so the coil changes its temperature more). The stages rise with the valve as a staged fan's
     * do, with overlaps, and every day (50 samples) sees two or three of them. Curve and offsets come back to
     * within 1e-3 of the truth.
     */
    @Test
    void stageOffsetsOnASharedCurveAreRecovered() {
        int n = 600;
        double[] valve = new double[n];
        double[] air = new double[n];
        double[] water = new double[n];
        int[] stage = new int[n];
        int[] day = new int[n];
        double[] offset = {0.0, -0.06, -0.11};
        for (int i = 0; i < n; i++) {
            valve[i] = i * 37 % 101;
            stage[i] = valve[i] < 30 ? 0 : valve[i] < 45 ? i % 2 : valve[i] < 65 ? 1 : valve[i] < 80 ? 1 + i % 2 : 2;
            day[i] = i / 50;
            double v = valve[i] / 100;
            water[i] = 12 + i % 5;
            air[i] = (0.1 + 0.8 * v - 0.2 * v * v + offset[stage[i]]) * water[i];
        }
        CoilResponse r = CoilResponse.fit(valve, air, water, stage, 3, day);
        String got = java.util.Arrays.toString(r.coefficients()) + java.util.Arrays.toString(r.stageOffsets());
        assertArrayEquals(new double[] {0.1, 0.8, -0.2}, r.coefficients(), 1e-3, got);
        assertArrayEquals(offset, r.stageOffsets(), 1e-3, got);
        assertEquals(0.0, r.residual(50, (0.1 + 0.4 - 0.05 - 0.06) * 14, 14, 1), 0.02);
        // Measured contrast: one curve for all stages leaves each stage on its own side of it, the split that
        // clustering would read as too much or too little airflow.
        CoilResponse pooled = CoilResponse.fit(valve, air, water);
        double lowAt35 = pooled.residual(35, (0.1 + 0.28 - 0.0245) * 14, 14);
        double mediumAt35 = pooled.residual(35, (0.1 + 0.28 - 0.0245 - 0.06) * 14, 14);
        assertTrue(lowAt35 - mediumAt35 > 0.8, lowAt35 + " vs " + mediumAt35);
    }

    /**
     * The case the within-day learning exists for: a fault that costs capacity makes a staged fan run high. Here
     * the high stage runs on 6 healthy days and on all 10 faulty days, where the coil does 0.15 less at every
     * stage (a leaking valve or a fouled coil), so two thirds of the high stage's samples are faulty. Offsets
     * learnt from all of a stage's samples would take most of the fault into the high stage's offset; learnt from
     * same-day differences they stay at the true -0.1, and the faulty high-stage samples keep a residual of
     * about -0.15 x 17 K. Worked by hand from the planted values.
     */
    @Test
    void aFaultThatRaisesTheStageIsNotLearntAsTheStage() {
        int days = 40;
        int perDay = 40;
        int n = days * perDay;
        double[] valve = new double[n];
        double[] air = new double[n];
        double[] water = new double[n];
        int[] stage = new int[n];
        int[] day = new int[n];
        for (int i = 0; i < n; i++) {
            int d = i / perDay;
            int q = i % perDay;
            boolean faulty = d >= 30;
            boolean hot = d % 5 == 0 || faulty;
            day[i] = d;
            // Low in the morning, medium after; high for the afternoons of hot days.
            stage[i] = q < 15 ? 0 : hot && q >= 28 ? 2 : 1;
            valve[i] = 20 + (q * 7 + d * 3) % 70;
            water[i] = WATER_DT;
            double e = 0.1 + 0.6 * valve[i] / 100 + new double[] {0.0, -0.05, -0.1}[stage[i]] - (faulty ? 0.15 : 0);
            air[i] = e * WATER_DT;
        }
        CoilResponse r = CoilResponse.fit(valve, air, water, stage, 3, day);
        assertEquals(-0.1, r.stageOffsets()[2], 0.02, java.util.Arrays.toString(r.stageOffsets()));
        int faultyHigh = 30 * perDay + 30;
        double residual = r.residual(valve[faultyHigh], air[faultyHigh], WATER_DT, 2);
        assertEquals(-0.15 * WATER_DT, residual, 0.5);
    }

    /** Without stages (null, or fewer than two) the fit is the plain one, bit for bit. */
    @Test
    void fewerThanTwoStagesIsThePlainFit() {
        int n = 200;
        SplittableRandom random = new SplittableRandom(5);
        double[] valve = new double[n];
        double[] air = new double[n];
        int[] stage = new int[n];
        for (int i = 0; i < n; i++) {
            valve[i] = random.nextDouble(0, 100);
            air[i] = 1 + 7 * valve[i] / 100 + 0.2 * random.nextGaussian();
        }
        double[] plain = CoilResponse.fit(valve, air, null).coefficients();
        assertArrayEquals(plain, CoilResponse.fit(valve, air, null, stage, 1, stage).coefficients(), 0.0);
        assertArrayEquals(plain, CoilResponse.fit(valve, air, null, null, 3, stage).coefficients(), 0.0);
        assertEquals(0, CoilResponse.fit(valve, air, null, null, 3, stage).stageOffsets().length);
    }

    /**
     * Huber weights (Huber, Annals of Mathematical Statistics 35(1), 1964): one gross outlier barely moves the
     * robust fit, while an ordinary least-squares quadratic computed in this test moves by about outlier / n.
     * Data: air change 2 + 6 v K with sensor noise sd 0.1 K (seeded), one sample 40 K too high at v = 0.5.
     */
    @Test
    void oneGrossOutlierMovesLeastSquaresButNotTheHuberFit() {
        int n = 60;
        SplittableRandom random = new SplittableRandom(11);
        double[] valve = new double[n];
        double[] air = new double[n];
        for (int i = 0; i < n; i++) {
            valve[i] = 100.0 * i / (n - 1);
            air[i] = 2 + 6 * valve[i] / 100 + 0.1 * random.nextGaussian();
        }
        double[] clean = leastSquaresQuadratic(fractions(valve), air, ones(n));
        int outlier = n / 2;
        air[outlier] += 40;
        double[] ols = leastSquaresQuadratic(fractions(valve), air, ones(n));
        CoilResponse huber = CoilResponse.fit(valve, air, null);
        double v = valve[outlier] / 100;
        double truth = 2 + 6 * v;
        double olsError = Math.abs(eval(ols, v) - truth);
        double huberError = Math.abs(eval(huber.coefficients(), v) - truth);
        // OLS on the clean data sits on the truth (a check of the reference fit itself).
        assertEquals(truth, eval(clean, v), 0.1);
        // OLS with the outlier moves by roughly 40 K / 60 samples (about 0.7 K here, more at the centre of a
        // quadratic); the Huber fit stays within the noise.
        assertTrue(olsError > 0.5, "OLS moved only " + olsError);
        assertTrue(huberError < 0.1, "Huber moved " + huberError);
        assertTrue(huberError < olsError / 5, "Huber " + huberError + " vs OLS " + olsError);
    }

    private static double eval(double[] c, double v) {
        return c[0] + c[1] * v + c[2] * v * v;
    }

    private static double[] fractions(double[] percent) {
        double[] f = new double[percent.length];
        for (int i = 0; i < f.length; i++) {
            f[i] = percent[i] / 100;
        }
        return f;
    }

    private static double[] ratio(double[] a, double[] b) {
        double[] r = new double[a.length];
        for (int i = 0; i < r.length; i++) {
            r[i] = a[i] / b[i];
        }
        return r;
    }

    private static double[] ones(int n) {
        double[] w = new double[n];
        java.util.Arrays.fill(w, 1);
        return w;
    }

    /**
     * Reference fit for the tests: least squares for y = c0 + c1 v + c2 v^2 by the normal equations solved with
     * Cramer's rule (common practice, no source; independent of the Gaussian elimination in CoilResponse).
     */
    static double[] leastSquaresQuadratic(double[] v, double[] y, double[] w) {
        double[][] a = new double[3][3];
        double[] b = new double[3];
        for (int i = 0; i < v.length; i++) {
            double[] x = {1, v[i], v[i] * v[i]};
            for (int r = 0; r < 3; r++) {
                for (int s = 0; s < 3; s++) {
                    a[r][s] += w[i] * x[r] * x[s];
                }
                b[r] += w[i] * x[r] * y[i];
            }
        }
        double d = det(a);
        double[] c = new double[3];
        for (int k = 0; k < 3; k++) {
            double[][] m = new double[3][];
            for (int r = 0; r < 3; r++) {
                m[r] = a[r].clone();
                m[r][k] = b[r];
            }
            c[k] = det(m) / d;
        }
        return c;
    }

    private static double det(double[][] m) {
        return m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1])
                - m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0])
                + m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
    }
}
