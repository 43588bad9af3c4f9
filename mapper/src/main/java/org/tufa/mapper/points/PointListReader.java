package org.tufa.mapper.points;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.TreeMap;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.tufa.common.InputException;

/**
 * Reads a BAS point-list export (CSV) into {@link PointRecord}s.
 *
 * <p>Accepts comma, semicolon or tab as delimiter (the one that occurs most often, outside quotes, in the header
 * line; comma on a tie), UTF-8 with or without byte-order mark, RFC 4180 quoting, blank lines anywhere. Columns are
 * found by header name, ignoring case, spaces and punctuation (see the *_HEADERS lists), unless fixed in
 * {@link ReadOptions}. Every problem is an {@link InputException} naming the file and line.
 */
public final class PointListReader {

    /** Longest physical line accepted: a point-list row is far shorter; longer means a broken or wrong file. */
    public static final int MAX_LINE_CHARS = 100_000;
    /** Largest file accepted (a million-point export is ~100 MB). */
    public static final long MAX_FILE_BYTES = 512L * 1024 * 1024;

    static final List<String> NAME_HEADERS = List.of("pointname", "name", "objectname", "point", "tagname",
            "pointlabel", "label", "tag");
    static final List<String> DESCRIPTION_HEADERS = List.of("description", "desc", "objectdescription",
            "pointdescription", "comment");
    static final List<String> UNITS_HEADERS = List.of("units", "unit", "engineeringunits", "engunits", "eu", "uom");
    static final List<String> TYPE_HEADERS = List.of("objecttype", "bacnetobjecttype", "bacnettype", "objtype",
            "type", "pointtype");
    static final List<String> DEVICE_HEADERS = List.of("device", "controller", "devicename", "deviceinstance",
            "deviceid", "controllername");
    static final List<String> SERIES_HEADERS = List.of("trendid", "seriesid", "timeseriesid", "trend", "historyid",
            "trendlog", "series", "logid");

    private static final java.util.regex.Pattern STARTLINE = java.util.regex.Pattern.compile("startline (\\d+)");

    private PointListReader() {
    }

    /** Reads and parses the file. */
    public static PointList read(Path file, ReadOptions options) {
        byte[] bytes = readBytes(file);
        return parse(file, bytes, options);
    }

    static byte[] readBytes(Path file) {
        if (Files.isDirectory(file)) {
            throw InputException.in(file, "is a directory; give the point-list CSV file");
        }
        if (!Files.exists(file)) {
            throw InputException.in(file, "point list not found; check the path given with --points");
        }
        try {
            long size = Files.size(file);
            if (size > MAX_FILE_BYTES) {
                throw InputException.in(file, "is " + size + " bytes, over the " + MAX_FILE_BYTES
                        + "-byte limit for a point list; split the export by building or system");
            }
            return Files.readAllBytes(file);
        } catch (IOException e) {
            throw InputException.in(file, "cannot be read (" + e.getClass().getSimpleName()
                    + "); check that the file exists and is readable");
        }
    }

