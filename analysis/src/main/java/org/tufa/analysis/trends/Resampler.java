package org.tufa.analysis.trends;

import java.util.Arrays;

/**
 * Puts irregular samples on a regular grid. Pure functions on arrays.
 *
 * <p>Grid cell {@code k} covers {@code [gridStart + k*interval, gridStart + (k+1)*interval)}, in epoch seconds.
 * Sample-and-hold, not interpolation: BAS trend logs record on change of value (BACnet Trend Log, ASHRAE 135-2020
 * clause 12.25), so between two samples the signal kept its last value (notes section 9). A value is held for at
 * most {@code maxGap} seconds after its sample (or until the next sample, if sooner): beyond that the gap is treated
 * as missing data, never filled.
 *
 * <ul>
 *   <li>Analog: the mean of the samples in the cell; a cell without samples takes the last earlier value when that
 *       value is still held at the cell start ({@code cellStart < lastSampleTime + maxGap}); otherwise NaN.</li>
 *   <li>Binary: the time-weighted mean of the held signal over the part of the cell it covers (the on-fraction for
 *       0/1 values); NaN when no held value covers any part of the cell.</li>
 * </ul>
 *
 * <p>Input times must be sorted ascending (equal times allowed). Samples before {@code gridStart} only supply
 * held values; samples at or after the grid end are ignored.
 */
public final class Resampler {

    private Resampler() {
    }

    /** Analog resampling: cell mean, else held value within maxGap, else NaN. */
    public static double[] analog(long[] times, double[] values, long gridStart, long interval, int cells, long maxGap) {
        checkArguments(times, values, interval, cells);
        double[] out = new double[cells];
        int n = times.length;
        int i = 0;
        boolean haveLast = false;
        long lastTime = 0;
        double lastValue = Double.NaN;
        while (i < n && times[i] < gridStart) {
            haveLast = true;
            lastTime = times[i];
            lastValue = values[i];
            i++;
        }
        for (int k = 0; k < cells; k++) {
            long cellStart = gridStart + k * interval;
            long cellEnd = cellStart + interval;
            double sum = 0;
            int count = 0;
            while (i < n && times[i] < cellEnd) {
                sum += values[i];
                count++;
                haveLast = true;
                lastTime = times[i];
                lastValue = values[i];
                i++;
            }
            if (count > 0) {
                out[k] = sum / count;
            } else if (haveLast && cellStart < lastTime + maxGap) {
                out[k] = lastValue;
            } else {
                out[k] = Double.NaN;
            }
        }
        return out;
    }

    /** Binary resampling: time-weighted mean of the held signal over the covered part of each cell. */
    public static double[] binary(long[] times, double[] values, long gridStart, long interval, int cells, long maxGap) {
        checkArguments(times, values, interval, cells);
        double[] weighted = new double[cells];
        double[] covered = new double[cells];
        long gridEnd = gridStart + cells * interval;
        int n = times.length;
        for (int i = 0; i < n; i++) {
            long segmentStart = times[i];
            long segmentEnd = segmentStart + maxGap;
            if (i + 1 < n && times[i + 1] < segmentEnd) {
                segmentEnd = times[i + 1];
            }
            segmentStart = Math.max(segmentStart, gridStart);
            segmentEnd = Math.min(segmentEnd, gridEnd);
            if (segmentEnd <= segmentStart) {
                continue;
            }
            int k = (int) ((segmentStart - gridStart) / interval);
            while (k < cells) {
                long cellStart = gridStart + k * interval;
                long cellEnd = cellStart + interval;
                long overlap = Math.min(segmentEnd, cellEnd) - Math.max(segmentStart, cellStart);
                if (overlap <= 0) {
                    break;
                }
                weighted[k] += overlap * values[i];
                covered[k] += overlap;
                k++;
            }
        }
        double[] out = new double[cells];
        for (int k = 0; k < cells; k++) {
            out[k] = covered[k] > 0 ? weighted[k] / covered[k] : Double.NaN;
        }
        return out;
    }

    /**
     * One series on a grid, with its sample counts: the shared last step of every trend source.
     *
     * @param times sample times in epoch seconds, sorted ascending
     * @param values sample values, same length
     */
    public static ResampledSeries resample(String id, SeriesKind kind, long[] times, double[] values, TrendGrid grid,
                                           long maxGap) {
        long gridStart = grid.start();
        long interval = grid.interval();
        int gridLength = grid.cells();
        double[] out = kind == SeriesKind.BINARY
                ? binary(times, values, gridStart, interval, gridLength, maxGap)
                : analog(times, values, gridStart, interval, gridLength, maxGap);
        boolean[] hasSample = new boolean[gridLength];
        int raw = 0;
        long gridEnd = gridStart + gridLength * interval;
        for (long t : times) {
            if (t >= gridStart && t < gridEnd) {
                raw++;
                hasSample[(int) ((t - gridStart) / interval)] = true;
            }
        }
        int withSamples = 0;
        int held = 0;
        for (int k = 0; k < gridLength; k++) {
            if (hasSample[k]) {
                withSamples++;
            } else if (!Double.isNaN(out[k])) {
                held++;
            }
        }
        return new ResampledSeries(id, kind, java.time.Instant.ofEpochSecond(gridStart),
                java.time.Duration.ofSeconds(interval), out, raw, withSamples, held);
    }

    /** Number of samples with {@code gridStart <= t < gridStart + cells*interval}. */
    public static int samplesInGrid(long[] times, long gridStart, long interval, int cells) {
        long gridEnd = gridStart + cells * interval;
        int count = 0;
        for (long t : times) {
            if (t >= gridStart && t < gridEnd) {
                count++;
            }
        }
        return count;
    }

    /** Sorts samples by time, keeping file order among equal times (stable); returns the inputs when sorted. */
    static SpillStore.Samples sortedByTime(SpillStore.Samples samples) {
        return sortedByTime(samples.epochSeconds(), samples.values());
    }

    /** Sorts two parallel arrays by time in place, keeping the given order among equal times (stable). */
    public static void sortByTime(long[] times, double[] values) {
        SpillStore.Samples sorted = sortedByTime(new SpillStore.Samples(times, values));
        if (sorted.epochSeconds() != times) {
            System.arraycopy(sorted.epochSeconds(), 0, times, 0, times.length);
            System.arraycopy(sorted.values(), 0, values, 0, values.length);
        }
    }

    private static SpillStore.Samples sortedByTime(long[] t, double[] v) {
        SpillStore.Samples samples = new SpillStore.Samples(t, v);
        boolean sorted = true;
        for (int i = 1; i < t.length && sorted; i++) {
            sorted = t[i - 1] <= t[i];
        }
        if (sorted) {
            return samples;
        }
        Integer[] order = new Integer[t.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Long.compare(t[a], t[b]));
        long[] times = new long[t.length];
        double[] values = new double[t.length];
        for (int i = 0; i < order.length; i++) {
            times[i] = t[order[i]];
            values[i] = samples.values()[order[i]];
        }
        return new SpillStore.Samples(times, values);
    }

    private static void checkArguments(long[] times, double[] values, long interval, int cells) {
        if (times.length != values.length) {
            throw new IllegalArgumentException("times and values differ in length");
        }
        if (interval <= 0 || cells < 0) {
            throw new IllegalArgumentException("interval must be positive and cells non-negative");
        }
    }
}
