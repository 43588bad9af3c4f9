package org.tufa.analysis.findings;

import java.time.Instant;
import java.util.List;

/**
 * One candidate fault of one unit: a time interval with its evidence and candidate causes.
 *
 * @param mode      operating mode the finding was made in ("any" for findings across modes)
 * @param kind      fault_cluster, out_of_band_high, out_of_band_low or simultaneous_heating_cooling
 * @param cluster   the cluster label for fault_cluster findings, -1 otherwise
 * @param range     grid samples covered
 * @param start     start of the first sample
 * @param end       end of the last sample
 * @param hours     duration
 * @param energyKwh sensible energy the unit moved during the interval (sum of |Q| dt), NaN when unknown
 * @param shifts    the cluster's shift from normal per feature (empty for rule-based findings)
 * @param causes    candidate causes to verify, from the cause table
 */
public record Finding(String mode, String kind, int cluster, IndexRange range, Instant start, Instant end,
                      double hours, double energyKwh, List<Shift> shifts, List<String> causes) {
    public Finding {
        shifts = List.copyOf(shifts);
        causes = List.copyOf(causes);
    }
}
