package org.tufa.analysis.simulate;

import java.time.Instant;
import java.util.List;

/**
 * The simulated trends: sample times (every 15 minutes over the season), the building-level series in SI (indexed
 * like the timestamps; must not be modified) and one {@link UnitTrace} per unit in plan order.
 */
public record SimulationResult(
        SimulationPlan plan,
        List<Instant> timestamps,
        float[] outdoorC,
        float[] chilledWaterSupplyC,
        float[] hotWaterSupplyC,
        List<UnitTrace> units) {

    /** The logged series of a building role (see {@link SimulationRoles#BUILDING_ROLES}). */
    public float[] buildingSeries(String role) {
        return switch (role) {
            case SimulationRoles.OUTDOOR_AIR_TEMPERATURE -> outdoorC;
            case SimulationRoles.CHILLED_WATER_SUPPLY_TEMPERATURE -> chilledWaterSupplyC;
            case SimulationRoles.HOT_WATER_SUPPLY_TEMPERATURE -> hotWaterSupplyC;
            default -> throw new IllegalArgumentException("not a building role: " + role);
        };
    }
}
