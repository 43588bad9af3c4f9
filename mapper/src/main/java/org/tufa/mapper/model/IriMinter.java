package org.tufa.mapper.model;

import java.nio.charset.StandardCharsets;

/**
 * Stable IRIs for a building's things, derived only from their ids: {@code BASE equipment/ID},
 * {@code BASE part/EQUIPMENT/PART}, {@code BASE location/CLASS/ID}, {@code BASE point/NAME} (or
 * {@code point/DEVICE/NAME} when the export names the point's device, since object names are often unique only
 * per device; {@code ;2} appended for the second row with the same name), {@code BASE building}. Each id is percent-encoded
 * as one path segment (RFC 3986 section 2.1: every byte of its UTF-8 form outside the unreserved set
 * A-Z a-z 0-9 - . _ ~ becomes %XX), so no id can contain '/' and no two ids share an IRI.
 */
public record IriMinter(String base) {

    /** The default base when neither the rule file nor the command line gives one. */
    public static final String DEFAULT_BASE = "https://tufa.example.org/building/";

    public IriMinter {
        if (!base.endsWith("/") && !base.endsWith("#")) {
            base = base + "/";
        }
    }

    /** The building node. */
    public String building() {
        return base + "building";
    }

    /** An equipment (or loop, or anything a feeds line names). */
    public String equipment(String id) {
        return base + "equipment/" + segment(id);
    }

    /** A part of an equipment. */
    public String part(String equipmentId, String partId) {
        return base + "part/" + segment(equipmentId) + "/" + segment(partId);
    }

    /** A location of a Brick class. */
    public String location(String className, String id) {
        return base + "location/" + segment(className) + "/" + segment(id);
    }

    /** A point; {@code device} may be empty; {@code occurrence} > 1 for repeated (device, name) pairs. */
    public String point(String device, String name, int occurrence) {
        return base + "point/" + (device.isEmpty() ? "" : segment(device) + "/") + segment(name)
                + (occurrence > 1 ? ";" + occurrence : "");
    }

    /** The time-series reference node of a point (an IRI, not a blank node, so output is byte-stable). */
    public static String timeseries(String pointIri) {
        return pointIri + "/timeseries";
    }

    /** An extra export column of a point. */
    public static String field(String pointIri, String column) {
        return pointIri + "/field/" + segment(column);
    }

    /** The nominal-airflow node of an equipment. */
    public static String airflow(String equipmentIri) {
        return equipmentIri + "/nominal-airflow";
    }

    /**
     * Percent-encodes everything but RFC 3986 unreserved characters. A segment of dots only is encoded too:
     * {@code .} and {@code ..} are dot-segments, which IRI resolution removes (RFC 3986 section 5.2.4), so two
     * points named "." and ".." would otherwise collapse into their parent's IRI.
     */
    public static String segment(String s) {
        if (s.isEmpty()) {
            return "%00";
        }
        if (s.chars().allMatch(c -> c == '.')) {
            return "%2E".repeat(s.length());
        }
        StringBuilder b = new StringBuilder(s.length() + 8);
        for (byte x : s.getBytes(StandardCharsets.UTF_8)) {
            int c = x & 0xFF;
            if (c >= 'A' && c <= 'Z' || c >= 'a' && c <= 'z' || c >= '0' && c <= '9' || c == '-' || c == '.'
                    || c == '_' || c == '~') {
                b.append((char) c);
            } else {
                b.append('%').append(Character.toUpperCase(Character.forDigit(c >> 4, 16)))
                        .append(Character.toUpperCase(Character.forDigit(c & 15, 16)));
            }
        }
        return b.toString();
    }
}
