package org.tufa.analysis.cluster.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.tufa.analysis.cluster.Optics;
import org.tufa.analysis.cluster.OpticsResult;

/**
 * Benchmark of {@link Optics} (MinPts 20, unbounded maxEps) against scikit-learn's OPTICS on the same data.
 *
 * <pre>
 * java -cp benchmarks/target/tufa-benchmarks.jar org.tufa.analysis.cluster.bench.OpticsBenchmark [--sizes 2000,10000,35040]
 * </pre>
 *
 * For each size it generates seeded 3-D operating-like data (a dense normal blob, two small fault blobs, 4 %
 * uniform noise), writes it as CSV to a temporary folder, times our fit (after one warm-up fit), times
 * scikit-learn's fit through {@code /usr/bin/python3} (only the fit is timed, inside Python), and prints both
 * times, their ratio and whether the core distances agree to 1e-12. Without python3/scikit-learn it prints ours
 * only. A benchmark, not a test: timings depend on the machine and its load.
 */
public final class OpticsBenchmark {

    private static final int MIN_PTS = 20;
    private static final String PYTHON = "/usr/bin/python3";
    private static final String SKLEARN_SCRIPT = String.join("\n",
            "import sys, time, numpy as np",
            "from sklearn.cluster import OPTICS",
            "X = np.loadtxt(sys.argv[1], delimiter=',')",
            "m = OPTICS(min_samples=int(sys.argv[2]), max_eps=np.inf, cluster_method='dbscan', eps=1.0)",
            "t = time.perf_counter(); m.fit(X); t = time.perf_counter() - t",
            "np.savetxt(sys.argv[3], m.core_distances_, fmt='%.17g')",
            "print(t)");

    private OpticsBenchmark() {}

    public static void main(String[] args) throws IOException, InterruptedException {
        int[] sizes = {2000, 10000, 35040};
        for (int i = 0; i < args.length; i++) {
            if (args[i].equals("--sizes") && i + 1 < args.length) {
                String[] parts = args[++i].split(",");
                sizes = new int[parts.length];
                for (int j = 0; j < parts.length; j++) {
                    sizes[j] = Integer.parseInt(parts[j].trim());
                }
            } else {
                System.err.println("usage: OpticsBenchmark [--sizes 2000,10000,35040]");
                System.exit(2);
            }
        }
        Path dir = Files.createTempDirectory("tufa-optics-bench");
        System.out.printf(Locale.ROOT, "%8s %12s %14s %8s %s%n", "n", "tufa [s]", "sklearn [s]", "ratio",
                "core distances within 1e-12");
        for (int n : sizes) {
            double[][] x = operatingLike(n, 20240601L + n);
            Path csv = dir.resolve("optics-" + n + ".csv");
            writeCsv(csv, x);
            Optics.fit(x, MIN_PTS); // warm-up
            long t0 = System.nanoTime();
            OpticsResult ours = Optics.fit(x, MIN_PTS);
            double oursSeconds = (System.nanoTime() - t0) / 1e9;
            Path coreOut = dir.resolve("core-" + n + ".txt");
            Double sk = runScikitLearn(csv, coreOut);
            if (sk == null) {
                System.out.printf(Locale.ROOT, "%8d %12.3f %14s %8s %s%n", n, oursSeconds, "n/a", "n/a", "n/a");
            } else {
                double maxDiff = 0;
                List<String> lines = Files.readAllLines(coreOut, StandardCharsets.UTF_8);
                for (int i = 0; i < n; i++) {
                    maxDiff = Math.max(maxDiff, Math.abs(Double.parseDouble(lines.get(i)) - ours.coreDistanceOf(i)));
                }
                System.out.printf(Locale.ROOT, "%8d %12.3f %14.3f %7.1fx %s (max diff %.1e)%n", n, oursSeconds, sk,
                        sk / oursSeconds, maxDiff <= 1e-12 ? "yes" : "NO", maxDiff);
            }
        }
        try (var files = Files.list(dir)) {
            for (Path f : (Iterable<Path>) files::iterator) {
                Files.delete(f);
            }
        }
        Files.delete(dir);
    }

    /** Operating-like 3-D data: 90 % normal blob (correlated), 4 % and 2 % fault blobs, 4 % uniform noise. */
    static double[][] operatingLike(int n, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        double[][] x = new double[n][];
        for (int i = 0; i < n; i++) {
            double u = random.nextDouble();
            if (u < 0.90) {
                double a = gaussian(random);
                double b = gaussian(random);
                double c = gaussian(random);
                x[i] = new double[] {a, 0.6 * a + 0.8 * b, 0.2 * a + 0.66 * c};
            } else if (u < 0.94) {
                x[i] = new double[] {
                    4 + 0.25 * gaussian(random), -3 + 0.25 * gaussian(random), 1 + 0.25 * gaussian(random)};
            } else if (u < 0.96) {
                x[i] = new double[] {
                    -3.5 + 0.2 * gaussian(random), 3.5 + 0.2 * gaussian(random), -2 + 0.2 * gaussian(random)};
            } else {
                x[i] = new double[] {
                    random.nextDouble(-7, 7), random.nextDouble(-7, 7), random.nextDouble(-7, 7)};
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
