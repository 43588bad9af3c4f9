package org.tufa.analysis.features;

import java.time.Duration;
import java.time.Instant;
import java.util.Arrays;
import java.util.Collections;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.tufa.analysis.modes.FanSignal;

/**
 * One terminal unit's signals on a regular time grid, keyed by role name (the {@code tufa:roleName} of tufa.ttl),
 * in canonical units: temperatures in degrees C, commands and positions in percent (0..100), the fan as a running
 * fraction (0..1), airflows in m3/s, pressures in Pa, occupancy as an occupied fraction (0..1). A role the unit
 * does not have reads as an array of NaN; a NaN inside an array is a sample without data. Beside the series: how
 * the fan signal is to be read and the unit's nominal airflow (m3/s), the two facts of the model the analysis
 * needs besides the points' data.
 *
 * <p>The arrays are shared, not copied: callers must not modify what an accessor returns.
 */
public final class UnitSignals {

    public static final String ZONE_AIR_TEMPERATURE = "zone_air_temperature";
    public static final String DISCHARGE_AIR_TEMPERATURE = "discharge_air_temperature";
    public static final String COOLING_VALVE_COMMAND = "cooling_valve_command";
    public static final String HEATING_VALVE_COMMAND = "heating_valve_command";
    /** The fan status or speed, held as a running fraction 0..1. */
    public static final String FAN_STATUS = "fan_status";
    /** The speed of a multi-speed fan (stage number or percent), as the point reports it: only its stages are read. */
    public static final String FAN_SPEED = "fan_speed";
    public static final String ZONE_TEMPERATURE_SETPOINT = "zone_temperature_setpoint";
    public static final String ZONE_COOLING_TEMPERATURE_SETPOINT = "zone_cooling_temperature_setpoint";
    public static final String ZONE_HEATING_TEMPERATURE_SETPOINT = "zone_heating_temperature_setpoint";
    public static final String CHILLED_WATER_SUPPLY_TEMPERATURE = "chilled_water_supply_temperature";
    public static final String HOT_WATER_SUPPLY_TEMPERATURE = "hot_water_supply_temperature";
    public static final String OUTDOOR_AIR_TEMPERATURE = "outdoor_air_temperature";
    public static final String OCCUPANCY = "occupancy";
    public static final String AIRFLOW = "airflow";
    public static final String AIRFLOW_SETPOINT = "airflow_setpoint";
    public static final String DAMPER_POSITION = "damper_position";
    public static final String DAMPER_COMMAND = "damper_command";
    public static final String REHEAT_VALVE_COMMAND = "reheat_valve_command";
    public static final String ELECTRIC_REHEAT_COMMAND = "electric_reheat_command";
    public static final String AHU_SUPPLY_AIR_TEMPERATURE = "ahu_supply_air_temperature";
    public static final String AHU_SUPPLY_STATIC_PRESSURE = "ahu_supply_static_pressure";

    private final Instant gridStart;
    private final Duration interval;
    private final int size;
    private final Map<String, double[]> series;
    private final FanSignal fanSignal;
    private final double nominalAirflow;
    private final double[] absent;

    private UnitSignals(Instant gridStart, Duration interval, int size, Map<String, double[]> series,
                        FanSignal fanSignal, double nominalAirflow) {
        this.gridStart = gridStart;
        this.interval = interval;
        this.size = size;
        this.series = Collections.unmodifiableMap(new TreeMap<>(series));
        this.fanSignal = fanSignal;
        this.nominalAirflow = nominalAirflow;
        this.absent = absent(size);
    }

    /** Signals of {@code size} samples from {@code gridStart}, every {@code interval}; add series with the builder. */
    public static Builder builder(Instant gridStart, Duration interval, int size) {
        return new Builder(gridStart, interval, size);
    }

    /** Collects the series of one unit. */
    public static final class Builder {
        private final Instant gridStart;
        private final Duration interval;
        private final int size;
        private final Map<String, double[]> series = new TreeMap<>();
        private FanSignal fanSignal = FanSignal.NONE;
        private double nominalAirflow = Double.NaN;

        private Builder(Instant gridStart, Duration interval, int size) {
            this.gridStart = gridStart;
            this.interval = interval;
            this.size = size;
        }

        /** The series of a role; an array of NaN, or null, leaves the role out. */
        public Builder with(String role, double[] values) {
            if (values == null) {
                return this;
            }
            if (values.length != size) {
                throw new IllegalArgumentException("all signals must have the same length: " + size + " vs "
                        + values.length + " (" + role + ")");
            }
            if (present(values)) {
                series.put(role, values);
            } else {
                series.remove(role);
            }
            return this;
        }

