package org.tufa.analysis.review;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;

/**
 * The review file: written and read back unchanged (text with commas, quotes, line breaks and leading formula
 * characters, OWASP CSV-injection guidance), columns in any order, and every bad row a one-line error naming the
 * line. Finding ids: SHA-256 (FIPS 180-4) checked against a value computed with Python's hashlib.
 */
class ReviewFileTest {

    static final ZoneId ZONE = ZoneId.of("America/Toronto");
    static final String U1 = "urn:example:fernlea#FCU-01";
    static final String U2 = "urn:example:fernlea#FCU-02";
    static final KnownUnits UNITS = new KnownUnits(Map.of(U1, "FCU-01", U2, "FCU-02"));
    static final Instant T0 = Instant.parse("2031-06-20T04:00:00Z");

    static Verdict verdict(String unit, String kind, Instant start, long hours, Verdict.Decision d, String cause,
                           String note) {
        return new Verdict(0, unit, "cooling", kind, start, start.plusSeconds(3600 * hours),
                FindingIds.of(unit, "cooling", kind, start), d, cause, note, "A. Analyst", LocalDate.of(2031, 9, 2));
    }

    @Test
    void findingIdIsTheSha256OfItsKey() {
        // python3 -c "import hashlib; print(hashlib.sha256('urn:example:fernlea#FCU-01\x1fcooling\x1ffault_cluster
        //   \x1f2031-06-20T04:00:00Z'.encode()).hexdigest()[:12])"
        assertEquals("db649808f857", FindingIds.of(U1, "cooling", "fault_cluster", T0));
        assertTrue(FindingIds.wellFormed(FindingIds.of(U2, "any", "mode_hunting", T0)));
    }

    @Test
    void roundTrip(@TempDir Path dir) {
        List<Verdict> written = List.of(
                verdict(U1, "fault_cluster", T0, 30, Verdict.Decision.CONFIRMED, "discharge sensor, reads 2 K low",
                        "checked with a \"reference\" probe,\nsee log"),
                verdict(U2, "out_of_band_high", T0.plusSeconds(86_400), 5, Verdict.Decision.REJECTED, "",
                        "=SUM(A1) -2 K is the design"),
                verdict(U2, "fault_cluster", T0, 48, Verdict.Decision.NOT_SURE, "-leak?", "@later"),
                new Verdict(0, U1, "any", "mode_hunting", T0, T0.plusSeconds(7200), "", Verdict.Decision.REJECTED,
                        "", "", "", null));
        Path file = dir.resolve("review.csv");
        ReviewFile.write(file, written, ZONE);
        List<Verdict> read = ReviewFile.read(file, UNITS);
        assertEquals(written.size(), read.size());
        for (int i = 0; i < written.size(); i++) {
            Verdict w = written.get(i);
            Verdict r = read.get(i);
            assertEquals(w, new Verdict(0, r.unit(), r.mode(), r.kind(), r.start(), r.end(), r.findingId(),
                    r.decision(), r.cause(), r.note(), r.reviewer(), r.date()), "row " + i);
        }
        assertEquals(List.of(2L, 4L, 5L, 6L), read.stream().map(Verdict::line).toList(),
                "lines, the quoted line break counted");
        // Written again from what was read: the same bytes.
        Path again = dir.resolve("again.csv");
        ReviewFile.write(again, read, ZONE);
        assertEquals(ReviewFile.text(written, ZONE), ReviewFile.text(read, ZONE));
    }

    @Test
    void columnsInAnyOrderLabelsForUnitsAndSpreadsheetSpellings(@TempDir Path dir) throws Exception {
        String id = FindingIds.of(U1, "cooling", "fault_cluster", T0);
        Path file = write(dir, "\ufeffverdict,unit,mode,kind,start,end,finding_id,cause,note,reviewer,date\r\n"
                + "Not Sure,FCU-01,cooling,fault_cluster,2031-06-20T00:00:00-04:00,2031-06-21T00:00:00-04:00," + id
                + ",,,,\r\n\r\n");
        List<Verdict> read = ReviewFile.read(file, UNITS);
        assertEquals(1, read.size());
        assertEquals(U1, read.get(0).unit());
        assertEquals(Verdict.Decision.NOT_SURE, read.get(0).decision());
        assertEquals(null, read.get(0).date());
    }

    @Test
    void badRowsAreOneLineErrorsNamingTheLine(@TempDir Path dir) throws Exception {
        String head = ReviewFile.HEADER + "\n";
        String good = U1 + ",cooling,fault_cluster,2031-06-20T00:00:00-04:00,2031-06-21T00:00:00-04:00,,confirmed,,,,"
                + "2031-09-02\n";
        expect(dir, "unit,mode,kind,start,end,finding_id,verdict,cause,note,reviewer,date,comment\n", ":1: unknown "
                + "column 'comment'");
        expect(dir, "unit,mode,kind,start,end,verdict,cause,note,reviewer,date\n", ":1: the header lacks the "
                + "column(s) finding_id");
        expect(dir, head + good + good.replace("2031-09-02", "9/2/2031"), ":3: column date: '9/2/2031' is not a "
                + "date");
        expect(dir, head + good + good.replace(U1, "FCU-77"), ":3: unit FCU-77 is not a unit of this fleet");
        expect(dir, head + good.replace("confirmed", "maybe"), ":2: column verdict: 'maybe' is not a verdict");
        expect(dir, head + good.replace("2031-06-20T00:00:00-04:00", "2031-06-20 00:00"), ":2: column start:");
        expect(dir, head + good.replace("2031-06-21T00:00:00-04:00", "2031-06-19T00:00:00-04:00"), ":2: end must "
                + "be after start");
        expect(dir, head + good.replace(",,confirmed", ",0123456789ab,confirmed"), ":2: finding_id 0123456789ab is "
                + "not the id of this row's unit");
        expect(dir, head + good.replace(",,confirmed", ",xyz,confirmed"), ":2: column finding_id: 'xyz'");
        expect(dir, head + good + good, ":3: a second verdict on the finding of line 2");
        expect(dir, head + good.replace("cooling", "Cooling Mode"), ":2: column mode:");
        expect(dir, head + good.replace(",2031-09-02", ""), ":2: expected 11 fields, found 10");
        assertThrows(InputException.class, () -> ReviewFile.read(dir.resolve("absent.csv"), UNITS));
    }

    private static void expect(Path dir, String text, String message) throws Exception {
        Path file = write(dir, text);
        InputException e = assertThrows(InputException.class, () -> ReviewFile.read(file, UNITS));
        assertTrue(e.getMessage().startsWith(file.toString()) && e.getMessage().contains(message), e.getMessage());
        assertEquals(1, e.getMessage().lines().count(), e.getMessage());
    }

    private static Path write(Path dir, String text) throws Exception {
        Path f = dir.resolve("review.csv");
        Files.writeString(f, text, StandardCharsets.UTF_8);
        return f;
    }
}
