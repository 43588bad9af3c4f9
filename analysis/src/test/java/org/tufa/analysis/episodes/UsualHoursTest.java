package org.tufa.analysis.episodes;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZoneOffset;
import org.junit.jupiter.api.Test;

/**
 * Usual hours learned from hand-built hourly records (worked examples, computed by hand; the rule itself is common
 * practice, no source). Two weeks from Monday 2031-06-02 at one sample an hour: workdays run 07:00-18:00 (hours 7
 * to 17), weekends are off; on two of the ten workdays the unit also runs 05:00-07:00 and 18:00-21:00.
 */
class UsualHoursTest {

    static final LocalDate MONDAY = LocalDate.of(2031, 6, 2);

    @Test
    void hoursAUnitRunsOnMostDaysOfTheirTypeAreUsual() {
        int n = 14 * 24;
        int[] day = new int[n];
        int[] hour = new int[n];
        boolean[] hasData = new boolean[n];
        boolean[] running = new boolean[n];
        for (int i = 0; i < n; i++) {
            LocalDate d = MONDAY.plusDays(i / 24);
            day[i] = (int) d.toEpochDay();
            hour[i] = i % 24;
            hasData[i] = true;
            boolean workday = d.getDayOfWeek().getValue() <= 5;
            boolean late = workday && (i / 24 == 2 || i / 24 == 3); // Wednesday and Thursday of week one
            running[i] = workday && (hour[i] >= 7 && hour[i] < 18 || late && (hour[i] >= 5 && hour[i] < 7
                    || hour[i] >= 18 && hour[i] < 21));
        }
        UsualHours usual = UsualHours.fit(day, hour, hasData, running);
        // Workdays: hour 7 runs on 10 of 10 days, hour 5 on 2 of 10; weekends never run.
        assertEquals(1.0, usual.runningShare()[0][7], 1e-12);
        assertEquals(0.2, usual.runningShare()[0][5], 1e-12);
        assertEquals(0.0, usual.runningShare()[1][10], 1e-12);
        int monday = (int) MONDAY.toEpochDay();
        assertFalse(usual.usuallyOff(monday, 7));
        assertTrue(usual.usuallyOff(monday, 5));
        assertTrue(usual.usuallyOff(monday + 5, 10)); // Saturday

        // On the late Wednesday, 5 of its 13 usually-off hours run (5, 6, 18, 19, 20): share 5/13.
        boolean[] eligible = usual.eligible(day, hour, hasData);
        int off = 0;
        int on = 0;
        for (int i = 2 * 24; i < 3 * 24; i++) {
            if (eligible[i]) {
                off++;
                on += running[i] ? 1 : 0;
            }
        }
        assertEquals(13, off);
        assertEquals(5, on);
    }

    @Test
    void anHourWithoutDataIsNotJudged() {
        int[] day = {(int) MONDAY.toEpochDay()};
        UsualHours usual = UsualHours.fit(day, new int[] {3}, new boolean[] {false}, new boolean[] {false});
        assertTrue(Double.isNaN(usual.runningShare()[0][3]));
        assertFalse(usual.usuallyOff(day[0], 3));
        assertArrayEquals(new boolean[] {false}, usual.eligible(day, new int[] {3}, new boolean[] {false}));
    }

    /**
     * Local hours across daylight saving in America/Toronto (2031: second Sunday of March is 9 March, first Sunday
     * of November is 2 November; the US rule, Energy Policy Act of 2005): at 02:00 the clock jumps to 03:00 in
     * March, and 01:00 repeats in November.
     */
    @Test
    void localHoursFollowDaylightSaving() {
        ZoneId toronto = ZoneId.of("America/Toronto");
        Instant springMidnight = LocalDate.of(2031, 3, 9).atStartOfDay(toronto).toInstant();
        int[] spring = DayIndex.hourOf(springMidnight, Duration.ofHours(1), 4, toronto);
        assertArrayEquals(new int[] {0, 1, 3, 4}, spring);
        Instant fallMidnight = LocalDate.of(2031, 11, 2).atStartOfDay(toronto).toInstant();
        int[] fall = DayIndex.hourOf(fallMidnight, Duration.ofHours(1), 4, toronto);
        assertArrayEquals(new int[] {0, 1, 1, 2}, fall);
        assertArrayEquals(new int[] {23, 0}, DayIndex.hourOf(Instant.parse("2031-06-01T23:00:00Z"),
                Duration.ofHours(1), 2, ZoneOffset.UTC));
    }
}
