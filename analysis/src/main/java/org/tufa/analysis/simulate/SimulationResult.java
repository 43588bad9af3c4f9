package org.tufa.analysis.simulate;

import java.time.Instant;
import java.util.List;

/**
 * The simulated trends: sample times (every 15 minutes over the season), the building-level series in SI (indexed
 * like the timestamps; must not be modified), one {@link UnitTrace} per fan coil unit and one {@link VavTrace} per
 * VAV box in plan order, and the boxes' air handler series (empty arrays when the plan has no boxes).
 */
public record SimulationResult(
        SimulationPlan plan,
        List<Instant> timestamps,
        float[] outdoorC,
        float[] chilledWaterSupplyC,
        float[] hotWaterSupplyC,
        List<UnitTrace> units,
        float[] ahuSupplyAirC,
        float[] ahuSupplyStaticPa,
        List<VavTrace> vavUnits) {

    /** A result of fan coil units only. */
    public SimulationResult(SimulationPlan plan, List<Instant> timestamps, float[] outdoorC,
            float[] chilledWaterSupplyC, float[] hotWaterSupplyC, List<UnitTrace> units) {
        this(plan, timestamps, outdoorC, chilledWaterSupplyC, hotWaterSupplyC, units, new float[0], new float[0],
                List.of());
    }

    /** The logged series of a building role (see {@link SimulationRoles#BUILDING_ROLES}). */
    public float[] buildingSeries(String role) {
        return switch (role) {
            case SimulationRoles.OUTDOOR_AIR_TEMPERATURE -> outdoorC;
            case SimulationRoles.CHILLED_WATER_SUPPLY_TEMPERATURE -> chilledWaterSupplyC;
            case SimulationRoles.HOT_WATER_SUPPLY_TEMPERATURE -> hotWaterSupplyC;
            case SimulationRoles.AHU_SUPPLY_AIR_TEMPERATURE -> ahuSupplyAirC;
            case SimulationRoles.AHU_SUPPLY_STATIC_PRESSURE -> ahuSupplyStaticPa;
            default -> throw new IllegalArgumentException("not a building role: " + role);
        };
    }
}
