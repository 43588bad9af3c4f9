package org.tufa.analysis.cluster.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.tufa.analysis.cluster.Optics;
import org.tufa.analysis.cluster.OpticsResult;
import org.tufa.analysis.cluster.ReferenceOptics;

/**
 * Benchmark of {@link Optics} (MinPts 20, unbounded maxEps) against the previous pass ({@link ReferenceOptics},
 * O(n^2)) and scikit-learn's OPTICS on the same data.
 *
 * <pre>
 * java -cp benchmarks/target/tufa-benchmarks.jar org.tufa.analysis.cluster.bench.OpticsBenchmark \
 *     [--sizes 2000,10000,35040] [--shapes operating,ties] [--dims 3] [--old-max 35040] [--sklearn-max 35040]
 *     [--repeat 3]
 * </pre>
 *
 * Shapes (seeded):
 * <ul>
 *   <li>{@code operating}: a dense correlated normal blob (90 %), two small fault blobs (4 %, 2 %), 4 % uniform noise;
 *   <li>{@code ties}: like PCA scores of smoothed, BAS-rounded health features: a slow walk between operating points
 *       that holds still a third of the time, rounded to a 0.05 grid, and 30 % of the samples parked exactly on four
 *       operating points (long runs of duplicates, clumps, exact distance ties).
 * </ul>
 * For each size and shape: the new pass, timed as the best of {@code --repeat} runs after a warm-up; the old pass
 * once (up to {@code --old-max} samples: it is quadratic) and whether its result is identical (ordering,
 * reachability, core distances, predecessors; the old pass is the one the scikit-learn fixtures and the replay check,
 * so identity means a valid ordering); scikit-learn 1.2.1 through {@code /usr/bin/python3} (fit only, timed inside
 * Python; up to {@code --sklearn-max}) and whether the core distances agree to 1e-12. Times are per-thread CPU
 * seconds of the benchmark thread (so other load on a shared machine inflates them less), and Python's
 * process_time for scikit-learn. A benchmark, not a test: the figures depend on the machine and its load.
 */
public final class OpticsBenchmark {

    private static final int MIN_PTS = 20;
    private static final String PYTHON = "/usr/bin/python3";
    private static final String SKLEARN_SCRIPT = String.join("\n",
            "import sys, time, numpy as np",
            "from sklearn.cluster import OPTICS",
            "X = np.loadtxt(sys.argv[1], delimiter=',', ndmin=2)",
            "m = OPTICS(min_samples=int(sys.argv[2]), max_eps=np.inf, cluster_method='dbscan', eps=1.0)",
            "t = time.process_time(); m.fit(X); t = time.process_time() - t",
            "np.savetxt(sys.argv[3], m.core_distances_, fmt='%.17g')",
            "print(t)");
    private static final ThreadMXBean THREADS = ManagementFactory.getThreadMXBean();

    private OpticsBenchmark() {}

    /** Command-line settings. */
    record Settings(int[] sizes, List<String> shapes, int[] dims, int oldMax, int sklearnMax, int repeat) {
    }

    public static void main(String[] args) throws IOException, InterruptedException {
        Settings s = parse(args);
        Path dir = Files.createTempDirectory("tufa-optics-bench");
        System.out.printf(Locale.ROOT, "| %8s | %4s | %-9s | %9s | %9s | %11s | %9s | %11s | %s |%n", "n", "dims",
                "data", "old [s]", "new [s]", "sklearn [s]", "old/new", "sklearn/new", "checks");
        System.out.println("|---:|---:|---|---:|---:|---:|---:|---:|---|");
        try {
            for (String shape : s.shapes()) {
                for (int dim : s.dims()) {
                    for (int n : s.sizes()) {
                        row(s, dir, shape, dim, n);
                    }
                }
            }
        } finally {
            try (var files = Files.list(dir)) {
                for (Path f : (Iterable<Path>) files::iterator) {
                    Files.delete(f);
                }
            }
            Files.delete(dir);
        }
    }

