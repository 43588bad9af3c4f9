package org.tufa.analysis.fleet;

import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;

/** Formatting shared by tufa's fleet CSV outputs: ISO-8601 times with offset, rounded figures, quoted fields. */
final class Csv {

    private static final DateTimeFormatter ISO = DateTimeFormatter.ISO_OFFSET_DATE_TIME;

    private Csv() {
    }

    static String time(Instant t, ZoneId zone) {
        return ISO.format(t.atZone(zone).toOffsetDateTime());
    }

    /** A decimal that parses back to the same double; inf/-inf/nan as numpy and pandas read them. */
    static String number(double v) {
        return org.tufa.analysis.tables.SampleTable.csvNumber(v);
    }

    /** A rounded figure for tables people read. */
    static String fixed(double v, int decimals) {
        if (Double.isNaN(v)) {
            return "";
        }
        return String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    /** One CSV field, quoted when it holds a comma, quote or line break (RFC 4180). */
    static String field(String s) {
        if (s == null) {
            return "";
        }
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
