package org.tufa.analysis.significance;

/**
 * Fisher's method for combining independent p-values (R. A. Fisher, Statistical Methods for Research Workers,
 * 4th ed., 1932, section 21.1): under the joint null, X = -2 sum ln p_i follows a chi-squared distribution with 2k
 * degrees of freedom. Used where two different kinds of evidence (a rule and a cluster) point at the same period:
 * their agreement is stronger evidence than either alone.
 */
public final class FisherCombination {

    private FisherCombination() {
    }

    /** The combined p-value of the given p-values (each in (0, 1]; a 0 gives 0). */
    public static double combine(double... p) {
        if (p.length == 0) {
            throw new IllegalArgumentException("no p-values to combine");
        }
        double x = 0;
        for (double v : p) {
            if (!(v >= 0 && v <= 1)) {
                throw new IllegalArgumentException("p-values must lie in [0, 1], got " + v);
            }
            if (v == 0) {
                return 0;
            }
            x -= 2 * Math.log(v);
        }
        return chiSquaredSurvivalEvenDf(x, 2 * p.length);
    }

    /**
     * P(chi2 with 2k degrees of freedom >= x) in closed form: exp(-x/2) sum_{i<k} (x/2)^i / i! (the Poisson sum;
     * Abramowitz and Stegun 26.4.21).
     */
    static double chiSquaredSurvivalEvenDf(double x, int df) {
        if (df <= 0 || df % 2 != 0) {
            throw new IllegalArgumentException("degrees of freedom must be even and positive: " + df);
        }
        double half = x / 2;
        double term = 1;
        double sum = 1;
        for (int i = 1; i < df / 2; i++) {
            term *= half / i;
            sum += term;
        }
        return Math.min(1.0, Math.exp(-half) * sum);
    }
}
