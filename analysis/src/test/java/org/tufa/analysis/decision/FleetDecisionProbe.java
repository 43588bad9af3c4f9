package org.tufa.analysis.decision;

/** Opens the package-private helpers of {@link FleetDecision} to tests in other packages. */
public final class FleetDecisionProbe {

    private FleetDecisionProbe() {
    }

    public static double poissonUpperTail(double lambda, int k) {
        return FleetDecision.poissonUpperTail(lambda, k);
    }
}
