package org.tufa.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.tufa.analysis.evaluate.EvaluationFiles;
import org.tufa.analysis.evaluate.TruthReview;
import org.tufa.analysis.labels.AnalysisFolder;
import org.tufa.analysis.review.ReviewFile;
import org.tufa.analysis.review.Verdict;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.SimulationResult;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.simulate.DemoSimulation;
import org.tufa.analysis.simulate.DemoTargets;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code tufa demo}: the whole job on the invented demo building. It runs the same commands a user would run, in
 * order (map, coverage, analyze, evaluate), with trends simulated from the mapped model in between.
 */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Run the whole job on the bundled demo building (Wrenfield Chandlery House, invented): map its "
                + "point list, check coverage, simulate a season of trends with known faults, analyse every unit, "
                + "write the report and score the findings against the known faults."})
public final class DemoCommand implements Callable<Integer> {

    /** Where the demo's inputs sit on the class path (module demo-data). */
    static final String RESOURCES = "org/tufa/demo/";

    @Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "tufa-demo",
            description = "Output folder (default: ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--full-year", description = "Simulate the whole year 2031 instead of the summer season.")
    boolean fullYear;

    @Option(names = "--seed", paramLabel = "N", description = "Seed of the simulated trends and faults (default: "
            + "the demo's own, ${DEFAULT-VALUE}). Another seed gives another season of the same building with other "
            + "faults: a check of the detection on data its settings were not chosen on.",
            defaultValue = "" + DemoSimulation.DEMO_SEED)
    long seed;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    int threads = Runtime.getRuntime().availableProcessors();

    @Option(names = "--review", description = "Then the review loop: a review file derived from the ground truth (as "
            + "an analyst who verified every finding would write it), a re-run with it, labelled data, label "
            + "spreading, a cause classifier and its leave-one-unit-out check, and the diagnosed causes scored.")
    boolean review;

    @Override
    public Integer call() throws IOException {
        PrintWriter stdout = spec.commandLine().getOut();
        long start = System.nanoTime();
        Path input = out.resolve("input");
        Files.createDirectories(input);
        Path points = copy("points.csv", input);
        Path rules = copy("rules.tufa", input);
        Path model = out.resolve("model.ttl");

        String of = review ? "/10 " : "/5 ";
        step(stdout, "1" + of + "map the point list to a Brick model");
        int code = run("map", "--points", points.toString(), "--rules", rules.toString(), "--out", model.toString(),
                "--report", out.resolve("mapping.csv").toString());
        if (code != ExitCodes.OK) {
            return code;
        }
        step(stdout, "2" + of + "coverage: which units have the points the analysis needs");
        code = run("coverage", "--model", model.toString(), "--out", out.resolve("coverage").toString(), "--list", "8");
        if (code != ExitCodes.OK) {
            return code;
        }
        Season season = fullYear ? Season.fullYear(2031) : Season.summer(2031);
        Path trends = out.resolve(fullYear ? "trends-year" : "trends-summer");
        step(stdout, "3" + of + "simulate " + (fullYear ? "the year" : "the summer") + " 2031 with known faults -> " + trends);
        simulate(model, season, trends, stdout);

        step(stdout, "4" + of + "analyse every unit, per operating mode");
        code = run("analyze", "--model", model.toString(), "--trends",
                trends.resolve(DemoTrends.TRENDS_FILE).toString(), "--out", out.toString(), "--timezone",
                season.zone().getId(), "--threads", Integer.toString(threads));
        if (code != ExitCodes.OK) {
            return code;
        }
        step(stdout, "5" + of + "score the findings against the known faults (the demo's ground truth)");
        code = run("evaluate", "--findings", out.toString(), "--truth", trends.resolve(DemoTrends.TRUTH_FILE).toString());
        if (review && code == ExitCodes.OK) {
            code = reviewLoop(model, trends, season, stdout);
        }
        stdout.printf(java.util.Locale.ROOT, "%nDemo done in %.1f s. Open %s in a browser; tables in %s and %s.%n",
                (System.nanoTime() - start) / 1e9, out.resolve("report").resolve("index.html"),
                out.resolve("fleet.csv"), out.resolve("findings.csv"));
        if (review) {
            stdout.println("Review loop: " + out.resolve("review.csv") + ", the re-run in " + out.resolve("reviewed")
                    + ", labelled samples and their data card in " + out.resolve("labels") + ", diagnosed causes in "
                    + out.resolve("diagnosis") + " (candidates to verify).");
        }
        stdout.flush();
        return code;
    }

    /**
     * Steps 6 to 10: the review an analyst who knew the truth would write, the re-run with it, the labelled data,
     * the classifier and the scores. Outputs under DIR/review.csv, DIR/reviewed/, DIR/labels/, DIR/diagnosis/.
     */
    private int reviewLoop(Path model, Path trends, Season season, PrintWriter stdout) {
        Path truth = trends.resolve(DemoTrends.TRUTH_FILE);
        Path reviewFile = out.resolve("review.csv");
        Path reviewed = out.resolve("reviewed");
        Path labels = out.resolve("labels");
        Path diagnosis = out.resolve("diagnosis");
        step(stdout, "6/10 review every finding as an analyst who knew the injected faults would -> " + reviewFile);
        AnalysisFolder first = AnalysisFolder.open(out);
        List<Verdict> verdicts = TruthReview.fit(first.findings(), EvaluationFiles.read(out, truth).truth(),
                season.zone());
        ReviewFile.write(reviewFile, verdicts, season.zone());
        long confirmed = verdicts.stream().filter(v -> v.decision() == Verdict.Decision.CONFIRMED).count();
        stdout.println("Review: " + verdicts.size() + " verdict(s), " + confirmed + " confirmed (cause: the injected "
                + "fault), " + (verdicts.size() - confirmed) + " rejected (no fault there)");
        step(stdout, "7/10 analyse again with the review -> " + reviewed);
        int code = run("analyze", "--model", model.toString(), "--trends", trends.resolve(DemoTrends.TRENDS_FILE)
                .toString(), "--out", reviewed.toString(), "--timezone", season.zone().getId(), "--threads",
                Integer.toString(threads), "--review", reviewFile.toString());
        if (code != ExitCodes.OK) {
            return code;
        }
        step(stdout, "8/10 export the labelled samples and spread the labels -> " + labels);
        code = run("labels", "--analysis", reviewed.toString(), "--review", reviewFile.toString(), "--out",
                labels.toString(), "--threads", Integer.toString(threads));
        if (code != ExitCodes.OK) {
            return code;
        }
        step(stdout, "9/10 train a cause classifier on the labels, check it leaving one unit out, diagnose -> "
                + diagnosis);
        code = run("diagnose", "--labels", labels.toString(), "--analysis", reviewed.toString(), "--out",
                diagnosis.toString());
        if (code != ExitCodes.OK) {
            return code;
        }
        step(stdout, "10/10 score the re-run, the review's effect and the diagnosed causes against the known faults");
        return run("evaluate", "--findings", reviewed.toString(), "--truth", truth.toString(), "--review",
                reviewFile.toString(), "--diagnosis", diagnosis.resolve("diagnosis.csv").toString());
    }

    /** Simulates the season unless the folder already holds the same simulation (same season and seed). */
    private void simulate(Path model, Season season, Path dir, PrintWriter stdout) throws IOException {
        Path stamp = dir.resolve("simulation.txt");
        String id = "season " + season.firstDay() + ".." + season.lastDay() + " " + season.zone() + ", seed "
                + seed + ", model sha256 " + sha256(model) + "\n";
        if (Files.isRegularFile(stamp) && Files.readString(stamp, StandardCharsets.UTF_8).equals(id)
                && Files.isRegularFile(dir.resolve(DemoTrends.TRENDS_FILE))) {
            stdout.println("Reusing the trends already simulated in " + dir);
            return;
        }
        String done = simulateDemo(model, season, dir, seed);
        org.tufa.common.OutputFiles.writeString(stamp, id);
        stdout.println(done);
    }

    /**
     * The demo's trends for a mapped demo model: its units simulated over the season with the demo's seed and
     * faults, written to {@code dir} as the demo writes them (wide trends.csv, truth.csv). Also for tests that need
     * the demo's input without the rest of the demo (the spark module's).
     *
     * @return what was simulated and written, one line
     */
    public static String simulateDemo(Path model, Season season, Path dir) throws IOException {
        return simulateDemo(model, season, dir, DemoSimulation.DEMO_SEED);
    }

    /** As {@link #simulateDemo(Path, Season, Path)} with another seed ({@code tufa demo --seed}). */
    public static String simulateDemo(Path model, Season season, Path dir, long seed) throws IOException {
        FleetModelOptions.Assessed assessed = FleetModelOptions.assess(model, List.of(), List.of(), List.of());
        DemoTargets targets = DemoTargets.from(assessed.coverage());
        SimulationPlan plan = DemoSimulation.plan(targets.units(), targets.vavUnits(), targets.building(), season,
                seed);
        SimulationResult result = Simulator.run(plan);
        Files.createDirectories(dir);
        List<Path> written = DemoTrends.write(dir, result, DemoTrends.Layout.WIDE);
        return "Simulated " + targets.units().size() + " fan coil units and " + targets.vavUnits().size()
                + " VAV boxes with " + plan.faults().size() + " fault episodes; wrote "
                + String.join(", ", written.stream().map(Path::toString).toList());
    }

    private int run(String... args) {
        // A fresh command line per step, with the same streams and error handling as the user's own call.
        CommandLine root = spec.root().commandLine();
        return Tufa.commandLine(root.getOut(), root.getErr(), false).execute(args);
    }

    private static void step(PrintWriter out, String text) {
        out.println();
        out.println("== " + text);
        out.flush();
    }

    private static Path copy(String name, Path dir) {
        Path target = dir.resolve(name);
        try (InputStream in = DemoCommand.class.getClassLoader().getResourceAsStream(RESOURCES + name)) {
            if (in == null) {
                throw new IllegalStateException("demo resource missing from the jar: " + RESOURCES + name);
            }
            org.tufa.common.OutputFiles.write(target, in::transferTo);
            return target;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + e.getMessage(), e);
        }
    }

    private static String sha256(Path file) throws IOException {
        try {
            java.security.MessageDigest d = java.security.MessageDigest.getInstance("SHA-256");
            return java.util.HexFormat.of().formatHex(d.digest(Files.readAllBytes(file)));
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
