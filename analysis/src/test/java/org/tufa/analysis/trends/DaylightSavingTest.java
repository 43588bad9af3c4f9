package org.tufa.analysis.trends;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneId;
import java.time.zone.ZoneOffsetTransition;
import java.time.zone.ZoneRules;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Naive local stamps across the 2031 transitions of America/Toronto. The transition dates and instants come from
 * the IANA time-zone database as shipped in java.time's {@link ZoneRules} (checked here, not assumed): US/Canada
 * DST starts the 2nd Sunday of March and ends the 1st Sunday of November at 02:00 local (notes section 9).
 */
class DaylightSavingTest {

    private static final ZoneId TORONTO = ZoneId.of("America/Toronto");
    private static ZoneOffsetTransition springForward;
    private static ZoneOffsetTransition fallBack;

    @TempDir
    Path dir;

    @BeforeAll
    static void findTransitions() {
        ZoneRules rules = TORONTO.getRules();
        springForward = rules.nextTransition(Instant.parse("2031-01-01T00:00:00Z"));
        fallBack = rules.nextTransition(springForward.getInstant());
        assertEquals(LocalDate.of(2031, 3, 9), springForward.getDateTimeBefore().toLocalDate());
        assertTrue(springForward.isGap());
        assertEquals(LocalDate.of(2031, 11, 2), fallBack.getDateTimeBefore().toLocalDate());
        assertTrue(fallBack.isOverlap());
        // 02:00 EST = 07:00Z; 02:00 EDT = 06:00Z.
        assertEquals(Instant.parse("2031-03-09T07:00:00Z"), springForward.getInstant());
        assertEquals(Instant.parse("2031-11-02T06:00:00Z"), fallBack.getInstant());
    }

    private TrendStore ingest(Path file) {
        return TrendStore.ingest(List.of(file), Map.of("ZNT", SeriesKind.ANALOG, "FAN", SeriesKind.BINARY),
                TimeOptions.defaults(TORONTO), dir);
    }

    @Test
    void fallBackRepeatedHourTakesTheEarlierOffsetFirstAndTheLaterAfterTheClockGoesBack() throws IOException {
        // A controller logging local time every 15 min writes 01:00..01:45 twice on 2031-11-02.
        StringBuilder csv = new StringBuilder("timestamp,ZNT\n");
        String[] stamps = {"00:30", "00:45", "01:00", "01:15", "01:30", "01:45", "01:00", "01:15", "01:30", "01:45",
            "02:00", "02:15"};
        for (int i = 0; i < stamps.length; i++) {
            csv.append("2031-11-02 ").append(stamps[i]).append(',').append(i).append('\n');
        }
        Path file = dir.resolve("fall.csv");
        Files.writeString(file, csv.toString());
        try (TrendStore store = ingest(file)) {
            IngestReport report = store.report();
            assertEquals(4, report.dstRepeatedFirstPass());
            assertEquals(4, report.dstRepeatedSecondPass());
            assertEquals(0, report.dstSkipped());
            // 00:30 EDT (-04:00) = 04:30Z; the twelve stamps are then 15 min apart in real time: one per cell.
            assertEquals(Instant.parse("2031-11-02T04:30:00Z"), store.gridStart());
            assertEquals(12, store.gridLength());
            assertArrayEquals(new double[] {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11}, store.series("ZNT").values(), 0);
            assertEquals(Instant.parse("2031-11-02T07:15:00Z"), store.report().seriesSpans().get(0).last());
        }
    }

    @Test
    void springForwardSkippedStampsAreShiftedForwardByTheGap() throws IOException {
        // Stamps 02:00..02:45 on 2031-03-09 do not exist; java.time shifts them by the 1 h gap (ZonedDateTime.ofLocal).
        Path file = dir.resolve("spring.csv");
        Files.writeString(file, """
                timestamp,point,value
                2031-03-09 01:45,ZNT,1
                2031-03-09 02:00,ZNT,2
                2031-03-09 02:30,ZNT,3
                2031-03-09 03:00,ZNT,4
                2031-03-09T03:15:00,ZNT,5
                """);
        try (TrendStore store = ingest(file)) {
            assertEquals(2, store.report().dstSkipped());
            assertEquals(0, store.report().dstRepeatedFirstPass() + store.report().dstRepeatedSecondPass());
            // 01:45 EST = 06:45Z; 02:00 -> 03:00 EDT = 07:00Z; 02:30 -> 07:30Z; 03:00 EDT = 07:00Z; 03:15 = 07:15Z.
            for (String local : new String[] {"2031-03-09T02:00", "2031-03-09T02:30"}) {
                LocalDateTime ldt = LocalDateTime.parse(local);
                assertTrue(TORONTO.getRules().getValidOffsets(ldt).isEmpty(), local + " is in the gap");
            }
            assertEquals(Instant.parse("2031-03-09T06:45:00Z"), store.gridStart());
            // Cells 06:45 [1], 07:00 [2 and 4 -> mean 3], 07:15 [5], 07:30 [3].
            assertArrayEquals(new double[] {1, 3, 5, 3}, store.series("ZNT").values(), 0);
        }
    }

    @Test
    void summerAndWinterOffsetsAwayFromTransitions() throws IOException {
        Path file = dir.resolve("plain.csv");
        Files.writeString(file, "timestamp,ZNT\n2031-07-01 08:15,1\n2031-12-01 08:15:00,2\n");
        try (TrendStore store = ingest(file)) {
            // EDT -04:00 in July, EST -05:00 in December (IANA tz database via java.time).
            assertEquals(Instant.parse("2031-07-01T12:15:00Z"), store.report().seriesSpans().get(0).first());
            assertEquals(Instant.parse("2031-12-01T13:15:00Z"), store.report().seriesSpans().get(0).last());
            assertEquals(0, store.report().dstSkipped() + store.report().dstRepeatedFirstPass());
        }
    }
}
