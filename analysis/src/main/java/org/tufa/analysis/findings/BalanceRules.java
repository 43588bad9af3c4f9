package org.tufa.analysis.findings;

/**
 * Energy-balance rules per operating mode, in the manner of the APAR rule set for air handlers (House,
 * Vaezi-Nejad and Whitcomb, ASHRAE Transactions 107(1), 2001; Schein, Bushby, Castro and House, Energy and
 * Buildings 38(12), 2006), written for a fan coil unit whose entering air is the zone air:
 * <ul>
 *   <li>heating: the discharge air must be warmer than the zone (less a sensor tolerance);</li>
 *   <li>cooling: the discharge air must be cooler than the zone (plus the tolerance);</li>
 *   <li>ventilation (fan only, both valves shut): the discharge air must be within the tolerance of the zone.</li>
 * </ul>
 * A rule that fails for long stretches is a fault whatever the clusters say, and it catches what clustering
 * within one mode cannot: when a fault creates the mode (a cooling valve stuck open in summer makes the unit heat
 * against it), every sample of that mode is faulty and the largest cluster is the fault.
 */
public final class BalanceRules {

    private BalanceRules() {
    }

    /** Heating: discharge below zone by more than the tolerance. */
    public static boolean heatingWithoutHeat(double zone, double discharge, double tolerance) {
        return discharge < zone - tolerance;
    }

    /** Cooling: discharge above zone by more than the tolerance. */
    public static boolean coolingWithoutCooling(double zone, double discharge, double tolerance) {
        return discharge > zone + tolerance;
    }

    /** Ventilation: discharge away from zone by more than the tolerance, either way. */
    public static boolean ventilationOffset(double zone, double discharge, double tolerance) {
        return Math.abs(discharge - zone) > tolerance;
    }
}
