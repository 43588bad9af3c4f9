package org.tufa.analysis.units;

import java.util.List;

/**
 * A series converted to tufa's working unit (C for temperatures, K for temperature differences, percent for
 * commands), with notes for the unit's report when its values contradict its declared unit.
 *
 * @param values converted values (NaN kept)
 * @param declared the unit the model declares
 * @param notes human-readable warnings; empty when the values look consistent with the unit
 */
public record NormalisedSeries(double[] values, MeasureUnit declared, List<String> notes) {

    public NormalisedSeries {
        notes = List.copyOf(notes);
    }

    public boolean suspicious() {
        return !notes.isEmpty();
    }
}
