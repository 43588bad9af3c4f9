package org.tufa.mapper.points;

import java.util.Optional;

/** The header chosen for each column role; empty when the export lacks that column. */
public record ColumnMap(String name, Optional<String> description, Optional<String> units,
        Optional<String> objectType, Optional<String> device, Optional<String> seriesId) {
}
