package org.tufa.analysis.trends;

import java.time.Duration;
import java.time.Instant;
import java.util.Collection;
import java.util.Map;

/**
 * Where a fleet run gets its trends: the CSV files read once into a {@link TrendStore}, or a SQL historian read one
 * unit at a time ({@code org.tufa.analysis.trends.sql}). Either way every series comes back on one grid, common to
 * all series, resampled the same way ({@link Resampler}), so the analysis cannot tell the two apart.
 */
public interface TrendSource extends AutoCloseable {

    /** Opens a source for the series a fleet run wants. */
    @FunctionalInterface
    interface Opener {
        /**
         * @param wanted series ids to read, with how to resample each
         * @param ranges plausible range per series id (from its unit): values outside are counted and not kept, or
         *     refused in strict mode ({@link PlausibleRange}); series without one are checked for non-finite values only
         * @param options zone, grid, hold limit, window, strictness
         * @throws org.tufa.common.InputException when the source cannot be read (one line naming it)
         */
        TrendSource open(Map<String, SeriesKind> wanted, Map<String, PlausibleRange> ranges, TimeOptions options);
    }

    /** Start of grid cell 0, the same for every series. */
    Instant gridStart();

    /** Length of one grid cell. */
    Duration interval();

    /** Number of grid cells, the same for every series. */
    int gridLength();

    /**
     * The resampled series of one unit, keyed by series id; ids the source does not hold are left out. Thread-safe:
     * worker threads each read their own unit.
     *
     * @throws org.tufa.common.InputException when the source fails or holds bad data (one line naming it)
     */
    Map<String, ResampledSeries> read(Collection<String> seriesIds);

    /** What was read; complete once every unit has been read. */
    IngestReport report();

    /** Releases files or connections. */
    @Override
    void close();
}