    /** Parses bytes already read from {@code file} (the path is only used in messages). */
    public static PointList parse(Path file, byte[] bytes, ReadOptions options) {
        int start = 0;
        if (bytes.length >= 2 && ((bytes[0] & 0xFF) == 0xFF && (bytes[1] & 0xFF) == 0xFE
                || (bytes[0] & 0xFF) == 0xFE && (bytes[1] & 0xFF) == 0xFF)) {
            throw InputException.in(file, "is UTF-16 encoded; re-export the point list as UTF-8 CSV");
        }
        String utf16 = org.tufa.common.Printable.utf16WithoutBom(bytes, 0, bytes.length);
        if (utf16 != null) {
            throw InputException.in(file, "looks " + utf16 + " encoded (no byte-order mark); re-export the point "
                    + "list as UTF-8 CSV");
        }
        if (org.tufa.common.Printable.looksBinary(bytes, 0, Math.min(bytes.length, 4096))) {
            throw InputException.in(file, "is not a text CSV file (it holds binary data); give the point-list "
                    + "export (CSV)");
        }
        if (bytes.length >= 3 && (bytes[0] & 0xFF) == 0xEF && (bytes[1] & 0xFF) == 0xBB && (bytes[2] & 0xFF) == 0xBF) {
            start = 3;
        }
        checkLineLengths(file, bytes, start);
        String text = decodeUtf8(file, bytes, start);
        if (text.isBlank()) {
            throw InputException.in(file, "is empty; export the point list with a header row and one row per point");
        }
        int[] lineStarts = lineStarts(text);
        char delimiter = options.delimiter().orElseGet(() -> detectDelimiter(firstNonBlankLine(text)));
        CSVFormat format = CSVFormat.RFC4180.builder().setDelimiter(delimiter).setIgnoreEmptyLines(true)
                .setIgnoreSurroundingSpaces(true).setTrim(true).get();
        List<CSVRecord> records = new ArrayList<>();
        try (CSVParser parser = CSVParser.parse(new StringReader(text), format)) {
            try {
                for (CSVRecord r : parser) {
                    records.add(r);
                }
            } catch (UncheckedIOException | IllegalStateException e) {
                // Commons CSV names the line where the unclosed quoted field started ("(startline 5)"); the
                // parser's current line is where it gave up, often the end of the file.
                java.util.regex.Matcher started = STARTLINE.matcher(String.valueOf(firstLine(e)));
                long line = started.find() ? Long.parseLong(started.group(1))
                        : Math.max(1, parser.getCurrentLineNumber());
                if (started.find(0)) {
                    throw InputException.at(file, line, "a double quote opened on this line is never closed; close "
                            + "it, or double it (\"\") if it is part of the text, or pass --delimiter if the guess '"
                            + printable(delimiter) + "' is wrong");
                }
                throw InputException.at(file, line, "broken CSV quoting (" + firstLine(e) + "); check for an "
                        + "unclosed double quote near this line, or pass --delimiter if the guess '"
                        + printable(delimiter) + "' is wrong");
            }
        } catch (IOException e) {
            throw InputException.in(file, "cannot be parsed as CSV (" + e.getMessage() + ")");
        }
        if (records.isEmpty()) {
            throw InputException.in(file, "is empty; export the point list with a header row and one row per point");
        }
        List<String> headers = new ArrayList<>();
        for (String h : records.get(0)) {
            headers.add(h);
        }
        long headerLine = lineOf(lineStarts, skipLineBreaks(text, records.get(0).getCharacterPosition()));
        ColumnMap columns = mapColumns(file, headerLine, headers, options, delimiter);
        int nameIdx = headers.indexOf(columns.name());
        int descIdx = columns.description().map(headers::indexOf).orElse(-1);
        int unitsIdx = columns.units().map(headers::indexOf).orElse(-1);
        int typeIdx = columns.objectType().map(headers::indexOf).orElse(-1);
        int devIdx = columns.device().map(headers::indexOf).orElse(-1);
        int seriesIdx = columns.seriesId().map(headers::indexOf).orElse(-1);
        List<String> extraKeys = extraKeys(headers);
        List<PointRecord> points = new ArrayList<>(records.size());
        for (int i = 1; i < records.size(); i++) {
            CSVRecord r = records.get(i);
            long line = lineOf(lineStarts, skipLineBreaks(text, r.getCharacterPosition()));
            TreeMap<String, String> extras = new TreeMap<>();
            for (int c = 0; c < r.size(); c++) {
                if (c == nameIdx || c == descIdx || c == unitsIdx || c == typeIdx || c == devIdx || c == seriesIdx) {
                    continue;
                }
                String v = r.get(c);
                if (!v.isEmpty()) {
                    extras.put(c < extraKeys.size() ? extraKeys.get(c) : "column " + (c + 1), v);
                }
            }
            String rawType = field(r, typeIdx);
            points.add(new PointRecord(line, field(r, nameIdx), field(r, descIdx), field(r, unitsIdx),
                    ObjectTypes.normalise(rawType).orElse(""), rawType, field(r, devIdx), field(r, seriesIdx),
                    extras));
        }
        if (points.isEmpty()) {
            throw InputException.at(file, headerLine, "has a header but no point rows; export the points too");
        }
        return new PointList(file, delimiter, headers, columns, points);
    }

    private static String field(CSVRecord r, int idx) {
        return idx >= 0 && idx < r.size() ? r.get(idx) : "";
    }

    private static List<String> extraKeys(List<String> headers) {
        List<String> keys = new ArrayList<>();
        for (int i = 0; i < headers.size(); i++) {
            String h = headers.get(i).isEmpty() ? "column " + (i + 1) : headers.get(i);
            String k = h;
            int n = 2;
            while (keys.contains(k)) {
                k = h + " (" + n++ + ")";
            }
            keys.add(k);
        }
        return keys;
    }

    static ColumnMap mapColumns(Path file, long headerLine, List<String> headers, ReadOptions o, char delimiter) {
        String name = pick(file, headerLine, headers, o.nameColumn(), NAME_HEADERS, "--name-column")
                .orElseThrow(() -> InputException.at(file, headerLine, "no point-name column among the headers "
                        + headers + " (delimiter '" + printable(delimiter) + "'); name it 'Name' or "
                        + "'Point Name', or pass --name-column HEADER"
                        + (headers.size() == 1 ? ", or --delimiter if the guess is wrong" : "")));
        return new ColumnMap(name,
                pick(file, headerLine, headers, o.descriptionColumn(), DESCRIPTION_HEADERS, "--description-column"),
                pick(file, headerLine, headers, o.unitsColumn(), UNITS_HEADERS, "--units-column"),
                pick(file, headerLine, headers, o.typeColumn(), TYPE_HEADERS, "--type-column"),
                pick(file, headerLine, headers, o.deviceColumn(), DEVICE_HEADERS, "--device-column"),
                pick(file, headerLine, headers, o.seriesColumn(), SERIES_HEADERS, "--series-column"));
    }

