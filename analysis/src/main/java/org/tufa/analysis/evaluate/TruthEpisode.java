package org.tufa.analysis.evaluate;

import java.time.Instant;

/** One row of {@code truth.csv}: a fault on a unit, active for {@code start <= t < end}. */
public record TruthEpisode(String unit, String fault, Instant start, Instant end, double severity) {
    boolean contains(Instant t) {
        return !t.isBefore(start) && t.isBefore(end);
    }
}
