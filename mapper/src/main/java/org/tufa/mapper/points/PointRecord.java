package org.tufa.mapper.points;

import java.util.Collections;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * One row of a point list, as exported (values trimmed, empty for a missing column).
 *
 * @param line the 1-based line in the file where the row starts
 * @param name the point name (object name)
 * @param description the description column, or empty
 * @param units the units column as written, or empty
 * @param objectType the BACnet object type normalised to its abbreviation (AI, AO, ..., MSV), or empty
 * @param rawObjectType the object type as written
 * @param device the device or controller column, or empty
 * @param seriesId the trend / series id column, or empty
 * @param extras every other column, header -> value, in header order of appearance sorted by header
 */
public record PointRecord(long line, String name, String description, String units, String objectType,
        String rawObjectType, String device, String seriesId, SortedMap<String, String> extras) {

    public PointRecord {
        extras = Collections.unmodifiableSortedMap(new TreeMap<>(extras));
    }

    /** A point with only a name (used by rule-file expectations and tests). */
    public static PointRecord named(String name) {
        return new PointRecord(0, name, "", "", "", "", "", "", new TreeMap<>());
    }
}
