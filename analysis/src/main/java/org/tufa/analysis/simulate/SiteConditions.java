package org.tufa.analysis.simulate;

import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.time.zone.ZoneRules;

/**
 * Everything the units share, per simulated minute: weather, plant-loop supply temperatures and the local calendar.
 * Minute 0 is {@code warmUpDays} before the season starts, so the zones start the season in a settled state.
 *
 * <p>Plant loops (common practice, no source): chilled water 6.7 C (44 F) with a slow +/- 0.2 K wander and a small
 * rise on hot afternoons when the plant is loaded; hot water reset linearly with outdoor temperature from 60 C at
 * -15 C outdoors to 45 C at 15 C and above.
 */
public record SiteConditions(
        Season season,
        Instant origin,
        int warmUpMinutes,
        Weather.Series weather,
        double[] chilledWaterSupplyC,
        double[] hotWaterSupplyC,
        short[] localMinuteOfDay,
        boolean[] workday,
        int[] localDay) {

    /** Days simulated before the season so that zone temperatures and controllers have settled. */
    public static final int WARM_UP_DAYS = 3;

    /** Builds the shared conditions for a season and seed. */
    public static SiteConditions generate(Season season, long seed) {
        Instant origin = season.start().minusSeconds(WARM_UP_DAYS * 86_400L);
        int minutes = (int) ((season.end().getEpochSecond() - origin.getEpochSecond()) / 60);
        Weather.Series weather = Weather.generate(origin, minutes, seed);

        SeededRandom rng = SeededRandom.forStream(seed, "plant");
        double[] chwWander = Weather.autoregressive(rng, minutes / 60 + 2, 6.0);
        double[] hwWander = Weather.autoregressive(rng, minutes / 60 + 2, 6.0);
        double[] chw = new double[minutes];
        double[] hw = new double[minutes];
        short[] minuteOfDay = new short[minutes];
        boolean[] workday = new boolean[minutes];
        int[] day = new int[minutes];
        ZoneRules rules = season.zone().getRules();
        long originSecond = origin.getEpochSecond();
        int offsetSeconds = rules.getOffset(origin).getTotalSeconds();
        long firstDay = LocalDateTime.ofEpochSecond(originSecond + offsetSeconds, 0, ZoneOffset.UTC)
                .toLocalDate().toEpochDay();
        long cachedDay = Long.MIN_VALUE;
        boolean cachedWorkday = false;
        for (int m = 0; m < minutes; m++) {
            long second = originSecond + 60L * m;
            if (m % 60 == 0) {
                offsetSeconds = rules.getOffset(Instant.ofEpochSecond(second)).getTotalSeconds();
            }
            long local = second + offsetSeconds;
            long epochDay = Math.floorDiv(local, 86_400L);
            if (epochDay != cachedDay) {
                cachedDay = epochDay;
                cachedWorkday = WorkCalendar.isWorkday(LocalDate.ofEpochDay(epochDay));
            }
            minuteOfDay[m] = (short) (Math.floorMod(local, 86_400L) / 60);
            workday[m] = cachedWorkday;
            day[m] = (int) (epochDay - firstDay);

            double frac = (m % 60) / 60.0;
            int h = m / 60;
            double oat = weather.outdoorC()[m];
            chw[m] = 6.7 + 0.2 * (chwWander[h] + (chwWander[h + 1] - chwWander[h]) * frac)
                    + 0.05 * Math.max(0.0, oat - 27.0);
            double reset = 45.0 + (60.0 - 45.0) * Math.max(0.0, Math.min(1.0, (15.0 - oat) / 30.0));
            hw[m] = reset + 0.3 * (hwWander[h] + (hwWander[h + 1] - hwWander[h]) * frac);
        }
        return new SiteConditions(season, origin, WARM_UP_DAYS * 1440, weather, chw, hw, minuteOfDay, workday, day);
    }

    /** Number of simulated minutes, warm-up included. */
    public int minutes() {
        return chilledWaterSupplyC.length;
    }

    /** The simulated minute index of an instant (clamped to the simulated range). */
    public int minuteOf(Instant t) {
        long m = (t.getEpochSecond() - origin.getEpochSecond()) / 60;
        return (int) Math.max(0, Math.min(minutes(), m));
    }
}
