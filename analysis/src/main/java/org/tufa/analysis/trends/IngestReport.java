package org.tufa.analysis.trends;

import java.time.Instant;
import java.util.List;
import java.util.function.ToLongFunction;

/**
 * What an ingest read, per source and in total, so that nothing is dropped silently. The counts are those of
 * {@link FileReport}, summed; a trend source other than files fills the same records.
 *
 * @param files one entry per file read, in reading order
 * @param unknownSeries ids of series found in the files but not asked for, sorted
 * @param seriesSpans per wanted series that had samples: first/last time and sample count, sorted by id
 * @param seriesNeverSeen wanted series without a single sample, sorted
 * @param laterDuplicates correction to the files' exact-duplicate counts from the check after reading, for series
 *     whose samples came out of time order (two files covering the same days, say): their repeats are recounted
 *     on the sorted samples, so this may be negative; the sums ({@link #duplicateSamples()}) are exact
 * @param laterConflicts the same correction for conflicting duplicates
 */
public record IngestReport(
        List<FileReport> files, List<String> unknownSeries, List<SeriesSpan> seriesSpans, List<String> seriesNeverSeen,
        long laterDuplicates, long laterConflicts) {

    public IngestReport {
        files = List.copyOf(files);
        unknownSeries = List.copyOf(unknownSeries);
        seriesSpans = List.copyOf(seriesSpans);
        seriesNeverSeen = List.copyOf(seriesNeverSeen);
    }

    /** A report without duplicates found after reading. */
    public IngestReport(List<FileReport> files, List<String> unknownSeries, List<SeriesSpan> seriesSpans,
            List<String> seriesNeverSeen) {
        this(files, unknownSeries, seriesSpans, seriesNeverSeen, 0, 0);
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

    public long emptyValues() {
        return sum(FileReport::emptyValues);
    }

    public long nonFiniteValues() {
        return sum(FileReport::nonFiniteValues);
    }

    public long implausibleValues() {
        return sum(FileReport::implausibleValues);
    }

    public long duplicateSamples() {
        return sum(FileReport::duplicateSamples) + laterDuplicates;
    }

    public long conflictingDuplicates() {
        return sum(FileReport::conflictingDuplicates) + laterConflicts;
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

    /** The first few problems over all files, at most {@code max}. */
    public List<String> problemExamples(int max) {
        return files.stream().flatMap(f -> f.problemExamples().stream()).limit(max).toList();
    }

    /** Earliest time stamp read in any file, any series; null when none was read. */
    public Instant firstStamp() {
        long t = files.stream().mapToLong(FileReport::firstStamp).min().orElse(Long.MAX_VALUE);
        return t == Long.MAX_VALUE ? null : Instant.ofEpochSecond(t);
    }

    /** Latest time stamp read in any file, any series; null when none was read. */
    public Instant lastStamp() {
        long t = files.stream().mapToLong(FileReport::lastStamp).max().orElse(Long.MIN_VALUE);
        return t == Long.MIN_VALUE ? null : Instant.ofEpochSecond(t);
    }

    private long sum(ToLongFunction<FileReport> field) {
        return files.stream().mapToLong(field).sum();
    }
}
