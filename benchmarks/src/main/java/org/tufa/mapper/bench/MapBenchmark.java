package org.tufa.mapper.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.model.BuiltModel;
import org.tufa.mapper.model.ModelBuilder;
import org.tufa.mapper.model.ModelFiles;
import org.tufa.mapper.points.PointList;
import org.tufa.mapper.points.PointListReader;
import org.tufa.mapper.points.ReadOptions;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * Times {@code tufa map} on generated input: N points (default 100 000) and R rules (default 200), seeded, with the
 * bundled Brick vocabulary (all of Brick 1.4.4).
 * Stages timed separately: rule parse, CSV read, match, model build, Turtle write; each run repeated, the first
 * (cold) and the best (warm) reported. Run:
 * <pre>
 * mvn -q -B -pl benchmarks -am package -DskipTests
 * java -cp benchmarks/target/tufa-benchmarks.jar org.tufa.mapper.bench.MapBenchmark [points] [rules] [seed] [runs]
 * </pre>
 * Add {@code -XX:ActiveProcessorCount=2} to mimic a 2-core machine. The model build allocates ~1.3 million triples;
 * {@code -XX:+UseParallelGC -Xms2g} cuts its garbage-collection share markedly (measured: best build 2.1 s vs
 * 3.3 s with the default G1 on the same loaded machine).
 */
public final class MapBenchmark {

    static final String[] SUFFIXES = {"ZN-TEMP", "DA-TEMP", "CHW-VLV-CMD", "HW-VLV-CMD", "FAN-SPD-CMD", "FAN-STAT",
        "FAN-SS-CMD", "OCC-MODE", "ZN-CLG-STPT", "ZN-HTG-STPT"};
    static final String[] TYPES = {"AI", "AI", "AO", "AO", "MSV", "BI", "BO", "BV", "AV", "AV"};

    private MapBenchmark() {
    }

    public static void main(String[] args) throws IOException {
        int points = args.length > 0 ? Integer.parseInt(args[0]) : 100_000;
        int rules = args.length > 1 ? Integer.parseInt(args[1]) : 200;
        long seed = args.length > 2 ? Long.parseLong(args[2]) : 42L;
        int runs = args.length > 3 ? Integer.parseInt(args[3]) : 5;
        Path dir = Files.createTempDirectory("tufa-map-bench");
        Path csv = dir.resolve("points.csv");
        Path ruleFile = dir.resolve("bench.tufa");
        writeRules(ruleFile, rules);
        writePoints(csv, points, rules, seed);
        System.out.printf(Locale.ROOT, "input: %d points (%d bytes), %d rules (%d lines), seed %d, %d cores%n",
                points, Files.size(csv), rules, Files.readAllLines(ruleFile).size(), seed,
                Runtime.getRuntime().availableProcessors());
        long t0 = System.nanoTime();
        BrickVocabulary vocab = BrickVocabulary.bundled();
        System.out.printf(Locale.ROOT, "vocabulary load (once): %.0f ms (%s, %d classes)%n", ms(t0), vocab.source(),
                vocab.classNames().size());
        double[] best = new double[6];
        java.util.Arrays.fill(best, Double.MAX_VALUE);
        for (int run = 1; run <= runs; run++) {
            java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
            long cpu0 = mx.getCurrentThreadCpuTime();
            long a = System.nanoTime();
            RuleSet rs = RuleFileParser.parse(ruleFile, vocab);
            long b = System.nanoTime();
            PointList list = PointListReader.read(csv, ReadOptions.detect());
            long c = System.nanoTime();
            long cpuMatch0 = mx.getCurrentThreadCpuTime();
            MappingResult result = Mapper.fit(rs, vocab).map(list);
            long cpuMatch1 = mx.getCurrentThreadCpuTime();
            long d = System.nanoTime();
            BuiltModel model = ModelBuilder.build(result, "https://bench.example.org/");
            long e = System.nanoTime();
            long cpu1 = mx.getCurrentThreadCpuTime();
            ModelFiles.write(model.model(), dir.resolve("model.ttl"));
            long f = System.nanoTime();
            double[] t = {(b - a) / 1e6, (c - b) / 1e6, (d - c) / 1e6, (e - d) / 1e6, (f - e) / 1e6, (e - a) / 1e6};
            for (int i = 0; i < t.length; i++) {
                best[i] = Math.min(best[i], t[i]);
            }
            System.out.printf(Locale.ROOT, "run %d: parse rules %5.0f ms | read %5.0f ms | match %5.0f ms (%5.0f ms CPU)"
                    + " | build %5.0f ms | parse+read+match+build %5.0f ms wall, %5.0f ms CPU | write Turtle %5.0f ms "
                    + "(%d triples, %d mapped)%n",
                    run, t[0], t[1], t[2], (cpuMatch1 - cpuMatch0) / 1e6, t[3], t[5], (cpu1 - cpu0) / 1e6, t[4],
                    model.model().size(),
                    result.countByStatus().get(org.tufa.mapper.match.Status.MAPPED));
        }
        System.out.printf(Locale.ROOT, "best: parse rules %.0f ms, read %.0f ms, match %.0f ms, build %.0f ms, "
                + "total without write %.0f ms, write %.0f ms%n", best[0], best[1], best[2], best[3], best[5], best[4]);
        for (Path p : List.of(csv, ruleFile, dir.resolve("model.ttl"))) {
            Files.deleteIfExists(p);
        }
        Files.deleteIfExists(dir);
    }

