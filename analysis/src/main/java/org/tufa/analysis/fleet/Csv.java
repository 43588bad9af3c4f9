package org.tufa.analysis.fleet;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;

/** Formatting shared by tufa's CSV outputs: ISO-8601 times with offset, rounded figures, quoted fields. */
public final class Csv {

    private static final DateTimeFormatter ISO = DateTimeFormatter.ISO_OFFSET_DATE_TIME;

    private Csv() {
    }

    /**
     * ISO-8601 with offset, exactly as {@link DateTimeFormatter#ISO_OFFSET_DATE_TIME} writes it. Whole seconds,
     * whole-minute offsets and years 1-9999 (every trend grid) are written directly, without the formatter's
     * objects: a year of 1-minute samples is 525,600 stamps per unit file. Anything else goes to the formatter.
     */
    public static String time(Instant t, ZoneId zone) {
        int offset = zone.getRules().getOffset(t).getTotalSeconds();
        long local = t.getEpochSecond() + offset;
        if (t.getNano() != 0 || offset % 60 != 0 || local < FIRST_FAST || local >= END_FAST) {
            return ISO.format(t.atZone(zone).toOffsetDateTime());
        }
        LocalDate date = LocalDate.ofEpochDay(Math.floorDiv(local, 86_400));
        int second = (int) Math.floorMod(local, 86_400);
        char[] c = new char[offset == 0 ? 20 : 25];
        four(c, 0, date.getYear());
        c[4] = '-';
        two(c, 5, date.getMonthValue());
        c[7] = '-';
        two(c, 8, date.getDayOfMonth());
        c[10] = 'T';
        two(c, 11, second / 3600);
        c[13] = ':';
        two(c, 14, second / 60 % 60);
        c[16] = ':';
        two(c, 17, second % 60);
        if (offset == 0) {
            c[19] = 'Z';
        } else {
            int minutes = Math.abs(offset) / 60;
            c[19] = offset < 0 ? '-' : '+';
            two(c, 20, minutes / 60);
            c[22] = ':';
            two(c, 23, minutes % 60);
        }
        return new String(c);
    }

    /** 0001-01-01T00:00:00 and 10000-01-01T00:00:00 in local epoch seconds. */
    private static final long FIRST_FAST = LocalDate.of(1, 1, 1).toEpochDay() * 86_400;
    private static final long END_FAST = LocalDate.of(10_000, 1, 1).toEpochDay() * 86_400;

    private static void two(char[] c, int at, int v) {
        c[at] = (char) ('0' + v / 10);
        c[at + 1] = (char) ('0' + v % 10);
    }

    private static void four(char[] c, int at, int v) {
        two(c, at, v / 100);
        two(c, at + 2, v % 100);
    }

    /** A decimal that parses back to the same double; inf/-inf/nan as numpy and pandas read them. */
    public static String number(double v) {
        return org.tufa.analysis.tables.SampleTable.csvNumber(v);
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
    public static String field(String text) {
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
