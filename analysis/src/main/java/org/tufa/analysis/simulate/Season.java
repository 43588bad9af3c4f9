package org.tufa.analysis.simulate;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.Objects;

/**
 * The simulated period: whole local days from {@code firstDay} to {@code lastDay} inclusive in {@code zone}.
 * Samples are every 15 minutes of elapsed time from local midnight of the first day, so a daylight-saving change
 * inside the period gives 92 or 100 samples on that day, as a real trend log would.
 */
public record Season(LocalDate firstDay, LocalDate lastDay, ZoneId zone) {
    /** The demo building's time zone (a fictional building in the Toronto climate). */
    public static final ZoneId DEMO_ZONE = ZoneId.of("America/Toronto");

    public Season {
        Objects.requireNonNull(firstDay);
        Objects.requireNonNull(lastDay);
        Objects.requireNonNull(zone);
        if (lastDay.isBefore(firstDay)) {
            throw new IllegalArgumentException("season ends before it starts: " + firstDay + " .. " + lastDay);
        }
    }

    /** June 1 to August 31 of {@code year}, America/Toronto. */
    public static Season summer(int year) {
        return new Season(LocalDate.of(year, 6, 1), LocalDate.of(year, 8, 31), DEMO_ZONE);
    }

    /** January 1 to December 31 of {@code year}, America/Toronto. */
    public static Season fullYear(int year) {
        return new Season(LocalDate.of(year, 1, 1), LocalDate.of(year, 12, 31), DEMO_ZONE);
    }

    public Instant start() {
        return firstDay.atStartOfDay(zone).toInstant();
    }

    /** Exclusive end: local midnight after the last day. */
    public Instant end() {
        return lastDay.plusDays(1).atStartOfDay(zone).toInstant();
    }

    /** Number of 15-minute samples. */
    public int sampleCount() {
        return (int) ((end().getEpochSecond() - start().getEpochSecond()) / (15 * 60));
    }
}
