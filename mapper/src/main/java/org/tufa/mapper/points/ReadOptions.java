package org.tufa.mapper.points;

import java.util.Optional;

/**
 * How to read a point list. Empty values mean "detect": the delimiter from the header line, each column from
 * its header name (see {@link PointListReader}).
 *
 * @param delimiter the field delimiter, or empty to detect comma, semicolon or tab
 * @param nameColumn header of the point-name column
 * @param descriptionColumn header of the description column
 * @param unitsColumn header of the units column
 * @param typeColumn header of the BACnet object-type column
 * @param deviceColumn header of the device / controller column
 * @param seriesColumn header of the trend / series id column
 */
public record ReadOptions(Optional<Character> delimiter, Optional<String> nameColumn,
        Optional<String> descriptionColumn, Optional<String> unitsColumn, Optional<String> typeColumn,
        Optional<String> deviceColumn, Optional<String> seriesColumn) {

    /** Detect everything. */
    public static ReadOptions detect() {
        return new ReadOptions(Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(),
                Optional.empty(), Optional.empty(), Optional.empty());
    }

    /** The same options with a fixed delimiter. */
    public ReadOptions withDelimiter(char c) {
        return new ReadOptions(Optional.of(c), nameColumn, descriptionColumn, unitsColumn, typeColumn,
                deviceColumn, seriesColumn);
    }
}
