package org.tufa.analysis.episodes;

/**
 * A run of fault days on one channel: the unit strayed from its own normal days, beyond the engineering gate and
 * the day threshold, day after day.
 *
 * @param from       first informative-day index of the run in its {@link DayChannel} (inclusive)
 * @param to         last informative-day index (exclusive)
 * @param firstDay   epoch day of the first fault day
 * @param lastDay    epoch day of the last fault day
 * @param faultDays  fault days in the run (bridged days not counted)
 * @param statistic  scan statistic of the run ({@link org.tufa.analysis.significance.ScanStatistic}): how far, in
 *                   day-to-day spreads, and how long
 * @param meanShift  mean deviation of the fault days from the normal level, in the fault direction, in the
 *                   channel's unit
 * @param meanZ      mean deviation of the fault days in day-to-day spreads
 * @param meanValue  mean day value of the fault days (a share, or a feature's day median)
 * @param meanNormal mean normal level the fault days were compared with
 */
public record Episode(int from, int to, int firstDay, int lastDay, int faultDays, double statistic, double meanShift,
                      double meanZ, double meanValue, double meanNormal) implements java.io.Serializable {
}
