package org.tufa.analysis.review;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.tufa.analysis.fleet.Csv;
import org.tufa.common.CsvCells;
import org.tufa.common.InputException;
import org.tufa.common.OutputFiles;

/**
 * The review file, {@code review.csv}: one verdict per row, in the columns of {@link #COLUMNS}, comma-separated,
 * UTF-8, RFC 4180 quoting, so it can be kept in a spreadsheet as well as saved from the report.
 *
 * <ul>
 *   <li>{@code unit}: the unit's IRI as in findings.csv (its label or local name also do when only one unit has
 *       it);</li>
 *   <li>{@code mode}, {@code kind}, {@code start}, {@code end}: the finding, as in findings.csv (times ISO 8601
 *       with offset);</li>
 *   <li>{@code finding_id}: the finding's id ({@link FindingIds}), or empty for a row written by hand;</li>
 *   <li>{@code verdict}: {@code confirmed}, {@code rejected} or {@code not_sure};</li>
 *   <li>{@code cause}, {@code note}, {@code reviewer}: free text, may be empty;</li>
 *   <li>{@code date}: the day of the verdict, {@code 2031-09-02}, may be empty.</li>
 * </ul>
 * Columns may come in any order; every one must be there and no other. Text cells a spreadsheet would run as a
 * formula carry a leading apostrophe (OWASP CSV-injection guidance, {@link CsvCells}), removed on reading. Every
 * problem is a one-line error naming the file, the line and what to do.
 */
public final class ReviewFile {

    /** The columns, in the order tufa writes them. */
    public static final List<String> COLUMNS = List.of("unit", "mode", "kind", "start", "end", "finding_id",
            "verdict", "cause", "note", "reviewer", "date");
    public static final String HEADER = String.join(",", COLUMNS);

    private ReviewFile() {
    }

