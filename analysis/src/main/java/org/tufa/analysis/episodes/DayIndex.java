package org.tufa.analysis.episodes;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;

/**
 * The local calendar day of every grid sample, as an epoch-day number ({@link LocalDate#toEpochDay()}). Days are
 * the unit of persistence in the detection: a fault lasts days, a healthy unit's odd hour does not, and a unit's
 * normal operation repeats day after day (occupancy, weather), so each day is one observation of it.
 */
public final class DayIndex {

    private DayIndex() {
    }

    /**
     * @param gridStart start of sample 0
     * @param interval  grid step
     * @param n         number of samples
     * @param zone      the zone whose midnights separate days (the building's local time)
     */
    public static int[] of(Instant gridStart, Duration interval, int n, ZoneId zone) {
        int[] day = new int[n];
        if (n == 0) {
            return day;
        }
        long step = interval.toMillis();
        long t = gridStart.toEpochMilli();
        LocalDate current = Instant.ofEpochMilli(t).atZone(zone).toLocalDate();
        long nextMidnight = current.plusDays(1).atStartOfDay(zone).toInstant().toEpochMilli();
        for (int i = 0; i < n; i++, t += step) {
            while (t >= nextMidnight) {
                current = current.plusDays(1);
                nextMidnight = current.plusDays(1).atStartOfDay(zone).toInstant().toEpochMilli();
            }
            day[i] = (int) current.toEpochDay();
        }
        return day;
    }

    /**
     * The local hour of the day (0-23) of every grid sample: on the day daylight saving starts one hour is missing,
     * on the day it ends one hour holds twice the samples.
     */
    public static int[] hourOf(Instant gridStart, Duration interval, int n, ZoneId zone) {
        int[] hour = new int[n];
        long step = interval.toMillis();
        long t = gridStart.toEpochMilli();
        for (int i = 0; i < n; i++, t += step) {
            hour[i] = Instant.ofEpochMilli(t).atZone(zone).getHour();
        }
        return hour;
    }
}
