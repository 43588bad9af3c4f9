package org.tufa.analysis.report;

import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;

/** Times as report tables show them: local to the run's zone, with the offset (e.g. 2031-07-03 08:00 -04:00). */
final class Times {

    private static final DateTimeFormatter LOCAL = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm xxx", Locale.ROOT);

    private Times() {
    }

    static String local(Instant t, ZoneId zone) {
        return LOCAL.format(t.atZone(zone));
    }
}
