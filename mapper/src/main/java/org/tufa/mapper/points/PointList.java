package org.tufa.mapper.points;

import java.nio.file.Path;
import java.util.List;

/**
 * A parsed point list.
 *
 * @param file where it was read from
 * @param delimiter the field delimiter used
 * @param headers the header row, as written
 * @param columns which header was taken for which role
 * @param points the rows, in file order
 */
public record PointList(Path file, char delimiter, List<String> headers, ColumnMap columns, List<PointRecord> points) {
    public PointList {
        headers = List.copyOf(headers);
        points = List.copyOf(points);
    }
}
