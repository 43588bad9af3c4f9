package org.tufa.mapper.rules;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A parsed rule file.
 *
 * @param file where it came from
 * @param building the building's name (the {@code building} line)
 * @param baseIri the {@code base-iri} line, if any
 * @param rules the rules in file order
 * @param dictionary the file's abbreviations
 * @param typeTags BACnet object type -> tags added when a point's own tags carry no role tag
 * @param unitDefaults tag -> QUDT unit, in file order ({@code unit-for} lines)
 * @param parts parts that apply to every rule's points
 * @param minScore lowest tag-match score accepted
 * @param expectations the file's inline tests
 * @param warnings things that are accepted but worth a look (deprecated classes), "file:line: text"
 */
public record RuleSet(Path file, String building, Optional<String> baseIri, List<Rule> rules, Dictionary dictionary,
        Map<String, List<String>> typeTags, List<Map.Entry<String, String>> unitDefaults, List<Rule.PartSpec> parts,
        double minScore, List<Expectation> expectations, List<String> warnings) {
    public RuleSet {
        rules = List.copyOf(rules);
        typeTags = Map.copyOf(typeTags);
        unitDefaults = List.copyOf(unitDefaults);
        parts = List.copyOf(parts);
        expectations = List.copyOf(expectations);
        warnings = List.copyOf(warnings);
    }
}
