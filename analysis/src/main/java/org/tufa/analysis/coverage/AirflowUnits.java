package org.tufa.analysis.coverage;

import java.util.Map;
import java.util.OptionalDouble;
import java.util.TreeMap;
import org.tufa.vocabulary.Namespaces;

/** Converts volume-flow values given in QUDT units to m3/s. */
public final class AirflowUnits {
    /** 1 ft = 0.3048 m exactly (international foot, NIST SP 811, 2008, appendix B.8), so 1 ft3/min in m3/s. */
    public static final double CUBIC_FOOT_PER_MINUTE = 0.3048 * 0.3048 * 0.3048 / 60.0;

    private static final Map<String, Double> FACTORS = new TreeMap<>(Map.of(
            Namespaces.UNIT + "M3-PER-SEC", 1.0,
            Namespaces.UNIT + "M3-PER-HR", 1.0 / 3600.0,
            Namespaces.UNIT + "L-PER-SEC", 0.001,
            Namespaces.UNIT + "L-PER-MIN", 0.001 / 60.0,
            Namespaces.UNIT + "FT3-PER-MIN", CUBIC_FOOT_PER_MINUTE));

    private AirflowUnits() {
    }

    /** The factor from the QUDT unit to m3/s, or empty for a unit tufa does not know. */
    public static OptionalDouble toCubicMetresPerSecond(String unitIri) {
        Double f = FACTORS.get(unitIri);
        return f == null ? OptionalDouble.empty() : OptionalDouble.of(f);
    }

    /** The QUDT units accepted, as prefixed names for messages. */
    public static String known() {
        return String.join(", ", FACTORS.keySet().stream().map(i -> "unit:" + i.substring(Namespaces.UNIT.length()))
                .toList());
    }
}
