package org.tufa.analysis.trends;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SortedSet;
import java.util.TreeSet;
import java.util.zip.GZIPInputStream;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.tufa.common.InputException;

/**
 * Reads trend CSV files (long or wide, plain or gzip) into a {@link SpillStore}, counting everything it does not
 * keep. One instance per ingest; single-threaded.
 *
 * <p>Hot path: lines are split on commas and parsed straight from the bytes. A line holding a double quote goes
 * through Commons CSV instead (RFC 4180 quoting), so quoted fields are read correctly, only more slowly. A quoted
 * field cannot span lines.
 */
final class TrendReader {

    private static final int MAX_EXAMPLES = 5;
    private static final CSVFormat CSV = CSVFormat.RFC4180;

    private final Map<String, Integer> seriesIndex;
    private final String[] seriesIds;
    private final SeriesKind[] kinds;
    /** Plausible range of each series, null when its unit has none. */
    private final PlausibleRange[] ranges;
    /** Time and value of each series' previous stored sample in reading order, for the duplicate check. */
    private final long[] previousTime;
    private final double[] previousValue;
    /** Series whose samples did not come in time order: duplicates are looked for after reading. */
    private final boolean[] outOfOrder;
    /** Per series, the duplicates and conflicts counted while reading (the after-reading check recounts them). */
    private final long[] seriesDuplicates;
    private final long[] seriesConflicts;
    private final SpillStore spill;
    private final java.time.ZoneId zone;
    private final boolean strict;
    private final long keepFrom;
    private final long keepTo;
    private final long[] firstTime;
    private final long[] lastTime;
    private final SortedSet<String> unknownSeries = new TreeSet<>();
    private final TimestampParser stamp = new TimestampParser();

    // Per-file state.
    private Path file;
    private long rows;
    private long kept;
    private long outsideWindow;
    private long unknownSamples;
    private long unparsableValues;
    private long unparsableTimestamps;
    private long malformedRows;
    private long emptyValues;
    private long nonFiniteValues;
    private long implausibleValues;
    private long duplicateSamples;
    private long conflictingDuplicates;
    private long firstStamp;
    private long lastStamp;
    private List<String> examples;
    private int[] fieldStarts = new int[64];
    private int[] fieldEnds = new int[64];
    private byte[] quotedLine = new byte[1024];
    /** Whether the fields of the current line point into {@link #quotedLine} rather than the line buffer. */
    private boolean isQuoted;

    TrendReader(String[] seriesIds, SeriesKind[] kinds, PlausibleRange[] ranges, SpillStore spill,
            TimeOptions options) {
        this.seriesIds = seriesIds;
        this.kinds = kinds;
        this.ranges = ranges;
        this.previousTime = new long[seriesIds.length];
        this.previousValue = new double[seriesIds.length];
        this.outOfOrder = new boolean[seriesIds.length];
        this.seriesDuplicates = new long[seriesIds.length];
        this.seriesConflicts = new long[seriesIds.length];
        Arrays.fill(previousTime, Long.MIN_VALUE);
        this.spill = spill;
        this.zone = options.zone();
        this.strict = options.strict();
        this.seriesIndex = new HashMap<>();
        for (int i = 0; i < seriesIds.length; i++) {
            seriesIndex.put(seriesIds[i], i);
        }
        long maxGap = options.maxGap().getSeconds();
        this.keepFrom = options.from() == null ? Long.MIN_VALUE : options.from().getEpochSecond() - maxGap;
        this.keepTo = options.to() == null ? Long.MAX_VALUE : options.to().getEpochSecond();
        this.firstTime = new long[seriesIds.length];
        this.lastTime = new long[seriesIds.length];
        Arrays.fill(firstTime, Long.MAX_VALUE);
        Arrays.fill(lastTime, Long.MIN_VALUE);
    }

    SortedSet<String> unknownSeries() {
        return unknownSeries;
    }

    /** Whether the series' samples came out of time order (so duplicates may remain in the spill). */
    boolean outOfOrder(int series) {
        return outOfOrder[series];
    }

