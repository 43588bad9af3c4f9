package org.tufa.analysis.significance;

import java.util.Arrays;
import org.tufa.analysis.band.Quantiles;

/**
 * The null distribution of a unit's most unusual stretch, estimated from the fleet itself.
 *
 * <p>Each unit contributes the largest scan statistic of its own record ({@link ScanStatistic}): how far its most
 * unusual run of days strays from its normal days. Most units of a fleet are healthy, so the bulk of these maxima
 * shows what "most unusual stretch of a healthy unit" looks like in this fleet, with its weather, occupancy and
 * control styles: an empirical null in the sense of Efron, "Large-scale simultaneous hypothesis testing: the
 * choice of a null hypothesis", JASA 99(465):96-104 (2004), who fits the null to the centre of the distribution of
 * all test statistics rather than assuming a theoretical one, so that correlation and unmodelled variation widen
 * it. A maximum of many weakly dependent values follows a Gumbel law (Fisher and Tippett 1928; Gumbel, Statistics of
 * Extremes, 1958), so the null is a Gumbel distribution fitted to the centre of the maxima by matching the median
 * and the interquartile range (robust to the faulty units in the upper tail): for a Gumbel law with location mu and
 * scale beta, Q(p) = mu - beta ln(-ln p), so Q(0.75) - Q(0.25) = beta (ln ln 4 - ln ln 4/3) and
 * Q(0.5) = mu - beta ln ln 2.
 *
 * <p>The fitted null is never laxer than the one independent normal days would give (location and scale of the
 * maximum of {@code windows} independent standard normal values; Leadbetter, Lindgren and Rootzen, Extremes and
 * Related Properties of Random Sequences and Processes, 1983, theorem 1.5.3), and with fewer than
 * {@link #MIN_POOL} units that theoretical null is used alone, widened by {@link #SMALL_POOL_WIDENING}: a
 * handful of units cannot show a fleet's variation.
 *
 * @param location Gumbel location mu
 * @param scale    Gumbel scale beta
 * @param pool     number of maxima it was fitted to
 * @param fitted   true when fitted to the fleet, false when the theoretical null was used alone
 */
public record GumbelNull(double location, double scale, int pool, boolean fitted) {

    /** Fewest maxima the fit needs (common practice, no source: a quartile needs a few points on each side). */
    public static final int MIN_POOL = 12;
    /** Widening of the theoretical null's scale when the fleet is too small to fit (common practice, no source). */
    public static final double SMALL_POOL_WIDENING = 2.0;

    private static final double LN_LN_2 = Math.log(Math.log(2));
    private static final double IQR_PER_SCALE = Math.log(Math.log(4)) - Math.log(Math.log(4.0 / 3.0));

    public GumbelNull {
        if (!(scale > 0) || !Double.isFinite(location)) {
            throw new IllegalArgumentException("bad Gumbel null: location " + location + ", scale " + scale);
        }
    }

    /**
     * @param maxima  one scan maximum per unit (NaN for units without data are ignored)
     * @param windows typical number of windows a unit's scan looks at (days x window lengths), for the theoretical
     *                floor
     */
    public static GumbelNull fit(double[] maxima, int windows) {
        double[] finite = Arrays.stream(maxima).filter(Double::isFinite).sorted().toArray();
        double n = Math.max(3, windows);
        double a = Math.sqrt(2 * Math.log(n));
        double theoryLocation = a - (Math.log(Math.log(n)) + Math.log(4 * Math.PI)) / (2 * a);
        double theoryScale = 1 / a;
        if (finite.length < MIN_POOL) {
            return new GumbelNull(theoryLocation, SMALL_POOL_WIDENING * theoryScale, finite.length, false);
        }
        double q1 = Quantiles.linearOfSorted(finite, 0.25);
        double median = Quantiles.linearOfSorted(finite, 0.5);
        double q3 = Quantiles.linearOfSorted(finite, 0.75);
        double scale = Math.max((q3 - q1) / IQR_PER_SCALE, theoryScale);
        double location = Math.max(median + scale * LN_LN_2, theoryLocation);
        return new GumbelNull(location, scale, finite.length, true);
    }

    /** P(maximum >= x) under this null. */
    public double survival(double x) {
        if (Double.isNaN(x)) {
            return 1;
        }
        double t = (x - location) / scale;
        // 1 - exp(-exp(-t)), written with expm1 so that tiny tail probabilities keep their digits.
        return -Math.expm1(-Math.exp(-t));
    }
}
