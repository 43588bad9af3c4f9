package org.tufa.analysis.fleet.bench;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.riot.RDFDataMgr;
import org.apache.jena.riot.RDFFormat;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.ProfileCatalog;
import org.tufa.analysis.coverage.UnitClasses;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.evaluate.Evaluation;
import org.tufa.analysis.evaluate.EvaluationFiles;
import org.tufa.analysis.evaluate.EvaluationReport;
import org.tufa.analysis.simulate.DemoSimulation;
import org.tufa.analysis.simulate.DemoTargets;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.FaultEpisode;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.SimulationResult;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.simulate.UnitSeriesTargets;
import org.tufa.analysis.simulate.UnitTrace;

/**
 * End-to-end benchmark of {@code tufa analyze} on a large fleet: a Brick model of N four-pipe fan coil units of an
 * invented building ("Quillmere Exchange", fictional) and one wide trend CSV of the year 2031 at 15 minutes, made by
 * the project's own simulator (6 series per unit plus outdoor air and both supply-water temperatures; about 660 MB
 * for 500 units). The measured part runs in a child JVM with its own heap limit, so generation costs nothing:
 *
 * <pre>
 * java -Xmx4g -cp benchmarks/target/tufa-benchmarks.jar org.tufa.analysis.fleet.bench.FleetBenchmark \
 *     [--units 500] [--dir DIR] [--keep] [--heap 1500m] [--threads 2] [--seed 2031] [--numbers fixed|trimmed]
 * </pre>
 *
 * {@code --numbers fixed} (default) writes the simulated values with fixed decimals and fan status as
 * active/inactive, as many BAS exports do ({@link ExportWriter}, about 680 MB at 500 units); {@code trimmed} uses the
 * simulator's own {@link DemoTrends#writeWide} (trailing zeros dropped, 0/1; about 430 MB).
 *
 * Without {@code --dir} the files go to a temporary folder. With {@code --keep} they stay, and a later run with the
 * same {@code --dir}, unit count and seed skips the generation. {@code --units 100} is a quick smoke run.
 * Targets (from the issue): under 60 s wall and under 1.5 GB heap on 2 cores. The child's peak heap comes from the
 * {@code time:} line {@code tufa analyze} prints on stderr; its peak resident set from {@code /usr/bin/time -v}
 * where that program is installed.
 */
public final class FleetBenchmark {

    private static final String BASE = "urn:example:quillmere#";
    private static final String GENERATOR_VERSION = "fleet-benchmark generator 1";
    private static final String STAMP_FILE = "generation.txt";
    private static final String MODEL_FILE = "model.ttl";
    /** Units simulated at a time: a unit's full-year trace with the simulator's internal truth is about 1.5 MB. */
    private static final int CHUNK_UNITS = 50;
    private static final double TARGET_SECONDS = 60;
    private static final double TARGET_HEAP_MB = 1536;
    private static final Pattern STAGE = Pattern.compile("([a-z]+) ([0-9.]+) s");
    private static final Pattern PEAK_HEAP = Pattern.compile("peak heap ([0-9.]+) MB in use, ([0-9.]+) MB live");

    /** Command-line settings. */
    record Settings(int units, Path dir, boolean keep, boolean temporary, String heap, int threads, long seed,
            boolean fixedDecimals) {
    }