    /** Exact duplicates of the series counted while reading. */
    long duplicatesCounted(int series) {
        return seriesDuplicates[series];
    }

    /** Conflicting duplicates of the series counted while reading. */
    long conflictsCounted(int series) {
        return seriesConflicts[series];
    }

    /** Earliest stored sample time of each series, Long.MAX_VALUE when none. */
    long[] firstTimes() {
        return firstTime;
    }

    /** Latest stored sample time of each series, Long.MIN_VALUE when none. */
    long[] lastTimes() {
        return lastTime;
    }

    FileReport read(Path path) {
        file = path;
        rows = kept = outsideWindow = unknownSamples = unparsableValues = unparsableTimestamps = malformedRows = 0;
        emptyValues = nonFiniteValues = implausibleValues = duplicateSamples = conflictingDuplicates = 0;
        firstStamp = Long.MAX_VALUE;
        lastStamp = Long.MIN_VALUE;
        examples = new ArrayList<>();
        try (InputStream in = open(path)) {
            return readLines(new LineSource(in));
        } catch (IOException e) {
            throw InputException.in(path, "cannot be read (" + e.getMessage()
                    + "); check that it is a complete CSV or gzip-compressed CSV file");
        }
    }

    private static InputStream open(Path path) throws IOException {
        BufferedInputStream in = new BufferedInputStream(Files.newInputStream(path), 1 << 16);
        in.mark(2);
        int b0 = in.read();
        int b1 = in.read();
        in.reset();
        // gzip magic number 1f 8b (RFC 1952, section 2.3.1), whatever the file is called.
        if (b0 == 0x1f && b1 == 0x8b) {
            return new GZIPInputStream(in, 1 << 16);
        }
        return in;
    }

    private FileReport readLines(LineSource lines) throws IOException {
        if (!lines.next()) {
            throw InputException.in(file, "is empty; expected a header row with a 'timestamp' column");
        }
        byte[] b = lines.buffer();
        int headerStart = lines.start();
        if (lines.end() - headerStart >= 2 && ((b[headerStart] & 0xff) == 0xFF && (b[headerStart + 1] & 0xff) == 0xFE
                || (b[headerStart] & 0xff) == 0xFE && (b[headerStart + 1] & 0xff) == 0xFF)) {
            throw InputException.in(file, "is UTF-16 encoded; save the trends as UTF-8 (or ASCII) CSV");
        }
        String utf16 = org.tufa.common.Printable.utf16WithoutBom(b, headerStart, lines.end());
        if (utf16 != null) {
            throw InputException.in(file, "looks " + utf16 + " encoded (no byte-order mark); save the trends as UTF-8 "
                    + "(or ASCII) CSV");
        }
        if (org.tufa.common.Printable.looksBinary(b, headerStart, lines.end())) {
            throw InputException.in(file, "is not a text CSV file (its first line holds binary data); pass trend "
                    + "CSV files (.csv, or gzip-compressed .csv.gz)");
        }
        // A UTF-8 byte order mark (EF BB BF), as some spreadsheet exports write, is not part of the first name.
        if (lines.end() - headerStart >= 3 && (b[headerStart] & 0xff) == 0xEF && (b[headerStart + 1] & 0xff) == 0xBB
                && (b[headerStart + 2] & 0xff) == 0xBF) {
            headerStart += 3;
        }
        String headerLine = new String(b, headerStart, lines.end() - headerStart, StandardCharsets.UTF_8);
        List<String> header = parseHeader(headerLine);
        int timestampColumn = -1;
        int pointColumn = -1;
        int valueColumn = -1;
        for (int j = 0; j < header.size(); j++) {
            switch (header.get(j).toLowerCase(Locale.ROOT)) {
                case "timestamp" -> timestampColumn = j;
                case "point" -> pointColumn = j;
                case "value" -> valueColumn = j;
                default -> {
                }
            }
        }
        if (timestampColumn < 0) {
            throw InputException.at(file, 1, "the header has no 'timestamp' column (found: " + abbreviate(headerLine)
                    + "); a trend file needs 'timestamp,point,value' (long) or 'timestamp,<series>,...' (wide)");
        }
        TrendFormat format = header.size() == 3 && pointColumn >= 0 && valueColumn >= 0
                ? TrendFormat.LONG : TrendFormat.WIDE;
        Tally dst = format == TrendFormat.LONG
                ? readLong(lines, header.size(), timestampColumn, pointColumn, valueColumn)
                : readWide(lines, header, timestampColumn);
        return new FileReport(file, format, rows, kept, outsideWindow, unknownSamples, unparsableValues,
                unparsableTimestamps, malformedRows, examples, dst.first, dst.second, dst.skipped, emptyValues,
                nonFiniteValues, implausibleValues, duplicateSamples, conflictingDuplicates, firstStamp, lastStamp);
    }

