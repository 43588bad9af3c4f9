package org.tufa.analysis.trends;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;

/**
 * Reading trend files end to end. Expected values are worked by hand from the input rows (cell mean, hold, counts);
 * time stamps follow ISO 8601 / RFC 3339 offsets.
 */
class TrendStoreTest {

    @TempDir
    Path dir;

    private static final TimeOptions UTC = TimeOptions.defaults(null);
    private static final double N = Double.NaN;

    private Path write(String name, String content) throws IOException {
        Path file = dir.resolve(name);
        Files.writeString(file, content, StandardCharsets.UTF_8);
        return file;
    }

    private TrendStore ingest(List<Path> inputs, Map<String, SeriesKind> wanted, TimeOptions options) {
        Path spill = dir.resolve("spill");
        try {
            Files.createDirectories(spill);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
        return TrendStore.ingest(inputs, wanted, options, spill);
    }

    @Test
    void longFormatMeanHoldUnknownSeriesAndCommonGrid() throws IOException {
        Path file = write("long.csv", """
                timestamp,point,value
                2031-07-01T10:00:00Z,ZNT,20
                2031-07-01T10:05:00Z,ZNT,22
                2031-07-01T10:00:00Z,FAN,on
                2031-07-01T10:05:00Z,FAN,off
                2031-07-01T10:07:00Z,OTHER,5
                2031-07-01T10:40:00Z,ZNT,25
                2031-07-01T10:50:00Z,OTHER,
                """);
        try (TrendStore store = ingest(List.of(file),
                Map.of("ZNT", SeriesKind.ANALOG, "FAN", SeriesKind.BINARY, "NEVER", SeriesKind.ANALOG), UTC)) {
            IngestReport report = store.report();
            assertEquals(TrendFormat.LONG, report.files().get(0).format());
            assertEquals(7, report.rows());
            assertEquals(5, report.samplesKept());
            assertEquals(2, report.unknownSeriesSamples(), "OTHER's rows, its empty value too: every row is counted");
            assertEquals(report.rows(), report.files().get(0).accounted(), "every row in one bucket");
            assertEquals(List.of("OTHER"), report.unknownSeries());
            assertEquals(List.of("NEVER"), report.seriesNeverSeen());
            // Grid from 10:00 to the cell holding 10:40: 3 cells [10:00, 10:15, 10:30].
            assertEquals(Instant.parse("2031-07-01T10:00:00Z"), store.gridStart());
            assertEquals(3, store.gridLength());
            ResampledSeries znt = store.series("ZNT");
            // Cell 0: mean(20, 22) = 21; cell 1: held 22 (10:15 < 10:05 + 1 h); cell 2: 25.
            assertArrayEquals(new double[] {21, 22, 25}, znt.values(), 1e-12);
            assertEquals(3, znt.rawSamples());
            assertEquals(2, znt.cellsWithSamples());
            assertEquals(1, znt.cellsHeld());
            // FAN on 10:00-10:05 then off: cell 0 = 5/15; then off held until 11:05 -> 0, 0.
            assertArrayEquals(new double[] {1.0 / 3, 0, 0}, store.series("FAN").values(), 1e-12);
            ResampledSeries never = store.series("NEVER");
            assertEquals(3, never.length(), "every series shares the grid");
            assertEquals(3, never.cellsMissing());
            assertThrows(IllegalArgumentException.class, () -> store.series("OTHER"));
        }
    }

    @Test
    void wideFormatWithBomQuotedHeaderCrlfAndBlankTrailingLines() throws IOException {
        String content = "\uFEFF\"Timestamp\",\"FCU-1.ZNT\",\"FCU, 2.ZNT\",\"FCU-1.FAN\"\r\n"
                + "2031-07-01T10:00:00Z,21.5,,active\r\n"
                + "2031-07-01T10:15:00Z,\"22.5\",19,inactive\r\n"
                + "\r\n   \r\n\r\n";
        Path file = write("wide.csv", content);
        try (TrendStore store = ingest(List.of(file), Map.of("FCU-1.ZNT", SeriesKind.ANALOG,
                "FCU, 2.ZNT", SeriesKind.ANALOG, "FCU-1.FAN", SeriesKind.BINARY), UTC)) {
            IngestReport report = store.report();
            assertEquals(TrendFormat.WIDE, report.files().get(0).format());
            assertEquals(2, report.rows(), "blank lines are not rows");
            assertEquals(0, report.malformedRows());
            assertEquals(5, report.samplesKept());
            assertArrayEquals(new double[] {21.5, 22.5}, store.series("FCU-1.ZNT").values(), 0);
            // "FCU, 2.ZNT": no sample at 10:00 and nothing earlier -> NaN; 19 at 10:15.
            assertArrayEquals(new double[] {N, 19}, store.series("FCU, 2.ZNT").values(), 0);
            assertArrayEquals(new double[] {1, 0}, store.series("FCU-1.FAN").values(), 0);
        }
    }

    @Test
    void folderIsReadInNameOrderIncludingGzip() throws IOException {
        Path folder = Files.createDirectory(dir.resolve("trends"));
        Files.writeString(folder.resolve("b-day2.csv"), "timestamp,ZNT\n2031-07-02T00:00:00Z,30\n");
        try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(folder.resolve("a-day1.csv.gz")))) {
            out.write("timestamp,point,value\n2031-07-01T23:45:00Z,ZNT,10\n".getBytes(StandardCharsets.UTF_8));
        }
        Files.writeString(folder.resolve("notes.txt"), "not a trend file");
        try (TrendStore store = ingest(List.of(folder), Map.of("ZNT", SeriesKind.ANALOG), UTC)) {
            List<FileReport> files = store.report().files();
            assertEquals(2, files.size());
            assertEquals("a-day1.csv.gz", files.get(0).file().getFileName().toString());
            assertEquals(TrendFormat.LONG, files.get(0).format());
            assertEquals(TrendFormat.WIDE, files.get(1).format());
            assertArrayEquals(new double[] {10, 30}, store.series("ZNT").values(), 0);
        }
    }

    @Test
    void badValuesAreCountedWithPlaceOrRejectedInStrictMode() throws IOException {
        Path file = write("bad.csv", """
                timestamp,ZNT,FAN
                2031-07-01T10:00:00Z,21,on
                2031-07-01T10:15:00Z,21;5,maybe
                yesterday,22,on
                2031-07-01T10:45:00Z,23,on,extra
                """);
        Map<String, SeriesKind> wanted = Map.of("ZNT", SeriesKind.ANALOG, "FAN", SeriesKind.BINARY);
        try (TrendStore store = ingest(List.of(file), wanted, UTC)) {
            FileReport report = store.report().files().get(0);
            assertEquals(2, report.unparsableValues());
            assertEquals(1, report.unparsableTimestamps());
            assertEquals(1, report.malformedRows());
            assertEquals(2, report.samplesKept());
            assertEquals(file + ":3:2: value '21;5' of series ZNT is not a number", report.problemExamples().get(0));
            assertTrue(report.problemExamples().get(2).startsWith(file + ":4:1: time stamp 'yesterday'"));
            assertTrue(report.problemExamples().get(3).startsWith(file + ":5:4: row has more fields"));
        }
        InputException strict = assertThrows(InputException.class,
                () -> ingest(List.of(file), wanted, UTC.withStrict(true)));
        assertTrue(strict.getMessage().startsWith(file + ":3:2: value '21;5' of series ZNT is not a number"),
                strict.getMessage());
        assertTrue(!strict.getMessage().contains("\n"), "one line");
    }

    @Test
    void missingTimestampColumnEmptyFileAndNaiveStampsWithoutZoneAreInputErrors() throws IOException {
        Path noTimestamp = write("nots.csv", "time,ZNT\n2031-07-01T10:00:00Z,21\n");
        InputException e1 = assertThrows(InputException.class,
                () -> ingest(List.of(noTimestamp), Map.of("ZNT", SeriesKind.ANALOG), UTC));
        assertTrue(e1.getMessage().startsWith(noTimestamp + ":1: the header has no 'timestamp' column"));
        Path empty = write("empty.csv", "");
        assertThrows(InputException.class, () -> ingest(List.of(empty), Map.of("ZNT", SeriesKind.ANALOG), UTC));
        Path naive = write("naive.csv", "timestamp,ZNT\n2031-07-01 10:00,21\n");
        InputException e3 = assertThrows(InputException.class,
                () -> ingest(List.of(naive), Map.of("ZNT", SeriesKind.ANALOG), UTC));
        assertTrue(e3.getMessage().startsWith(naive + ":2:1: "), e3.getMessage());
        assertTrue(e3.getMessage().contains("--timezone"));
        assertThrows(InputException.class,
                () -> ingest(List.of(dir.resolve("absent.csv")), Map.of("ZNT", SeriesKind.ANALOG), UTC));
        // The temp spill files of failed ingests are deleted.
        try (Stream<Path> left = Files.list(dir.resolve("spill"))) {
            assertEquals(0, left.count());
        }
    }

    @Test
    void isoOffsetsAreHonouredAndWindowLimitsTheGrid() throws IOException {
        // 08:15-04:00 = 12:15Z; 17:45+05:30 = 12:15Z; 1215Z itself (ISO 8601 / RFC 3339 offsets).
        Path file = write("iso.csv", """
                timestamp,ZNT
                2031-07-01T08:15:00-04:00,1
                2031-07-01T17:45:00+05:30,3
                2031-07-01T12:30Z,5
                2031-07-01T13:30:00.250Z,7
                2031-07-01T09:00:00Z,9
                """);
        TimeOptions window = UTC.withWindow(Instant.parse("2031-07-01T12:15:00Z"), Instant.parse("2031-07-01T13:00:00Z"));
        try (TrendStore store = ingest(List.of(file), Map.of("ZNT", SeriesKind.ANALOG), window)) {
            assertEquals(Instant.parse("2031-07-01T12:15:00Z"), store.gridStart());
            assertEquals(3, store.gridLength());
            // 12:15 cell: mean(1, 3) = 2; 12:30: 5; 12:45: held 5.
            assertArrayEquals(new double[] {2, 5, 5}, store.series("ZNT").values(), 0);
            // 08:15-04:00 and 17:45+05:30 are one instant with two values: kept, averaged, and counted.
            assertEquals(1, store.report().conflictingDuplicates());
            // 13:30 is at/after 'to'; 09:00 is before from - maxGap (11:15): both outside the window.
            assertEquals(2, store.report().samplesOutsideWindow());
        }
    }

    @Test
    void seriesIsThreadSafeAndCloseDeletesTheSpillFile() throws Exception {
        StringBuilder csv = new StringBuilder("timestamp,A,B\n");
        Instant t = Instant.parse("2031-01-01T00:00:00Z");
        for (int i = 0; i < 5000; i++) {
            csv.append(t.plus(Duration.ofMinutes(15L * i))).append(',').append(i).append(',').append(-i).append('\n');
        }
        Path file = write("big.csv", csv.toString());
        TrendStore store = ingest(List.of(file), Map.of("A", SeriesKind.ANALOG, "B", SeriesKind.ANALOG),
                UTC.withInterval(Duration.ofMinutes(30)));
        ExecutorService pool = Executors.newFixedThreadPool(4);
        List<Future<double[]>> results = new java.util.ArrayList<>();
        for (int i = 0; i < 16; i++) {
            String id = i % 2 == 0 ? "A" : "B";
            results.add(pool.submit(() -> store.series(id).values()));
        }
        for (int i = 0; i < 16; i++) {
            double[] v = results.get(i).get();
            assertEquals(2500, v.length);
            // 30-min cell k holds rows 2k and 2k+1: mean = 2k + 0.5 (negated for B); cell 2499 -> 4998.5.
            assertEquals((i % 2 == 0 ? 1 : -1) * 4998.5, v[2499], 1e-9);
            assertEquals((i % 2 == 0 ? 1 : -1) * 0.5, v[0], 1e-9);
        }
        pool.shutdown();
        store.close();
        try (Stream<Path> left = Files.list(dir.resolve("spill"))) {
            assertEquals(0, left.count());
        }
    }
}
