package org.tufa.analysis.findings;

import java.time.Instant;
import java.util.List;

/**
 * One candidate fault of one unit: a time interval with its evidence and candidate causes.
 *
 * @param mode      operating mode the finding was made in ("any" for findings across modes)
 * @param kind      fault_cluster, a rule's name (simultaneous_heating_cooling, mode_hunting, ...), or the peer and
 *                  fleet kinds of the fleet stage
 * @param cluster   the cluster label for fault_cluster findings, -1 otherwise
 * @param range     grid samples covered
 * @param start     start of the first sample
 * @param end       end of the last sample
 * @param hours     duration
 * @param energyKwh sensible energy the unit moved during the interval (sum of |Q| dt), NaN when unknown
 * @param shifts    the cluster's shift from normal per feature (empty for rule-based findings)
 * @param causes    candidate causes to verify, from the cause table
 * @param evidence  what the finding rests on, in words (the deviation from the unit's normal days or its peers,
 *                  its duration, what agrees with it)
 * @param pValue    the probability of evidence at least this strong from a healthy unit of this fleet, NaN until
 *                  the fleet stage has decided ({@code org.tufa.analysis.decision.FleetDecision})
 * @param confidence 1 minus the finding's false-discovery-rate q-value (Benjamini and Hochberg 1995): among the
 *                  findings at or above this confidence, the expected share of false ones is at most 1 minus it;
 *                  NaN until decided
 */
public record Finding(String mode, String kind, int cluster, IndexRange range, Instant start, Instant end,
                      double hours, double energyKwh, List<Shift> shifts, List<String> causes, String evidence,
                      double pValue, double confidence) implements java.io.Serializable {
    public Finding {
        shifts = List.copyOf(shifts);
        causes = List.copyOf(causes);
    }

    /** A finding not yet decided by the fleet stage. */
    public Finding(String mode, String kind, int cluster, IndexRange range, Instant start, Instant end,
                   double hours, double energyKwh, List<Shift> shifts, List<String> causes) {
        this(mode, kind, cluster, range, start, end, hours, energyKwh, shifts, causes, "", Double.NaN, Double.NaN);
    }

    /** This finding with the fleet stage's decision. */
    public Finding decided(String evidenceText, double p, double confidenceValue) {
        return new Finding(mode, kind, cluster, range, start, end, hours, energyKwh, shifts, causes, evidenceText, p,
                confidenceValue);
    }

    /** This finding with its evidence described (before the fleet stage). */
    public Finding withEvidence(String evidenceText) {
        return new Finding(mode, kind, cluster, range, start, end, hours, energyKwh, shifts, causes, evidenceText,
                pValue, confidence);
    }
}