    private List<String> parseHeader(String headerLine) {
        if (headerLine.isBlank()) {
            throw InputException.at(file, 1, "the first line is blank; it must be the header row with a 'timestamp' column");
        }
        List<String> names = new ArrayList<>();
        try (CSVParser parser = CSVParser.parse(new StringReader(headerLine), CSV)) {
            for (CSVRecord record : parser) {
                for (String name : record) {
                    names.add(name.trim());
                }
                break;
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw InputException.at(file, 1, "the header row is not valid CSV (" + e.getMessage()
                    + "); check its quotes");
        }
        SortedSet<String> seen = new TreeSet<>();
        for (int j = 0; j < names.size(); j++) {
            String name = names.get(j);
            if (name.isEmpty()) {
                throw new InputException(file + ":1:" + (j + 1) + ": header column " + (j + 1)
                        + " has no name; name every column (timestamp, then series ids)");
            }
            if (!seen.add(name)) {
                throw new InputException(file + ":1:" + (j + 1) + ": column name '" + name
                        + "' appears twice in the header; each series needs its own column");
            }
        }
        return names;
    }

    /** DST counters summed over the resolvers of one file. */
    private static final class Tally {
        long first;
        long second;
        long skipped;

        void add(LocalTimeResolver resolver) {
            if (resolver != null) {
                first += resolver.repeatedFirstPass;
                second += resolver.repeatedSecondPass;
                skipped += resolver.skipped;
            }
        }
    }

    private Tally readWide(LineSource lines, List<String> header, int timestampColumn) throws IOException {
        int columns = header.size();
        int[] columnSeries = new int[columns];
        for (int j = 0; j < columns; j++) {
            Integer index = j == timestampColumn ? null : seriesIndex.get(header.get(j));
            columnSeries[j] = index == null ? -1 : index;
            if (j != timestampColumn && index == null) {
                unknownSeries.add(header.get(j));
            }
        }
        columnSeries[timestampColumn] = -1;
        LocalTimeResolver resolver = zone == null ? null : new LocalTimeResolver(zone);
        while (lines.next()) {
            byte[] line = lines.buffer();
            int fields = splitLine(lines, columns);
            if (fields < 0) {
                continue;
            }
            if (isQuoted) {
                line = quotedLine;
            }
            long lineNumber = lines.lineNumber();
            rows++;
            if (fields > columns) {
                malformed(lineNumber, columns + 1, "row has more fields than the header's " + columns
                        + " columns; the row is skipped");
                continue;
            }
            long time = readTime(line, timestampColumn, lineNumber, resolver);
            if (time == Long.MIN_VALUE) {
                continue;
            }
            boolean inWindow = time >= keepFrom && time < keepTo;
            for (int j = 0; j < fields; j++) {
                if (j == timestampColumn) {
                    continue;
                }
                int s = trimStart(line, fieldStarts[j], fieldEnds[j]);
                int e = trimEnd(line, s, fieldEnds[j]);
                int series = columnSeries[j];
                if (s == e) {
                    if (series >= 0) {
                        emptyValues++;
                        strictOnly(lineNumber, j + 1, "the value of series " + seriesIds[series] + " is empty",
                                "fill it in or remove the row");
                    }
                    continue;
                }
                if (series < 0) {
                    unknownSamples++;
                } else if (!inWindow) {
                    outsideWindow++;
                } else {
                    store(series, time, line, s, e, lineNumber, j + 1);
                }
            }
            if (fields < columns) {
                malformed(lineNumber, fields + 1, "row has " + fields + " fields but the header has " + columns
                        + "; the missing fields are read as empty");
            }
        }
        Tally tally = new Tally();
        tally.add(resolver);
        return tally;
    }

    private Tally readLong(LineSource lines, int columns, int timestampColumn, int pointColumn, int valueColumn)
            throws IOException {
        LocalTimeResolver[] resolvers = new LocalTimeResolver[seriesIds.length];
        byte[] lastPoint = new byte[0];
        int lastPointSeries = -1;
        while (lines.next()) {
            byte[] line = lines.buffer();
            int fields = splitLine(lines, columns);
            if (fields < 0) {
                continue;
            }
            if (isQuoted) {
                line = quotedLine;
            }
            long lineNumber = lines.lineNumber();
            rows++;
            if (fields != columns) {
                malformed(lineNumber, Math.min(fields, columns) + 1, "row has " + fields
                        + " fields but a long trend file has 3 (timestamp,point,value); the row is skipped");
                continue;
            }
            int ps = trimStart(line, fieldStarts[pointColumn], fieldEnds[pointColumn]);
            int pe = trimEnd(line, ps, fieldEnds[pointColumn]);
            int vs = trimStart(line, fieldStarts[valueColumn], fieldEnds[valueColumn]);
            int ve = trimEnd(line, vs, fieldEnds[valueColumn]);
            int series;
            if (Arrays.equals(line, ps, pe, lastPoint, 0, lastPoint.length)) {
                series = lastPointSeries;
            } else {
                String id = new String(line, ps, pe - ps, StandardCharsets.UTF_8);
                Integer index = seriesIndex.get(id);
                series = index == null ? -1 : index;
                if (index == null) {
                    unknownSeries.add(id);
                }
                lastPoint = Arrays.copyOfRange(line, ps, pe);
                lastPointSeries = series;
            }
            if (series < 0) {
                // Counted and named, never refused, even in strict mode: an export holds many series no analysed
                // unit reads (humidity, alarms), and the reader cannot tell them from series of no model.
                unknownSamples++;
                continue;
            }
            if (vs == ve) {
                emptyValues++;
                strictOnly(lineNumber, valueColumn + 1, "the value of series " + seriesIds[series] + " is empty",
                        "fill it in or remove the row");
                continue;
            }
            if (resolvers[series] == null && zone != null) {
                resolvers[series] = new LocalTimeResolver(zone);
            }
            long time = readTime(line, timestampColumn, lineNumber, resolvers[series]);
            if (time == Long.MIN_VALUE) {
                continue;
            }
            if (time < keepFrom || time >= keepTo) {
                outsideWindow++;
                continue;
            }
            store(series, time, line, vs, ve, lineNumber, valueColumn + 1);
        }
        Tally tally = new Tally();
        for (LocalTimeResolver resolver : resolvers) {
            tally.add(resolver);
        }
        return tally;
    }

    /**
     * Parses and stores one value, or counts why not: unparsable, non-finite, outside the plausible range of its
     * unit. A second sample of the series at the same time is stored and counted (an exact duplicate, or a
     * conflict).
     */
    private void store(int series, long time, byte[] line, int s, int e, long lineNumber, int column) {
        double value = kinds[series] == SeriesKind.BINARY ? ValueParser.binary(line, s, e) : ValueParser.number(line, s, e);
        if (Double.isNaN(value)) {
            if (ValueParser.isNonFinite(line, s, e)) {
                nonFiniteValues++;
                problem(lineNumber, column, "value '" + text(line, s, e) + "' of series " + seriesIds[series]
                        + " is not a finite number", "correct the value or leave the field empty");
                return;
            }
            unparsableValues++;
            String what = "value '" + text(line, s, e) + "' of series " + seriesIds[series] + " is not a number"
                    + (kinds[series] == SeriesKind.BINARY ? " nor true/false, on/off, active/inactive, run/stop" : "");
            problem(lineNumber, column, what, "correct the value or leave the field empty");
            return;
        }
        PlausibleRange range = ranges[series];
        if (range != null && !range.contains(value)) {
            implausibleValues++;
            problem(lineNumber, column, "value " + text(line, s, e) + " of series " + seriesIds[series]
                    + " is outside the plausible range " + range.min() + ".." + range.max() + " of its unit",
                    "correct the value or the point's unit");
            return;
        }
        if (time == previousTime[series]) {
            // Both are kept (averaged in their grid cell, as any two samples in one cell are), and counted.
            if (Double.compare(value, previousValue[series]) == 0) {
                duplicateSamples++;
                seriesDuplicates[series]++;
            } else {
                conflictingDuplicates++;
                seriesConflicts[series]++;
                problem(lineNumber, column, "series " + seriesIds[series] + " has a second value (" + text(line, s, e)
                        + ", the first was " + previousValue[series] + ") at " + java.time.Instant.ofEpochSecond(time)
                        + "; both are kept and averaged", "remove one of the two rows");
            }
        } else if (time < previousTime[series]) {
            outOfOrder[series] = true;
        }
        previousTime[series] = time;
        previousValue[series] = value;
        spill.add(series, time, value);
        kept++;
        if (time < firstTime[series]) {
            firstTime[series] = time;
        }
        if (time > lastTime[series]) {
            lastTime[series] = time;
        }
    }

    /** Epoch seconds of the row's time stamp, or Long.MIN_VALUE when unreadable (counted). */
    private long readTime(byte[] line, int column, long lineNumber, LocalTimeResolver resolver) {
        int s = trimStart(line, fieldStarts[column], fieldEnds[column]);
        int e = trimEnd(line, s, fieldEnds[column]);
        if (!stamp.parse(line, s, e)) {
            unparsableTimestamps++;
            if (looksEpoch(line, s, e)) {
                problem(lineNumber, column + 1, "time stamp '" + text(line, s, e) + "' looks like a Unix epoch time "
                        + "(seconds or milliseconds since 1970); tufa reads ISO 8601 stamps such as "
                        + "2031-07-01T08:15:00Z", "convert the time stamp column");
            } else {
                problem(lineNumber, column + 1, "time stamp '" + text(line, s, e) + "' is neither ISO 8601 with an "
                        + "offset (2031-07-01T08:15:00-04:00) nor local (2031-07-01 08:15)", "correct the time stamp");
            }
            return Long.MIN_VALUE;
        }
        long time = stamp.seconds;
        if (stamp.naive) {
            if (resolver == null) {
                throw new InputException(file + ":" + lineNumber + ":" + (column + 1) + ": time stamp '"
                        + text(line, s, e) + "' has no UTC offset; pass --timezone with the zone the controllers"
                        + " logged in (e.g. --timezone America/Toronto)");
            }
            time = resolver.toEpochSecond(time);
        }
        if (time < firstStamp) {
            firstStamp = time;
        }
        if (time > lastStamp) {
            lastStamp = time;
        }
        if (!spill.fits(time)) {
            unparsableTimestamps++;
            problem(lineNumber, column + 1, "time stamp '" + text(line, s, e)
                    + "' is outside the supported years 1932-2067", "correct the time stamp");
            return Long.MIN_VALUE;
        }
        return time;
    }

    /**
     * Splits the current line into {@code fieldStarts/fieldEnds}; returns the number of fields (may exceed
     * {@code columns} by one, meaning "too many"), or -1 for a blank line. Sets {@link #isQuoted} when the fields
     * point into {@link #quotedLine} rather than the line buffer.
     */
    private int splitLine(LineSource lines, int columns) {
        byte[] b = lines.buffer();
        int start = lines.start();
        int end = lines.end();
        isQuoted = false;
        if (trimStart(b, start, end) == end) {
            return -1;
        }
        ensureFieldCapacity(columns + 1);
        int fields = 0;
        fieldStarts[0] = start;
        for (int i = start; i < end; i++) {
            byte c = b[i];
            if (c == ',') {
                fieldEnds[fields] = i;
                fields++;
                if (fields > columns) {
                    return fields;
                }
                fieldStarts[fields] = i + 1;
            } else if (c == '"') {
                return splitQuoted(lines, columns);
            }
        }
        fieldEnds[fields] = end;
        return fields + 1;
    }

    private int splitQuoted(LineSource lines, int columns) {
        String text = new String(lines.buffer(), lines.start(), lines.end() - lines.start(), StandardCharsets.UTF_8);
        List<String> fields = new ArrayList<>();
        try (CSVParser parser = CSVParser.parse(new StringReader(text), CSV)) {
            for (CSVRecord record : parser) {
                record.forEach(fields::add);
                break;
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            rows++;
            malformed(lines.lineNumber(), 1, "row is not valid CSV (" + e.getMessage() + "); the row is skipped");
            return -1;
        }
        ensureFieldCapacity(Math.max(columns + 1, fields.size()));
        int length = 0;
        byte[][] encoded = new byte[fields.size()][];
        for (int i = 0; i < encoded.length; i++) {
            encoded[i] = fields.get(i).getBytes(StandardCharsets.UTF_8);
            length += encoded[i].length;
        }
        if (quotedLine.length < length) {
            quotedLine = new byte[Math.max(length, quotedLine.length * 2)];
        }
        int p = 0;
        for (int i = 0; i < encoded.length; i++) {
            fieldStarts[i] = p;
            System.arraycopy(encoded[i], 0, quotedLine, p, encoded[i].length);
            p += encoded[i].length;
            fieldEnds[i] = p;
        }
        isQuoted = true;
        return Math.min(encoded.length, columns + 1);
    }

    private void ensureFieldCapacity(int n) {
        if (fieldStarts.length < n) {
            fieldStarts = new int[n];
            fieldEnds = new int[n];
        }
    }

    private void malformed(long lineNumber, int column, String what) {
        malformedRows++;
        problem(lineNumber, column, what, "fix the row so that it has one field per header column");
    }

    /** A problem that is counted without an example, and refused in strict mode. */
    private void strictOnly(long lineNumber, int column, String what, String todo) {
        if (strict) {
            throw new InputException(file + ":" + lineNumber + ":" + column + ": " + what + "; " + todo
                    + " (or read without strict mode to count and skip such problems)");
        }
    }

    private void problem(long lineNumber, int column, String what, String todo) {
        String place = file + ":" + lineNumber + ":" + column;
        if (strict) {
            throw new InputException(place + ": " + what + "; " + todo
                    + " (or read without strict mode to count and skip such problems)");
        }
        if (examples.size() < MAX_EXAMPLES) {
            examples.add(place + ": " + what);
        }
    }

    private static int trimStart(byte[] b, int s, int e) {
        while (s < e && (b[s] == ' ' || b[s] == '\t')) {
            s++;
        }
        return s;
    }

    private static int trimEnd(byte[] b, int s, int e) {
        while (e > s && (b[e - 1] == ' ' || b[e - 1] == '\t')) {
            e--;
        }
        return e;
    }

    private static String text(byte[] b, int s, int e) {
        return abbreviate(new String(b, s, e - s, StandardCharsets.UTF_8));
    }

    private static String abbreviate(String s) {
        return org.tufa.common.Printable.excerpt(s);
    }

    /** Nine to thirteen digits, optionally with a fraction: seconds or milliseconds since 1970. */
    private static boolean looksEpoch(byte[] b, int s, int e) {
        int digits = 0;
        int p = s;
        while (p < e && b[p] >= '0' && b[p] <= '9') {
            digits++;
            p++;
        }
        if (p < e && b[p] == '.') {
            p++;
            while (p < e && b[p] >= '0' && b[p] <= '9') {
                p++;
            }
        }
        return p == e && digits >= 9 && digits <= 13;
    }
}
