package org.tufa.analysis.trends;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.tufa.common.InputException;

/**
 * Trend data of a whole fleet, read once, kept on disk, and handed out one resampled series at a time on a grid
 * common to all series.
 *
 * <p>{@link #ingest} reads every input once (long or wide CSV, plain or gzip, or folders of them), keeps only the
 * wanted series, and spills their samples to a temp file ({@link SpillStore}), so memory grows with one series,
 * not with the fleet. {@link #series} loads and resamples one series; it is thread-safe, for worker threads that
 * each handle one unit. Close the store to delete its temp file.
 */
public final class TrendStore implements TrendSource {

    /** Spill buffers in total during ingest: at most about this many bytes, whatever the number of series. */
    private static final long SPILL_BUFFER_BYTES = 48L << 20;

    private final SpillStore spill;
    private final Map<String, Integer> index;
    private final SeriesKind[] kinds;
    private final IngestReport report;
    private final long gridStart;
    private final long interval;
    private final long maxGap;
    private final int gridLength;

    private TrendStore(SpillStore spill, Map<String, Integer> index, SeriesKind[] kinds, IngestReport report,
            long gridStart, long interval, long maxGap, int gridLength) {
        this.spill = spill;
        this.index = index;
        this.kinds = kinds;
        this.report = report;
        this.gridStart = gridStart;
        this.interval = interval;
        this.maxGap = maxGap;
        this.gridLength = gridLength;
    }

    /** Opens these trend files for a fleet run: {@link #ingest} with temp files in {@code java.io.tmpdir}. */
    public static TrendSource.Opener opener(List<Path> inputs) {
        return (wanted, ranges, options) -> ingest(inputs, wanted, ranges, options,
                Path.of(System.getProperty("java.io.tmpdir")));
    }

    /** Ingest with temp files in {@code java.io.tmpdir}. */
    public static TrendStore ingest(List<Path> inputs, Map<String, SeriesKind> wanted, TimeOptions options) {
        return ingest(inputs, wanted, options, Path.of(System.getProperty("java.io.tmpdir")));
    }

    /**
     * Reads every input once and keeps the wanted series.
     *
     * @param inputs CSV or .csv.gz files, or folders of them (read in file-name order)
     * @param wanted series ids to keep, with how to read each; other series are counted, not kept
     * @param options zone, grid, hold limit, window, strictness
     * @param tempDirectory where the spill file goes
     * @throws InputException for unreadable input, a missing header or timestamp column, naive time stamps without a
     *     zone, and (in strict mode) the first unparsable value or stamp
     */
    public static TrendStore ingest(List<Path> inputs, Map<String, SeriesKind> wanted, TimeOptions options,
            Path tempDirectory) {
        return ingest(inputs, wanted, Map.of(), options, tempDirectory);
    }

    /**
     * Reads every input once and keeps the wanted series, dropping (and counting) values outside each series'
     * plausible range.
     *
     * @param ranges plausible range per series id (from its unit); series without one are only checked for
     *     non-finite values
     */
    public static TrendStore ingest(List<Path> inputs, Map<String, SeriesKind> wanted,
            Map<String, PlausibleRange> ranges, TimeOptions options, Path tempDirectory) {
        return ingest(inputs, wanted, ranges, options, null, tempDirectory);
    }

