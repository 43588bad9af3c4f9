package org.tufa.analysis.simulate;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.Month;
import java.time.temporal.TemporalAdjusters;

/**
 * Working days of the fictional office building: Monday to Friday except Ontario's statutory holidays (New Year's
 * Day, Family Day, Good Friday, Victoria Day, Canada Day, Civic Holiday, Labour Day, Thanksgiving, Christmas, Boxing
 * Day; the Civic Holiday is not statutory but widely observed). Rules from memory; observed-day shifts for holidays
 * on a weekend are applied to Canada Day, Christmas, Boxing Day and New Year's Day.
 */
public final class WorkCalendar {
    private WorkCalendar() {
    }

    public static boolean isWorkday(LocalDate d) {
        DayOfWeek w = d.getDayOfWeek();
        return w != DayOfWeek.SATURDAY && w != DayOfWeek.SUNDAY && !isHoliday(d);
    }

    public static boolean isHoliday(LocalDate d) {
        int y = d.getYear();
        return d.equals(observed(LocalDate.of(y, 1, 1)))
                || d.equals(nthWeekday(y, Month.FEBRUARY, DayOfWeek.MONDAY, 3))
                || d.equals(easterSunday(y).minusDays(2))
                || d.equals(LocalDate.of(y, 5, 25).with(TemporalAdjusters.previous(DayOfWeek.MONDAY)))
                || d.equals(observed(LocalDate.of(y, 7, 1)))
                || d.equals(nthWeekday(y, Month.AUGUST, DayOfWeek.MONDAY, 1))
                || d.equals(nthWeekday(y, Month.SEPTEMBER, DayOfWeek.MONDAY, 1))
                || d.equals(nthWeekday(y, Month.OCTOBER, DayOfWeek.MONDAY, 2))
                || isChristmasBreak(d);
    }

    private static boolean isChristmasBreak(LocalDate d) {
        LocalDate christmas = LocalDate.of(d.getYear(), 12, 25);
        LocalDate boxing = LocalDate.of(d.getYear(), 12, 26);
        if (christmas.getDayOfWeek() == DayOfWeek.SATURDAY) {
            christmas = christmas.plusDays(2);
            boxing = boxing.plusDays(2);
        } else if (christmas.getDayOfWeek() == DayOfWeek.SUNDAY) {
            christmas = christmas.plusDays(1);
            boxing = boxing.plusDays(1);
        } else if (boxing.getDayOfWeek() == DayOfWeek.SATURDAY) {
            boxing = boxing.plusDays(2);
        }
        return d.equals(christmas) || d.equals(boxing);
    }

    private static LocalDate observed(LocalDate holiday) {
        return switch (holiday.getDayOfWeek()) {
            case SATURDAY -> holiday.plusDays(2);
            case SUNDAY -> holiday.plusDays(1);
            default -> holiday;
        };
    }

    private static LocalDate nthWeekday(int year, Month month, DayOfWeek day, int n) {
        return LocalDate.of(year, month, 1).with(TemporalAdjusters.dayOfWeekInMonth(n, day));
    }

    /** Gregorian Easter Sunday by the anonymous (Meeus/Jones/Butcher) algorithm (Meeus, Astronomical Algorithms). */
    static LocalDate easterSunday(int y) {
        int a = y % 19;
        int b = y / 100;
        int c = y % 100;
        int d = b / 4;
        int e = b % 4;
        int f = (b + 8) / 25;
        int g = (b - f + 1) / 3;
        int h = (19 * a + b - d - g + 15) % 30;
        int i = c / 4;
        int k = c % 4;
        int l = (32 + 2 * e + 2 * i - h - k) % 7;
        int m = (a + 11 * h + 22 * l) / 451;
        int month = (h + l - 7 * m + 114) / 31;
        int day = ((h + l - 7 * m + 114) % 31) + 1;
        return LocalDate.of(y, month, day);
    }
}
