package org.tufa.analysis.trends;

import java.nio.file.Path;
import java.util.List;

/**
 * What was read from one trend file.
 *
 * @param file the file
 * @param format layout detected from its header
 * @param rows data rows (blank lines not counted)
 * @param samplesKept samples of wanted series stored for resampling
 * @param samplesOutsideWindow samples of wanted series dropped because they lie outside the time window (before
 *     {@code from - maxGap}, or at/after {@code to})
 * @param unknownSeriesSamples non-empty values of series not asked for (not an error: points outside the model)
 * @param unparsableValues values of wanted series that are not numbers (or binary words); not stored
 * @param unparsableTimestamps rows whose time stamp could not be read; their samples are not stored
 * @param malformedRows rows with more fields than the header (skipped) or fewer (missing fields read as empty)
 * @param problemExamples the first few problems as {@code file:line:column: what}
 * @param dstRepeatedFirstPass naive stamps in a fall-back overlap read with the earlier (summer) offset
 * @param dstRepeatedSecondPass naive stamps in a fall-back overlap read with the later (winter) offset
 * @param dstSkipped naive stamps inside a spring-forward gap, shifted forward by the gap
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
        long dstSkipped) {

    public FileReport {
        problemExamples = List.copyOf(problemExamples);
    }

    /** Problems of all kinds (unparsable values and stamps, malformed rows). */
    public long problems() {
        return unparsableValues + unparsableTimestamps + malformedRows;
    }
}
