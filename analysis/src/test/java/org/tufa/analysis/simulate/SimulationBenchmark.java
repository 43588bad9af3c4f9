package org.tufa.analysis.simulate;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Benchmark (not a unit test): simulates a fleet for a season and writes both layouts, printing timings and a
 * per-unit summary. Run from the repository root after {@code mvn -q -B -o -pl analysis -am test-compile}:
 * <pre>
 * java -cp analysis/target/classes:analysis/target/test-classes:mapper/target/classes \
 *     org.tufa.analysis.simulate.SimulationBenchmark 150 summer /tmp/tufa-sim-bench
 * </pre>
 * Arguments: unit count, {@code summer} or {@code year}, output directory, and any fourth argument to print a
 * per-unit summary. {@code -Dtufa.bench.wideOnly=true} skips the (large) long layout.
 */
public final class SimulationBenchmark {
    private SimulationBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 150;
        Season season = args.length > 1 && args[1].equals("year") ? Season.fullYear(2031) : Season.summer(2031);
        Path dir = Path.of(args.length > 2 ? args[2] : "bench-out");
        Files.createDirectories(dir);
        List<UnitSeriesTargets> units = fleet(n, "");
        Map<String, SeriesTarget> building = buildingTargets("");

        long t0 = System.nanoTime();
        SimulationPlan plan = DemoSimulation.plan(units, building, season, DemoSimulation.DEMO_SEED);
        SimulationResult result = Simulator.run(plan);
        long t1 = System.nanoTime();
        DemoTrends.write(dir.resolve("wide"), result, DemoTrends.Layout.WIDE);
        long t2 = System.nanoTime();
        boolean withLong = !Boolean.getBoolean("tufa.bench.wideOnly");
        if (withLong) {
            DemoTrends.write(dir.resolve("long"), result, DemoTrends.Layout.LONG);
        }
        long t3 = System.nanoTime();
        System.out.printf(java.util.Locale.ROOT,
                "%d units, %s, %d samples: simulate %.2f s, write wide %.2f s (%d MB), write long %.2f s (%d MB)%n",
                n, season.firstDay() + ".." + season.lastDay(), season.sampleCount(), (t1 - t0) / 1e9,
                (t2 - t1) / 1e9, Files.size(dir.resolve("wide").resolve(DemoTrends.TRENDS_FILE)) >> 20,
                (t3 - t2) / 1e9, withLong ? Files.size(dir.resolve("long").resolve(DemoTrends.TRENDS_FILE)) >> 20 : 0);
        if (args.length > 3) {
            for (UnitTrace u : result.units()) {
                System.out.println(TraceSummary.of(u, result).line());
            }
        }
    }

    /** A fleet of n units named like a fictional building's point list, all in SI. */
    static List<UnitSeriesTargets> fleet(int n, String unitIri) {
        List<UnitSeriesTargets> units = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            String name = String.format(java.util.Locale.ROOT, "FCU-%02d-%02d", 1 + i / 20, 1 + i % 20);
            Map<String, SeriesTarget> t = new java.util.TreeMap<>();
            for (String role : SimulationRoles.UNIT_ROLES) {
                t.put(role, new SeriesTarget("ELM." + name + "." + role, unitFor(role)));
            }
            units.add(new UnitSeriesTargets("https://example.org/elm#" + name, name, t));
        }
        return units;
    }

    static Map<String, SeriesTarget> buildingTargets(String prefix) {
        Map<String, SeriesTarget> b = new java.util.TreeMap<>();
        for (String role : SimulationRoles.BUILDING_ROLES) {
            b.put(role, new SeriesTarget("ELM.PLANT." + role, unitFor(role)));
        }
        return b;
    }

    static String unitFor(String role) {
        return switch (SimulationRoles.quantityOf(role)) {
            case TEMPERATURE -> "http://qudt.org/vocab/unit/DEG_C";
            case COMMAND -> "http://qudt.org/vocab/unit/PERCENT";
            case BINARY -> "";
            case AIRFLOW -> "http://qudt.org/vocab/unit/L-PER-SEC";
            case PRESSURE -> "http://qudt.org/vocab/unit/PA";
        };
    }
}
