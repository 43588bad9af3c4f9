package org.tufa.analysis.coverage;

import java.util.Locale;
import org.tufa.vocabulary.Namespaces;

/** Where, relative to a terminal unit, a role's point may hang; the tufa:Place individuals of tufa.ttl. */
public enum Place {
    /** Points of the unit itself (brick:hasPoint / brick:isPointOf). */
    ON_UNIT("OnUnit"),
    /** Points of a part of the unit (brick:hasPart+) of a given class, e.g. its chilled-water valve. */
    ON_PART("OnPart"),
    /** Points of the zone or room the unit feeds or is located in. */
    ON_ZONE("OnZone"),
    /** Points of the loops and plant that feed the unit, nearest first. */
    UPSTREAM("Upstream"),
    /** Any point in the model, preferring those on the building, site or weather station. */
    BUILDING_WIDE("BuildingWide");

    private final String localName;

    Place(String localName) {
        this.localName = localName;
    }

    /** The IRI of the individual in tufa.ttl. */
    public String iri() {
        return Namespaces.TUFA + localName;
    }

    /** Short lower-case name used in reports: unit, part, zone, upstream, building. */
    public String label() {
        return switch (this) {
            case ON_UNIT -> "unit";
            case ON_PART -> "part";
            case ON_ZONE -> "zone";
            case UPSTREAM -> "upstream";
            case BUILDING_WIDE -> "building";
        };
    }

    /** The place with this IRI, or null. */
    public static Place fromIri(String iri) {
        for (Place p : values()) {
            if (p.iri().equals(iri)) {
                return p;
            }
        }
        return null;
    }

    @Override
    public String toString() {
        return label().toLowerCase(Locale.ROOT);
    }
}
