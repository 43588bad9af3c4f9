package org.tufa.analysis.simulate;

import java.util.List;

/**
 * Role names the simulator writes. Lists are in writing order (columns of the wide file, blocks of the long file):
 * the building roles, the fan coil units (each in {@link #UNIT_ROLES} order), the air handler of the VAV wing
 * ({@link #AHU_ROLES}), the VAV boxes (each in {@link #VAV_ROLES} order).
 */
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

    public static final String ZONE_COOLING_TEMPERATURE_SETPOINT = "zone_cooling_temperature_setpoint";
    public static final String ZONE_HEATING_TEMPERATURE_SETPOINT = "zone_heating_temperature_setpoint";
    /** A VAV box's measured airflow, L/s, as its (possibly faulty) sensor reads it. */
    public static final String AIRFLOW = "airflow";
    /** The active airflow setpoint of the box's flow loop, L/s. */
    public static final String AIRFLOW_SETPOINT = "airflow_setpoint";
    /** The flow loop's command to the damper actuator, percent open. */
    public static final String DAMPER_COMMAND = "damper_command";
    /** The damper actuator's position feedback, percent open. */
    public static final String DAMPER_POSITION = "damper_position";
    /** The discharge loop's command to the hot-water reheat valve, percent. */
    public static final String REHEAT_VALVE_COMMAND = "reheat_valve_command";
    /** The air handler's supply air temperature (what reaches the boxes, before duct gains). */
    public static final String AHU_SUPPLY_AIR_TEMPERATURE = "ahu_supply_air_temperature";
    /** The air handler's supply duct static pressure, Pa. */
    public static final String AHU_SUPPLY_STATIC_PRESSURE = "ahu_supply_static_pressure";

    /** Per-unit roles, in writing order. */
    public static final List<String> UNIT_ROLES = List.of(ZONE_AIR_TEMPERATURE, DISCHARGE_AIR_TEMPERATURE,
            ZONE_TEMPERATURE_SETPOINT, COOLING_VALVE_COMMAND, HEATING_VALVE_COMMAND, FAN_STATUS, OCCUPANCY);

    /** Per-box roles of a VAV box, in writing order. */
    public static final List<String> VAV_ROLES = List.of(ZONE_AIR_TEMPERATURE, DISCHARGE_AIR_TEMPERATURE,
            ZONE_COOLING_TEMPERATURE_SETPOINT, ZONE_HEATING_TEMPERATURE_SETPOINT, AIRFLOW, AIRFLOW_SETPOINT,
            DAMPER_COMMAND, DAMPER_POSITION, REHEAT_VALVE_COMMAND, OCCUPANCY);

    /** Building-level (shared) roles, in writing order. */
    public static final List<String> BUILDING_ROLES = List.of(OUTDOOR_AIR_TEMPERATURE,
            CHILLED_WATER_SUPPLY_TEMPERATURE, HOT_WATER_SUPPLY_TEMPERATURE);

    /** Roles of the air handler that feeds the VAV boxes, in writing order. */
    public static final List<String> AHU_ROLES = List.of(AHU_SUPPLY_AIR_TEMPERATURE, AHU_SUPPLY_STATIC_PRESSURE);

    /** What kind of quantity a role carries; decides the unit conversion on writing. */
    public enum Quantity { TEMPERATURE, COMMAND, BINARY, AIRFLOW, PRESSURE }

    /** The quantity kind of a role. */
    public static Quantity quantityOf(String role) {
        return switch (role) {
            case COOLING_VALVE_COMMAND, HEATING_VALVE_COMMAND, DAMPER_COMMAND, DAMPER_POSITION,
                    REHEAT_VALVE_COMMAND -> Quantity.COMMAND;
            case FAN_STATUS, OCCUPANCY -> Quantity.BINARY;
            case DISCHARGE_AIR_TEMPERATURE, ZONE_AIR_TEMPERATURE, ZONE_TEMPERATURE_SETPOINT,
                    CHILLED_WATER_SUPPLY_TEMPERATURE, HOT_WATER_SUPPLY_TEMPERATURE, OUTDOOR_AIR_TEMPERATURE,
                    ZONE_COOLING_TEMPERATURE_SETPOINT, ZONE_HEATING_TEMPERATURE_SETPOINT, AHU_SUPPLY_AIR_TEMPERATURE ->
                    Quantity.TEMPERATURE;
            case AIRFLOW, AIRFLOW_SETPOINT -> Quantity.AIRFLOW;
            case AHU_SUPPLY_STATIC_PRESSURE -> Quantity.PRESSURE;
            default -> throw new IllegalArgumentException("unknown role " + role);
        };
    }

    private SimulationRoles() {
    }
}
