package org.tufa.spark;

import java.io.Serializable;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;
import org.apache.spark.SparkException;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.api.java.function.Function;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.fleet.FleetAnalysis;
import org.tufa.analysis.fleet.FleetPlan;
import org.tufa.analysis.fleet.StageTimes;
import org.tufa.analysis.fleet.UnitSink;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.analysis.trends.TrendGrid;
import org.tufa.analysis.trends.TrendSource;
import org.tufa.analysis.trends.TrendStore;
import org.tufa.analysis.trends.sql.HistorianSource;
import org.tufa.cli.DatabaseTrends;
import org.tufa.cli.UnitEngine;
import org.tufa.cli.UnitSinks;
import org.tufa.common.InputException;
import picocli.CommandLine.Option;

/**
 * Phase 1 of the fleet run (each unit's own analysis) as a Spark job. The driver has opened the trends, as
 * {@code tufa analyze} does, which fixes the grid (and, for files, the ingest report); the units are cut, in run
 * order, into partitions of about equal numbers of analysed units; each task reads its units' series only, on the
 * driver's grid, from the trend files ({@link TrendStore#ingest(List, Map, Map, TimeOptions, TrendGrid, Path)}) or
 * from the historian ({@link HistorianSource#open(org.tufa.analysis.trends.sql.HistorianSettings,
 * org.tufa.analysis.trends.sql.DatabaseLogin, Map, Map, java.util.Set, TimeOptions, TrendGrid)}, with the counts of
 * the rows it read sent back for the driver's ingest report), analyses them one at a time with the library
 * ({@link FleetAnalysis#analyse}), writes their per-unit files and returns what the fleet keeps of each
 * ({@link FleetAnalysis.Kept}: a summary and the evidence, a few kilobytes). The fleet decision and phase 3 run on
 * the driver, so the outputs are those of the local engine.
 *
 * <p>An executor holds one unit's signals at a time, and its trend store spills to local disk, so its memory does
 * not grow with the units of its partition. The trend files and {@code --out} must be on a file system every
 * executor sees (a shared mount): the tasks read the one and write below the other. With a database, every
 * executor connects to it itself, with the login it resolves from the same login file or environment variables:
 * no password travels with the tasks.
 */
final class SparkUnitEngine implements UnitEngine {

    @Option(names = "--partitions", paramLabel = "N",
            description = "Spark partitions (tasks) the units are cut into (default: the cluster's default "
                    + "parallelism). Each task reads the trend files once for its units' series.")
    Integer partitions;

    private final Supplier<JavaSparkContext> context;

    SparkUnitEngine(Supplier<JavaSparkContext> context) {
        this.context = context;
    }

    @Override
    public FleetAnalysis.UnitAnalyser analyser(List<Path> trendFiles, DatabaseTrends database, UnitSinks sinks) {
        if (partitions != null && partitions < 1) {
            throw new InputException("--partitions " + partitions + ": give 1 or more");
        }
        List<String> files = trendFiles.stream().map(p -> p.toAbsolutePath().toString()).toList();
        return (plan, store, time, settings, times, progress) -> {
            JavaSparkContext sc = context.get();
            int wanted = partitions != null ? partitions : sc.defaultParallelism();
            List<FleetPlan> parts = split(plan, wanted);
            TrendGrid grid = new TrendGrid(store.gridStart().getEpochSecond(), store.interval().getSeconds(),
                    store.gridLength());
            List<PartResult> results;
            try {
                results = sc.parallelize(parts, Math.max(1, parts.size()))
                        .map(new AnalysePart(files, database, time, grid, settings, sinks)).collect();
            } catch (Exception e) {
                // Scala throws SparkException (checked) undeclared. Its message holds the remote stack trace: keep
                // its first line.
                if (e instanceof SparkException) {
                    String first = e.getMessage() == null ? "" : e.getMessage().lines().findFirst().orElse("");
                    throw new IllegalStateException("a Spark task failed: " + first, e);
                }
                throw e;
            }
            List<FleetAnalysis.Kept> kept = new ArrayList<>(plan.units().size());
            for (PartResult r : results) {
                if (r.error() != null) {
                    // The driver opened the same trends without error: what failed is an executor's view of them.
                    throw new InputException(r.error() + (database == null
                            ? " (on a Spark executor: the trend files must be where every executor can read them)"
                            : " (on a Spark executor: every executor must reach the database and find the login "
                            + "file, or the TUFA_DB_USER and TUFA_DB_PASSWORD variables, as the driver does)"));
                }
                if (r.readCounts() != null && store instanceof HistorianSource source) {
                    // The executors read the series; the run's ingest report is the driver's.
                    source.addReadCounts(r.readCounts());
                }
                kept.addAll(r.kept());
                for (StageTimes.Stage s : StageTimes.Stage.values()) {
                    times.add(s, r.nanos()[s.ordinal()]);
                }
            }
            Path missing = missingUnitFile(kept, sinks);
            if (missing != null) {
                throw new InputException("--out " + sinks.out() + ": the executors wrote the per-unit files where "
                        + "the driver cannot see them (" + missing + " is missing); put --out on a file system that "
                        + "every executor and the driver share");
            }
            progress.unitDone(kept.size(), plan.units().size());
            return kept;
        };
    }

