package org.tufa.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.tufa.analysis.band.BandKind;
import org.tufa.analysis.coverage.CoverageFiles;
import org.tufa.analysis.cluster.AutoParameters;
import org.tufa.analysis.findings.CauseTable;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.fleet.FleetAnalysis;
import org.tufa.analysis.fleet.FleetOutputs;
import org.tufa.analysis.fleet.FleetReport;
import org.tufa.analysis.modes.ModeThresholds;
import org.tufa.analysis.fleet.UnitSink;
import org.tufa.analysis.report.FleetPage;
import org.tufa.analysis.review.KnownUnits;
import org.tufa.analysis.review.ReviewFile;
import org.tufa.analysis.review.Verdict;
import org.tufa.analysis.tables.SampleFormat;
import org.tufa.analysis.trends.TimeOptions;
import java.nio.file.Files;
import org.tufa.common.InputException;
import org.tufa.common.OutputFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tufa analyze}: the per-unit, per-mode detection on every analysable unit of a fleet. */
@Command(name = "analyze", mixinStandardHelpOptions = true,
        description = {"Run the detection on every analysable terminal unit, per operating mode: trends, modes, load "
                + "band, PCA, OPTICS, clusters, candidate faults.",
            "Writes DIR/fleet.csv, DIR/findings.csv, DIR/fleet_findings.csv, DIR/ranking.csv, DIR/run.json, DIR/units/ and the HTML report "
                + "DIR/report/index.html (opens offline in any browser). Findings are "
                + "candidates for review by qualified staff, never commands to equipment."})
public final class AnalyzeCommand implements Callable<Integer> {

    /** Phase 1 elsewhere (the Spark job), or null: in this JVM's worker threads. */
    private final UnitEngine engine;

    /** {@code tufa analyze}: every phase in this JVM. */
    public AnalyzeCommand() {
        this(null);
    }

    /** The same command with each unit's analysis run by {@code engine} (the spark module's job). */
    public AnalyzeCommand(UnitEngine engine) {
        this.engine = engine;
    }

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Mixin
    FleetModelOptions fleet;

    @Option(names = "--trends", required = true, paramLabel = "PATH|URL",
            description = "Trend CSV files (long timestamp,point,value or wide timestamp,<series>...), .csv.gz, "
                    + "or folders of them (repeatable); or one PostgreSQL database, jdbc:postgresql://host:port/db "
                    + "(login from TUFA_DB_USER and TUFA_DB_PASSWORD or --db-login; layout from --historian).")
    List<String> trends = new ArrayList<>();

    @Option(names = "--historian", paramLabel = "FILE",
            description = "With a database: its layout (long table or one table per series), table and column "
                    + "names, as key = value lines (README, 'Trends from a database'). Default: a long table "
                    + "trend_samples(series_id, ts, value).")
    Path historian;

    @Option(names = "--db-login", paramLabel = "FILE",
            description = "With a database: a file of 'user = ...' and 'password = ...' lines, instead of the "
                    + "environment variables TUFA_DB_USER and TUFA_DB_PASSWORD.")
    Path dbLogin;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output directory.")
    Path out;

    @Option(names = "--timezone", paramLabel = "ZONE",
            description = "IANA zone of naive time stamps in the trends, and of times in the outputs "
                    + "(e.g. America/Toronto). Default: UTC for outputs; naive stamps then need it.")
    String timezone;

    @Option(names = "--from", paramLabel = "TIME", description = "Start of the window (2031-06-01, or an ISO date-time).")
    String from;

    @Option(names = "--to", paramLabel = "TIME", description = "End of the window, exclusive.")
    String to;

    @Option(names = "--interval", paramLabel = "DURATION", defaultValue = "PT15M", converter = DurationConverter.class,
            description = "Resampling step: ISO 8601 (PT15M) or 15min, 1h (default: ${DEFAULT-VALUE}).")
    Duration interval;

    @Option(names = "--max-gap", paramLabel = "DURATION", defaultValue = "PT1H", converter = DurationConverter.class,
            description = "Longest gap a value is held across (default: ${DEFAULT-VALUE}).")
    Duration maxGap;

    @Option(names = "--band", paramLabel = "KIND", defaultValue = "tukey",
            description = "Load band: iqr (Q1..Q3), tukey (Q1-1.5 IQR..Q3+1.5 IQR) or none (default: ${DEFAULT-VALUE}).")
    String band;

