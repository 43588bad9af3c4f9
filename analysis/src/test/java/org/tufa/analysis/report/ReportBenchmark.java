package org.tufa.analysis.report;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.tufa.analysis.fleet.UnitOutcome;
import org.tufa.analysis.simulate.Season;

/**
 * Benchmark (not a unit test): how long the report adds to a fleet run. Simulates and analyses a fleet (not timed
 * here), then renders every unit page on a fixed thread pool, as the fleet runner's sinks do, and the fleet page;
 * prints wall time, per-unit time and the report's size. Run from the repository root after
 * {@code mvn -q -B -o -pl analysis -am test-compile}:
 * <pre>
 * java -cp analysis/target/classes:analysis/target/test-classes:mapper/target/classes:$(cat cp.txt) \
 *     org.tufa.analysis.report.ReportBenchmark 150 2 /tmp/tufa-report-bench
 * </pre>
 * (cp.txt from {@code mvn -q -o -pl analysis dependency:build-classpath -Dmdep.outputFile=cp.txt}.) Arguments:
 * unit count, render threads, output directory. The season is the summer of 2031 (June to August).
 */
public final class ReportBenchmark {
    private ReportBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 150;
        int threads = args.length > 1 ? Integer.parseInt(args[1]) : 2;
        Path out = Path.of(args.length > 2 ? args[2] : "report-bench");
        long t0 = System.nanoTime();
        SyntheticFleet.Fleet fleet = SyntheticFleet.build(n, Season.summer(2031));
        long t1 = System.nanoTime();
        System.out.printf(java.util.Locale.ROOT, "simulate + analyse %d units: %.1f s%n", n, (t1 - t0) / 1e9);
        for (int round = 1; round <= 2; round++) {
            long s0 = System.nanoTime();
            UnitPages pages = new UnitPages(out, SyntheticFleet.ZONE);
            ExecutorService pool = Executors.newFixedThreadPool(threads);
            List<UnitOutcome> units = fleet.result().units();
            List<Future<?>> done = new java.util.ArrayList<>();
            for (int i = 0; i < units.size(); i++) {
                int k = i;
                done.add(pool.submit(() -> {
                    pages.analysed(fleet.analysed().get(k), fleet.signals().get(k));
                    pages.decided(units.get(k), units.get(k).findings().isEmpty() ? null : fleet.signals().get(k),
                            fleet.loads().get(k));
                }));
            }
            for (Future<?> f : done) {
                f.get();
            }
            pool.shutdown();
            long s1 = System.nanoTime();
            FleetPage.write(FleetPage.reportDir(out), fleet.result(), fleet.coverage(), SyntheticFleet.ZONE);
            long s2 = System.nanoTime();
            long bytes;
            long files;
            try (Stream<Path> s = Files.walk(FleetPage.reportDir(out))) {
                List<Path> all = s.filter(Files::isRegularFile).toList();
                files = all.size();
                bytes = 0;
                for (Path p : all) {
                    bytes += Files.size(p);
                }
            }
            System.out.printf(java.util.Locale.ROOT, "round %d: unit pages %.2f s wall on %d threads (%.0f ms per unit"
                    + " per thread), fleet page %.2f s; report %d files, %.1f MB%n", round, (s1 - s0) / 1e9, threads,
                    (s1 - s0) / 1e6 * threads / units.size(), (s2 - s1) / 1e9, files, bytes / 1e6);
        }
    }
}