    /**
     * Reads every input once and keeps some of a run's series, resampled on the grid that run chose from all of
     * its series ({@link #grid}): how an engine that reads each part of a fleet in another process (the Spark
     * job's executors) gets, for every series, the same samples as one store over the whole fleet would give.
     *
     * @param grid the run's grid, or null to choose it from these series (as every other ingest does)
     */
    public static TrendStore ingest(List<Path> inputs, Map<String, SeriesKind> wanted,
            Map<String, PlausibleRange> ranges, TimeOptions options, TrendGrid grid, Path tempDirectory) {
        Objects.requireNonNull(options, "options");
        List<Path> files = expand(inputs);
        TreeMap<String, SeriesKind> sorted = new TreeMap<>(wanted);
        String[] ids = sorted.keySet().toArray(String[]::new);
        SeriesKind[] kinds = sorted.values().toArray(SeriesKind[]::new);
        PlausibleRange[] seriesRanges = new PlausibleRange[ids.length];
        for (int i = 0; i < ids.length; i++) {
            seriesRanges[i] = ranges.get(ids[i]);
        }
        Map<String, Integer> index = new TreeMap<>();
        for (int i = 0; i < ids.length; i++) {
            index.put(ids[i], i);
        }
        int chunkSamples = (int) Math.max(256, Math.min(8192, SPILL_BUFFER_BYTES / 12 / Math.max(1, ids.length)));
        // Times are stored as int seconds from a base: the window start, or 2000-01-01T00:00Z (years 1932-2067).
        long base = options.from() != null ? options.from().getEpochSecond() : 946_684_800L;
        SpillStore spill = new SpillStore(tempDirectory, ids.length, chunkSamples, base);
        try {
            TrendReader reader = new TrendReader(ids, kinds, seriesRanges, spill, options);
            List<FileReport> fileReports = new ArrayList<>();
            for (Path file : files) {
                fileReports.add(reader.read(file));
            }
            spill.finish();
            long[] first = reader.firstTimes();
            long[] last = reader.lastTimes();
            // Series whose samples came out of time order (two files covering the same days, say) may still hold
            // repeated times the reader could not see: count them now (kept and averaged, like the others).
            long laterDuplicates = 0;
            long laterConflicts = 0;
            for (int i = 0; i < ids.length; i++) {
                if (!reader.outOfOrder(i)) {
                    continue;
                }
                SpillStore.Samples samples = Resampler.sortedByTime(spill.read(i));
                long[] t = samples.epochSeconds();
                double[] v = samples.values();
                // Every repeat of the series is found here; its counts replace those made while reading.
                laterDuplicates -= reader.duplicatesCounted(i);
                laterConflicts -= reader.conflictsCounted(i);
                int runStart = 0;
                for (int k = 1; k < t.length; k++) {
                    if (t[k] != t[runStart]) {
                        runStart = k;
                    } else if (Double.compare(v[k], v[runStart]) == 0) {
                        laterDuplicates++;
                    } else {
                        laterConflicts++;
                        if (options.strict()) {
                            throw new InputException("series " + ids[i] + " has two values at "
                                    + Instant.ofEpochSecond(t[k]) + " (" + v[runStart] + " and " + v[k] + ") in the trend "
                                    + "files; remove one (or read without strict mode: both are kept and averaged)");
                        }
                    }
                }
            }
            List<SeriesSpan> spans = new ArrayList<>();
            List<String> neverSeen = new ArrayList<>();
            long minTime = Long.MAX_VALUE;
            long maxTime = Long.MIN_VALUE;
            for (int i = 0; i < ids.length; i++) {
                if (spill.sampleCount(i) == 0) {
                    neverSeen.add(ids[i]);
                } else {
                    spans.add(new SeriesSpan(ids[i], Instant.ofEpochSecond(first[i]), Instant.ofEpochSecond(last[i]),
                            spill.sampleCount(i)));
                    minTime = Math.min(minTime, first[i]);
                    maxTime = Math.max(maxTime, last[i]);
                }
            }
            IngestReport report = new IngestReport(fileReports, new ArrayList<>(reader.unknownSeries()), spans,
                    neverSeen, laterDuplicates, laterConflicts);
            TrendGrid onGrid = grid;
            if (onGrid == null) {
                onGrid = TrendGrid.of(options, minTime, maxTime);
                checkGridDensity(onGrid.cells(), spans, options.interval());
            }
            return new TrendStore(spill, index, kinds, report, onGrid.start(), onGrid.interval(),
                    options.maxGap().getSeconds(), onGrid.cells());
        } catch (RuntimeException e) {
            spill.close();
            throw e;
        }
    }

    /** Grid cells per series above which a grid much finer than the data is refused. */
    static final long DENSE_GRID_CELLS = 100_000;