        public Builder fanSignal(FanSignal signal) {
            this.fanSignal = signal;
            return this;
        }

        /** The unit's nominal (design) airflow, m3/s. */
        public Builder nominalAirflow(double cubicMetresPerSecond) {
            this.nominalAirflow = cubicMetresPerSecond;
            return this;
        }

        public UnitSignals build() {
            return new UnitSignals(gridStart, interval, size, series, fanSignal, nominalAirflow);
        }
    }

    /** Start of sample 0. */
    public Instant gridStart() {
        return gridStart;
    }

    /** Grid step. */
    public Duration interval() {
        return interval;
    }

    /** Number of samples on the grid. */
    public int size() {
        return size;
    }

    /** Start time of sample {@code i}. */
    public Instant time(int i) {
        return gridStart.plus(interval.multipliedBy(i));
    }

    /** How the fan series reads (status, speed, none). */
    public FanSignal fanSignal() {
        return fanSignal;
    }

    /** The unit's nominal airflow, m3/s (NaN when unknown). */
    public double nominalAirflow() {
        return nominalAirflow;
    }

    /** The series of a role, or an array of NaN when the unit has no data for it. */
    public double[] series(String role) {
        double[] v = series.get(role);
        return v == null ? absent : v;
    }

    /** Whether the unit has data for a role. */
    public boolean has(String role) {
        return series.containsKey(role);
    }

    /** The roles with data, sorted. */
    public Set<String> roles() {
        return series.keySet();
    }

    public double[] zoneAirTemperature() {
        return series(ZONE_AIR_TEMPERATURE);
    }

    public double[] dischargeAirTemperature() {
        return series(DISCHARGE_AIR_TEMPERATURE);
    }

    public double[] coolingValveCommand() {
        return series(COOLING_VALVE_COMMAND);
    }

    public double[] heatingValveCommand() {
        return series(HEATING_VALVE_COMMAND);
    }

    /** Fan running fraction 0..1. */
    public double[] fanFraction() {
        return series(FAN_STATUS);
    }

    /**
     * The fan's speed where the unit reports one: its fan speed point, else the fan signal itself when that is a
     * speed; null when the unit has neither.
     */
    public double[] fanSpeed() {
        if (present(series(FAN_SPEED))) {
            return series(FAN_SPEED);
        }
        return fanSignal == FanSignal.SPEED && present(fanFraction()) ? fanFraction() : null;
    }

    public double[] zoneSetpoint() {
        return series(ZONE_TEMPERATURE_SETPOINT);
    }

    public double[] zoneCoolingSetpoint() {
        return series(ZONE_COOLING_TEMPERATURE_SETPOINT);
    }

    public double[] zoneHeatingSetpoint() {
        return series(ZONE_HEATING_TEMPERATURE_SETPOINT);
    }

    public double[] chilledWaterSupplyTemperature() {
        return series(CHILLED_WATER_SUPPLY_TEMPERATURE);
    }

    public double[] hotWaterSupplyTemperature() {
        return series(HOT_WATER_SUPPLY_TEMPERATURE);
    }

    public double[] outdoorAirTemperature() {
        return series(OUTDOOR_AIR_TEMPERATURE);
    }

    /** Occupied fraction 0..1. */
    public double[] occupancy() {
        return series(OCCUPANCY);
    }

    /** Measured airflow, m3/s. */
    public double[] airflow() {
        return series(AIRFLOW);
    }

    /** Active airflow setpoint, m3/s. */
    public double[] airflowSetpoint() {
        return series(AIRFLOW_SETPOINT);
    }

    public double[] damperPosition() {
        return series(DAMPER_POSITION);
    }

    public double[] damperCommand() {
        return series(DAMPER_COMMAND);
    }

    public double[] reheatValveCommand() {
        return series(REHEAT_VALVE_COMMAND);
    }

    public double[] electricReheatCommand() {
        return series(ELECTRIC_REHEAT_COMMAND);
    }

    public double[] ahuSupplyAirTemperature() {
        return series(AHU_SUPPLY_AIR_TEMPERATURE);
    }

    /** The air handler's supply duct static pressure, Pa. */
    public double[] ahuSupplyStaticPressure() {
        return series(AHU_SUPPLY_STATIC_PRESSURE);
    }

    /** True when the array holds at least one sample (a role the unit has). */
    public static boolean present(double[] signal) {
        for (double v : signal) {
            if (!Double.isNaN(v)) {
                return true;
            }
        }
        return false;
    }

    /** An all-NaN signal of length n, for a role the unit does not have. */
    public static double[] absent(int n) {
        double[] a = new double[n];
        Arrays.fill(a, Double.NaN);
        return a;
    }
}
