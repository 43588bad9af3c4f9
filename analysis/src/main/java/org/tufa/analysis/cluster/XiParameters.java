package org.tufa.analysis.cluster;

/**
 * Parameters of the xi-steep extraction ({@link Extraction#xi}).
 *
 * @param xi steepness, 0 < xi < 1: a point is steep upward when r(p) <= r(p+1) * (1 - xi) (Ankerst et al. 1999,
 *     section 4.3; scikit-learn's default 0.05)
 * @param minClusterSize smallest cluster, in samples, >= 2
 * @param predecessorCorrection apply Schubert &amp; Gertz (LWDA 2018) Algorithm 2 to every candidate cluster
 * @param trailingPoint how the last point of the reachability plot is treated, see {@link TrailingPoint}
 */
public record XiParameters(double xi, int minClusterSize, boolean predecessorCorrection, TrailingPoint trailingPoint) {

    public XiParameters {
        if (!(xi > 0 && xi < 1)) {
            throw new IllegalArgumentException("xi must lie strictly between 0 and 1, got " + xi);
        }
        if (minClusterSize < 2) {
            throw new IllegalArgumentException("minimum cluster size must be at least 2, got " + minClusterSize);
        }
        if (trailingPoint == null) {
            throw new IllegalArgumentException("trailing point rule missing");
        }
    }

    /** xi and minimum cluster size with predecessor correction and the {@link TrailingPoint#EXCLUDE_STEEP_RISE}
     * convention. */
    public static XiParameters of(double xi, int minClusterSize) {
        return new XiParameters(xi, minClusterSize, true, TrailingPoint.EXCLUDE_STEEP_RISE);
    }

    /** The same parameters with another trailing point rule. */
    public XiParameters with(TrailingPoint rule) {
        return new XiParameters(xi, minClusterSize, predecessorCorrection, rule);
    }

    /**
     * The last point of the reachability plot has no successor, yet the xi method needs r(p+1) to decide
     * whether p is steep. Both rules append r(n) = +infinity after the last point, so that a cluster running to the
     * end of the plot is closed.
     */
    public enum TrailingPoint {
        /**
         * As scikit-learn 1.2.1's cluster_optics_xi: the appended infinity makes the last point steep upward, so a
         * trailing outlier (a last point reached by a big jump) is absorbed into the last cluster. Kept for
         * comparison with scikit-learn.
         */
        ABSORB_LIKE_SCIKIT_LEARN,
        /**
         * Ours (default): when the last point is itself a xi-steep rise (r(n-2) <= r(n-1) * (1 - xi)), it is not
         * steep with respect to the appended infinity. The last cluster then ends before it, exactly as an
         * interior point reached by a jump ends a cluster when a lower point follows it; the trailing outlier
         * stays noise. Otherwise (a flat or falling end) the rule equals scikit-learn's.
         */
        EXCLUDE_STEEP_RISE
    }
}