    private static void row(Settings s, Path dir, String shape, int dim, int n)
            throws IOException, InterruptedException {
        double[][] x = shape.equals("ties") ? heavyTies(n, dim, 20260601L + n) : operatingLike(n, dim, 20240601L + n);
        Optics.fit(operatingLike(Math.min(n, 5000), dim, 7), MIN_PTS); // warm-up
        double best = Double.POSITIVE_INFINITY;
        OpticsResult ours = null;
        for (int r = 0; r < s.repeat(); r++) {
            long t0 = THREADS.getCurrentThreadCpuTime();
            ours = Optics.fit(x, MIN_PTS);
            best = Math.min(best, (THREADS.getCurrentThreadCpuTime() - t0) / 1e9);
        }
        List<String> checks = new ArrayList<>();
        double old = Double.NaN;
        if (n <= s.oldMax()) {
            ReferenceOptics.fit(operatingLike(Math.min(n, 2000), dim, 7), MIN_PTS); // warm-up
            long t0 = THREADS.getCurrentThreadCpuTime();
            OpticsResult theirs = ReferenceOptics.fit(x, MIN_PTS);
            old = (THREADS.getCurrentThreadCpuTime() - t0) / 1e9;
            boolean same = Arrays.equals(theirs.ordering(), ours.ordering())
                    && Arrays.equals(theirs.reachability(), ours.reachability())
                    && Arrays.equals(theirs.coreDistance(), ours.coreDistance())
                    && Arrays.equals(theirs.predecessor(), ours.predecessor());
            checks.add(same ? "identical to old pass" : "DIFFERS from old pass");
        }
        double sk = Double.NaN;
        if (n <= s.sklearnMax()) {
            Path csv = dir.resolve("optics.csv");
            Path coreOut = dir.resolve("core.txt");
            writeCsv(csv, x);
            Double t = runScikitLearn(csv, coreOut);
            if (t != null) {
                sk = t;
                double maxDiff = 0;
                List<String> lines = Files.readAllLines(coreOut, StandardCharsets.UTF_8);
                for (int i = 0; i < n; i++) {
                    maxDiff = Math.max(maxDiff, Math.abs(Double.parseDouble(lines.get(i)) - ours.coreDistanceOf(i)));
                }
                checks.add(String.format(Locale.ROOT, "core vs sklearn %s (max diff %.1e)",
                        maxDiff <= 1e-12 ? "within 1e-12" : "DIFFER", maxDiff));
            } else {
                checks.add("sklearn n/a");
            }
        }
        System.out.printf(Locale.ROOT, "| %8d | %4d | %-9s | %9s | %9.3f | %11s | %9s | %11s | %s |%n", n, dim, shape,
                fmt(old, "%.3f"), best, fmt(sk, "%.3f"), fmt(old / best, "%.0fx"), fmt(sk / best, "%.0fx"),
                String.join("; ", checks));
    }

