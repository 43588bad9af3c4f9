package org.tufa.analysis.cluster;

/**
 * Parameters of {@link Extraction#auto}; see that class comment for the reasoning.
 *
 * @param xi xi steepness (0 < xi < 1)
 * @param minClusterFraction smallest cluster as a fraction of the samples (the size used is at least MinPts and 2)
 * @param mergeCoverage a cluster whose sub-clusters cover at least this fraction of it is replaced by them
 */
public record AutoParameters(double xi, double minClusterFraction, double mergeCoverage)
        implements java.io.Serializable {

    /** xi = 0.05 (scikit-learn's default), 1 % minimum cluster size, 0.8 merge coverage. */
    public static final AutoParameters DEFAULT = new AutoParameters(0.05, 0.01, 0.8);

    public AutoParameters {
        if (!(xi > 0 && xi < 1)) {
            throw new IllegalArgumentException("xi must lie strictly between 0 and 1, got " + xi);
        }
        if (!(minClusterFraction >= 0 && minClusterFraction < 1)) {
            throw new IllegalArgumentException("minimum cluster fraction must be in [0, 1), got " + minClusterFraction);
        }
        if (!(mergeCoverage > 0)) {
            throw new IllegalArgumentException("merge coverage must be positive, got " + mergeCoverage);
        }
    }
}
