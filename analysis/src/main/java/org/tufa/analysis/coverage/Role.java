package org.tufa.analysis.coverage;

import java.util.List;

/**
 * A quantity an analysis needs from a unit (a tufa:Role of tufa.ttl).
 *
 * @param name identifier such as {@code discharge_air_temperature}: CSV column and channel name
 * @param iri the role's IRI
 * @param columnOrder orders roles in tables (then the name)
 * @param lookups tried in order; the first that finds a point decides
 */
public record Role(String name, String iri, int columnOrder, List<Lookup> lookups) {
    public Role {
        lookups = List.copyOf(lookups);
    }
}
