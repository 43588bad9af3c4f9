package org.tufa.analysis.cluster;

/** How many principal components {@link Pca#fit} keeps. */
public sealed interface ComponentRule {

    /** Cumulative explained variance of 90 %, the upper end of the 70-90 % range in Jolliffe, Principal Component
     * Analysis, 2nd ed., Springer 2002, section 6.1.1. */
    ComponentRule DEFAULT = new CumulativeVariance(0.90);

    /**
     * The smallest k whose cumulative explained variance ratio reaches {@code target} (compared with a 1e-12
     * tolerance, so that 0.9 computed as 0.8999999999999999 counts), but at least 2 and at most the number of kept
     * features.
     */
    record CumulativeVariance(double target) implements ComponentRule {
        public CumulativeVariance {
            if (!(target > 0 && target <= 1)) {
                throw new IllegalArgumentException("target explained variance must be in (0, 1], got " + target);
            }
        }
    }

    /** Exactly k components, capped at the number of kept features (the result reports the k used). */
    record Fixed(int k) implements ComponentRule {
        public Fixed {
            if (k < 1) {
                throw new IllegalArgumentException("number of components must be at least 1, got " + k);
            }
        }
    }

    static ComponentRule cumulativeVariance(double target) {
        return new CumulativeVariance(target);
    }

    static ComponentRule fixed(int k) {
        return new Fixed(k);
    }
}
