package org.tufa.analysis.trends;

import java.time.LocalDate;

/**
 * Fast reader of the two time-stamp forms tufa accepts, straight from the bytes of a CSV field.
 *
 * <ul>
 *   <li>ISO 8601 with a UTC offset (ISO 8601; RFC 3339): {@code 2031-07-01T08:15:00-04:00},
 *       {@code 2031-07-01T12:15Z}, {@code +0530} and {@code +05} also accepted, one optional space before the
 *       offset;</li>
 *   <li>naive local time: {@code 2031-07-01 08:15}, {@code 2031-07-01T08:15:00}, interpreted later in the zone the
 *       user gives (see {@link LocalTimeResolver}).</li>
 * </ul>
 *
 * <p>Seconds are optional; fractional seconds ({@code .5} or {@code ,5}) are accepted and truncated, since the
 * grid works in whole seconds. Hand-written rather than {@code DateTimeFormatter} because it runs once per row of
 * files with millions of rows. Not thread-safe: one instance per reader.
 */
final class TimestampParser {

    /** Seconds since 1970-01-01T00:00 of the last parsed stamp: UTC for offset stamps, local wall time if naive. */
    long seconds;
    /** Whether the last parsed stamp had no UTC offset. */
    boolean naive;

    /** Parses {@code b[start, end)} (already trimmed); false when it is not one of the accepted forms. */
    boolean parse(byte[] b, int start, int end) {
        int p = start;
        if (end - p < 16) {
            return false;
        }
        int year = digits(b, p, 4);
        if (year < 0 || b[p + 4] != '-') {
            return false;
        }
        int month = digits(b, p + 5, 2);
        if (month < 1 || month > 12 || b[p + 7] != '-') {
            return false;
        }
        int day = digits(b, p + 8, 2);
        byte sep = b[p + 10];
        if (day < 1 || (sep != 'T' && sep != 't' && sep != ' ')) {
            return false;
        }
        int hour = digits(b, p + 11, 2);
        if (hour < 0 || hour > 23 || b[p + 13] != ':') {
            return false;
        }
        int minute = digits(b, p + 14, 2);
        if (minute < 0 || minute > 59) {
            return false;
        }
        p += 16;
        int second = 0;
        if (p < end && b[p] == ':') {
            if (end - p < 3) {
                return false;
            }
            second = digits(b, p + 1, 2);
            if (second < 0 || second > 59) {
                return false;
            }
            p += 3;
            if (p < end && (b[p] == '.' || b[p] == ',')) {
                p++;
                int fractionStart = p;
                while (p < end && b[p] >= '0' && b[p] <= '9') {
                    p++;
                }
                if (p == fractionStart) {
                    return false;
                }
            }
        }
        if (day > LocalDate.of(year, month, 1).lengthOfMonth()) {
            return false;
        }
        long local = LocalDate.of(year, month, day).toEpochDay() * 86_400L + hour * 3600L + minute * 60L + second;
        if (p == end) {
            seconds = local;
            naive = true;
            return true;
        }
        if (b[p] == ' ' && p + 1 < end && (b[p + 1] == '+' || b[p + 1] == '-')) {
            p++;
        }
        int offsetSeconds;
        if ((b[p] == 'Z' || b[p] == 'z') && p + 1 == end) {
            offsetSeconds = 0;
        } else if (b[p] == '+' || b[p] == '-') {
            int sign = b[p] == '-' ? -1 : 1;
            int rest = end - p - 1;
            int oh = rest >= 2 ? digits(b, p + 1, 2) : -1;
            int om;
            if (rest == 2) {
                om = 0;
            } else if (rest == 4) {
                om = digits(b, p + 3, 2);
            } else if (rest == 5 && b[p + 3] == ':') {
                om = digits(b, p + 4, 2);
            } else {
                return false;
            }
            if (oh < 0 || oh > 18 || om < 0 || om > 59) {
                return false;
            }
            offsetSeconds = sign * (oh * 3600 + om * 60);
        } else {
            return false;
        }
        seconds = local - offsetSeconds;
        naive = false;
        return true;
    }

    /** The value of {@code n} ASCII digits at {@code b[p]}, or -1 if any is not a digit. */
    private static int digits(byte[] b, int p, int n) {
        int v = 0;
        for (int i = 0; i < n; i++) {
            int d = b[p + i] - '0';
            if (d < 0 || d > 9) {
                return -1;
            }
            v = v * 10 + d;
        }
        return v;
    }
}
