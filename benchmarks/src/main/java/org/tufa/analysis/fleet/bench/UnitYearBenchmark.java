package org.tufa.analysis.fleet.bench;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * {@code tufa analyze} on high-rate data: a year of one unit (or a few) at 1 or 5 minutes, measured in a child JVM
 * with a 1 GB heap. The trends come from the shared fleet generator ({@code shared/fleets/fleetgen.py}, independent
 * of tufa's own simulator, whose grid is fixed at 15 minutes), generated once into {@code --dir} and reused:
 *
 * <pre>
 * java -cp benchmarks/target/tufa-benchmarks.jar org.tufa.analysis.fleet.bench.UnitYearBenchmark \
 *     [--units 1] [--minutes 1] [--days 365] [--seed 5] [--dir /tmp/tufa-unit-year] [--heap 1g] [--threads 2] \
 *     [--fleetgen ../shared/fleets/fleetgen.py] [--no-report]
 * </pre>
 *
 * Prints the command, the child's {@code time:} line (wall, stages, peak heap in use and live after a collection),
 * its peak resident set where {@code /usr/bin/time} exists, and whether the targets of issue 15 hold (under 20 s,
 * under 1 GB heap). The run is what a user gets (per-unit files and the HTML report); {@code --no-report} leaves the
 * report out. A benchmark, not a test.
 */
public final class UnitYearBenchmark {

    private static final double TARGET_SECONDS = 20;

    private UnitYearBenchmark() {
    }

    public static void main(String[] args) throws IOException, InterruptedException, URISyntaxException {
        int units = 1;
        int minutes = 1;
        int days = 365;
        int seed = 5;
        int threads = 2;
        String heap = "1g";
        boolean report = true;
        Path dir = Path.of(System.getProperty("java.io.tmpdir"), "tufa-unit-year");
        Path fleetgen = Path.of("..", "shared", "fleets", "fleetgen.py");
        for (int i = 0; i < args.length; i++) {
            String a = args[i];
            if (a.equals("--no-report")) {
                report = false;
                continue;
            }
            if (i + 1 >= args.length) {
                usage();
            }
            String v = args[++i];
            switch (a) {
                case "--units" -> units = Integer.parseInt(v);
                case "--minutes" -> minutes = Integer.parseInt(v);
                case "--days" -> days = Integer.parseInt(v);
                case "--seed" -> seed = Integer.parseInt(v);
                case "--threads" -> threads = Integer.parseInt(v);
                case "--heap" -> heap = v;
                case "--dir" -> dir = Path.of(v);
                case "--fleetgen" -> fleetgen = Path.of(v);
                default -> usage();
            }
        }
        Path data = dir.resolve(String.format(Locale.ROOT, "u%d-d%d-m%d-s%d", units, days, minutes, seed));
        Path model = data.resolve("model.ttl");
        Path trends = data.resolve("trends.csv");
        if (!Files.isRegularFile(model) || !Files.isRegularFile(trends)) {
            if (!Files.isRegularFile(fleetgen)) {
                System.err.println("no trends in " + data + " and no generator at " + fleetgen
                        + "; pass --fleetgen PATH (shared/fleets/fleetgen.py)");
                System.exit(2);
            }
            run(List.of("/usr/bin/python3", fleetgen.toString(), data.toString(), "--units", Integer.toString(units),
                    "--days", Integer.toString(days), "--interval", Integer.toString(minutes), "--start",
                    "2031-01-01", "--format", "wide", "--seed", Integer.toString(seed)), data.resolve("fleetgen.log"));
        }
        Path jar = Path.of(UnitYearBenchmark.class.getProtectionDomain().getCodeSource().getLocation().toURI());
        String java = ProcessHandle.current().info().command().orElse("java");
        Path out = data.resolve("analysis-out");
        List<String> command = new ArrayList<>();
        if (Files.isExecutable(Path.of("/usr/bin/time"))) {
            command.addAll(List.of("/usr/bin/time", "-v"));
        }
        command.addAll(List.of(java, "-Xmx" + heap, "-cp", jar.toString(), "org.tufa.cli.Tufa", "analyze", "--model",
                model.toString(), "--trends", trends.toString(), "--out", out.toString(), "--interval",
                "PT" + minutes + "M", "--threads", Integer.toString(threads)));
        if (!report) {
            command.add("--no-report");
        }
        System.out.println("measuring: " + String.join(" ", command));
        Path log = data.resolve("analyze-stderr.txt");
        long t0 = System.nanoTime();
        int code = run(command, log);
        double wall = (System.nanoTime() - t0) / 1e9;
        String timeLine = "";
        String rss = "";
        for (String raw : Files.readAllLines(log, StandardCharsets.UTF_8)) {
            String line = raw.substring(raw.lastIndexOf('\r') + 1).trim();
            if (line.startsWith("time: ")) {
                timeLine = line;
            } else if (line.startsWith("Maximum resident set size (kbytes):")) {
                rss = String.format(Locale.ROOT, "%.0f MB",
                        Long.parseLong(line.substring(line.indexOf(':') + 1).trim()) / 1024.0);
            }
        }
        System.out.printf(Locale.ROOT, "%d unit(s), %d days at %d min, -Xmx%s, %d thread(s): exit %d, %.1f s wall"
                + " (child JVM included)%s%n", units, days, minutes, heap, threads, code, wall,
                rss.isEmpty() ? "" : ", peak RSS " + rss);
        System.out.println(timeLine);
        System.out.println(code == 0 && wall < TARGET_SECONDS
                ? "target met: under " + TARGET_SECONDS + " s with a " + heap + " heap"
                : "target NOT met (under " + TARGET_SECONDS + " s with a " + heap + " heap)");
        System.exit(code);
    }

    private static int run(List<String> command, Path log) throws IOException, InterruptedException {
        Files.createDirectories(log.getParent());
        Process p = new ProcessBuilder(command).redirectErrorStream(false)
                .redirectOutput(ProcessBuilder.Redirect.DISCARD).redirectError(log.toFile()).start();
        return p.waitFor();
    }

    private static void usage() {
        System.err.println("usage: UnitYearBenchmark [--units 1] [--minutes 1] [--days 365] [--seed 5] [--dir DIR]"
                + " [--heap 1g] [--threads 2] [--fleetgen PATH] [--no-report]");
        System.exit(2);
    }
}
