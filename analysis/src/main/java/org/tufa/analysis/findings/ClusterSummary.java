package org.tufa.analysis.findings;

import java.util.List;

/**
 * What one cluster of a unit's mode looks like next to the normal (largest) cluster.
 *
 * @param label          cluster label (0 = normal)
 * @param size           samples in the cluster
 * @param candidateFault true when the cluster differs from normal in a health feature by more than the gate or
 *                       fails the direction check; false for the normal cluster and for clusters that differ
 *                       only in operating point (load level, weather): another regime of normal operation
 * @param shifts         median shift from normal per feature (empty for the normal cluster)
 * @param direction      expected-direction check of the cluster (null where it does not apply)
 * @param causes         candidate causes (empty unless a candidate fault)
 */
public record ClusterSummary(int label, int size, boolean candidateFault, List<Shift> shifts,
                             DirectionCheck.Outcome direction, List<String> causes) implements java.io.Serializable {
    public ClusterSummary {
        shifts = List.copyOf(shifts);
        causes = List.copyOf(causes);
    }
}
