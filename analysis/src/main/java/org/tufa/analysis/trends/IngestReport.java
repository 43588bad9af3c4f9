package org.tufa.analysis.trends;

import java.util.List;
import java.util.function.ToLongFunction;

/**
 * What an ingest read, per file and in total, so that nothing is dropped silently.
 *
 * @param files one entry per file read, in reading order
 * @param unknownSeries ids of series found in the files but not asked for, sorted
 * @param seriesSpans per wanted series that had samples: first/last time and sample count, sorted by id
 * @param seriesNeverSeen wanted series without a single sample, sorted
 */
public record IngestReport(
        List<FileReport> files, List<String> unknownSeries, List<SeriesSpan> seriesSpans, List<String> seriesNeverSeen) {

    public IngestReport {
        files = List.copyOf(files);
        unknownSeries = List.copyOf(unknownSeries);
        seriesSpans = List.copyOf(seriesSpans);
        seriesNeverSeen = List.copyOf(seriesNeverSeen);
    }

    public long rows() {
        return sum(FileReport::rows);
    }

    public long samplesKept() {
        return sum(FileReport::samplesKept);
    }

    public long samplesOutsideWindow() {
        return sum(FileReport::samplesOutsideWindow);
    }

    public long unknownSeriesSamples() {
        return sum(FileReport::unknownSeriesSamples);
    }

    public long unparsableValues() {
        return sum(FileReport::unparsableValues);
    }

    public long unparsableTimestamps() {
        return sum(FileReport::unparsableTimestamps);
    }

    public long malformedRows() {
        return sum(FileReport::malformedRows);
    }

    public long dstRepeatedFirstPass() {
        return sum(FileReport::dstRepeatedFirstPass);
    }

    public long dstRepeatedSecondPass() {
        return sum(FileReport::dstRepeatedSecondPass);
    }

    public long dstSkipped() {
        return sum(FileReport::dstSkipped);
    }

    private long sum(ToLongFunction<FileReport> field) {
        return files.stream().mapToLong(field).sum();
    }
}
