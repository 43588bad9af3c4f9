package org.tufa.analysis.report;

import java.time.Duration;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.MatchStatus;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.Profile;
import org.tufa.analysis.coverage.Role;
import org.tufa.analysis.coverage.RoleMatch;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.decision.FleetDecision;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.fleet.FleetAnalysis;
import org.tufa.analysis.fleet.ModeResult;
import org.tufa.analysis.fleet.StageTimes;
import org.tufa.analysis.fleet.UnitAnalysis;
import org.tufa.analysis.fleet.UnitOutcome;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.simulate.FaultPlanner;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SeriesTarget;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.SimulationResult;
import org.tufa.analysis.simulate.SimulationRoles;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.simulate.UnitSeriesTargets;
import org.tufa.analysis.simulate.UnitTrace;
import org.tufa.analysis.trends.IngestReport;

/**
 * A small invented fleet for report tests: units of the fictional Elm Street office simulated over a few summer
 * weeks (tufa's own simulator, with its planned fault episodes), analysed by {@link UnitAnalysis#run}; one unit
 * with a label full of HTML specials, one unit skipped for a missing role, one with an ambiguous (so unused) setpoint. Every simulated unit gets
 * a fault episode; seed 6 gives cooling and heating fault clusters (override with -Dtufa.test.seed).
 */
final class SyntheticFleet {

    static final String TRICKY_LABEL = "FCU <1> & \"A\" 'b'";
    static final long SEED = Long.getLong("tufa.test.seed", 6L);
    static final ZoneId ZONE = Season.DEMO_ZONE;
    static final List<String> ROLES = List.of("zone_air_temperature", "discharge_air_temperature",
            "zone_temperature_setpoint", "cooling_valve_command", "heating_valve_command", "fan_status");

    /**
     * The fleet: the decided outcomes, the outcomes straight from the analysis (with their detailed results), the
     * signals each was computed from (null when not analysed) and each unit's load.
     */
    record Fleet(FleetAnalysis.Result result, FleetCoverage coverage, List<UnitOutcome> analysed,
                 List<UnitSignals> signals, List<double[]> loads) {
    }

    private SyntheticFleet() {
    }

    static Fleet build(int units, LocalDate first, LocalDate last) {
        return build(units, new Season(first, last, ZONE));
    }

    static Fleet build(int units, Season season) {
        List<UnitSeriesTargets> targets = new ArrayList<>();
        for (int i = 0; i < units; i++) {
            String name = String.format(java.util.Locale.ROOT, "FCU-%02d", i + 1);
            Map<String, SeriesTarget> t = new TreeMap<>();
            for (String role : SimulationRoles.UNIT_ROLES) {
                t.put(role, new SeriesTarget("ELM." + name + "." + role, ""));
            }
            targets.add(new UnitSeriesTargets("https://example.org/elm#" + name, name, t));
        }
        Map<String, SeriesTarget> building = new TreeMap<>();
        for (String role : SimulationRoles.BUILDING_ROLES) {
            building.put(role, new SeriesTarget("ELM.PLANT." + role, ""));
        }
        // Every unit gets a planned fault episode, so the report shows fault clusters next to normal ones.
        SimulationResult sim = Simulator.run(new SimulationPlan(targets, building, season, SEED,
                FaultPlanner.plan(targets.stream().map(UnitSeriesTargets::unitIri).toList(), season, SEED, 1.0)));
        AnalysisSettings settings = AnalysisSettings.defaults();
        List<UnitOutcome> outcomes = new ArrayList<>();
        List<UnitSignals> signals = new ArrayList<>();
        List<UnitCoverage> coverage = new ArrayList<>();
        Duration step = Duration.between(sim.timestamps().get(0), sim.timestamps().get(1));
        int n = sim.units().size();
        UnitSignals[] prepared = new UnitSignals[n];
        UnitAnalysis.Result[] results = new UnitAnalysis.Result[n];
        // Units are independent and the analysis is pure: analyse in parallel, collect by index (same order).
        java.util.stream.IntStream.range(0, n).parallel().forEach(i -> {
            UnitTrace u = sim.units().get(i);
            prepared[i] = new UnitSignals(sim.timestamps().get(0), step, d(u.zoneC()), d(u.dischargeC()),
                    d(u.coolingCommandPct()), d(u.heatingCommandPct()), d(u.fanStatus()),
                    i == 2 ? UnitSignals.absent(u.zoneC().length) : d(u.setpointC()), d(sim.chilledWaterSupplyC()),
                    d(sim.hotWaterSupplyC()), d(sim.outdoorC()));
            results[i] = UnitAnalysis.run(prepared[i], FanSignal.STATUS, 0.19, settings, new StageTimes());
        });
        for (int i = 0; i < n; i++) {
            UnitTrace u = sim.units().get(i);
            String label = i == 0 ? TRICKY_LABEL : targets.get(i).unitName();
            String folder = "FCU-" + (i + 1);
            boolean ambiguous = i == 2;
            coverage.add(coverage(u.unitIri(), label, ambiguous ? "zone_temperature_setpoint" : null, false));
            UnitSignals s = prepared[i];
            UnitAnalysis.Result r = results[i];
            List<String> notes = i == 1 ? List.of("series ELM.FCU-02.fan_status: values 0/1 read as on/off <ok>")
                    : List.of();
            boolean any = r.modeResults().stream().anyMatch(ModeResult::analyzed);
            outcomes.add(new UnitOutcome(u.unitIri(), label, folder, any ? UnitOutcome.ANALYZED : UnitOutcome.SKIPPED,
                    any ? "" : "no mode could be clustered", notes, r));
            signals.add(s);
        }
        String skipped = "https://example.org/elm#FCU-99";
        coverage.add(coverage(skipped, "FCU-99", null, true));
        outcomes.add(new UnitOutcome(skipped, "FCU-99", "FCU-99", UnitOutcome.SKIPPED,
                "missing discharge_air_temperature", List.of(), null));
        signals.add(null);
        // The fleet stage, listing every candidate (confidence 0 and up) so the pages show findings of each kind.
        List<FleetDecision.UnitEvidence> evidence = new ArrayList<>();
        for (UnitOutcome o : outcomes) {
            if (o.result() != null && o.status().equals(UnitOutcome.ANALYZED)) {
                evidence.add(new FleetDecision.UnitEvidence(o.unit(), o.result().evidence()));
            }
        }
        FleetDecision.Decision decision = FleetDecision.fit(evidence, settings.decision(), settings.causes(),
                settings.dayZone(), settings.maxEpisodeWindowDays());
        List<UnitOutcome> decided = new ArrayList<>();
        List<double[]> loads = new ArrayList<>();
        for (UnitOutcome o : outcomes) {
            double[] load = o.result() == null ? null : o.result().loadKw();
            decided.add(o.withoutDetail().decided(decision.findings().getOrDefault(o.unit(), List.of()), 0,
                    List.of(), load));
            loads.add(load);
        }
        FleetCoverage fleet = new FleetCoverage(List.of(PROFILE), true,
                List.of("https://brickschema.org/schema/Brick#FCU"), coverage, Map.of(), false);
        FleetAnalysis.Result result = new FleetAnalysis.Result(decided, decision.fleet(), decision.nulls(),
                decision.tests(), 0, new IngestReport(List.of(), List.of(), List.of(), List.of()), new StageTimes());
        return new Fleet(result, fleet, outcomes, signals, loads);
    }

