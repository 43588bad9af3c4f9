package org.tufa.analysis.trends;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;

/**
 * Every trend row is accounted for: each kind of row a careless export holds lands in its own count (worked
 * examples, counted by hand), strict mode refuses each, and the plausible ranges follow absolute zero (0 K =
 * -273.15 C = -459.67 F, NIST SP 811 (2008), from memory).
 */
class RowAccountingTest {
    @TempDir
    Path dir;

    private static final Map<String, SeriesKind> WANTED = Map.of("ZNT", SeriesKind.ANALOG, "VLV", SeriesKind.ANALOG);
    private static final Map<String, PlausibleRange> RANGES = Map.of("ZNT", PlausibleRange.forUnit("unit:DEG_F")
            .orElseThrow(), "VLV", PlausibleRange.forUnit("http://qudt.org/vocab/unit/PERCENT").orElseThrow());

    /** One row of each kind, in a long file; the comment says where each lands. */
    private static final String DIRTY = String.join("\n",
            "timestamp,point,value",
            "2031-07-01T10:00:00Z,ZNT,72",           // kept
            "2031-07-01T10:15:00Z,ZNT,72.5",         // kept
            "2031-07-01T10:15:00Z,ZNT,72.5",         // kept, exact duplicate
            "2031-07-01T10:15:00Z,ZNT,99",           // kept, conflicting duplicate
            "2031-07-01T10:30:00Z,ZNT,",             // empty value
            "2031-07-01T10:45:00Z,ZNT,warm",         // unparsable value
            "2031-07-01T11:00:00Z,ZNT,NaN",          // non-finite
            "2031-07-01T11:15:00Z,ZNT,1e400",        // non-finite (too large for a double)
            "2031-07-01T11:30:00Z,ZNT,1e308",        // implausible for degrees F
            "2031-07-01T11:45:00Z,ZNT,-500",         // implausible: colder than absolute zero
            "2031-07-01T10:00:00Z,VLV,150",          // kept: within twice full scale
            "2031-07-01T10:15:00Z,VLV,900",          // implausible percent
            "1938000000,VLV,40",                     // unreadable time stamp (epoch seconds)
            "yesterday,VLV,40",                      // unreadable time stamp
            "2031-07-01T10:30:00Z,VLV,40,extra",     // wrong field count
            "2031-07-01T10:30:00Z,VLV",              // wrong field count
            "2031-07-01T10:30:00Z,SPARE-1,1",        // unknown series
            "2031-07-01T10:30:00Z,SPARE-2,",         // unknown series (empty value too)
            "") + "\n";

