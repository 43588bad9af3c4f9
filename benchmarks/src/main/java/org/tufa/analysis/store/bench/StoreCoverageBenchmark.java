package org.tufa.analysis.store.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Locale;
import java.util.Set;
import java.util.stream.Stream;
import org.apache.jena.rdf.model.Model;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.Profile;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.coverage.bench.CoverageBenchmark;
import org.tufa.analysis.store.ModelStore;

/**
 * Coverage on the generated fleet of {@link CoverageBenchmark} (N units, 12 points each), on the model in memory
 * and on the same model in a TDB2 store (each run in its own read transaction, as {@code coverage --store} does).
 * Target: the store within 1.5x of memory.
 *
 * <pre>
 * java -cp benchmarks/target/tufa-benchmarks.jar org.tufa.analysis.store.bench.StoreCoverageBenchmark [units] [runs]
 * </pre>
 */
public final class StoreCoverageBenchmark {
    private StoreCoverageBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        int units = args.length > 0 ? Integer.parseInt(args[0]) : 2000;
        int runs = args.length > 1 ? Integer.parseInt(args[1]) : 5;
        Path dir = Files.createTempDirectory("tufa-store-bench-");
        try {
            Path file = dir.resolve("fleet.ttl");
            CoverageBenchmark.writeFleet(file, units, 20260101L);
            Model model = ModelLoader.load(file);
            Vocabulary vocabulary = Vocabulary.standard();
            Profile profile = vocabulary.profiles().profile("fcu-modes");
            System.out.printf(Locale.ROOT, "fleet: %d units, %d triples; load average %.2f on %d processors%n", units,
                    model.size(), java.lang.management.ManagementFactory.getOperatingSystemMXBean()
                            .getSystemLoadAverage(), Runtime.getRuntime().availableProcessors());
            long memoryBest = Long.MAX_VALUE;
            FleetCoverage inMemory = null;
            for (int i = 1; i <= runs; i++) {
                long a = System.nanoTime();
                inMemory = Coverage.assess(model, vocabulary, profile, Set.of());
                long t = System.nanoTime() - a;
                memoryBest = Math.min(memoryBest, t);
                System.out.printf(Locale.ROOT, "memory run %d: %.0f ms%n", i, t / 1e6);
            }
            try (ModelStore store = ModelStore.open(dir.resolve("store"), true)) {
                long a = System.nanoTime();
                store.load(model, "urn:bench:building", vocabulary.model(), file.toString());
                System.out.printf(Locale.ROOT, "store load: %.0f ms%n", (System.nanoTime() - a) / 1e6);
                Vocabulary stored = store.read(null, (data, v) -> Vocabulary.of(v, java.util.List.of()));
                long storeBest = Long.MAX_VALUE;
                FleetCoverage fromStore = null;
                for (int i = 1; i <= runs; i++) {
                    long b = System.nanoTime();
                    fromStore = store.read(null, (data, v) -> Coverage.assess(data, stored, profile, Set.of()));
                    long t = System.nanoTime() - b;
                    storeBest = Math.min(storeBest, t);
                    System.out.printf(Locale.ROOT, "store run %d:  %.0f ms%n", i, t / 1e6);
                }
                System.out.printf(Locale.ROOT, "best: memory %.0f ms, store %.0f ms, ratio %.2f; same units: %s%n",
                        memoryBest / 1e6, storeBest / 1e6, storeBest / (double) memoryBest,
                        inMemory.units().equals(fromStore.units()));
            }
        } finally {
            try (Stream<Path> s = Files.walk(dir)) {
                s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
            }
        }
    }
}
