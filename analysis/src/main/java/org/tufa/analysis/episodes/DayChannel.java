package org.tufa.analysis.episodes;

import java.util.Arrays;
import org.tufa.analysis.band.Quantiles;

/**
 * One evidence channel of one unit in one mode, day by day, against the unit's own normal days: the day's median
 * of a health feature (or the share of the day's samples a rule flags), the unit's normal level and day-to-day
 * spread, and each day's deviation from it in spreads, signed so that the fault direction is positive.
 *
 * <p>Normal level and spread are the median and the scaled median absolute deviation (1.4826 MAD: Hampel, JASA
 * 69(346), 1974; the factor makes it estimate the standard deviation of normal data) of the reference days, the
 * days that are not dominated by candidate-fault samples, of the day's own type (workday or weekend) when the unit
 * has enough of them. A spread floor keeps a very steady unit from turning a
 * sensor's resolution step into a large deviation.
 *
 * @param channel   name of the evidence (a feature or a rule)
 * @param direction +1 when larger values are the fault side, -1 when smaller values are
 * @param days      the informative days (epoch days), ascending
 * @param samples   samples of the mode on each informative day
 * @param value     the day's median (features) or share (rules) on each informative day
 * @param dominated per informative day: candidate-fault samples make up at least half of it (always false for
 *                  rule channels, whose days all count as reference)
 * @param center    the normal level (median over all reference days); NaN when there are none
 * @param spread    the day-to-day spread (1.4826 MAD over reference days, at least the floor)
 * @param normal    per informative day: the normal level it is compared with (its type's, or the pooled one)
 * @param z         per informative day: direction * (value - normal) / (its type's spread)
 */
