package org.tufa.analysis.simulate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import org.junit.jupiter.api.Test;

class WeatherTest {

    @Test
    void sunPositionAtSummerSolsticeNoon() {
        // Duffie and Beckman: at solar noon the zenith is |latitude - declination|. June 21 = day 172; Cooper:
        // 23.45 sin(360 * 456 / 365) = 23.4498 deg, so zenith = 43.68 - 23.45 = 20.23 deg, cos = 0.93832.
        assertEquals(0.93832, Weather.cosZenith(172, 12.0), 2e-4);
        // Haurwitz clear-sky GHI at that zenith, by hand: 1098 * 0.93832 * exp(-0.057 / 0.93832) = 969.6 W/m2.
        assertEquals(969.6, Weather.clearSkyGlobal(0.93832), 0.5);
        // Winter solstice (day 355): zenith 43.68 + 23.45 = 67.13 deg, cos = 0.3887.
        assertEquals(0.3887, Weather.cosZenith(355, 12.0), 1e-3);
    }

    @Test
    void summerTemperaturesArePlausibleForToronto() {
        // Canadian Climate Normals 1981-2010, Toronto Pearson (from memory): July mean daily max about 27.6 C,
        // mean daily min about 16.5 C; summer days mostly 20-32 C. Checked over three seeds.
        for (long seed = 1; seed <= 3; seed++) {
            SiteConditions site = SiteConditions.generate(Season.summer(2031), seed);
            double[] t = site.weather().outdoorC();
            int days = t.length / 1440;
            double sumMax = 0;
            double sumMin = 0;
            int julyDays = 0;
            for (int d = 0; d < days; d++) {
                double max = Double.NEGATIVE_INFINITY;
                double min = Double.POSITIVE_INFINITY;
                for (int m = d * 1440; m < (d + 1) * 1440; m++) {
                    max = Math.max(max, t[m]);
                    min = Math.min(min, t[m]);
                }
                assertTrue(max > 12 && max < 38, "daily max " + max);
                assertTrue(min > 3 && min < 28, "daily min " + min);
                LocalDate date = Season.summer(2031).firstDay().plusDays(d - SiteConditions.WARM_UP_DAYS);
                if (date.getMonthValue() == 7) {
                    sumMax += max;
                    sumMin += min;
                    julyDays++;
                }
            }
            assertEquals(27.6, sumMax / julyDays, 2.5);
            assertEquals(16.5, sumMin / julyDays, 2.5);
        }
    }

    @Test
    void winterIsColdAndFacadesSeeTheSunAtTheRightHours() {
        SiteConditions site = SiteConditions.generate(Season.fullYear(2031), 5);
        double[] t = site.weather().outdoorC();
        int warm = site.warmUpMinutes();
        double jan = 0;
        for (int m = warm; m < warm + 31 * 1440; m++) {
            jan += t[m];
        }
        // Normals: January daily mean -5.5 C (from memory); one synthetic month may stray by a few kelvin.
        assertEquals(-5.5, jan / (31 * 1440), 4.0);
        // Over the year, east facades get their sun before solar noon and west ones after (geometry).
        double[][] f = site.weather().facadeIrradiance();
        double eastMorning = 0;
        double eastAfternoon = 0;
        double westMorning = 0;
        double westAfternoon = 0;
        for (int m = 0; m < f[0].length; m++) {
            int minuteOfDay = site.localMinuteOfDay()[m];
            boolean morning = minuteOfDay < 12 * 60; // local clock; solar noon is near 12:20-13:30 local
            if (morning) {
                eastMorning += f[1][m];
                westMorning += f[3][m];
            } else {
                eastAfternoon += f[1][m];
                westAfternoon += f[3][m];
            }
        }
        assertTrue(eastMorning > 1.5 * eastAfternoon);
        assertTrue(westAfternoon > 1.5 * westMorning);
    }

    @Test
    void ontarioHolidays() {
        // Easter Sunday 2024 = March 31 and 2025 = April 20 (published calendars).
        assertEquals(LocalDate.of(2024, 3, 31), WorkCalendar.easterSunday(2024));
        assertEquals(LocalDate.of(2025, 4, 20), WorkCalendar.easterSunday(2025));
        assertTrue(WorkCalendar.isHoliday(LocalDate.of(2031, 7, 1)));  // Canada Day, a Tuesday
        assertTrue(WorkCalendar.isHoliday(LocalDate.of(2031, 8, 4)));  // first Monday of August
        assertTrue(WorkCalendar.isHoliday(LocalDate.of(2031, 9, 1)));  // Labour Day
        assertTrue(WorkCalendar.isWorkday(LocalDate.of(2031, 7, 2)));
        assertTrue(!WorkCalendar.isWorkday(LocalDate.of(2031, 7, 5))); // Saturday
    }
}
