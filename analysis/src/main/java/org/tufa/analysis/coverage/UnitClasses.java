package org.tufa.analysis.coverage;

import java.util.Comparator;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.apache.jena.irix.IRIs;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.shared.PrefixMapping;
import org.tufa.common.InputException;

/** Turns the user's --unit-class values (prefixed names or IRIs) into terminal-unit class IRIs. */
public final class UnitClasses {
    private UnitClasses() {
    }

    /** As {@link #resolve(List, Model, PrefixMapping, boolean)} without the Brick ontology loaded (the error then suggests it). */
    public static Set<String> resolve(List<String> names, Model all, PrefixMapping prefixes) {
        return resolve(names, all, prefixes, false);
    }

    /**
     * Resolves each name: {@code brick:Fan_Coil_Unit}, a bare Brick name {@code Fan_Coil_Unit}, {@code <iri>} or a
     * full IRI. The class must be brick:Terminal_Unit or one of its subclasses in the vocabulary or the model.
     *
     * @param all vocabulary and model together
     * @param fullBrick whether the full Brick file is loaded (if not, the error suggests passing it)
     * @throws InputException for an unknown class, naming the nearest known terminal-unit classes
     */
    public static Set<String> resolve(List<String> names, Model all, PrefixMapping prefixes, boolean fullBrick) {
        Set<String> known = Sparql.subclassClosure(all, List.of(Coverage.TERMINAL_UNIT));
        Set<String> out = new TreeSet<>();
        for (String name : names) {
            String iri = expand(name.strip(), prefixes);
            if (iri == null || !known.contains(iri)) {
                throw new InputException("--unit-class " + name + ": not a terminal-unit class in the loaded vocabulary"
                        + " or model; nearest: " + String.join(", ", nearest(name, known, prefixes))
                        + (fullBrick ? "" : " (for classes the loaded vocabulary lacks "
                                + CoverageSummary.FULL_BRICK_HINT + ")"));
            }
            out.add(iri);
        }
        return out;
    }

    private static String expand(String name, PrefixMapping prefixes) {
        String iri;
        if (name.startsWith("<") && name.endsWith(">")) {
            iri = name.substring(1, name.length() - 1);
        } else if (name.contains("://") || name.startsWith("urn:")) {
            iri = name;
        } else if (name.contains(":")) {
            String prefix = name.substring(0, name.indexOf(':'));
            String ns = prefixes.getNsPrefixURI(prefix);
            if (ns == null) {
                return null;
            }
            iri = ns + name.substring(prefix.length() + 1);
        } else {
            iri = prefixes.getNsPrefixURI("brick") + name;
        }
        return IRIs.check(iri) ? iri : null;
    }

    private static List<String> nearest(String name, Set<String> known, PrefixMapping prefixes) {
        String local = localName(name);
        return known.stream().map(prefixes::shortForm)
                .sorted(Comparator.<String>comparingInt(k -> org.tufa.vocabulary.NameSuggester.levenshtein(localName(k).toLowerCase(java.util.Locale.ROOT),
                        local.toLowerCase(java.util.Locale.ROOT))).thenComparing(Comparator.naturalOrder()))
                .limit(3).toList();
    }

    private static String localName(String s) {
        int cut = Math.max(Math.max(s.lastIndexOf('#'), s.lastIndexOf('/')), s.lastIndexOf(':'));
        return s.substring(cut + 1).replace(">", "");
    }
}
