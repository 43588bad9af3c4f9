package org.tufa.analysis.simulate;

import java.util.List;
import java.util.Map;

/**
 * The entry for "the demo": plans faults on about {@value FaultPlanner#DEMO_FAULTY_SHARE} of the units
 * ({@link FaultPlanner}) and returns the plan, ready for {@link Simulator#run}.
 */
public final class DemoSimulation {
    /** Seed of the shipped demo. */
    public static final long DEMO_SEED = 2031L;

    private DemoSimulation() {
    }

    /**
     * A demo plan.
     *
     * @param units per-unit targets, in writing order
     * @param buildingTargets shared targets by building role (outdoor air, chilled- and hot-water supply)
     * @param season {@link Season#summer(int)} or {@link Season#fullYear(int)}
     * @param seed run seed
     */
    public static SimulationPlan plan(List<UnitSeriesTargets> units, Map<String, SeriesTarget> buildingTargets,
            Season season, long seed) {
        List<FaultEpisode> faults = FaultPlanner.plan(units.stream().map(UnitSeriesTargets::unitIri).toList(),
                season, seed, FaultPlanner.DEMO_FAULTY_SHARE);
        return new SimulationPlan(units, buildingTargets, season, seed, faults);
    }

    /** Share of the VAV boxes given a fault in the demo (two episodes of each VAV fault type on 40 boxes). */
    public static final double DEMO_VAV_FAULTY_SHARE = 0.30;

    /**
     * A demo plan with a VAV wing: the fan coil units planned exactly as {@link #plan(List, Map, Season, long)}
     * does, the boxes from a stream of their own (reheat faults only on boxes with reheat).
     */
    public static SimulationPlan plan(List<UnitSeriesTargets> units, List<VavSeriesTargets> boxes,
            Map<String, SeriesTarget> buildingTargets, Season season, long seed) {
        List<FaultEpisode> faults = new java.util.ArrayList<>(FaultPlanner.plan(
                units.stream().map(UnitSeriesTargets::unitIri).toList(), season, seed, FaultPlanner.DEMO_FAULTY_SHARE));
        if (!boxes.isEmpty()) {
            java.util.Set<String> reheat = new java.util.HashSet<>();
            boxes.stream().filter(VavSeriesTargets::reheat).forEach(b -> reheat.add(b.unitIri()));
            faults.addAll(FaultPlanner.plan(boxes.stream().map(VavSeriesTargets::unitIri).toList(), reheat,
                    FaultType.Kind.VAV, season, seed, DEMO_VAV_FAULTY_SHARE));
        }
        faults.sort(java.util.Comparator.comparing(FaultEpisode::unitIri));
        return new SimulationPlan(units, boxes, buildingTargets, season, seed, faults);
    }
}