    private static String fmt(double v, String format) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, format, v);
    }

    private static Settings parse(String[] args) {
        int[] sizes = {2000, 10000, 35040};
        List<String> shapes = List.of("operating", "ties");
        int[] dims = {3};
        int oldMax = 35040;
        int sklearnMax = 35040;
        int repeat = 3;
        for (int i = 0; i < args.length; i++) {
            String value = i + 1 < args.length ? args[i + 1] : null;
            if (value == null) {
                usage();
            }
            switch (args[i]) {
                case "--sizes" -> sizes = ints(value);
                case "--shapes" -> shapes = List.of(value.split(","));
                case "--dims" -> dims = ints(value);
                case "--old-max" -> oldMax = Integer.parseInt(value);
                case "--sklearn-max" -> sklearnMax = Integer.parseInt(value);
                case "--repeat" -> repeat = Integer.parseInt(value);
                default -> usage();
            }
            i++;
        }
        for (String shape : shapes) {
            if (!shape.equals("operating") && !shape.equals("ties")) {
                usage();
            }
        }
        return new Settings(sizes, shapes, dims, oldMax, sklearnMax, Math.max(1, repeat));
    }

    private static void usage() {
        System.err.println("usage: OpticsBenchmark [--sizes 2000,10000,35040] [--shapes operating,ties] [--dims 3]"
                + " [--old-max 35040] [--sklearn-max 35040] [--repeat 3]");
        System.exit(2);
    }

    private static int[] ints(String list) {
        return Arrays.stream(list.split(",")).mapToInt(v -> Integer.parseInt(v.trim())).toArray();
    }

    /**
     * Operating-like data: 90 % normal blob (correlated in the first three dimensions), 4 % and 2 % fault blobs,
     * 4 % uniform noise. Dimensions past the third are independent normal; fewer than three keep the first ones.
     */
    static double[][] operatingLike(int n, int dim, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        double[][] x = new double[n][];
        for (int i = 0; i < n; i++) {
            double u = random.nextDouble();
            double[] p;
            if (u < 0.90) {
                double a = gaussian(random);
                double b = gaussian(random);
                double c = gaussian(random);
                p = new double[] {a, 0.6 * a + 0.8 * b, 0.2 * a + 0.66 * c};
            } else if (u < 0.94) {
                p = new double[] {
                    4 + 0.25 * gaussian(random), -3 + 0.25 * gaussian(random), 1 + 0.25 * gaussian(random)};
            } else if (u < 0.96) {
                p = new double[] {
                    -3.5 + 0.2 * gaussian(random), 3.5 + 0.2 * gaussian(random), -2 + 0.2 * gaussian(random)};
            } else {
                p = new double[] {random.nextDouble(-7, 7), random.nextDouble(-7, 7), random.nextDouble(-7, 7)};
            }
            x[i] = new double[dim];
            for (int d = 0; d < dim; d++) {
                x[i][d] = d < 3 ? p[d] : gaussian(random);
            }
        }
        return x;
    }

    /**
     * Heavy ties: a walk between operating points that holds still a third of the time, rounded to a 0.05 grid, and
     * 30 % of the samples exactly on one of four operating points.
     */
    static double[][] heavyTies(int n, int dim, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        double[][] parked = new double[4][dim];
        for (double[] p : parked) {
            for (int d = 0; d < dim; d++) {
                p[d] = Math.round(random.nextDouble(-3, 3) * 20) / 20.0;
            }
        }
        double[][] x = new double[n][dim];
        double[] position = new double[dim];
        double[] velocity = new double[dim];
        for (double[] row : x) {
            if (random.nextDouble() < 0.3) {
                System.arraycopy(parked[random.nextInt(parked.length)], 0, row, 0, dim);
                continue;
            }
            boolean hold = random.nextDouble() < 0.33;
            for (int d = 0; d < dim; d++) {
                if (!hold) {
                    velocity[d] = 0.95 * velocity[d] + 0.05 * gaussian(random);
                    position[d] = 0.999 * position[d] + 0.05 * velocity[d];
                }
                row[d] = Math.round(position[d] * 20) / 20.0;
            }
        }
        return x;
    }

    private static double gaussian(SplittableRandom random) {
        // Box-Muller; SplittableRandom has no nextGaussian in Java 17.
        double u1 = 1.0 - random.nextDouble();
        double u2 = random.nextDouble();
        return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
    }

    private static void writeCsv(Path csv, double[][] x) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(csv, StandardCharsets.UTF_8)) {
            for (double[] row : x) {
                for (int j = 0; j < row.length; j++) {
                    if (j > 0) {
                        w.write(',');
                    }
                    w.write(Double.toString(row[j]));
                }
                w.write('\n');
            }
        }
    }

    /** scikit-learn's fit time in seconds, or null when python3 or scikit-learn is unavailable. */
    private static Double runScikitLearn(Path csv, Path coreOut) throws IOException, InterruptedException {
        if (!Files.isExecutable(Path.of(PYTHON))) {
            return null;
        }
        List<String> command = new ArrayList<>(List.of(PYTHON, "-c", SKLEARN_SCRIPT, csv.toString(),
                Integer.toString(MIN_PTS), coreOut.toString()));
        Process process = new ProcessBuilder(command).redirectErrorStream(true).start();
        String output = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8).trim();
        if (!process.waitFor(2, TimeUnit.HOURS) || process.exitValue() != 0) {
            System.err.println("scikit-learn run failed: " + output);
            return null;
        }
        String[] lines = output.split("\\R");
        return Double.parseDouble(lines[lines.length - 1].trim());
    }
}
