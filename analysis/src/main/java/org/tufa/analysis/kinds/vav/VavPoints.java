package org.tufa.analysis.kinds.vav;

import org.tufa.analysis.features.UnitSignals;

/**
 * The series a VAV box's detection reads where a box may expose one of two points: the damper's position feedback
 * or else its command; the hot-water reheat valve's command or else the electric heater's; the cooling and heating
 * setpoints, or else the single zone setpoint for both.
 */
final class VavPoints {

    private VavPoints() {
    }

    /** The damper in percent open: its measured position when the box has one, else its command. */
    static double[] damper(UnitSignals s) {
        return s.has(UnitSignals.DAMPER_POSITION) ? s.damperPosition() : s.damperCommand();
    }

    static boolean hasDamper(UnitSignals s) {
        return s.has(UnitSignals.DAMPER_POSITION) || s.has(UnitSignals.DAMPER_COMMAND);
    }

    /** The reheat in percent: the hot-water valve's command, else the electric heater's. */
    static double[] reheat(UnitSignals s) {
        return s.has(UnitSignals.REHEAT_VALVE_COMMAND) ? s.reheatValveCommand() : s.electricReheatCommand();
    }

    static boolean hasReheat(UnitSignals s) {
        return s.has(UnitSignals.REHEAT_VALVE_COMMAND) || s.has(UnitSignals.ELECTRIC_REHEAT_COMMAND);
    }

    /** The setpoint the zone is cooled to: the cooling setpoint, else the single zone setpoint. */
    static double[] coolingSetpoint(UnitSignals s) {
        return s.has(UnitSignals.ZONE_COOLING_TEMPERATURE_SETPOINT) ? s.zoneCoolingSetpoint() : s.zoneSetpoint();
    }

    /** The setpoint the zone is heated to: the heating setpoint, else the single zone setpoint. */
    static double[] heatingSetpoint(UnitSignals s) {
        return s.has(UnitSignals.ZONE_HEATING_TEMPERATURE_SETPOINT) ? s.zoneHeatingSetpoint() : s.zoneSetpoint();
    }

    static boolean hasZoneSetpoint(UnitSignals s) {
        return s.has(UnitSignals.ZONE_COOLING_TEMPERATURE_SETPOINT) || s.has(UnitSignals.ZONE_TEMPERATURE_SETPOINT)
                || s.has(UnitSignals.ZONE_HEATING_TEMPERATURE_SETPOINT);
    }
}
