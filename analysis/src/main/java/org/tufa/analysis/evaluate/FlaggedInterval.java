package org.tufa.analysis.evaluate;

import java.time.Instant;

/**
 * One row of {@code findings.csv}, read as the half-open interval {@code [start, end)}: a sample at time t is
 * flagged when {@code start <= t < end}, or when {@code t == start} (so a one-sample finding with start = end counts).
 */
public record FlaggedInterval(String unit, String kind, Instant start, Instant end) {
    boolean covers(Instant t) {
        return t.equals(start) || (!t.isBefore(start) && t.isBefore(end));
    }
}
