package org.tufa.analysis.trends;

import java.time.Duration;
import java.time.Instant;

/**
 * One series on the store's common grid: cell {@code k} covers {@code [gridStart + k*interval, gridStart +
 * (k+1)*interval)}. Every series of one {@link TrendStore} has the same grid start and length.
 *
 * @param id series id
 * @param kind how it was resampled
 * @param gridStart start of cell 0
 * @param interval cell length
 * @param values one value per cell; NaN = no data
 * @param rawSamples samples that fell inside the grid
 * @param cellsWithSamples cells holding at least one sample
 * @param cellsHeld cells without a sample that hold an earlier value (sample-and-hold within maxGap)
 */
public record ResampledSeries(
        String id,
        SeriesKind kind,
        Instant gridStart,
        Duration interval,
        double[] values,
        int rawSamples,
        int cellsWithSamples,
        int cellsHeld) {

    /** Number of grid cells. */
    public int length() {
        return values.length;
    }

    /** Cells with no data (NaN). */
    public int cellsMissing() {
        int missing = 0;
        for (double v : values) {
            if (Double.isNaN(v)) {
                missing++;
            }
        }
        return missing;
    }

    /** Start time of cell {@code k}. */
    public Instant cellStart(int k) {
        return gridStart.plus(interval.multipliedBy(k));
    }
}
