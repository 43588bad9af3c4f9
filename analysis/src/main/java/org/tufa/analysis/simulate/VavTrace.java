package org.tufa.analysis.simulate;

import java.util.Optional;

/**
 * The 15-minute samples of one simulated VAV box, in SI (degrees C, L/s, percent 0..100, 0/1), as a trend log
 * would hold them (sensor noise, spikes and any sensor fault applied). Arrays are indexed like
 * {@link SimulationResult#timestamps()} and must not be modified.
 *
 * <p>The last three arrays are the simulator's internal truth for tests, never written: the true airflow, the
 * discharge temperature without noise, and the reheat coil's heat flow (W, positive when heating).
 */
public record VavTrace(
        String unitIri,
        VavParameters parameters,
        Optional<FaultEpisode> fault,
        float[] zoneC,
        float[] dischargeC,
        float[] coolingSetpointC,
        float[] heatingSetpointC,
        float[] airflowLps,
        float[] airflowSetpointLps,
        float[] damperCommandPct,
        float[] damperPositionPct,
        float[] reheatCommandPct,
        float[] occupancy,
        float[] airflowTrueLps,
        float[] dischargeTrueC,
        float[] reheatW) {

    /** The logged series of a role (see {@link SimulationRoles#VAV_ROLES}). */
    public float[] series(String role) {
        return switch (role) {
            case SimulationRoles.ZONE_AIR_TEMPERATURE -> zoneC;
            case SimulationRoles.DISCHARGE_AIR_TEMPERATURE -> dischargeC;
            case SimulationRoles.ZONE_COOLING_TEMPERATURE_SETPOINT -> coolingSetpointC;
            case SimulationRoles.ZONE_HEATING_TEMPERATURE_SETPOINT -> heatingSetpointC;
            case SimulationRoles.AIRFLOW -> airflowLps;
            case SimulationRoles.AIRFLOW_SETPOINT -> airflowSetpointLps;
            case SimulationRoles.DAMPER_COMMAND -> damperCommandPct;
            case SimulationRoles.DAMPER_POSITION -> damperPositionPct;
            case SimulationRoles.REHEAT_VALVE_COMMAND -> reheatCommandPct;
            case SimulationRoles.OCCUPANCY -> occupancy;
            default -> throw new IllegalArgumentException("not a VAV box role: " + role);
        };
    }
}
