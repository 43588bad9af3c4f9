package org.tufa.analysis.trends;

import java.nio.file.Path;
import java.util.List;

/**
 * What was read from one trend source (a file; another source fills the same counts), so that every row is
 * accounted for. In a long file each data row lands in exactly one of: kept, outside the window, unknown series,
 * empty value, unparsable value, non-finite value, implausible value, unparsable time stamp, malformed row
 * ({@link #accounted()} equals {@link #rows()}); duplicates are kept samples, counted apart. In a wide file the counts are
 * of cells, except stamps and malformed rows, which are rows.
 *
 * @param file the file
 * @param format layout detected from its header
 * @param rows data rows (blank lines not counted)
 * @param samplesKept samples of wanted series stored for resampling
 * @param samplesOutsideWindow samples of wanted series dropped because they lie outside the time window (before
 *     {@code from - maxGap}, or at/after {@code to})
 * @param unknownSeriesSamples values of series not asked for (long: rows; wide: non-empty cells); not an error,
 *     not even in strict mode (an export holds many series no analysed unit reads); the ids are listed in
 *     {@link IngestReport#unknownSeries()}
 * @param unparsableValues values of wanted series that are not numbers (or binary words); not stored
 * @param unparsableTimestamps rows whose time stamp could not be read; their samples are not stored
 * @param malformedRows rows with more fields than the header (skipped) or fewer (missing fields read as empty)
 * @param problemExamples the first few problems as {@code file:line:column: what}
 * @param dstRepeatedFirstPass naive stamps in a fall-back overlap read with the earlier (summer) offset
 * @param dstRepeatedSecondPass naive stamps in a fall-back overlap read with the later (winter) offset
 * @param dstSkipped naive stamps inside a spring-forward gap, shifted forward by the gap
 * @param emptyValues empty value fields of wanted series (no sample)
 * @param nonFiniteValues values NaN, Infinity or too large for a double; not stored
 * @param implausibleValues numbers outside the physically plausible range of the series' unit
 *     ({@link PlausibleRange}); not stored
 * @param duplicateSamples kept samples that repeat a series' previous time with the same value
 * @param conflictingDuplicates kept samples that repeat a series' previous time with another value (both are kept
 *     and averaged in their grid cell, like any samples sharing a cell)
 * @param firstStamp earliest time stamp read in the file, any series (epoch seconds), Long.MAX_VALUE when none
 * @param lastStamp latest time stamp read in the file, any series (epoch seconds), Long.MIN_VALUE when none
 */
public record FileReport(
        Path file,
        TrendFormat format,
        long rows,
        long samplesKept,
        long samplesOutsideWindow,
        long unknownSeriesSamples,
        long unparsableValues,
        long unparsableTimestamps,
        long malformedRows,
        List<String> problemExamples,
        long dstRepeatedFirstPass,
        long dstRepeatedSecondPass,
        long dstSkipped,
        long emptyValues,
        long nonFiniteValues,
        long implausibleValues,
        long duplicateSamples,
        long conflictingDuplicates,
        long firstStamp,
        long lastStamp) {

    public FileReport {
        problemExamples = List.copyOf(problemExamples);
    }

    /** Problems of all kinds (values that are unparsable, non-finite or implausible, bad stamps, malformed rows, conflicts). */
    public long problems() {
        return unparsableValues + nonFiniteValues + implausibleValues + unparsableTimestamps + malformedRows
                + conflictingDuplicates;
    }

    /** The sum of every bucket a row (long) or cell (wide) can land in; equals {@link #rows()} for long files. */
    public long accounted() {
        return samplesKept + samplesOutsideWindow + unknownSeriesSamples + unparsableValues + unparsableTimestamps
                + malformedRows + emptyValues + nonFiniteValues + implausibleValues;
    }
}