    @Option(names = "--valve-open", paramLabel = "PERCENT", defaultValue = "5",
            description = "A valve command above this counts as open when splitting modes (default: ${DEFAULT-VALUE}).")
    double valveOpen;

    @Option(names = "--fan-on", paramLabel = "FRACTION", defaultValue = "0.5",
            description = "A fan status on for at least this share of a sample counts as running "
                    + "(default: ${DEFAULT-VALUE}); a fan speed above 0 always does.")
    double fanOn;

    @Option(names = "--settling", paramLabel = "SAMPLES", defaultValue = "1",
            description = "Samples after a mode change left out as transition (default: ${DEFAULT-VALUE}).")
    int settling;

    @Option(names = "--min-pts", paramLabel = "N", defaultValue = "20", description = "OPTICS MinPts (default: ${DEFAULT-VALUE}).")
    int minPts;

    @Option(names = "--variance", paramLabel = "FRACTION", defaultValue = "0.90",
            description = "PCA: cumulative explained variance to keep (default: ${DEFAULT-VALUE}).")
    double variance;

    @Option(names = "--xi", paramLabel = "XI", defaultValue = "0.03",
            description = "OPTICS xi steepness for cluster extraction (default: ${DEFAULT-VALUE}).")
    double xi;

    @Option(names = "--causes", paramLabel = "FILE",
            description = "Candidate-cause table to use instead of the one shipped with tufa.")
    Path causes;

    @Option(names = "--threads", paramLabel = "N",
            description = "Worker threads, 1 to " + MAX_THREADS + " (default: all cores).")
    int threads = Math.min(MAX_THREADS, Runtime.getRuntime().availableProcessors());

    /** More workers than this only add memory (each holds one unit's signals): no machine tufa runs on needs them. */
    static final int MAX_THREADS = 256;

    @Option(names = "--strict", description = "Stop at the first unparsable trend value instead of counting it.")
    boolean strict;

    @Option(names = "--sample-files", paramLabel = "FORMAT", defaultValue = "parquet",
            description = "Per-sample tables under DIR/units/ (modes, features, scores, reachability): parquet "
                    + "(compressed, typed; pandas, DuckDB, Spark read it) or csv, same columns (default: ${DEFAULT-VALUE}).")
    String sampleFiles;

    @Option(names = "--min-confidence", paramLabel = "C", defaultValue = "0.9",
            description = "List findings with at least this confidence, 1 minus the false-discovery rate at which "
                    + "the finding holds (default: ${DEFAULT-VALUE}); the others are counted, not listed. 0 lists "
                    + "every candidate.")
    double minConfidence;

    @Option(names = "--no-report", description = "Skip the HTML report (DIR/report/index.html and one page per unit).")
    boolean noReport;

    @Option(names = "--review", paramLabel = "FILE",
            description = "An analyst's verdicts on an earlier run's findings (review.csv, saved from the report): "
                    + "rejected findings' periods and signatures count as normal operation of their unit and are "
                    + "not listed again, confirmed ones are listed and marked.")
    Path review;

