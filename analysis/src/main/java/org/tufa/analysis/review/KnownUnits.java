package org.tufa.analysis.review;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * The units a review file may name, and how a name is read: the unit's IRI, or else its label or the IRI's local
 * name (after the last '#', '/' or ':') when exactly one unit has it, so a review kept in a spreadsheet may say
 * {@code FCU-03-04}.
 */
public final class KnownUnits {

    private final Map<String, String> labels = new TreeMap<>();

    /** @param labelsByIri every unit's IRI and label (empty when it has none) */
    public KnownUnits(Map<String, String> labelsByIri) {
        labels.putAll(labelsByIri);
    }

    /** The unit IRI a name means, or a message saying why there is none. */
    public Resolved resolve(String name) {
        if (labels.containsKey(name)) {
            return new Resolved(Optional.of(name), "");
        }
        for (boolean byLabel : new boolean[] {true, false}) {
            List<String> hits = labels.entrySet().stream().filter(e -> name.equals(byLabel ? e.getValue()
                    : localName(e.getKey()))).map(Map.Entry::getKey).toList();
            if (hits.size() == 1) {
                return new Resolved(Optional.of(hits.get(0)), "");
            }
            if (hits.size() > 1) {
                return new Resolved(Optional.empty(), "unit " + org.tufa.common.Printable.excerpt(name) + " names "
                        + hits.size() + " units (" + hits.get(0) + ", " + hits.get(1) + "); write the unit's IRI");
            }
        }
        return new Resolved(Optional.empty(), "unit " + org.tufa.common.Printable.excerpt(name) + " is not a unit of "
                + "this fleet (by IRI, label or local name); review files belong to the fleet they were made for");
    }

    /** A resolved name: the IRI, or why there is none. */
    public record Resolved(Optional<String> iri, String problem) {
    }

    /** The label of a unit, or its IRI when it has none. */
    public String label(String iri) {
        String l = labels.get(iri);
        return l == null || l.isEmpty() ? iri : l;
    }

    static String localName(String iri) {
        int cut = Math.max(iri.lastIndexOf('#'), Math.max(iri.lastIndexOf('/'), iri.lastIndexOf(':')));
        return iri.substring(cut + 1);
    }
}
