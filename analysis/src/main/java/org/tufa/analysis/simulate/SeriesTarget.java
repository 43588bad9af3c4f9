package org.tufa.analysis.simulate;

import java.util.Objects;

/**
 * Where one simulated quantity goes: the series id written to the trend files and the QUDT unit the values are
 * converted to on writing (for example {@code http://qudt.org/vocab/unit/DEG_F}). A null or empty unit means the
 * simulator's own SI convention: degrees Celsius, percent 0..100 for valve commands, 0/1 for binary points.
 */
public record SeriesTarget(String seriesId, String qudtUnitIri) {
    public SeriesTarget {
        Objects.requireNonNull(seriesId, "seriesId");
        if (seriesId.isBlank()) {
            throw new IllegalArgumentException("series id must not be blank");
        }
        qudtUnitIri = qudtUnitIri == null ? "" : qudtUnitIri;
    }
}