    @Override
    public Integer call() {
        PrintWriter stdout = spec.commandLine().getOut();
        PrintWriter stderr = spec.commandLine().getErr();
        ZoneId zone = zone();
        TimeOptions time;
        try {
            time = new TimeOptions(timezone == null ? null : zone, interval, maxGap, instant(from, zone, "--from"),
                    instant(to, zone, "--to"), strict);
        } catch (IllegalArgumentException e) {
            throw new InputException("--interval, --max-gap, --from or --to: " + e.getMessage());
        }
        AnalysisSettings defaults = AnalysisSettings.defaults();
        if (threads < 1 || threads > MAX_THREADS) {
            throw new InputException("--threads " + threads + ": give 1 to " + MAX_THREADS
                    + " worker threads (this machine has " + Runtime.getRuntime().availableProcessors() + " cores)");
        }
        if (!(valveOpen >= 0 && valveOpen < 100) || !(fanOn > 0 && fanOn <= 1) || settling < 0) {
            throw new InputException("--valve-open must be 0..100, --fan-on in (0, 1] and --settling >= 0; got "
                    + valveOpen + ", " + fanOn + ", " + settling);
        }
        SampleFormat sampleFormat;
        try {
            sampleFormat = SampleFormat.fromName(sampleFiles);
        } catch (IllegalArgumentException e) {
            throw new InputException("--sample-files: '" + sampleFiles + "' is not a format; use parquet or csv");
        }
        if (minPts < 2 || !(variance > 0 && variance <= 1) || !(xi > 0 && xi < 1)) {
            throw new InputException("--min-pts must be >= 2, --variance in (0, 1] and --xi in (0, 1); got "
                    + minPts + ", " + variance + ", " + xi);
        }
        ModeThresholds modes = new ModeThresholds(valveOpen, fanOn, defaults.modeThresholds().fanSpeedOnFraction(),
                settling);
        if (!(minConfidence >= 0 && minConfidence <= 1)) {
            throw new InputException("--min-confidence must be in [0, 1]; got " + minConfidence);
        }
        AnalysisSettings.DecisionSettings d = defaults.decision();
        AnalysisSettings settings = defaults.withModeThresholds(modes)
                .withClustering(bandKind(), variance, minPts, new AutoParameters(xi,
                        defaults.extraction().minClusterFraction(), defaults.extraction().mergeCoverage()))
                .withCauses(causes == null ? defaults.causes() : CauseTable.load(causes))
                .withDayZone(zone)
                .withDecision(new AnalysisSettings.DecisionSettings(minConfidence, d.minPeerDeviation(),
                        d.minPeers(), d.fleetWideP(), d.minFleetUnits()));
        TrendInput input = TrendInput.of(trends, historian, dbLogin);
        checkOutputs(input);
        HeapWatch heap = HeapWatch.start();
        FleetModelOptions.Assessed assessed = fleet.assess();
        if (assessed.coverage().units().isEmpty()) {
            stdout.println("Nothing to analyse in " + fleet.source() + ": no terminal units of the requested classes.");
            stdout.flush();
            heap.stop();
            return ExitCodes.CHECK_FAILED;
        }
        List<Verdict> verdicts = review == null ? List.of() : ReviewFile.read(review, knownUnits(assessed));
        ProgressBar bar = new ProgressBar(stderr, "units");
        long start = System.nanoTime();
        UnitSinks unitSinks = new UnitSinks(out.toAbsolutePath().toString(), zone, sampleFormat, !noReport);
        List<UnitSink> sinks = unitSinks.create();
        FleetAnalysis.UnitAnalyser analyser = engine == null ? null
                : engine.analyser(input.files(), input.forEngine(assessed.coverage(), dbLogin), unitSinks);
        FleetAnalysis.Result result = FleetAnalysis.run(assessed.coverage(), input.opener(assessed.coverage()), time,
                settings, verdicts, threads, sinks, bar::update, analyser);
        CoverageFiles.write(assessed.coverage(), out);
        List<Path> inputs = new ArrayList<>();
        if (fleet.model != null) {
            inputs.add(fleet.model);
        }
        inputs.addAll(input.files());
        if (review != null) {
            inputs.add(review);
        }
        Map<String, Object> parameters = parameters(settings, time, zone);
        parameters.putAll(input.parameters());
        if (engine != null) {
            parameters.putAll(engine.parameters());
        }
        if (fleet.store != null) {
            parameters.put("model_store", fleet.store.toString());
            parameters.put("model_graph", fleet.graph == null ? "" : fleet.graph);
        }
        FleetOutputs.write(out, result, zone, parameters, inputs);
        Path report = noReport ? null : FleetPage.write(FleetPage.reportDir(out), result, assessed.coverage(), zone);
        FleetReport.summary(result, assessed.coverage(), out, minConfidence).forEach(stdout::println);
        if (report != null) {
            stdout.println("Report: " + report + " (" + FleetPage.describeSize(FleetPage.reportDir(out)) + ")");
        }
        stderr.printf(java.util.Locale.ROOT, "time: %.1f s wall; per stage (summed over threads): %s; %s%n",
                (System.nanoTime() - start) / 1e9, result.times().summary(), heap.stop());
        stdout.flush();
        boolean anyDetection = assessed.coverage().units().stream().anyMatch(u -> u.analyzable()
                && u.unitKind().equals(org.tufa.analysis.coverage.Profile.FAN_COIL));
        if (result.ingest().samplesKept() == 0 && anyDetection) {
            // A database is asked for the model's series only, so it has no unknown series to count: no row at all
            // means its series ids are not the model's.
            boolean noDatabaseRows = input.database() != null && result.ingest().rows() == 0;
            stderr.println("tufa: " + (noDatabaseRows ? "the database (" + input.database().where() + ") holds no "
                    + "row of any series of the model: its series ids must be the points' ref:hasTimeseriesId "
                    + "values (or their labels when the model has none)" : nothingKept(result.ingest(), time)));
            stderr.flush();
            return noDatabaseRows || result.ingest().unknownSeriesSamples() >= Math.max(
                    result.ingest().unparsableTimestamps(), result.ingest().samplesOutsideWindow())
                    && result.ingest().unknownSeriesSamples() > 0 ? ExitCodes.CHECK_FAILED : ExitCodes.INPUT_ERROR;
        }
        stderr.flush();
        return ExitCodes.OK;
    }