    /** Reads and checks a review file against the fleet's units. */
    public static List<Verdict> read(Path file, KnownUnits units) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "review file not found; pass the review.csv saved from the report "
                    + "(or written with the columns " + HEADER + ")");
        }
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true)
                .setIgnoreEmptyLines(true).get();
        List<Verdict> out = new ArrayList<>();
        Map<String, Long> seen = new HashMap<>();
        try (Reader reader = Files.newBufferedReader(file, StandardCharsets.UTF_8);
                CSVParser parser = CSVParser.builder().setReader(reader).setFormat(format).get()) {
            List<String> names = parser.getHeaderNames().stream()
                    .map(n -> n.startsWith("\ufeff") ? n.substring(1) : n).map(String::strip).toList();
            for (String n : names) {
                if (!COLUMNS.contains(n)) {
                    throw InputException.at(file, 1, "unknown column '" + org.tufa.common.Printable.excerpt(n)
                            + "'; a review file has exactly the columns " + HEADER);
                }
            }
            List<String> missing = COLUMNS.stream().filter(c -> !names.contains(c)).toList();
            if (!missing.isEmpty()) {
                throw InputException.at(file, 1, "the header lacks the column(s) " + String.join(", ", missing)
                        + "; a review file has the columns " + HEADER);
            }
            if (names.stream().distinct().count() != names.size()) {
                throw InputException.at(file, 1, "a column is named twice; a review file has the columns " + HEADER);
            }
            long previousEnd = parser.getCurrentLineNumber();
            for (CSVRecord r : parser) {
                // The record's first line (a quoted cell may hold line breaks; the parser counts to its last).
                long line = previousEnd + 1;
                previousEnd = parser.getCurrentLineNumber();
                if (r.size() != names.size()) {
                    throw InputException.at(file, line, "expected " + names.size() + " fields, found " + r.size()
                            + " (a cell with a comma needs quotes)");
                }
                Map<String, String> cells = new HashMap<>();
                for (int i = 0; i < names.size(); i++) {
                    cells.put(names.get(i), r.get(i));
                }
                Verdict v = verdict(file, line, cells, units);
                String key = v.findingId().isEmpty() ? v.unit() + '\u001f' + v.mode() + '\u001f' + v.kind() + '\u001f'
                        + v.start() + '\u001f' + v.end() : v.findingId();
                Long before = seen.putIfAbsent(key, line);
                if (before != null) {
                    throw InputException.at(file, line, "a second verdict on the finding of line " + before
                            + "; keep one row per finding");
                }
                out.add(v);
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        } catch (IllegalArgumentException | IllegalStateException e) {
            throw InputException.in(file, "not a valid CSV file: " + String.valueOf(e.getMessage()).replace('\n', ' '));
        }
        return List.copyOf(out);
    }

    private static Verdict verdict(Path file, long line, Map<String, String> c, KnownUnits units) {
        String unitName = CsvCells.restore(c.get("unit").strip());
        if (unitName.isEmpty()) {
            throw InputException.at(file, line, "column unit is empty; name the unit as in findings.csv");
        }
        KnownUnits.Resolved unit = units.resolve(unitName);
        if (unit.iri().isEmpty()) {
            throw InputException.at(file, line, unit.problem());
        }
        String mode = token(file, line, "mode", c.get("mode"));
        String kind = token(file, line, "kind", c.get("kind"));
        Instant start = time(file, line, "start", c.get("start"));
        Instant end = time(file, line, "end", c.get("end"));
        if (!end.isAfter(start)) {
            throw InputException.at(file, line, "end must be after start");
        }
        String id = c.get("finding_id").strip();
        if (!id.isEmpty()) {
            if (!FindingIds.wellFormed(id)) {
                throw InputException.at(file, line, "column finding_id: '" + org.tufa.common.Printable.excerpt(id)
                        + "' is not a finding id (12 hexadecimal digits, as in findings.csv); clear it for a row "
                        + "written by hand");
            }
            String expected = FindingIds.of(unit.iri().get(), mode, kind, start);
            if (!expected.equals(id)) {
                throw InputException.at(file, line, "finding_id " + id + " is not the id of this row's unit, mode, "
                        + "kind and start (that is " + expected + "); correct the row or clear the id");
            }
        }
        String verdictCell = c.get("verdict");
        Verdict.Decision decision = Verdict.Decision.parse(verdictCell);
        if (decision == null) {
            throw InputException.at(file, line, "column verdict: '" + org.tufa.common.Printable.excerpt(verdictCell)
                    + "' is not a verdict; write confirmed, rejected or not_sure (or delete the row)");
        }
        String dateCell = c.get("date").strip();
        LocalDate date = null;
        if (!dateCell.isEmpty()) {
            try {
                date = LocalDate.parse(dateCell);
            } catch (DateTimeParseException e) {
                throw InputException.at(file, line, "column date: '" + org.tufa.common.Printable.excerpt(dateCell)
                        + "' is not a date; write it as 2031-09-02 (ISO 8601), or leave it empty");
            }
        }
        return new Verdict(line, unit.iri().get(), mode, kind, start, end, id, decision,
                CsvCells.restore(c.get("cause").strip()), CsvCells.restore(c.get("note").strip()),
                CsvCells.restore(c.get("reviewer").strip()), date);
    }

    private static String token(Path file, long line, String column, String cell) {
        String t = cell.strip();
        if (t.isEmpty() || !t.chars().allMatch(ch -> ch >= 'a' && ch <= 'z' || ch >= '0' && ch <= '9' || ch == '_')) {
            throw InputException.at(file, line, "column " + column + ": '" + org.tufa.common.Printable.excerpt(t)
                    + "' is not a " + column + " as findings.csv writes it (lower-case letters, digits and _)");
        }
        return t;
    }

    private static Instant time(Path file, long line, String column, String cell) {
        try {
            return OffsetDateTime.parse(cell.strip()).toInstant();
        } catch (DateTimeParseException e) {
            throw InputException.at(file, line, "column " + column + ": '" + org.tufa.common.Printable.excerpt(cell)
                    + "' is not an ISO-8601 date-time with offset, e.g. 2031-06-01T00:15:00-04:00 (as in findings.csv)");
        }
    }

    /** The file's text: the header and one row per verdict, in the given order; times in {@code zone}. */
    public static String text(List<Verdict> verdicts, ZoneId zone) {
        StringBuilder b = new StringBuilder(HEADER).append('\n');
        for (Verdict v : verdicts) {
            b.append(Csv.field(v.unit())).append(',').append(v.mode()).append(',').append(v.kind()).append(',')
                    .append(Csv.time(v.start(), zone)).append(',').append(Csv.time(v.end(), zone)).append(',')
                    .append(v.findingId()).append(',').append(v.decision().word()).append(',')
                    .append(Csv.field(v.cause())).append(',').append(Csv.field(v.note())).append(',')
                    .append(Csv.field(v.reviewer())).append(',').append(v.date() == null ? "" : v.date().toString())
                    .append('\n');
        }
        return b.toString();
    }

    /** Writes the file (through {@link OutputFiles}: a temporary file renamed into place). */
    public static void write(Path file, List<Verdict> verdicts, ZoneId zone) {
        OutputFiles.writeString(file, text(verdicts, zone));
    }
}
