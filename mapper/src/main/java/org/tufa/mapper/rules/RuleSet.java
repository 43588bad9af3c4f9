package org.tufa.mapper.rules;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * A parsed rule file.
 *
 * @param file where it came from
 * @param building the building's name (the {@code building} line)
 * @param baseIri the {@code base-iri} line, if any
 * @param rules the rules in file order
 * @param dictionary the file's abbreviations (falling back to the built-in trade abbreviations)
 * @param typeTags BACnet object type -> tags added when a point's own tags carry no role tag
 * @param defaultRole role tags added when neither the name nor the object type gives one ({@code default-role})
 * @param unitDefaults tag -> QUDT unit, in file order ({@code unit-for} lines)
 * @param parts parts that apply to every rule's points
 * @param minScore lowest tag-match score accepted
 * @param margin a tag-matched class whose runner-up scores within this much of it is {@code ambiguous}
 * @param skips {@code skip} lines: points deliberately left out, with the reason
 * @param strip the file's {@code strip} patterns (each rule's list already holds them after its own)
 * @param expectations the file's inline tests
 * @param warnings things that are accepted but worth a look (deprecated classes), "file:line: text"
 */
public record RuleSet(Path file, String building, Optional<String> baseIri, List<Rule> rules, Dictionary dictionary,
        Map<String, List<String>> typeTags, List<String> defaultRole, List<Map.Entry<String, String>> unitDefaults,
        List<Rule.PartSpec> parts, double minScore, double margin, List<Skip> skips, List<Pattern> strip,
        List<Expectation> expectations, List<String> warnings) {

    /** Tags that say what role a point plays; a point without one gets its object type's tags. */
    public static final Set<String> ROLE_TAGS = Set.of("Sensor", "Setpoint", "Command", "Status", "Alarm",
            "Parameter");

    /**
     * Default ambiguity margin: two classes whose Jaccard scores differ by less than this are too close to call.
     * One tag more or less in a set of five or six moves the score by 0.14-0.2, so 0.1 flags ties and near-ties
     * only; our choice, no source.
     */
    public static final double DEFAULT_MARGIN = 0.1;

    /** A {@code skip REGEX because REASON} line. */
    public record Skip(Pattern pattern, String reason, String label) {
    }

    public RuleSet {
        rules = List.copyOf(rules);
        typeTags = Map.copyOf(typeTags);
        defaultRole = List.copyOf(defaultRole);
        unitDefaults = List.copyOf(unitDefaults);
        parts = List.copyOf(parts);
        skips = List.copyOf(skips);
        strip = List.copyOf(strip);
        expectations = List.copyOf(expectations);
        warnings = List.copyOf(warnings);
    }
}