    private static Optional<String> pick(Path file, long headerLine, List<String> headers, Optional<String> forced,
            List<String> known, String option) {
        if (forced.isPresent()) {
            for (String h : headers) {
                if (h.trim().equalsIgnoreCase(forced.get().trim())) {
                    return Optional.of(h);
                }
            }
            throw InputException.at(file, headerLine, option + " '" + forced.get() + "' is not a header; the "
                    + "headers are " + headers);
        }
        for (String k : known) {
            for (String h : headers) {
                if (normaliseHeader(h).equals(k)) {
                    return Optional.of(h);
                }
            }
        }
        return Optional.empty();
    }

    static String normaliseHeader(String h) {
        return h.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]", "");
    }

    /** The delimiter among , ; TAB seen most often outside double quotes in the header line; comma on a tie. */
    public static char detectDelimiter(String headerLine) {
        int comma = 0;
        int semi = 0;
        int tab = 0;
        boolean quoted = false;
        for (int i = 0; i < headerLine.length(); i++) {
            char c = headerLine.charAt(i);
            if (c == '"') {
                quoted = !quoted;
            } else if (!quoted) {
                if (c == ',') {
                    comma++;
                } else if (c == ';') {
                    semi++;
                } else if (c == '\t') {
                    tab++;
                }
            }
        }
        if (tab > comma && tab >= semi) {
            return '\t';
        }
        return semi > comma ? ';' : ',';
    }

    private static String firstNonBlankLine(String text) {
        return text.lines().filter(l -> !l.isBlank()).findFirst().orElse("");
    }

    private static void checkLineLengths(Path file, byte[] bytes, int start) {
        int lineStart = start;
        long line = 1;
        for (int i = start; i <= bytes.length; i++) {
            if (i == bytes.length || bytes[i] == '\n') {
                // bytes >= chars for UTF-8, so a byte count under the limit is always safe; over it, be exact enough
                if (i - lineStart > MAX_LINE_CHARS * 4L
                        || i - lineStart > MAX_LINE_CHARS && charCount(bytes, lineStart, i) > MAX_LINE_CHARS) {
                    throw InputException.at(file, line, "line is longer than " + MAX_LINE_CHARS + " characters ("
                            + (i - lineStart) + " bytes); a point-list row is much shorter: the line breaks may be "
                            + "lost or this is not a point list; re-export with one point per line");
                }
                lineStart = i + 1;
                line++;
            }
        }
    }

    private static int charCount(byte[] b, int from, int to) {
        int n = 0;
        for (int i = from; i < to; i++) {
            if ((b[i] & 0xC0) != 0x80) {
                n++;
            }
        }
        return n;
    }

    private static String decodeUtf8(Path file, byte[] bytes, int start) {
        CharsetDecoder dec = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes, start, bytes.length - start);
        CharBuffer out = CharBuffer.allocate(bytes.length - start + 1);
        CoderResult r = dec.decode(in, out, true);
        if (r.isError()) {
            int pos = in.position();
            long line = 1;
            for (int i = start; i < pos; i++) {
                if (bytes[i] == '\n') {
                    line++;
                }
            }
            throw InputException.at(file, line, String.format(Locale.ROOT, "byte 0x%02X is not UTF-8 (the file "
                    + "looks like Windows-1252 or Latin-1); re-export the point list as UTF-8 CSV", bytes[pos] & 0xFF));
        }
        dec.flush(out);
        out.flip();
        return out.toString();
    }

    private static int[] lineStarts(String text) {
        int[] starts = new int[16];
        int n = 0;
        starts[n++] = 0;
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) == '\n') {
                if (n == starts.length) {
                    starts = Arrays.copyOf(starts, n * 2);
                }
                starts[n++] = i + 1;
            }
        }
        return Arrays.copyOf(starts, n);
    }

    /** Commons CSV reports a record's position before the empty lines it skipped; step over them. */
    private static long skipLineBreaks(String text, long pos) {
        int p = (int) pos;
        while (p < text.length() && (text.charAt(p) == '\n' || text.charAt(p) == '\r')) {
            p++;
        }
        return p;
    }

    private static long lineOf(int[] lineStarts, long charPos) {
        int idx = Arrays.binarySearch(lineStarts, (int) charPos);
        return idx >= 0 ? idx + 1 : -idx - 1;
    }

    private static String firstLine(Throwable e) {
        Throwable t = e.getCause() != null ? e.getCause() : e;
        return String.valueOf(t.getMessage()).lines().findFirst().orElse("");
    }

    static String printable(char c) {
        return c == '\t' ? "TAB" : String.valueOf(c);
    }
}