    /** The fleet's result with an analyst's verdicts applied to its decided findings ({@code ReviewStep}). */
    static FleetAnalysis.Result reviewed(Fleet fleet, List<org.tufa.analysis.review.Verdict> verdicts) {
        Map<String, List<org.tufa.analysis.findings.Finding>> decided = new LinkedHashMap<>();
        for (UnitOutcome u : fleet.result().units()) {
            if (u.status().equals(UnitOutcome.ANALYZED)) {
                decided.put(u.unit(), u.findings());
            }
        }
        org.tufa.analysis.review.ReviewStep.Result review = org.tufa.analysis.review.ReviewStep.apply(decided,
                verdicts);
        List<UnitOutcome> units = new ArrayList<>();
        for (int i = 0; i < fleet.result().units().size(); i++) {
            UnitOutcome u = fleet.result().units().get(i);
            var r = review.unit(u.unit(), u.findings());
            units.add(u.decided(r.findings(), 0, r.notes(), fleet.loads().get(i), r));
        }
        FleetAnalysis.Result before = fleet.result();
        return new FleetAnalysis.Result(units, before.fleetFindings(), before.nulls(), before.tests(), 0,
                before.ingest(), before.times(), review);
    }

    private static final Profile PROFILE = new Profile("fcu-modes", "https://tufa.example.org/ns#FcuModes", "",
            Profile.FAN_COIL, List.of("https://brickschema.org/schema/Brick#FCU"), false, 0, List.of(), List.of(),
            List.of(), ROLES.stream().map(r -> new Role(r, "https://tufa.example.org/ns#" + r, ROLES.indexOf(r),
                    List.of())).toList());

    private static UnitCoverage coverage(String unit, String label, String ambiguousRole, boolean noDischarge) {
        Map<String, RoleMatch> roles = new LinkedHashMap<>();
        for (String role : ROLES) {
            PointRef p = new PointRef(unit + "." + role, label + " " + role, unit + "." + role, null,
                    "https://brickschema.org/schema/Brick#Point");
            if (role.equals(ambiguousRole)) {
                PointRef q = new PointRef(unit + "." + role + "2", label + " " + role + " 2", null, null, null);
                roles.put(role, new RoleMatch(role, MatchStatus.AMBIGUOUS, Optional.empty(), List.of(p, q), null,
                        List.of()));
            } else if (noDischarge && role.equals("discharge_air_temperature")) {
                roles.put(role, new RoleMatch(role, MatchStatus.MISSING, Optional.empty(), List.of(), null,
                        List.of()));
            } else {
                roles.put(role, new RoleMatch(role, MatchStatus.FOUND, Optional.of(p), List.of(p), null, List.of()));
            }
        }
        return new UnitCoverage(unit, label, "https://brickschema.org/schema/Brick#FCU", Optional.of(PROFILE), roles,
                Optional.empty(), Map.of("cooling", !noDischarge), List.of());
    }

    private static double[] d(float[] f) {
        double[] out = new double[f.length];
        for (int i = 0; i < f.length; i++) {
            out[i] = f[i];
        }
        return out;
    }
}
