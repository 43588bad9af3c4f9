package org.tufa.analysis.fleet;

import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;

/** Formatting shared by tufa's CSV outputs: ISO-8601 times with offset, numbers that read back exactly. */
final class Csv {

    private static final DateTimeFormatter ISO = DateTimeFormatter.ISO_OFFSET_DATE_TIME;

    private Csv() {
    }

    static String time(Instant t, ZoneId zone) {
        return ISO.format(t.atZone(zone).toOffsetDateTime());
    }

    /** A decimal that parses back to the same double (Double.toString); inf/-inf/nan as numpy and pandas read them. */
    static String number(double v) {
        if (Double.isNaN(v)) {
            return "nan";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        return Double.toString(v);
    }

    /** A rounded figure for tables people read. */
    static String fixed(double v, int decimals) {
        if (Double.isNaN(v)) {
            return "";
        }
        return String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    /**
     * One CSV field of text, quoted when it holds a comma, quote or line break (RFC 4180), with a leading apostrophe
     * when a spreadsheet would run it as a formula ({@link org.tufa.common.CsvCells}).
     */
    static String field(String text) {
        if (text == null) {
            return "";
        }
        String s = org.tufa.common.CsvCells.neutral(text);
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
