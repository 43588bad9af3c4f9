package org.tufa.analysis.simulate;

/**
 * The faults the simulator can inject, with what {@code severity} (always in [0, 1]) means for each. The ids are
 * the names written to {@code truth.csv}. The fault set follows the fan-coil fault inventories of Granderson et al.,
 * Sci Data 7:65 (2020) and Sci Data 10:342 (2023); the modelling of each is ours and described per constant.
 */
public enum FaultType {
    /**
     * Low chilled-water flow or a water-side fouled cooling coil: the water flow through the coil at any valve
     * opening is multiplied by {@code 1 - 0.75 * severity} (severity 1 leaves a quarter of the flow). Less cooling
     * at the same command; the loop opens the valve further and saturates more often.
     */
    LOW_CHW_FLOW("low_chw_flow", 0.5, 1.0),
    /**
     * The discharge-air sensor reads {@code 1 + 3 * severity} kelvin off (sign drawn per episode, either way). The
     * control does not use this sensor, so nothing else changes.
     */
    DISCHARGE_SENSOR_BIAS("discharge_sensor_bias", 0.4, 1.0),
    /**
     * The cooling valve is stuck at an opening of {@code severity} (0 = stuck closed, 1 = stuck fully open)
     * whatever the command; the logged command keeps following the loop.
     */
    STUCK_COOLING_VALVE("stuck_cooling_valve", 0.1, 0.9),
    /**
     * The fan stops while the controller still commands it, so the reported status stays 1: airflow drops to
     * {@code 0.3 * (1 - severity)} of nominal (severity 1 = no airflow at all). The zone drifts; the discharge
     * sensor, without airflow, reads close to the zone with some pull towards the coil.
     */
    FAN_FAILURE("fan_failure", 0.8, 1.0),
    /**
     * The heating valve passes hot water when commanded closed: a leak of {@code 0.03 + 0.17 * severity} of the
     * design hot-water flow (3 % to 20 %), added to whatever the valve passes. Discharge warmer; cooling works
     * against it (simultaneous heating and cooling in effect).
     */
    LEAKING_HEATING_VALVE("leaking_heating_valve", 0.4, 1.0),
    /**
     * Hunting: both loops' proportional gains are multiplied by {@code 20 + 30 * severity} and their integral times
     * by 0.15 (a mis-set or auto-tuned-gone-wrong loop), so with the zone sensor's lag and the actuator's stroke
     * time the commands swing between the limits within minutes; 15-minute samples show large jumps.
     */
    OSCILLATING_CONTROL("oscillating_control", 0.4, 1.0);

    private final String id;
    private final double demoSeverityMin;
    private final double demoSeverityMax;

    FaultType(String id, double demoSeverityMin, double demoSeverityMax) {
        this.id = id;
        this.demoSeverityMin = demoSeverityMin;
        this.demoSeverityMax = demoSeverityMax;
    }

    /** The name written to {@code truth.csv}. */
    public String id() {
        return id;
    }

    /** Lowest severity the demo planner draws for this fault. */
    public double demoSeverityMin() {
        return demoSeverityMin;
    }

    /** Highest severity the demo planner draws for this fault. */
    public double demoSeverityMax() {
        return demoSeverityMax;
    }

    /** The fault with this {@link #id()}. */
    public static FaultType ofId(String id) {
        for (FaultType t : values()) {
            if (t.id.equals(id)) {
                return t;
            }
        }
        throw new IllegalArgumentException("unknown fault type '" + id + "'");
    }
}
