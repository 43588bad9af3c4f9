package org.tufa.analysis.trends;

import org.tufa.common.InputException;

/**
 * The grid every series of a run is resampled onto: epoch-aligned cells of {@code interval} seconds from the window
 * start (rounded down) or the first sample, to the window end (rounded up) or just past the last sample.
 *
 * @param start epoch second of cell 0
 * @param interval cell length in seconds
 * @param cells number of cells
 */
public record TrendGrid(long start, long interval, int cells) implements java.io.Serializable {

    /**
     * @param options window and interval
     * @param minTime earliest kept sample (epoch seconds), Long.MAX_VALUE when none
     * @param maxTime latest kept sample, Long.MIN_VALUE when none
     * @throws InputException when the grid would be too long to hold
     */
    public static TrendGrid of(TimeOptions options, long minTime, long maxTime) {
        long interval = options.interval().getSeconds();
        long start;
        long end;
        if (options.from() != null) {
            start = Math.floorDiv(options.from().getEpochSecond(), interval) * interval;
        } else {
            start = minTime == Long.MAX_VALUE ? 0 : Math.floorDiv(minTime, interval) * interval;
        }
        if (options.to() != null) {
            end = -Math.floorDiv(-options.to().getEpochSecond(), interval) * interval;
        } else {
            end = maxTime == Long.MIN_VALUE ? start : (Math.floorDiv(maxTime, interval) + 1) * interval;
        }
        long cells = Math.max(0, (end - start) / interval);
        if (cells > Integer.MAX_VALUE - 8) {
            throw new InputException("the trend data span " + cells + " grid cells of " + options.interval()
                    + "; choose a longer interval or a shorter window (from/to)");
        }
        return new TrendGrid(start, interval, (int) cells);
    }

    /** First epoch second a sample must have to be kept: the window start less the hold limit, or no limit. */
    public static long keepFrom(TimeOptions options) {
        return options.from() == null ? Long.MIN_VALUE
                : options.from().getEpochSecond() - options.maxGap().getSeconds();
    }

    /** Epoch second at and after which samples are dropped: the window end, or no limit. */
    public static long keepTo(TimeOptions options) {
        return options.to() == null ? Long.MAX_VALUE : options.to().getEpochSecond();
    }
}
