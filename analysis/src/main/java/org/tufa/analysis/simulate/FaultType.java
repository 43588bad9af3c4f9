package org.tufa.analysis.simulate;

import java.util.List;

/**
 * The faults the simulator can inject, with what {@code severity} (always in [0, 1]) means for each. The ids are
 * the names written to {@code truth.csv}. The fan coil set follows the fan-coil fault inventories of Granderson et
 * al., Sci Data 7:65 (2020) and Sci Data 10:342 (2023); the VAV set the terminal-unit faults those inventories and
 * issue 11 list (damper, airflow sensor, reheat valve, supply air, flow setpoint). The modelling of each is ours and
 * described per constant. Each fault belongs to one kind of unit ({@link #kind()}).
 */
public enum FaultType {
    /**
     * Low chilled-water flow or a water-side fouled cooling coil: the water flow through the coil at any valve
     * opening is multiplied by {@code 1 - 0.75 * severity} (severity 1 leaves a quarter of the flow). Less cooling
     * at the same command; the loop opens the valve further and saturates more often.
     */
    LOW_CHW_FLOW(Kind.FAN_COIL, "low_chw_flow", 0.5, 1.0),
    /**
     * The discharge-air sensor reads {@code 1 + 3 * severity} kelvin off (sign drawn per episode, either way). The
     * control does not use this sensor, so nothing else changes.
     */
    DISCHARGE_SENSOR_BIAS(Kind.FAN_COIL, "discharge_sensor_bias", 0.4, 1.0),
    /**
     * The cooling valve is stuck at an opening of {@code severity} (0 = stuck closed, 1 = stuck fully open)
     * whatever the command; the logged command keeps following the loop.
     */
    STUCK_COOLING_VALVE(Kind.FAN_COIL, "stuck_cooling_valve", 0.1, 0.9),
    /**
     * The fan stops while the controller still commands it, so the reported status stays 1: airflow drops to
     * {@code 0.3 * (1 - severity)} of nominal (severity 1 = no airflow at all). The zone drifts; the discharge
     * sensor, without airflow, reads close to the zone with some pull towards the coil.
     */
    FAN_FAILURE(Kind.FAN_COIL, "fan_failure", 0.8, 1.0),
    /**
     * The heating valve passes hot water when commanded closed: a leak of {@code 0.03 + 0.17 * severity} of the
     * design hot-water flow (3 % to 20 %), added to whatever the valve passes. Discharge warmer; cooling works
     * against it (simultaneous heating and cooling in effect).
     */
    LEAKING_HEATING_VALVE(Kind.FAN_COIL, "leaking_heating_valve", 0.4, 1.0),
    /**
     * Hunting: both loops' proportional gains are multiplied by {@code 20 + 30 * severity} and their integral times
     * by 0.15 (a mis-set or auto-tuned-gone-wrong loop), so with the zone sensor's lag and the actuator's stroke
     * time the commands swing between the limits within minutes; 15-minute samples show large jumps.
     */
    OSCILLATING_CONTROL(Kind.FAN_COIL, "oscillating_control", 0.4, 1.0),
    /**
     * VAV: the damper actuator fails and the damper stays at an opening of {@code 0.1 + 0.8 * severity} whatever
     * the flow loop commands (the logged command keeps following the loop; the position feedback shows the stuck
     * damper). Airflow no longer follows its setpoint; the zone drifts.
     */
    STUCK_DAMPER(Kind.VAV, "stuck_damper", 0.0, 1.0),
    /**
     * VAV: the airflow sensor drifts: over the first two days of the episode its reading moves linearly to
     * {@code 1 +/- (0.15 + 0.35 * severity)} times the true flow (sign drawn per episode), then stays. The flow loop
     * controls the reading to its setpoint, so the true airflow is off by the inverse factor.
     */
    AIRFLOW_SENSOR_DRIFT(Kind.VAV, "airflow_sensor_drift", 0.4, 1.0),
    /**
     * VAV with reheat: the reheat valve passes {@code 0.03 + 0.17 * severity} of the design hot-water flow when
     * commanded closed (as {@link #LEAKING_HEATING_VALVE}): the discharge air is warmer than the supply air with the
     * valve shut, and the cooling loop asks for more airflow to make up.
     */
    LEAKING_REHEAT_VALVE(Kind.VAV, "leaking_reheat_valve", 0.4, 1.0),
    /**
     * VAV with reheat: the reheat valve is stuck at an opening of {@code 0.8 * severity} whatever the command
     * (0 = stuck shut: no heat when reheat is called for; open: heating while the box cools).
     */
    STUCK_REHEAT_VALVE(Kind.VAV, "stuck_reheat_valve", 0.4, 1.0),
    /**
     * VAV: the static pressure available at the box inlet falls to {@code 0.6 - 0.5 * severity} of design (a
     * restriction in the branch duct, a closed balancing or fire damper, or the far end of a duct the air handler
     * cannot keep pressurised), so the box's largest airflow falls with its square root: at high load the damper
     * opens fully and the airflow stays short of its setpoint; the zone warms.
     */
    INSUFFICIENT_SUPPLY_AIR(Kind.VAV, "insufficient_supply_air", 0.5, 1.0),
    /**
     * VAV: the box's airflow setpoint is held (an operator override, or a mis-set flow factor) at
     * {@code 1.4 + 0.8 * severity} times its design maximum whenever the box is on, beyond what the inlet delivers
     * with the damper fully open: the damper stays at 100 %, the airflow short of its setpoint, the zone overcooled
     * (and, on a reheat box, the reheat fighting it).
     */
    UNREACHABLE_AIRFLOW_SETPOINT(Kind.VAV, "unreachable_airflow_setpoint", 0.5, 1.0);

    /** The kind of unit a fault belongs to. */
    public enum Kind { FAN_COIL, VAV }

    private final Kind kind;
    private final String id;
    private final double demoSeverityMin;
    private final double demoSeverityMax;

    FaultType(Kind kind, String id, double demoSeverityMin, double demoSeverityMax) {
        this.kind = kind;
        this.id = id;
        this.demoSeverityMin = demoSeverityMin;
        this.demoSeverityMax = demoSeverityMax;
    }

    /** The kind of unit this fault belongs to. */
    public Kind kind() {
        return kind;
    }

    /** True for the reheat faults, which only boxes with a reheat coil can have. */
    public boolean needsReheat() {
        return this == LEAKING_REHEAT_VALVE || this == STUCK_REHEAT_VALVE;
    }

    /** The faults of one kind of unit, in declaration order. */
    public static List<FaultType> ofKind(Kind kind) {
        return java.util.Arrays.stream(values()).filter(t -> t.kind == kind).toList();
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