    /**
     * The first per-sample table phase 1 should have written but that this process cannot see (an --out on each
     * executor's own disk), or null when all are there.
     */
    static Path missingUnitFile(List<FleetAnalysis.Kept> kept, UnitSinks sinks) {
        Path units = Path.of(sinks.out()).resolve("units");
        for (FleetAnalysis.Kept k : kept) {
            if (k.outcome().summary() != null) {
                Path modes = units.resolve(k.outcome().folder()).resolve("modes." + sinks.format().extension());
                if (!java.nio.file.Files.isRegularFile(modes)) {
                    return modes;
                }
            }
        }
        return null;
    }

    @Override
    public Map<String, Object> parameters() {
        Map<String, Object> p = new LinkedHashMap<>();
        p.put("engine", "spark");
        p.put("spark_partitions", partitions == null ? "default" : partitions.toString());
        return p;
    }

    /**
     * The plan cut into at most {@code count} runs of consecutive units, each with about the same number of
     * analysed units (skipped ones cost nothing); no part is empty.
     */
    static List<FleetPlan> split(FleetPlan plan, int count) {
        long analysed = plan.units().stream().filter(FleetPlan.Unit::analysed).count();
        int n = (int) Math.max(1, Math.min(count, Math.max(1, analysed)));
        List<FleetPlan> parts = new ArrayList<>();
        List<FleetPlan.Unit> current = new ArrayList<>();
        long seen = 0;
        int part = 0;
        for (FleetPlan.Unit u : plan.units()) {
            current.add(u);
            if (u.analysed()) {
                seen++;
            }
            // Part k ends after the ceil(analysed * (k + 1) / n)-th analysed unit.
            if (part < n - 1 && u.analysed() && seen * n >= analysed * (part + 1)) {
                parts.add(plan.part(current));
                current = new ArrayList<>();
                part++;
            }
        }
        if (!current.isEmpty() || parts.isEmpty()) {
            parts.add(plan.part(current));
        }
        return parts;
    }

    /**
     * What one task returns: the kept units of its part in order and the time it spent per stage, or the one-line
     * error of an input it could not read (passed back as text, so the driver prints it as {@code tufa analyze}
     * would).
     */
    record PartResult(List<FleetAnalysis.Kept> kept, long[] nanos, HistorianSource.ReadCounts readCounts,
                      String error) implements Serializable {
    }

    /** The task: phase 1 for the units of one part. */
    static final class AnalysePart implements Function<FleetPlan, PartResult> {
        private final List<String> files;
        private final DatabaseTrends database;
        private final TimeOptions time;
        private final TrendGrid grid;
        private final AnalysisSettings settings;
        private final UnitSinks sinks;

        AnalysePart(List<String> files, DatabaseTrends database, TimeOptions time, TrendGrid grid,
                    AnalysisSettings settings, UnitSinks sinks) {
            this.files = List.copyOf(files);
            this.database = database;
            this.time = time;
            this.grid = grid;
            this.settings = settings;
            this.sinks = sinks;
        }

        @Override
        public PartResult call(FleetPlan part) {
            StageTimes times = new StageTimes();
            List<UnitSink> unitSinks = sinks.create();
            List<FleetAnalysis.Kept> kept = new ArrayList<>();
            HistorianSource.ReadCounts counts = null;
            try (TrendSource store = open(part, times)) {
                for (FleetPlan.Unit u : part.units()) {
                    // The sinks' phase-1 state (the charts drawn) goes back with the unit: the driver writes phase 2.
                    kept.add(FleetAnalysis.analyse(u, store, settings, unitSinks, times).carried(unitSinks));
                }
                if (store instanceof HistorianSource source) {
                    counts = source.readCounts();
                }
            } catch (InputException e) {
                return new PartResult(List.of(), new long[StageTimes.Stage.values().length], null, e.getMessage());
            }
            long[] nanos = new long[StageTimes.Stage.values().length];
            for (StageTimes.Stage s : StageTimes.Stage.values()) {
                nanos[s.ordinal()] = Math.round(times.seconds(s) * 1e9);
            }
            return new PartResult(kept, nanos, counts, null);
        }

        /**
         * This part's series on the run's grid, from the trend files or the database; a source of nothing when the
         * part has no analysed unit.
         */
        private TrendSource open(FleetPlan part, StageTimes times) {
            long t0 = System.nanoTime();
            TrendSource store;
            if (part.wanted().isEmpty()) {
                store = null;
            } else if (database != null) {
                store = HistorianSource.open(database.settings(), database.login(), part.wanted(), part.ranges(),
                        database.storedElsewhere(), time, grid);
            } else {
                List<Path> paths = files.stream().map(Path::of).toList();
                store = TrendStore.ingest(paths, part.wanted(), part.ranges(), time, grid,
                        Path.of(System.getProperty("java.io.tmpdir")));
            }
            times.add(StageTimes.Stage.READ, System.nanoTime() - t0);
            return store;
        }
    }
}