    private Path write(String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text, StandardCharsets.UTF_8);
        return f;
    }

    private TrendStore ingest(Path file, TimeOptions options) {
        Path spill = dir.resolve("spill");
        try {
            Files.createDirectories(spill);
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
        return TrendStore.ingest(List.of(file), WANTED, RANGES, options, spill);
    }

    @Test
    void everyRowLandsInOneCount() throws IOException {
        Path file = write("dirty.csv", DIRTY);
        try (TrendStore store = ingest(file, TimeOptions.defaults(null))) {
            IngestReport r = store.report();
            FileReport f = r.files().get(0);
            assertEquals(18, r.rows());
            assertEquals(5, r.samplesKept());
            assertEquals(1, r.duplicateSamples());
            assertEquals(1, r.conflictingDuplicates());
            assertEquals(1, r.emptyValues());
            assertEquals(1, r.unparsableValues());
            assertEquals(2, r.nonFiniteValues());
            assertEquals(3, r.implausibleValues());
            assertEquals(2, r.unparsableTimestamps());
            assertEquals(2, r.malformedRows());
            assertEquals(2, r.unknownSeriesSamples());
            assertEquals(List.of("SPARE-1", "SPARE-2"), r.unknownSeries());
            // Series no unit reads are counted and named, never refused: strict mode reads this file's SPARE rows.
            assertEquals(r.rows(), f.accounted(), "each row in exactly one count");
            assertEquals(5, f.problemExamples().size(), "the first five problems are named");
        }
    }

    @Test
    void strictModeRefusesEachKind() throws IOException {
        String header = "timestamp,point,value\n2031-07-01T10:00:00Z,ZNT,72\n";
        Map<String, String> kinds = Map.of(
                "empty", "2031-07-01T10:15:00Z,ZNT,\n",
                "non-finite", "2031-07-01T10:15:00Z,ZNT,Infinity\n",
                "implausible", "2031-07-01T10:15:00Z,ZNT,1e308\n",
                "conflict", "2031-07-01T10:00:00Z,ZNT,75\n",
                "stamp", "1938000000,ZNT,72\n",
                "fields", "2031-07-01T10:15:00Z,ZNT,72,1\n");
        for (Map.Entry<String, String> k : kinds.entrySet()) {
            Path file = write(k.getKey() + ".csv", header + k.getValue());
            InputException e = assertThrows(InputException.class,
                    () -> ingest(file, TimeOptions.defaults(null).withStrict(true)).close(), k.getKey());
            assertTrue(e.getMessage().startsWith(file + ":3:"), e.getMessage());
            assertEquals(1, e.getMessage().lines().count());
            if (k.getKey().equals("stamp")) {
                assertTrue(e.getMessage().contains("looks like a Unix epoch time"), e.getMessage());
            }
        }
    }

    @Test
    void duplicatesAcrossFilesAreCountedAfterReading() throws IOException {
        // 10:00 appears three times with 70 (one repeat within a.csv, seen while reading, one across the files):
        // two exact duplicates, counted once each; 10:15 holds 71 and 75: one conflict.
        Path a = write("a.csv", "timestamp,ZNT\n2031-07-01T10:00:00Z,70\n2031-07-01T10:00:00Z,70\n"
                + "2031-07-01T10:15:00Z,71\n");
        Path b = write("b.csv", "timestamp,ZNT\n2031-07-01T10:00:00Z,70\n2031-07-01T10:15:00Z,75\n");
        try (TrendStore store = TrendStore.ingest(List.of(a, b), WANTED, RANGES, TimeOptions.defaults(null), dir)) {
            assertEquals(2, store.report().duplicateSamples());
            assertEquals(1, store.report().conflictingDuplicates());
            // Both kept: the 10:15 cell averages 71 and 75 (and 10:00 averages 70 and 70).
            assertEquals(73, store.series("ZNT").values()[1], 1e-12);
        }
        assertThrows(InputException.class, () -> TrendStore.ingest(List.of(a, b), WANTED, RANGES,
                TimeOptions.defaults(null).withStrict(true), dir).close());
    }

    @Test
    void aGridFarFinerThanTheDataIsRefusedBeforeAnyWork() throws IOException {
        StringBuilder b = new StringBuilder("timestamp,ZNT\n");
        java.time.Instant t = java.time.Instant.parse("2031-07-01T00:00:00Z");
        for (int i = 0; i < 5 * 96; i++) {
            b.append(t.plus(Duration.ofMinutes(15L * i))).append(",72\n");
        }
        Path file = write("five-days.csv", b.toString());
        InputException e = assertThrows(InputException.class,
                () -> ingest(file, TimeOptions.defaults(null).withInterval(Duration.ofSeconds(1))).close());
        // First to last sample: 479 x 15 min = 431,100 s, so 431,101 cells of 1 s; 480 samples, one every 15 min.
        assertTrue(e.getMessage().contains("431101 grid cells") && e.getMessage().contains("PT15M"), e.getMessage());
        try (TrendStore store = ingest(file, TimeOptions.defaults(null))) {
            assertEquals(480, store.gridLength());
        }
    }

    @Test
    void theSpillFileNeverOutlivesTheIngest() throws IOException {
        Path file = write("ok.csv", "timestamp,ZNT\n2031-07-01T10:00:00Z,70\n");
        try (TrendStore store = ingest(file, TimeOptions.defaults(null))) {
            try (Stream<Path> left = Files.list(dir.resolve("spill"))) {
                // POSIX: unlinked as soon as it is open, so even a killed run leaves nothing.
                assertEquals(0, left.filter(p -> p.getFileName().toString().endsWith(".spill")).count());
            }
            assertEquals(70, store.series("ZNT").values()[0], 0);
        }
    }

    @Test
    void binaryAndUtf16FilesAreNamedNotEchoed() throws IOException {
        Path bin = dir.resolve("bin.csv");
        Files.write(bin, new byte[] {0x7f, 'E', 'L', 'F', 2, 1, 1, 0, 0, 0, 0, 0, 0x1b, '[', '2', 'J', '\n'});
        InputException e = assertThrows(InputException.class, () -> ingest(bin, TimeOptions.defaults(null)));
        assertTrue(e.getMessage().contains("binary data"), e.getMessage());
        assertTrue(e.getMessage().chars().noneMatch(c -> c < 0x20 || c == 0x7f), e.getMessage());
        Path utf16 = dir.resolve("utf16.csv");
        Files.write(utf16, "timestamp,ZNT\n2031-07-01T10:00:00Z,70\n".getBytes(StandardCharsets.UTF_16LE));
        e = assertThrows(InputException.class, () -> ingest(utf16, TimeOptions.defaults(null)));
        assertTrue(e.getMessage().contains("UTF-16LE"), e.getMessage());
    }
}
