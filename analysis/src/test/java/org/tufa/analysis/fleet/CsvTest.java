package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** Csv.time against java.time's own ISO_OFFSET_DATE_TIME formatter (the reference), character for character. */
class CsvTest {

    private static String reference(Instant t, ZoneId zone) {
        return DateTimeFormatter.ISO_OFFSET_DATE_TIME.format(t.atZone(zone).toOffsetDateTime());
    }

    @Test
    void timeEqualsTheIsoFormatterAcrossZonesOffsetsAndDaylightSaving() {
        // Zones with negative, positive, half- and quarter-hour offsets and UTC; Europe/Amsterdam before 1937 had
        // an offset with seconds (+00:19:32), which takes the formatter's path.
        List<ZoneId> zones = List.of(ZoneId.of("America/Toronto"), ZoneId.of("Europe/Berlin"), ZoneId.of("UTC"),
                ZoneId.of("Asia/Kolkata"), ZoneId.of("Asia/Kathmandu"), ZoneId.of("Pacific/Chatham"),
                ZoneId.of("America/St_Johns"), ZoneId.of("Europe/Amsterdam"));
        SplittableRandom random = new SplittableRandom(2031);
        for (ZoneId zone : zones) {
            // every minute around both 2031 daylight-saving changes in Toronto and Berlin
            for (String around : List.of("2031-03-09T05:00:00Z", "2031-11-02T04:00:00Z", "2031-03-30T00:00:00Z",
                    "2031-10-26T00:00:00Z")) {
                Instant start = Instant.parse(around).minus(Duration.ofHours(3));
                for (int m = 0; m < 6 * 60; m++) {
                    Instant t = start.plusSeconds(60L * m);
                    assertEquals(reference(t, zone), Csv.time(t, zone), t + " in " + zone);
                }
            }
            // random instants from year 1 to 9999, whole seconds and with nanoseconds; and years outside
            for (int k = 0; k < 20_000; k++) {
                long seconds = random.nextLong(-62_135_596_800L, 253_402_300_800L);
                Instant t = Instant.ofEpochSecond(seconds, k % 5 == 0 ? random.nextInt(1_000_000_000) : 0);
                assertEquals(reference(t, zone), Csv.time(t, zone), t + " in " + zone);
            }
            for (String far : List.of("-0001-06-01T00:00:00Z", "+10000-01-01T00:00:00Z", "0001-01-01T00:00:00Z",
                    "9999-12-31T23:59:59Z", "1900-01-01T00:00:00Z")) {
                Instant t = Instant.parse(far);
                assertEquals(reference(t, zone), Csv.time(t, zone), t + " in " + zone);
            }
        }
    }
}
