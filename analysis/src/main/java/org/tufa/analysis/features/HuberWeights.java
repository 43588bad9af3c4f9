package org.tufa.analysis.features;

import org.tufa.analysis.band.Quantiles;

/**
 * One reweighting step of iteratively reweighted least squares with Huber's weights (Huber, "Robust estimation of
 * a location parameter", Annals of Mathematical Statistics 35(1), 1964): weight 1 for a residual within k times
 * the scale, k s / |r| beyond, with k = 1.345 (95 % efficiency at the normal distribution) and the scale the MAD
 * times 1.4826 (Holland and Welsch, Communications in Statistics A6(9), 1977). Shared by the robust fits of this
 * package: {@link CoilResponse}, {@link RobustLine}, {@link StageContrasts}.
 */
final class HuberWeights {

    /** Huber's tuning constant for 95 % efficiency at the normal distribution (Holland and Welsch 1977). */
    static final double K = 1.345;
    /** The MAD of a normal sample times this estimates its standard deviation. */
    static final double MAD_TO_SD = 1.4826;

    private HuberWeights() {
    }

    /**
     * Sets {@code weights} from {@code residuals}; returns false, leaving the weights, when the scale is below
     * {@code minScale} (the fit is exact: nothing left to reweight).
     */
    static boolean reweight(double[] residuals, double[] weights, double minScale) {
        int n = residuals.length;
        double[] abs = new double[n];
        for (int i = 0; i < n; i++) {
            abs[i] = Math.abs(residuals[i]);
        }
        double scale = MAD_TO_SD * Quantiles.medianInPlace(abs, n);
        if (scale < minScale) {
            return false;
        }
        for (int i = 0; i < n; i++) {
            double u = Math.abs(residuals[i]) / (K * scale);
            weights[i] = u <= 1 ? 1 : 1 / u;
        }
        return true;
    }
}
