package org.tufa.analysis.simulate;

import java.util.List;

/** Role names the simulator writes. Lists are in writing order (columns of the wide file, blocks of the long file). */
public final class SimulationRoles {
    public static final String DISCHARGE_AIR_TEMPERATURE = "discharge_air_temperature";
    public static final String ZONE_AIR_TEMPERATURE = "zone_air_temperature";
    /** The effective setpoint: the cooling setpoint, or the heating setpoint while the heating loop was last active. */
    public static final String ZONE_TEMPERATURE_SETPOINT = "zone_temperature_setpoint";
    public static final String COOLING_VALVE_COMMAND = "cooling_valve_command";
    public static final String HEATING_VALVE_COMMAND = "heating_valve_command";
    /** Fan status as the controller reports it (an echo of the command: it stays 1 when the fan has failed). */
    public static final String FAN_STATUS = "fan_status";
    /** Occupancy mode from the schedule: 1 occupied, 0 unoccupied. */
    public static final String OCCUPANCY = "occupancy";

    public static final String CHILLED_WATER_SUPPLY_TEMPERATURE = "chilled_water_supply_temperature";
    public static final String HOT_WATER_SUPPLY_TEMPERATURE = "hot_water_supply_temperature";
    public static final String OUTDOOR_AIR_TEMPERATURE = "outdoor_air_temperature";

    /** Per-unit roles, in writing order. */
    public static final List<String> UNIT_ROLES = List.of(ZONE_AIR_TEMPERATURE, DISCHARGE_AIR_TEMPERATURE,
            ZONE_TEMPERATURE_SETPOINT, COOLING_VALVE_COMMAND, HEATING_VALVE_COMMAND, FAN_STATUS, OCCUPANCY);

    /** Building-level (shared) roles, in writing order. */
    public static final List<String> BUILDING_ROLES = List.of(OUTDOOR_AIR_TEMPERATURE,
            CHILLED_WATER_SUPPLY_TEMPERATURE, HOT_WATER_SUPPLY_TEMPERATURE);

    /** What kind of quantity a role carries; decides the unit conversion on writing. */
    public enum Quantity { TEMPERATURE, COMMAND, BINARY }

    /** The quantity kind of a role. */
    public static Quantity quantityOf(String role) {
        return switch (role) {
            case COOLING_VALVE_COMMAND, HEATING_VALVE_COMMAND -> Quantity.COMMAND;
            case FAN_STATUS, OCCUPANCY -> Quantity.BINARY;
            case DISCHARGE_AIR_TEMPERATURE, ZONE_AIR_TEMPERATURE, ZONE_TEMPERATURE_SETPOINT,
                    CHILLED_WATER_SUPPLY_TEMPERATURE, HOT_WATER_SUPPLY_TEMPERATURE, OUTDOOR_AIR_TEMPERATURE ->
                    Quantity.TEMPERATURE;
            default -> throw new IllegalArgumentException("unknown role " + role);
        };
    }

    private SimulationRoles() {
    }
}
