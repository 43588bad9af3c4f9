package org.tufa.analysis.units;

import java.util.Locale;
import java.util.Optional;

/**
 * Units of measure tufa converts, identified by QUDT unit IRIs (http://qudt.org/vocab/unit/...), which Brick uses
 * for {@code brick:hasUnit}. QUDT has no separate "delta" units: a temperature difference carries DEG_F, DEG_C or
 * K with a difference quantity kind, so the caller chooses between {@link UnitConversions#toCelsius} and
 * {@link UnitConversions#differenceToKelvin} by the point's role.
 */
public enum MeasureUnit {
    DEG_C("DEG_C"),
    DEG_F("DEG_F"),
    KELVIN("K"),
    PERCENT("PERCENT"),
    /** A 0-1 fraction: QUDT UNITLESS, NUM or FRACTION. */
    FRACTION("UNITLESS");

    public static final String QUDT_UNIT_NAMESPACE = "http://qudt.org/vocab/unit/";

    private final String qudtLocalName;

    MeasureUnit(String qudtLocalName) {
        this.qudtLocalName = qudtLocalName;
    }

    /** The QUDT IRI of this unit. */
    public String iri() {
        return QUDT_UNIT_NAMESPACE + qudtLocalName;
    }

    /**
     * The unit of a QUDT IRI ({@code http://qudt.org/vocab/unit/DEG_F}), a prefixed name ({@code unit:DEG_F}) or a
     * bare local name ({@code DEG_F}); empty for units tufa does not convert.
     */
    public static Optional<MeasureUnit> fromQudt(String iriOrName) {
        if (iriOrName == null) {
            return Optional.empty();
        }
        String name = iriOrName.trim();
        if (name.startsWith(QUDT_UNIT_NAMESPACE)) {
            name = name.substring(QUDT_UNIT_NAMESPACE.length());
        } else if (name.startsWith("https://qudt.org/vocab/unit/")) {
            name = name.substring("https://qudt.org/vocab/unit/".length());
        } else if (name.startsWith("unit:")) {
            name = name.substring("unit:".length());
        }
        return switch (name.toUpperCase(Locale.ROOT)) {
            case "DEG_C" -> Optional.of(DEG_C);
            case "DEG_F" -> Optional.of(DEG_F);
            case "K" -> Optional.of(KELVIN);
            case "PERCENT" -> Optional.of(PERCENT);
            case "UNITLESS", "NUM", "FRACTION" -> Optional.of(FRACTION);
            default -> Optional.empty();
        };
    }
}