    /**
     * Refuses, before anything is read or written, an --out that is a file and inputs that the run would overwrite:
     * a file named like one of the fleet files in DIR, or anything under DIR/units or DIR/report.
     */
    private void checkOutputs(TrendInput input) {
        OutputFiles.checkFolder("--out", out);
        Map<String, Path> inputs = new LinkedHashMap<>(fleet.inputs());
        if (causes != null) {
            inputs.put("--causes", causes);
        }
        if (review != null) {
            inputs.put("--review", review);
        }
        for (Path t : input.files()) {
            if (Files.isDirectory(t)) {
                if (OutputFiles.canonical(t).equals(OutputFiles.canonical(out))) {
                    throw InputException.in(t, "--trends names the --out folder; the run writes its CSV files there "
                            + "and would read them back as trends: keep trends and outputs in separate folders");
                }
                try (var listing = Files.list(t)) {
                    listing.filter(Files::isRegularFile).sorted().forEach(f -> inputs.put("--trends " + f, f));
                } catch (java.io.IOException e) {
                    throw InputException.in(t, "cannot list the folder (" + OutputFiles.reason(e) + ")");
                }
            } else {
                inputs.put("--trends " + t, t);
            }
        }
        Map<String, Path> outputs = new LinkedHashMap<>();
        for (String name : List.of("fleet.csv", "findings.csv", "ranking.csv", "run.json", CoverageFiles.CSV_FILE,
                CoverageFiles.JSON_FILE)) {
            outputs.put("--out (" + name + ")", out.resolve(name));
        }
        OutputFiles.checkDistinct(inputs, outputs);
        for (String sub : List.of("units", "report")) {
            Path below = OutputFiles.canonical(out.resolve(sub));
            inputs.forEach((option, file) -> {
                if (file != null && OutputFiles.canonical(file).startsWith(below)) {
                    throw InputException.in(file, option.split(" ")[0] + " lies in " + out.resolve(sub)
                            + ", which the run rewrites; move the input out of the output folder");
                }
            });
        }
    }

    /**
     * Why not a single sample was kept, by the largest reason: unreadable time stamps, a window outside the data,
     * or series ids that are not the model's (the only one that is not an input error: exit code 3).
     */
    static String nothingKept(org.tufa.analysis.trends.IngestReport ingest, TimeOptions time) {
        if (ingest.rows() == 0) {
            return "the trend files hold no data rows, only headers; pass the files with the data";
        }
        long stamps = ingest.unparsableTimestamps();
        long outside = ingest.samplesOutsideWindow();
        long unknown = ingest.unknownSeriesSamples();
        if (unknown > 0 && unknown >= stamps && unknown >= outside) {
            List<String> seen = ingest.unknownSeries();
            return "no trend sample belongs to a point of the model: the trends' point names (long files) or "
                    + "column headers (wide files) must be the points' ref:hasTimeseriesId values (or their labels "
                    + "when the model has none)" + (seen.isEmpty() ? "" : "; the trends hold e.g. " + String.join(
                            ", ", seen.subList(0, Math.min(3, seen.size())).stream()
                                    .map(org.tufa.common.Printable::excerpt).toList()));
        }
        if (stamps > 0 && stamps >= outside) {
            List<String> examples = ingest.problemExamples(1);
            return "no time stamp of the trends could be read (" + stamps + " rows)" + (examples.isEmpty() ? ""
                    : ", e.g. " + examples.get(0)) + "; write ISO 8601 stamps (2031-07-01T08:15:00-04:00, or local "
                    + "2031-07-01 08:15 with --timezone)";
        }
        if (outside > 0) {
            return "all " + outside + " samples of the model's series lie outside the window"
                    + (time.from() == null ? "" : " --from " + time.from()) + (time.to() == null ? "" : " --to "
                    + time.to()) + (ingest.firstStamp() == null ? "" : "; the trends run from " + ingest.firstStamp()
                    + " to " + ingest.lastStamp()) + ": choose --from/--to within that span";
        }
        return "no trend sample was kept: " + org.tufa.analysis.fleet.FleetReport.ingestLines(ingest).get(0);
    }