public record DayChannel(String channel, int direction, int[] days, int[] samples, double[] value,
                         boolean[] dominated, double center, double spread, double[] normal, double[] z) {

    /** The MAD-to-standard-deviation factor for normal data (Hampel 1974). */
    public static final double MAD_SCALE = 1.4826;

    public DayChannel {
        if (direction != 1 && direction != -1) {
            throw new IllegalArgumentException("direction must be +1 or -1");
        }
    }

    /** Number of informative days. */
    public int size() {
        return days.length;
    }

    /** direction * (value - center) on informative day k, in the feature's unit. */
    public double shift(int k) {
        return direction * (value[k] - normal[k]);
    }

    /**
     * Day medians of a per-row value.
     *
     * @param dayOfRow   the day of each row (ascending: rows are in time order)
     * @param rowValue   the value of each row (NaN rows are skipped)
     * @param candidate  per row: in a candidate-fault cluster for this channel (null: none)
     * @param minSamples fewest rows that make a day informative
     * @param floor      smallest spread
     */
    public static DayChannel ofMedians(String channel, int direction, int[] dayOfRow, double[] rowValue,
                                       boolean[] candidate, int minSamples, double floor) {
        return build(channel, direction, dayOfRow, rowValue, candidate, minSamples, floor, true, Double.NaN);
    }

    /**
     * Day shares of flagged rows (the rule's failures among the day's eligible samples).
     *
     * @param dayOfRow   the day of each eligible row, ascending
     * @param flagged    per eligible row: the rule flags it
     * @param minSamples fewest rows that make a day informative
     * @param floor      smallest spread of the share
     */
    public static DayChannel ofShares(String channel, int[] dayOfRow, boolean[] flagged, int minSamples,
                                      double floor) {
        return build(channel, 1, dayOfRow, flags(flagged), null, minSamples, floor, false, Double.NaN);
    }

    /**
     * Day shares of flagged rows against a normal level known from physics rather than learnt from the unit: an
     * energy-balance rule never fails on a healthy unit in steady state, so its normal share is 0 whatever the unit
     * did (a fault that creates a mode, such as heating in summer against a cooling valve stuck open, would
     * otherwise be all the unit's days of that mode and look normal). The spread is then the floor: a spread
     * learnt from days that may all be faulty would hide the fault.
     */
    public static DayChannel ofSharesAgainst(double normalShare, String channel, int[] dayOfRow, boolean[] flagged,
                                             int minSamples, double floor) {
        return build(channel, 1, dayOfRow, flags(flagged), null, minSamples, floor, false, normalShare);
    }

    private static double[] flags(boolean[] flagged) {
        double[] v = new double[flagged.length];
        for (int i = 0; i < v.length; i++) {
            v[i] = flagged[i] ? 1 : 0;
        }
        return v;
    }

    private static DayChannel build(String channel, int direction, int[] dayOfRow, double[] rowValue,
                                    boolean[] candidate, int minSamples, double floor, boolean median,
                                    double fixedCenter) {
        int n = dayOfRow.length;
        int[] days = new int[n];
        int[] counts = new int[n];
        double[] values = new double[n];
        boolean[] dominated = new boolean[n];
        int d = 0;
        double[] buffer = new double[n];
        int i = 0;
        while (i < n) {
            int j = i;
            int valid = 0;
            int cand = 0;
            double sum = 0;
            while (j < n && dayOfRow[j] == dayOfRow[i]) {
                if (!Double.isNaN(rowValue[j])) {
                    buffer[valid++] = rowValue[j];
                    sum += rowValue[j];
                    if (candidate != null && candidate[j]) {
                        cand++;
                    }
                }
                j++;
            }
            if (valid >= minSamples) {
                days[d] = dayOfRow[i];
                counts[d] = valid;
                if (median) {
                    Arrays.sort(buffer, 0, valid);
                    values[d] = valid % 2 == 1 ? buffer[valid / 2] : 0.5 * (buffer[valid / 2 - 1] + buffer[valid / 2]);
                } else {
                    values[d] = sum / valid;
                }
                dominated[d] = 2 * cand >= valid && cand > 0;
                d++;
            }
            i = j;
        }
        days = Arrays.copyOf(days, d);
        counts = Arrays.copyOf(counts, d);
        values = Arrays.copyOf(values, d);
        dominated = Arrays.copyOf(dominated, d);
        // Workdays and weekends run to different schedules (occupied hours, setback, plant time clocks), so each
        // day is compared with the unit's normal days of its own type when there are enough of them.
        double[] pooled = baseline(values, dominated, days, -1, floor, fixedCenter);
        double[][] byType = {baseline(values, dominated, days, 0, floor, fixedCenter),
                baseline(values, dominated, days, 1, floor, fixedCenter)};
        double center = pooled[0];
        double spread = pooled[1];
        double[] z = new double[d];
        double[] normal = new double[d];
        for (int k = 0; k < d; k++) {
            double[] b = byType[weekend(days[k]) ? 1 : 0];
            if (Double.isNaN(b[0])) {
                b = pooled;
            }
            normal[k] = b[0];
            z[k] = Double.isNaN(b[0]) ? Double.NaN : direction * (values[k] - b[0]) / b[1];
        }
        return new DayChannel(channel, direction, days, counts, values, dominated, center, spread, normal, z);
    }

    /** Fewest reference days of one type (workday, weekend) for that type to get its own normal level. */
    public static final int MIN_DAYS_OF_TYPE = 4;

    /** Saturday or Sunday (the workweek of most commercial buildings; common practice, no source). */
    static boolean weekend(int epochDay) {
        java.time.DayOfWeek d = java.time.LocalDate.ofEpochDay(epochDay).getDayOfWeek();
        return d == java.time.DayOfWeek.SATURDAY || d == java.time.DayOfWeek.SUNDAY;
    }

    /**
     * {center, spread} of the reference days of one type (0 workdays, 1 weekends, -1 all); NaN centre when a type
     * has fewer than {@link #MIN_DAYS_OF_TYPE} of them.
     */
    private static double[] baseline(double[] values, boolean[] dominated, int[] days, int type, double floor,
                                     double fixedCenter) {
        double[] ref = new double[values.length];
        int r = 0;
        for (int k = 0; k < values.length; k++) {
            if (!dominated[k] && (type < 0 || weekend(days[k]) == (type == 1))) {
                ref[r++] = values[k];
            }
        }
        if (!Double.isNaN(fixedCenter)) {
            return new double[] {fixedCenter, floor};
        }
        if (r == 0 || (type >= 0 && r < MIN_DAYS_OF_TYPE)) {
            return new double[] {Double.NaN, floor};
        }
        ref = Arrays.copyOf(ref, r);
        double center = Quantiles.median(ref);
        double[] dev = new double[r];
        for (int k = 0; k < r; k++) {
            dev[k] = Math.abs(ref[k] - center);
        }
        return new double[] {center, Math.max(floor, MAD_SCALE * Quantiles.median(dev))};
    }

    /** The same days seen from the other side (direction flipped), for two-sided features. */
    public DayChannel flipped() {
        double[] zf = new double[z.length];
        for (int k = 0; k < z.length; k++) {
            zf[k] = -z[k];
        }
        return new DayChannel(channel, -direction, days, samples, value, dominated, center, spread, normal, zf);
    }
}
