package org.tufa.analysis.kinds;

/**
 * A rule of a kind of unit, as the per-unit detection judges it: per day, the share of the eligible samples the
 * rule flags, against the unit's own normal days or a share known from physics.
 *
 * @param mode        the mode the rule belongs to ("any" for a rule across modes)
 * @param name        the rule's name: the kind of its findings and the key of its candidate causes
 * @param eligible    per grid sample: the rule can be judged on it
 * @param flagged     per grid sample: the rule fails on it (read only where eligible)
 * @param minShare    the share of a day's eligible samples the rule must flag on a fault day
 * @param normalShare the share a healthy unit flags by physics (0 for a rule that never fails on a healthy unit),
 *                    or NaN to judge against the unit's own normal days
 * @param comparableAcrossUnits whether the share means the same on every unit, so a unit can be compared with its
 *                    peers on it (not for a share that follows the unit's own control style)
 */
public record RuleChannel(String mode, String name, boolean[] eligible, boolean[] flagged, double minShare,
                          double normalShare, boolean comparableAcrossUnits) {

    /** The usual share of a day's eligible samples a rule must flag on a fault day (common practice, no source). */
    public static final double DEFAULT_MIN_SHARE = 0.25;

    public RuleChannel {
        if (eligible.length != flagged.length) {
            throw new IllegalArgumentException("eligible and flagged samples differ in length");
        }
    }
}
