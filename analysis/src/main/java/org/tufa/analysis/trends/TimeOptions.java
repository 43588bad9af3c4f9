package org.tufa.analysis.trends;

import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.util.Objects;

/**
 * How trend time stamps are read and resampled.
 *
 * @param zone the zone the controllers logged naive local times in ({@code --timezone}); null when every stamp
 *     carries a UTC offset. A naive stamp without a zone is an input error.
 * @param interval grid interval (default 15 min), a whole number of seconds; the grid is aligned to the epoch (UTC)
 * @param maxGap longest time a value is held after its sample (default 1 h); nothing is filled beyond it
 * @param from optional window start (inclusive, rounded down to the grid); null = from the first sample
 * @param to optional window end (exclusive, rounded up to the grid); null = to the last sample
 * @param strict when true, the first unparsable value, time stamp or malformed row is an input error; when false
 *     they are counted, with examples, in the ingest report
 */
public record TimeOptions(ZoneId zone, Duration interval, Duration maxGap, Instant from, Instant to, boolean strict)
        implements java.io.Serializable {

    public static final Duration DEFAULT_INTERVAL = Duration.ofMinutes(15);
    public static final Duration DEFAULT_MAX_GAP = Duration.ofHours(1);

    public TimeOptions {
        Objects.requireNonNull(interval, "interval");
        Objects.requireNonNull(maxGap, "maxGap");
        if (interval.isNegative() || interval.isZero() || interval.getNano() != 0) {
            throw new IllegalArgumentException("interval must be a positive whole number of seconds: " + interval);
        }
        if (maxGap.isNegative() || maxGap.getNano() != 0) {
            throw new IllegalArgumentException("maxGap must be a non-negative whole number of seconds: " + maxGap);
        }
        if (from != null && to != null && !from.isBefore(to)) {
            throw new IllegalArgumentException("window start " + from + " is not before its end " + to);
        }
    }

    /** Defaults: 15 min grid, 1 h hold limit, no window, counting (not strict). */
    public static TimeOptions defaults(ZoneId zone) {
        return new TimeOptions(zone, DEFAULT_INTERVAL, DEFAULT_MAX_GAP, null, null, false);
    }

    public TimeOptions withInterval(Duration newInterval) {
        return new TimeOptions(zone, newInterval, maxGap, from, to, strict);
    }

    public TimeOptions withMaxGap(Duration newMaxGap) {
        return new TimeOptions(zone, interval, newMaxGap, from, to, strict);
    }

    public TimeOptions withWindow(Instant newFrom, Instant newTo) {
        return new TimeOptions(zone, interval, maxGap, newFrom, newTo, strict);
    }

    public TimeOptions withStrict(boolean newStrict) {
        return new TimeOptions(zone, interval, maxGap, from, to, newStrict);
    }
}
