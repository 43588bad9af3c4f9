package org.tufa.analysis.fleet;

import java.time.Duration;
import java.time.Instant;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.modes.FanSignal;

/** Fan coil signals for tests, in the order the fan coil roles are read ({@code FanCoilKind.ROLES}). */
public final class FanCoilSignals {

    private FanCoilSignals() {
    }

    /** A fan coil unit with a fan status and the given nominal airflow, m3/s. */
    public static UnitSignals of(Instant start, Duration step, double airflow, double[] zone, double[] discharge,
                                 double[] cooling, double[] heating, double[] fan, double[] setpoint,
                                 double[] chilledWater, double[] hotWater, double[] outdoor) {
        return of(start, step, airflow, zone, discharge, cooling, heating, fan, setpoint, chilledWater, hotWater,
                outdoor, null);
    }

    /** The same with a multi-speed fan's speed beside its status (null: none). */
    public static UnitSignals of(Instant start, Duration step, double airflow, double[] zone, double[] discharge,
                                 double[] cooling, double[] heating, double[] fan, double[] setpoint,
                                 double[] chilledWater, double[] hotWater, double[] outdoor, double[] fanSpeed) {
        UnitSignals.Builder b = UnitSignals.builder(start, step, zone.length).fanSignal(FanSignal.STATUS)
                .nominalAirflow(airflow)
                .with(UnitSignals.ZONE_AIR_TEMPERATURE, zone)
                .with(UnitSignals.DISCHARGE_AIR_TEMPERATURE, discharge)
                .with(UnitSignals.COOLING_VALVE_COMMAND, cooling)
                .with(UnitSignals.HEATING_VALVE_COMMAND, heating)
                .with(UnitSignals.FAN_STATUS, fan)
                .with(UnitSignals.ZONE_TEMPERATURE_SETPOINT, setpoint)
                .with(UnitSignals.CHILLED_WATER_SUPPLY_TEMPERATURE, chilledWater)
                .with(UnitSignals.HOT_WATER_SUPPLY_TEMPERATURE, hotWater)
                .with(UnitSignals.OUTDOOR_AIR_TEMPERATURE, outdoor);
        if (fanSpeed != null) {
            b.with(UnitSignals.FAN_SPEED, fanSpeed);
        }
        return b.build();
    }
}
