package org.tufa.analysis.simulate;

import java.time.Instant;
import java.util.Objects;

/** One injected fault: on {@code unitIri}, active for {@code start <= t < end}, with a severity in [0, 1]. */
public record FaultEpisode(String unitIri, FaultType fault, Instant start, Instant end, double severity) {
    public FaultEpisode {
        Objects.requireNonNull(unitIri);
        Objects.requireNonNull(fault);
        Objects.requireNonNull(start);
        Objects.requireNonNull(end);
        if (!end.isAfter(start)) {
            throw new IllegalArgumentException("fault episode on " + unitIri + " ends before it starts");
        }
        if (!(severity >= 0 && severity <= 1)) {
            throw new IllegalArgumentException("fault severity must be in [0, 1], got " + severity);
        }
    }

    /** Whether the fault is active at {@code t}. */
    public boolean activeAt(Instant t) {
        return !t.isBefore(start) && t.isBefore(end);
    }
}
