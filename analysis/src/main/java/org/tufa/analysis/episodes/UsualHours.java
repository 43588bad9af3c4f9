package org.tufa.analysis.episodes;

/**
 * The hours of the day a unit usually runs, learned from its own record, and the samples on which it runs outside
 * them. Per day type (workday, weekend: schedules differ) and hour of the local day, the share of the samples with
 * data on which the unit runs; an hour the unit runs on less than half of them is <em>usually off</em>. A unit left
 * running after hours (an override left on, a time clock or occupancy schedule changed by mistake, an occupancy
 * sensor stuck at occupied) then runs in usually-off hours day after day; the detection judges the share of a day's
 * usually-off samples it runs in as any rule, against the unit's own days (common practice, no source: running
 * outside the occupied schedule is a classic energy-waste check of building re-commissioning).
 *
 * <p>The majority threshold keeps the learning robust: a fault that lasts less than half the record of its day type
 * cannot make its own hours usual. A unit that cycles at night (setback) runs in usually-off hours every night; its
 * own days say so, and only an unusual share is a fault day.
 *
 * @param runningShare per day type (0 workday, 1 weekend) and hour (0-23): share of the samples with data on which
 *                     the unit runs, NaN for an hour without data
 */
public record UsualHours(double[][] runningShare) {

    /** Hours of the local day. */
    public static final int HOURS = 24;

    /** An hour is usual when the unit runs on at least this share of its samples with data. */
    public static final double USUAL_SHARE = 0.5;

    public UsualHours {
        runningShare = new double[][] {runningShare[0].clone(), runningShare[1].clone()};
    }

    /**
     * @param day     local epoch day of every sample ({@link DayIndex#of})
     * @param hour    local hour of the day of every sample, 0-23 ({@link DayIndex#hourOf})
     * @param hasData per sample: the unit's state is known
     * @param running per sample: the unit runs (fan on)
     */
    public static UsualHours fit(int[] day, int[] hour, boolean[] hasData, boolean[] running) {
        if (day.length != hour.length || day.length != hasData.length || day.length != running.length) {
            throw new IllegalArgumentException("day, hour, hasData and running differ in length");
        }
        long[][] data = new long[2][HOURS];
        long[][] on = new long[2][HOURS];
        for (int i = 0; i < day.length; i++) {
            if (hasData[i]) {
                int type = DayChannel.weekend(day[i]) ? 1 : 0;
                data[type][hour[i]]++;
                if (running[i]) {
                    on[type][hour[i]]++;
                }
            }
        }
        double[][] share = new double[2][HOURS];
        for (int t = 0; t < 2; t++) {
            for (int h = 0; h < HOURS; h++) {
                share[t][h] = data[t][h] == 0 ? Double.NaN : on[t][h] / (double) data[t][h];
            }
        }
        return new UsualHours(share);
    }

    /** Whether the unit usually does not run in this hour of this day (an hour without data is not judged). */
    public boolean usuallyOff(int epochDay, int hour) {
        double share = runningShare[DayChannel.weekend(epochDay) ? 1 : 0][hour];
        return share < USUAL_SHARE;
    }

    /** Per sample: it has data and falls in a usually-off hour (the samples the rule can judge). */
    public boolean[] eligible(int[] day, int[] hour, boolean[] hasData) {
        boolean[] out = new boolean[day.length];
        for (int i = 0; i < day.length; i++) {
            out[i] = hasData[i] && usuallyOff(day[i], hour[i]);
        }
        return out;
    }

    @Override
    public double[][] runningShare() {
        return new double[][] {runningShare[0].clone(), runningShare[1].clone()};
    }
}
