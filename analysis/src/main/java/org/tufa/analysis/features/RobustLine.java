package org.tufa.analysis.features;

import java.util.Arrays;

/**
 * A straight line y = a + b x fitted by iteratively reweighted least squares with Huber weights (Huber, "Robust
 * estimation of a location parameter", Annals of Mathematical Statistics 35(1), 1964; tuning constant 1.345 with
 * the MAD scale, Holland and Welsch 1977), as {@link CoilResponse} fits its curve: a minority of faulty samples
 * does not bend it. Used to take out of the coil residual what follows the outdoor temperature when the
 * supply-water temperature is not measured (plants reset it on the outdoor temperature).
 *
 * @param intercept a
 * @param slope     b
 */
public record RobustLine(double intercept, double slope) {

    private static final int ITERATIONS = 20;

    /** Fits the line to the pairs where both values are finite; a flat line at 0 when fewer than 3 are. */
    public static RobustLine fit(double[] x, double[] y) {
        int n = 0;
        double[] xs = new double[x.length];
        double[] ys = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            if (Double.isFinite(x[i]) && Double.isFinite(y[i])) {
                xs[n] = x[i];
                ys[n++] = y[i];
            }
        }
        if (n < 3) {
            return new RobustLine(0, 0);
        }
        double[] w = new double[n];
        Arrays.fill(w, 1.0);
        double a = 0;
        double b = 0;
        double[] r = new double[n];
        for (int it = 0; it < ITERATIONS; it++) {
            double sw = 0;
            double sx = 0;
            double sy = 0;
            for (int i = 0; i < n; i++) {
                sw += w[i];
                sx += w[i] * xs[i];
                sy += w[i] * ys[i];
            }
            double mx = sx / sw;
            double my = sy / sw;
            double sxx = 0;
            double sxy = 0;
            for (int i = 0; i < n; i++) {
                sxx += w[i] * (xs[i] - mx) * (xs[i] - mx);
                sxy += w[i] * (xs[i] - mx) * (ys[i] - my);
            }
            b = sxx > 0 ? sxy / sxx : 0;
            a = my - b * mx;
            for (int i = 0; i < n; i++) {
                r[i] = ys[i] - a - b * xs[i];
            }
            if (!HuberWeights.reweight(r, w, 1e-12)) {
                break;
            }
        }
        return new RobustLine(a, b);
    }

    /** y - (a + b x) per sample; NaN where either is missing. */
    public double[] residuals(double[] x, double[] y) {
        double[] out = new double[y.length];
        for (int i = 0; i < y.length; i++) {
            out[i] = Double.isFinite(x[i]) && Double.isFinite(y[i]) ? y[i] - intercept - slope * x[i] : Double.NaN;
        }
        return out;
    }
}
