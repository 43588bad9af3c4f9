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
}