    private static double ms(long since) {
        return (System.nanoTime() - since) / 1e6;
    }

    static void writeRules(Path file, int rules) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("building Benchmark Campus\n");
            for (String a : List.of("ZN = Zone Air", "DA = Discharge Air", "TEMP = Temperature", "CHW = Chilled Water",
                    "HW = Hot Water", "VLV = Valve Position", "CMD = Command", "SPD = Speed", "STAT = Status",
                    "SS = Start Stop", "OCC = Occupied", "CLG = Cool", "HTG = Heat", "STPT = Temperature Setpoint")) {
                w.write("abbr " + a + "\n");
            }
            w.write("type-tags BV = Status\nunit-for Temperature DEG_F\n");
            w.write("part CHWV Chilled_Water_Valve when Chilled Valve\npart HWV Hot_Water_Valve when Hot Valve\n"
                    + "part FAN Fan when Fan\n");
            for (int k = 0; k < rules; k++) {
                String site = String.format(Locale.ROOT, "S%03d", k);
                w.write("rule " + site + "\n");
                w.write("  match name ^" + site + "\\.B(?<b>\\d)\\.F(?<floor>\\d\\d)\\.FCU(?<unit>\\d\\d)\\."
                        + "(?<what>[A-Z-]+)$\n");
                w.write("  class tags {what}\n");
                w.write("  equipment " + site + "-FCU-{b}-{floor}-{unit} Fan_Coil_Unit\n");
                w.write("  location Floor " + site + "-B{b}-F{floor}\n");
                w.write("  fed-by Chilled_Water_Loop " + site + "-CHW\n");
            }
        }
    }

    static void writePoints(Path file, int points, int rules, long seed) throws IOException {
        Random rnd = new Random(seed);
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("Point Name,Description,Units,Object Type,Device,Trend ID\n");
            // a realistic fleet: about ten points per unit, units spread over the rules' sites
            int fleet = Math.max(1, points / 10);
            int[] unitOf = new int[fleet];
            for (int u = 0; u < fleet; u++) {
                unitOf[u] = rnd.nextInt(Integer.MAX_VALUE);
            }
            for (int i = 0; i < points; i++) {
                int s = i % SUFFIXES.length;
                int u = unitOf[(i / SUFFIXES.length) % fleet];
                String name;
                if (rnd.nextInt(50) == 0) {
                    name = "LEGACY_" + rnd.nextInt(1000) + "_" + SUFFIXES[s];
                } else {
                    name = String.format(Locale.ROOT, "S%03d.B%d.F%02d.FCU%02d.%s", u % rules, (u / rules) % 4,
                            (u / rules / 4) % 30, (u / rules / 120) % 40, SUFFIXES[s]);
                }
                String units = TYPES[s].startsWith("A") ? (SUFFIXES[s].contains("VLV") ? "%" : "°F") : "";
                w.write(name + ",," + units + "," + TYPES[s] + ",DEV" + (i / 50) + ",T" + i + "\n");
            }
        }
    }
}