    private FleetBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        Settings s = parse(args);
        Files.createDirectories(s.dir());
        Path model = s.dir().resolve(MODEL_FILE);
        Path trends = s.dir().resolve(DemoTrends.TRENDS_FILE);
        String stamp = GENERATOR_VERSION + "; units " + s.units() + "; season 2031-01-01..2031-12-31 "
                + Season.DEMO_ZONE + "; seed " + s.seed() + "; numbers " + (s.fixedDecimals() ? "fixed" : "trimmed")
                + "\n";
        if (isGenerated(s.dir(), stamp, model, trends)) {
            System.out.println("Reusing the model and trends in " + s.dir());
        } else {
            generate(s, model, stamp);
        }
        Path out = s.dir().resolve("analysis-out");
        deleteTree(out);
        Measurement m = measure(s, model, trends, out);
        report(s, trends, out, m);
        if (!s.keep()) {
            deleteTree(out);
            for (String name : List.of(MODEL_FILE, DemoTrends.TRENDS_FILE, DemoTrends.TRUTH_FILE, STAMP_FILE)) {
                Files.deleteIfExists(s.dir().resolve(name));
            }
            Files.deleteIfExists(s.dir().resolve("tmp"));
            if (s.temporary()) {
                Files.deleteIfExists(s.dir());
            }
        }
        System.exit(m.exitCode() == 0 && m.passes() ? 0 : 1);
    }

    static Settings parse(String[] args) throws IOException {
        int units = 500;
        Path dir = null;
        boolean keep = false;
        String heap = "1500m";
        int threads = 2;
        long seed = DemoSimulation.DEMO_SEED;
        boolean fixedDecimals = true;
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--units" -> units = Integer.parseInt(args[++i]);
                case "--dir" -> dir = Path.of(args[++i]);
                case "--keep" -> keep = true;
                case "--heap" -> heap = args[++i];
                case "--threads" -> threads = Integer.parseInt(args[++i]);
                case "--seed" -> seed = Long.parseLong(args[++i]);
                case "--numbers" -> fixedDecimals = switch (args[++i]) {
                    case "fixed" -> true;
                    case "trimmed" -> false;
                    default -> throw new IllegalArgumentException("--numbers: use fixed or trimmed");
                };
                default -> throw new IllegalArgumentException("unknown argument " + args[i]
                        + "; use --units N, --dir DIR, --keep, --heap SIZE, --threads N, --seed N,"
                        + " --numbers fixed|trimmed");
            }
        }
        if (units < 1) {
            throw new IllegalArgumentException("--units must be at least 1");
        }
        boolean temporary = dir == null;
        return new Settings(units, temporary ? Files.createTempDirectory("tufa-fleet-bench") : dir, keep, temporary,
                heap, threads, seed, fixedDecimals);
    }

    private static boolean isGenerated(Path dir, String stamp, Path model, Path trends) throws IOException {
        Path file = dir.resolve(STAMP_FILE);
        return Files.isRegularFile(file) && Files.readString(file, StandardCharsets.UTF_8).equals(stamp)
                && Files.isRegularFile(model) && Files.isRegularFile(trends);
    }

    // ---------------------------------------------------------------- generation

    private static void generate(Settings s, Path modelFile, String stamp) throws IOException {
        long t0 = System.nanoTime();
        Files.deleteIfExists(s.dir().resolve(STAMP_FILE));
        Model model = fleetModel(s.units());
        try (OutputStream out = Files.newOutputStream(modelFile)) {
            RDFDataMgr.write(out, model, RDFFormat.TURTLE_PRETTY);
        }
        FleetCoverage coverage = coverage(modelFile);
        DemoTargets targets = DemoTargets.from(coverage);
        if (targets.units().size() != s.units()) {
            throw new IllegalStateException("coverage found " + targets.units().size() + " units, expected "
                    + s.units());
        }
        SimulationPlan plan = DemoSimulation.plan(targets.units(), targets.building(), Season.fullYear(2031),
                s.seed());
        SimulationResult result = simulateInChunks(plan);
        long t1 = System.nanoTime();
        if (s.fixedDecimals()) {
            ExportWriter.writeWide(s.dir().resolve(DemoTrends.TRENDS_FILE), result);
            DemoTrends.writeTruth(s.dir().resolve(DemoTrends.TRUTH_FILE), result);
        } else {
            DemoTrends.write(s.dir(), result, DemoTrends.Layout.WIDE);
        }
        Files.writeString(s.dir().resolve(STAMP_FILE), stamp, StandardCharsets.UTF_8);
        System.out.printf(Locale.ROOT, "generated %d units with %d fault episodes: simulate %.1f s, write %.1f s;"
                        + " model %.1f MB, trends %.1f MB%n", s.units(), plan.faults().size(), (t1 - t0) / 1e9,
                (System.nanoTime() - t1) / 1e9, Files.size(modelFile) / 1e6,
                Files.size(s.dir().resolve(DemoTrends.TRENDS_FILE)) / 1e6);
    }

    /**
     * Simulates the plan {@link #CHUNK_UNITS} units at a time and keeps only the logged series of each unit, so the
     * heap holds about 0.8 MB per unit instead of 1.5 MB. Each unit draws from its own seeded streams and the site
     * conditions depend on the seed only, so the result equals {@code Simulator.run(plan)} on the whole plan.
     */
    static SimulationResult simulateInChunks(SimulationPlan plan) {
        List<UnitTrace> kept = new ArrayList<>(plan.units().size());
        SimulationResult first = null;
        for (int from = 0; from < plan.units().size(); from += CHUNK_UNITS) {
            List<UnitSeriesTargets> chunk = plan.units().subList(from, Math.min(from + CHUNK_UNITS,
                    plan.units().size()));
            Set<String> iris = chunk.stream().map(UnitSeriesTargets::unitIri)
                    .collect(java.util.stream.Collectors.toSet());
            List<FaultEpisode> faults = plan.faults().stream().filter(f -> iris.contains(f.unitIri())).toList();
            SimulationResult part = Simulator.run(new SimulationPlan(chunk, plan.buildingTargets(), plan.season(),
                    plan.seed(), faults));
            if (first == null) {
                first = part;
            }
            for (UnitTrace u : part.units()) {
                kept.add(new UnitTrace(u.unitIri(), u.parameters(), u.fault(), u.zoneC(), u.dischargeC(),
                        u.setpointC(), u.coolingCommandPct(), u.heatingCommandPct(), u.fanStatus(), null, null, null,
                        null, null));
            }
            System.out.printf(Locale.ROOT, "  simulated %d of %d units%n", kept.size(), plan.units().size());
        }
        return new SimulationResult(plan, first.timestamps(), first.outdoorC(), first.chilledWaterSupplyC(),
                first.hotWaterSupplyC(), kept);
    }

    /**
     * The Brick model: per unit zone and discharge air temperature sensors, fan status, a zone setpoint and the
     * valve commands of its chilled- and hot-water valves (parts of the unit); both loops with their supply
     * temperatures; the outdoor air sensor on the building. Units of measure in SI.
     */
    static Model fleetModel(int units) {
        List<FanCoilFleetModel.Unit> list = new java.util.ArrayList<>();
        for (int u = 1; u <= units; u++) {
            String id = String.format(Locale.ROOT, "FCU-%02d-%03d", 1 + (u - 1) / 40, u);
            list.add(new FanCoilFleetModel.Unit(id, "QX." + id, "DEG_C", true));
        }
        Model m = FanCoilFleetModel.build(BASE, "Quillmere Exchange", "QX.PLANT.", list);
        m.setNsPrefix("qx", BASE);
        return m;
    }

    /** The coverage {@code tufa analyze} will see: default profile, all terminal units. */
    private static FleetCoverage coverage(Path modelFile) {
        Vocabulary vocabulary = Vocabulary.standard();
        Model data = ModelLoader.load(modelFile);
        Model all = vocabulary.unionWith(data);
        Set<String> classes = UnitClasses.resolve(List.of(), all, all);
        return Coverage.assess(data, vocabulary, vocabulary.profiles().profile(ProfileCatalog.DEFAULT_PROFILE),
                classes);
    }

    // ---------------------------------------------------------------- measurement

    /** What the child run gave. */
    record Measurement(int exitCode, double wallSeconds, String timeLine, Map<String, Double> stageSeconds,
            double peakHeapMb, double liveHeapMb, long maxRssKb, String loadBefore, String loadAfter) {

        boolean passes() {
            return wallSeconds < TARGET_SECONDS && peakHeapMb >= 0 && peakHeapMb < TARGET_HEAP_MB;
        }
    }

    private static Measurement measure(Settings s, Path model, Path trends, Path out)
            throws IOException, InterruptedException, URISyntaxException {
        Path jar = Path.of(FleetBenchmark.class.getProtectionDomain().getCodeSource().getLocation().toURI());
        String java = ProcessHandle.current().info().command().orElse("java");
        Path spill = s.dir().resolve("tmp");
        Files.createDirectories(spill);
        List<String> command = new ArrayList<>();
        boolean timed = Files.isExecutable(Path.of("/usr/bin/time"));
        if (timed) {
            command.addAll(List.of("/usr/bin/time", "-v"));
        }
        command.addAll(List.of(java, "-Xmx" + s.heap(), "-Djava.io.tmpdir=" + spill, "-cp", jar.toString(),
                "org.tufa.cli.Tufa", "analyze", "--model", model.toString(), "--trends", trends.toString(), "--out",
                out.toString(), "--timezone", Season.DEMO_ZONE.getId(), "--threads", Integer.toString(s.threads()),
                "--no-report"));
        Path stdout = s.dir().resolve("analyze-stdout.txt");
        Path stderr = s.dir().resolve("analyze-stderr.txt");
        System.out.println("measuring: " + String.join(" ", command));
        String loadBefore = loadAverage();
        long t0 = System.nanoTime();
        Process child = new ProcessBuilder(command).redirectOutput(stdout.toFile()).redirectError(stderr.toFile())
                .start();
        int code = child.waitFor();
        double wall = (System.nanoTime() - t0) / 1e9;
        String loadAfter = loadAverage();
        List<String> errLines = Files.readAllLines(stderr, StandardCharsets.UTF_8);
        String timeLine = "";
        long rss = -1;
        for (String raw : errLines) {
            String line = raw.substring(raw.lastIndexOf('\r') + 1).trim();
            if (line.startsWith("time: ")) {
                timeLine = line;
            } else if (line.startsWith("Maximum resident set size (kbytes):")) {
                rss = Long.parseLong(line.substring(line.indexOf(':') + 1).trim());
            }
        }
        Map<String, Double> stages = new java.util.LinkedHashMap<>();
        int perStage = timeLine.indexOf("per stage");
        if (perStage >= 0) {
            Matcher sm = STAGE.matcher(timeLine.substring(perStage));
            while (sm.find()) {
                stages.put(sm.group(1), Double.parseDouble(sm.group(2)));
            }
        }
        Matcher hm = PEAK_HEAP.matcher(timeLine);
        boolean heapFound = hm.find();
        double peakHeap = heapFound ? Double.parseDouble(hm.group(1)) : -1;
        double liveHeap = heapFound ? Double.parseDouble(hm.group(2)) : -1;
        if (code != 0) {
            System.out.println("child failed with exit code " + code + "; its stderr (" + stderr + "):");
            errLines.stream().skip(Math.max(0, errLines.size() - 30)).forEach(System.out::println);
        } else {
            Files.readAllLines(stdout, StandardCharsets.UTF_8).forEach(l -> System.out.println("  | " + l));
        }
        return new Measurement(code, wall, timeLine, stages, peakHeap, liveHeap, rss, loadBefore, loadAfter);
    }

    private static String loadAverage() {
        try {
            return Files.readString(Path.of("/proc/loadavg"), StandardCharsets.US_ASCII).trim();
        } catch (IOException e) {
            return "n/a";
        }
    }

    private static void report(Settings s, Path trends, Path out, Measurement m) throws IOException {
        long size = Files.size(trends);
        long rows;
        int columns;
        try (var reader = Files.newBufferedReader(trends, StandardCharsets.UTF_8)) {
            columns = reader.readLine().split(",", -1).length - 1;
            rows = 0;
            while (reader.readLine() != null) {
                rows++;
            }
        }
        System.out.println();
        System.out.println("== fleet benchmark");
        System.out.printf(Locale.ROOT, "trends file      %s: %.1f MB (%d bytes), %d series x %d rows%n", trends,
                size / 1e6, size, columns, rows);
        System.out.printf(Locale.ROOT, "units            %d%s%n", s.units(), samplesUsed(out));
        System.out.printf(Locale.ROOT, "child            -Xmx%s, --threads %d, exit code %d%n", s.heap(), s.threads(),
                m.exitCode());
        System.out.printf(Locale.ROOT, "wall time        %.1f s end to end (JVM start to exit)%n", m.wallSeconds());
        System.out.println("analyze says     " + (m.timeLine().isEmpty() ? "(no time line)" : m.timeLine()));
        StringBuilder stages = new StringBuilder();
        m.stageSeconds().forEach((k, v) -> stages.append(String.format(Locale.ROOT, "%s %.1f s  ", k, v)));
        System.out.println("stages (summed over worker threads) " + stages.toString().trim());
        System.out.printf(Locale.ROOT, "peak heap        %s%n", m.peakHeapMb() < 0 ? "unknown"
                : String.format(Locale.ROOT, "%.0f MB in use just before a GC; %.0f MB live just after one (what the"
                        + " run needs; G1 lets use grow towards -Xmx before collecting)", m.peakHeapMb(),
                        m.liveHeapMb()));
        System.out.printf(Locale.ROOT, "peak RSS         %s%n",
                m.maxRssKb() < 0 ? "unknown (/usr/bin/time not installed)"
                        : String.format(Locale.ROOT, "%.0f MB (whole JVM, /usr/bin/time -v)", m.maxRssKb() / 1024.0));
        System.out.println("load average     before " + m.loadBefore() + " | after " + m.loadAfter());
        System.out.printf(Locale.ROOT, "result           %s (targets: under %.0f s wall, under %.0f MB heap)%n",
                m.exitCode() == 0 && m.passes() ? "PASS" : "FAIL", TARGET_SECONDS, TARGET_HEAP_MB);
        detection(s.dir().resolve(DemoTrends.TRUTH_FILE), out);
    }

    /**
     * The detection figures beside the speed: the fleet's totals from {@code tufa evaluate}'s scoring against the
     * simulator's ground truth (a speed-up that costs findings shows here).
     */
    private static void detection(Path truth, Path out) {
        if (!Files.isRegularFile(truth) || !Files.isRegularFile(out.resolve("findings.csv"))) {
            System.out.println("detection        not scored (no truth.csv or findings.csv)");
            return;
        }
        Evaluation.Result result = Evaluation.fit(EvaluationFiles.read(out, truth), Evaluation.DEFAULT_MIN_HOURS);
        System.out.println("detection        (tufa evaluate against the simulator's truth)");
        for (String line : EvaluationReport.table(result)) {
            if (line.startsWith("all_") || line.startsWith("healthy") || line.startsWith("goal")
                    || line.startsWith("fault ")) {
                System.out.println("  " + line);
            }
        }
    }

    /** Mean, min and max samples used per analysed unit, from fleet.csv (column samples_used). */
    private static String samplesUsed(Path out) throws IOException {
        Path fleet = out.resolve("fleet.csv");
        if (!Files.isRegularFile(fleet)) {
            return "";
        }
        List<String> lines = Files.readAllLines(fleet, StandardCharsets.UTF_8);
        List<String> header = List.of(lines.get(0).split(","));
        int col = header.indexOf("samples_used");
        int status = header.indexOf("status");
        long sum = 0;
        long min = Long.MAX_VALUE;
        long max = 0;
        int analysed = 0;
        Map<String, Integer> statuses = new java.util.TreeMap<>();
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",", -1);
            if (f.length != header.size()) {
                continue; // a quoted comma; the counts below are for information only
            }
            statuses.merge(f[status], 1, Integer::sum);
            long n = Long.parseLong(f[col]);
            if (n > 0) {
                analysed++;
                sum += n;
                min = Math.min(min, n);
                max = Math.max(max, n);
            }
        }
        return analysed == 0 ? "; statuses " + statuses : String.format(Locale.ROOT,
                "; statuses %s; samples used per analysed unit (all modes, after the band): mean %d, min %d, max %d",
                statuses, sum / analysed, min, max);
    }

    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        } catch (UncheckedIOException e) {
            throw e.getCause();
        }
    }
}
