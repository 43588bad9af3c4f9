package org.tufa.analysis.simulate;

import java.util.Optional;

/**
 * The 15-minute samples of one simulated unit, in SI (degrees C, percent 0..100, 0/1), as a trend log would hold
 * them: instantaneous values at each sample time, with sensor noise, rare spikes and any sensor fault applied.
 * Arrays are indexed like {@link SimulationResult#timestamps()} and must not be modified.
 *
 * <p>The last four arrays are the simulator's internal truth for tests and diagnostics, never written: the
 * discharge temperature without sensor effects, the actual airflow, the actual cooling valve opening (0..1) and
 * the cooling coil's sensible heat flow (W, positive when cooling).
 */
public record UnitTrace(
        String unitIri,
        UnitParameters parameters,
        Optional<FaultEpisode> fault,
        float[] zoneC,
        float[] dischargeC,
        float[] setpointC,
        float[] coolingCommandPct,
        float[] heatingCommandPct,
        float[] fanStatus,
        float[] occupancy,
        float[] dischargeTrueC,
        float[] airflowLps,
        float[] coolingValveOpening,
        float[] coolingCoilW) {

    /** The logged series of a role (see {@link SimulationRoles#UNIT_ROLES}). */
    public float[] series(String role) {
        return switch (role) {
            case SimulationRoles.ZONE_AIR_TEMPERATURE -> zoneC;
            case SimulationRoles.DISCHARGE_AIR_TEMPERATURE -> dischargeC;
            case SimulationRoles.ZONE_TEMPERATURE_SETPOINT -> setpointC;
            case SimulationRoles.COOLING_VALVE_COMMAND -> coolingCommandPct;
            case SimulationRoles.HEATING_VALVE_COMMAND -> heatingCommandPct;
            case SimulationRoles.FAN_STATUS -> fanStatus;
            case SimulationRoles.OCCUPANCY -> occupancy;
            default -> throw new IllegalArgumentException("not a unit role: " + role);
        };
    }
}
