package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.simulate.DemoTargets;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.FaultEpisode;
import org.tufa.analysis.simulate.FaultType;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.trends.TimeOptions;

/**
 * End to end on a small invented fleet: Brick model -> coverage -> simulated summer with one known fault ->
 * fleet analysis. Checks that the fault is found where it was put and hardly anywhere else, that every unit is
 * accounted for, and that outputs are the same bytes with one or two threads.
 */
class FleetAnalysisTest {

    static final ZoneId ZONE = Season.DEMO_ZONE;
    static final int UNITS = 4;
    static Path trendsDir;
    static FleetCoverage coverage;
    static FaultEpisode fault;

    @BeforeAll
    static void simulate(@TempDir Path dir) throws Exception {
        Model model = SmallFleet.model(UNITS, true);
        Vocabulary v = Vocabulary.standard();
        coverage = Coverage.assess(model, v, v.profiles().profile("fcu-modes"), Set.of(Coverage.TERMINAL_UNIT));
        DemoTargets targets = DemoTargets.from(coverage);
        Season season = new Season(java.time.LocalDate.of(2031, 6, 1), java.time.LocalDate.of(2031, 7, 15), ZONE);
        Instant start = java.time.LocalDate.of(2031, 6, 20).atStartOfDay(ZONE).toInstant();
        fault = new FaultEpisode(SmallFleet.unitIris(UNITS).get(1), FaultType.DISCHARGE_SENSOR_BIAS, start,
                start.plus(Duration.ofDays(10)), 0.8);
        SimulationPlan plan = new SimulationPlan(targets.units(), targets.building(), season, 7L, List.of(fault));
        trendsDir = dir;
        DemoTrends.write(dir, Simulator.run(plan), DemoTrends.Layout.WIDE);
    }

    private static FleetAnalysis.Result run(Path out, int threads) {
        TimeOptions time = TimeOptions.defaults(ZONE);
        return FleetAnalysis.run(coverage, List.of(trendsDir.resolve(DemoTrends.TRENDS_FILE)), time,
                AnalysisSettings.defaults(), threads, List.of(new UnitFiles(out, ZONE)), (d, t) -> { });
    }

    @Test
    void findsTheBiasedSensorAndLittleElse(@TempDir Path out) {
        FleetAnalysis.Result r = run(out, 2);
        assertEquals(UNITS, r.units().size(), "every unit accounted for");
        for (UnitOutcome u : r.units()) {
            assertEquals(UnitOutcome.ANALYZED, u.status(), u.unit() + ": " + u.reason());
        }
        UnitOutcome faulty = r.units().stream().filter(u -> u.unit().equals(fault.unitIri())).findFirst().orElseThrow();
        double inside = flaggedHours(faulty, fault.start(), fault.end());
        double episode = Duration.between(fault.start(), fault.end()).toHours();
        // The unit runs (fan on) about half of the hours; a found fault flags a good part of those.
        assertTrue(inside >= 0.25 * episode, "flagged " + inside + " h of a " + episode + " h episode");
        for (UnitOutcome u : r.units()) {
            if (u != faulty) {
                assertTrue(u.faultHours() <= 0.05 * 45 * 24, u.unit() + " flagged " + u.faultHours() + " h: "
                        + u.findings().stream().map(f -> f.kind() + " " + f.start() + " " + f.end() + " " + f.evidence()).toList());
            }
        }
    }

    @Test
    void sameBytesWithOneOrTwoThreads(@TempDir Path a, @TempDir Path b) throws Exception {
        FleetAnalysis.Result one = run(a, 1);
        FleetAnalysis.Result two = run(b, 2);
        FleetOutputs.write(a, one, ZONE, Map.of("k", "v"), List.of());
        FleetOutputs.write(b, two, ZONE, Map.of("k", "v"), List.of());
        Map<String, byte[]> fa = files(a);
        Map<String, byte[]> fb = files(b);
        assertEquals(fa.keySet(), fb.keySet());
        assertTrue(fa.keySet().stream().anyMatch(k -> k.endsWith("reachability.csv")));
        for (String k : fa.keySet()) {
            assertArrayEquals(fa.get(k), fb.get(k), k);
        }
    }

    private static double flaggedHours(UnitOutcome u, Instant from, Instant to) {
        double h = 0;
        List<Finding> fs = new ArrayList<>(u.findings());
        for (Finding f : fs) {
            Instant s = f.start().isAfter(from) ? f.start() : from;
            Instant e = f.end().isBefore(to) ? f.end() : to;
            if (e.isAfter(s)) {
                h += Duration.between(s, e).toMinutes() / 60.0;
            }
        }
        return h;
    }

    private static Map<String, byte[]> files(Path root) throws Exception {
        Map<String, byte[]> out = new TreeMap<>();
        try (Stream<Path> s = Files.walk(root)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                out.put(root.relativize(p).toString(), Files.readAllBytes(p));
            }
        }
        return out;
    }
}
