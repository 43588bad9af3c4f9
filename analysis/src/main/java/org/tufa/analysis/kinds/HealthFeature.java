package org.tufa.analysis.kinds;

/**
 * How one health feature is judged.
 *
 * @param name           the feature's name (a column of features.csv)
 * @param faultSides     the sides of the feature that mean a fault (+1 a rise, -1 a fall)
 * @param gate           the shift from normal, in the feature's unit, that matters in engineering terms
 * @param spreadFloor    the smallest day-to-day spread of the feature (about the resolution it is logged with)
 * @param levelGateShare on a fault day the samples must also lie this share of the unit's normal level from it
 *                       (for features whose normal level varies by unit, such as a valve's activity); 0 for none
 * @param comparableAcrossUnits whether the feature's normal level means the same on every unit, so a unit can be
 *                       compared with its peers on it (not for a residual against the unit's own response curve)
 */
public record HealthFeature(String name, int[] faultSides, double gate, double spreadFloor, double levelGateShare,
                            boolean comparableAcrossUnits) {

    /** Both sides are faults. */
    public static final int[] BOTH_SIDES = {1, -1};
    /** Only a rise is a fault. */
    public static final int[] RISE_ONLY = {1};

    public HealthFeature {
        faultSides = faultSides.clone();
        if (!(gate > 0)) {
            throw new IllegalArgumentException("the gate of " + name + " must be positive, got " + gate);
        }
    }

    @Override
    public int[] faultSides() {
        return faultSides.clone();
    }

    /** The gate on a day whose rows have the normal level {@code normalLevel}. */
    public double dayGate(double normalLevel) {
        return levelGateShare > 0 ? Math.max(gate, levelGateShare * normalLevel) : gate;
    }
}