    /**
     * Refuses a grid far finer than the data (--interval PT1S on trends logged every 15 minutes): every sample
     * would be repeated hundreds of times, and the clustering would run for hours on copies. Allowed: up to eight
     * grid cells per sample of the densest series, or any grid under {@link #DENSE_GRID_CELLS} cells.
     */
    static void checkGridDensity(long cells, List<SeriesSpan> spans, Duration interval) {
        long densest = spans.stream().mapToLong(SeriesSpan::samples).max().orElse(0);
        if (cells <= DENSE_GRID_CELLS || densest == 0 || cells <= 8 * densest) {
            return;
        }
        SeriesSpan d = spans.stream().filter(sp -> sp.samples() == densest).findFirst().orElseThrow();
        long seconds = Math.max(1, Duration.between(d.first(), d.last()).getSeconds() / Math.max(1, densest - 1));
        throw new InputException("--interval " + interval + " makes " + cells + " grid cells per series, but the "
                + "densest series (" + d.id() + ") has " + densest + " samples, about one every "
                + Duration.ofSeconds(seconds) + ": each sample would be repeated about " + cells / densest
                + " times; choose an interval near the logging interval (e.g. --interval " + Duration.ofSeconds(
                        Math.max(60, seconds / 60 * 60)) + ")");
    }

    /** Files to read: each input file as given; each folder's *.csv and *.csv.gz files, sorted by name. */
    static List<Path> expand(List<Path> inputs) {
        if (inputs.isEmpty()) {
            throw new InputException("no trend files given; pass a CSV file or a folder of CSV files");
        }
        List<Path> files = new ArrayList<>();
        for (Path input : inputs) {
            if (Files.isDirectory(input)) {
                List<Path> inFolder;
                try (Stream<Path> listing = Files.list(input)) {
                    inFolder = listing.filter(Files::isRegularFile).filter(TrendStore::isTrendFileName)
                            .sorted((a, b) -> a.getFileName().toString().compareTo(b.getFileName().toString()))
                            .toList();
                } catch (IOException e) {
                    throw InputException.in(input, "cannot list the folder (" + e.getMessage() + ")");
                }
                if (inFolder.isEmpty()) {
                    throw InputException.in(input, "folder holds no .csv or .csv.gz files; point to the trend files");
                }
                files.addAll(inFolder);
            } else if (Files.isRegularFile(input)) {
                files.add(input);
            } else {
                throw InputException.in(input, "no such file or folder; check the trend data path");
            }
        }
        return files;
    }

    private static boolean isTrendFileName(Path path) {
        String name = path.getFileName().toString().toLowerCase(Locale.ROOT);
        return name.endsWith(".csv") || name.endsWith(".csv.gz");
    }

    @Override
    public IngestReport report() {
        return report;
    }

    @Override
    public Map<String, ResampledSeries> read(Collection<String> seriesIds) {
        Map<String, ResampledSeries> out = new TreeMap<>();
        for (String id : seriesIds) {
            if (index.containsKey(id)) {
                out.put(id, series(id));
            }
        }
        return out;
    }

    /** The grid every series of this store is resampled on. */
    public TrendGrid grid() {
        return new TrendGrid(gridStart, interval, gridLength);
    }

    /** Start of grid cell 0, the same for every series. */
    @Override
    public Instant gridStart() {
        return Instant.ofEpochSecond(gridStart);
    }

    @Override
    public Duration interval() {
        return Duration.ofSeconds(interval);
    }

    /** Number of grid cells, the same for every series. */
    @Override
    public int gridLength() {
        return gridLength;
    }

    /** The wanted series ids, sorted. */
    public List<String> seriesIds() {
        return List.copyOf(index.keySet());
    }

    /**
     * One series, resampled on the common grid (all NaN if it had no sample). Thread-safe.
     *
     * @throws IllegalArgumentException if the id was not among the wanted series
     */
    public ResampledSeries series(String id) {
        Integer i = index.get(id);
        if (i == null) {
            throw new IllegalArgumentException("series " + id + " was not requested at ingest");
        }
        SpillStore.Samples samples = Resampler.sortedByTime(spill.read(i));
        return Resampler.resample(id, kinds[i], samples.epochSeconds(), samples.values(),
                new TrendGrid(gridStart, interval, gridLength), maxGap);
    }

    /** Deletes the temp file. */
    @Override
    public void close() {
        spill.close();
    }
}