    private ZoneId zone() {
        if (timezone == null) {
            return ZoneOffset.UTC;
        }
        try {
            return ZoneId.of(timezone);
        } catch (java.time.DateTimeException e) {
            throw new InputException("--timezone: unknown zone '" + timezone
                    + "'; use an IANA name such as America/Toronto or Europe/Berlin");
        }
    }

    private BandKind bandKind() {
        try {
            return BandKind.fromLabel(band);
        } catch (IllegalArgumentException e) {
            throw new InputException("--band: '" + band + "' is not a band kind; use iqr, tukey or none");
        }
    }

    static Instant instant(String text, ZoneId zone, String option) {
        if (text == null) {
            return null;
        }
        try {
            return OffsetDateTime.parse(text).toInstant();
        } catch (DateTimeParseException ignored) {
            // try the local forms below
        }
        try {
            return LocalDateTime.parse(text).atZone(zone).toInstant();
        } catch (DateTimeParseException ignored) {
            // try a plain date
        }
        try {
            return LocalDate.parse(text).atStartOfDay(zone).toInstant();
        } catch (DateTimeParseException e) {
            throw new InputException(option + ": '" + text + "' is not a date or time; use 2031-06-01, "
                    + "2031-06-01T08:00 or 2031-06-01T08:00-04:00");
        }
    }

    private Map<String, Object> parameters(AnalysisSettings s, TimeOptions time, ZoneId zone) {
        Map<String, Object> p = new LinkedHashMap<>();
        p.put("profile", fleet.profiles.isEmpty() ? "automatic" : String.join(",", new java.util.TreeSet<>(fleet.profiles)));
        p.put("unit_classes", String.join(",", assessedClasses()));
        p.put("timezone", zone.getId());
        p.put("from", time.from() == null ? "" : time.from().toString());
        p.put("to", time.to() == null ? "" : time.to().toString());
        p.put("interval", time.interval().toString());
        p.put("max_gap", time.maxGap().toString());
        p.put("valve_open_percent", s.modeThresholds().valveOpenPercent());
        p.put("fan_status_on_fraction", s.modeThresholds().fanStatusOnFraction());
        p.put("fan_speed_on_fraction", s.modeThresholds().fanSpeedOnFraction());
        p.put("settling_samples", s.modeThresholds().settlingSamples());
        p.put("band", s.band().label());
        p.put("band_min_outside_samples", s.bandRuns().minOutsideSamples());
        p.put("band_max_bridged_samples", s.bandRuns().maxBridgedSamples());
        p.put("pca_variance", s.varianceTarget());
        p.put("optics_min_pts", s.minPts());
        p.put("xi", s.extraction().xi());
        p.put("min_cluster_fraction", s.extraction().minClusterFraction());
        p.put("merge_coverage", s.extraction().mergeCoverage());
        p.put("min_mode_samples", s.minModeSamples());
        p.put("residual_gate_k", s.residualGate());
        p.put("activity_gate_percent", s.activityGate());
        p.put("zone_error_gate_k", s.zoneErrorGate());
        p.put("default_airflow_m3s", s.defaultAirflow());
        p.put("day_zone", s.dayZone().getId());
        p.put("min_day_deviation", s.minDayDeviation());
        p.put("max_episode_window_days", s.maxEpisodeWindowDays());
        p.put("min_episode_days", s.minEpisodeDays());
        p.put("min_confidence", s.decision().minConfidence());
        p.put("min_peer_deviation", s.decision().minPeerDeviation());
        p.put("min_peers", s.decision().minPeers());
        p.put("fleet_wide_p", s.decision().fleetWideP());
        p.put("min_fleet_units", s.decision().minFleetUnits());
        p.put("causes", causes == null ? "built-in" : causes.toString());
        p.put("strict", strict);
        p.put("review", review == null ? "none" : review.toString());
        p.put("sample_files", sampleFiles.toLowerCase(java.util.Locale.ROOT));
        return p;
    }

    /** The fleet's units by IRI with their labels: the names a review file may use. */
    static KnownUnits knownUnits(FleetModelOptions.Assessed assessed) {
        Map<String, String> labels = new java.util.TreeMap<>();
        assessed.coverage().units().forEach(u -> labels.put(u.unit(), u.label()));
        return new KnownUnits(labels);
    }

    private List<String> assessedClasses() {
        return fleet.unitClasses.isEmpty() ? List.of("brick:Terminal_Unit") : fleet.unitClasses;
    }
}
