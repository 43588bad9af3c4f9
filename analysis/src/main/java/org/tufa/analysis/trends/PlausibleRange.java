package org.tufa.analysis.trends;

import java.util.Optional;
import org.tufa.analysis.units.MeasureUnit;

/**
 * The range outside which a value in a unit cannot be a building signal: a trend value beyond it is a logging
 * error (a sentinel such as 1e308 or -9999, a wrong unit), counted and not stored.
 *
 * <p>Temperatures: nothing is colder than absolute zero (0 K = -273.15 degrees C = -459.67 degrees F, the SI
 * definition, NIST SP 811 (2008), from memory), and no HVAC sensor reads 1000 degrees C (common practice, no
 * source). Commands and positions: percent within -100..200 and fractions within -1..2, twice full scale either
 * way, so a slightly over-ranged actuator reading is kept (common practice, no source). Units tufa does not convert
 * get no range; every series is still checked for non-finite values.
 */
public record PlausibleRange(double min, double max) implements java.io.Serializable {

    public PlausibleRange {
        if (!(min < max)) {
            throw new IllegalArgumentException("empty range " + min + ".." + max);
        }
    }

    public boolean contains(double v) {
        return v >= min && v <= max;
    }

    /** The range for a QUDT unit IRI or name; empty for units without one. */
    public static Optional<PlausibleRange> forUnit(String qudtIriOrName) {
        return MeasureUnit.fromQudt(qudtIriOrName).map(u -> switch (u) {
            case DEG_C -> new PlausibleRange(-273.15, 1000);
            case DEG_F -> new PlausibleRange(-459.67, 1832);
            case KELVIN -> new PlausibleRange(0, 1273.15);
            case PERCENT -> new PlausibleRange(-100, 200);
            case FRACTION -> new PlausibleRange(-1, 2);
        });
    }
}
