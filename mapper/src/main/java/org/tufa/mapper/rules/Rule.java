package org.tufa.mapper.rules;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * One rule of a rule file, compiled. See RULES-FORMAT.md for the meaning of each line.
 *
 * @param id the rule's name (or "rule" when it has none)
 * @param label "file:line" of the rule's first line, used in reports
 * @param index position in the file (0-based): first match wins in this order
 * @param name pattern on the point name (Java regex, find() semantics: anchor with ^...$ for a full match)
 * @param description pattern on the description
 * @param units pattern on the units column
 * @param device pattern on the device / controller column
 * @param types object types the point must have (empty: any)
 * @param pointClass a fixed Brick class, or empty to resolve the class from tags
 * @param tagSource the text whose tokens give the tags, when the class is resolved from tags
 * @param extraTags tags added to every point of this rule before resolution
 * @param equipment the equipment the point belongs to (empty: none)
 * @param parts rule-local parts, tried before the file's global parts
 * @param locations location chain, outermost first (first isPartOf the building, each next isPartOf the previous)
 * @param feeds things the equipment feeds
 * @param fedBy things that feed the equipment
 * @param unit default QUDT unit for points of this rule when the export gives none
 * @param unitDefaults this rule's own {@code unit-for} lines (tag -> QUDT unit), tried before the file's
 * @param airflow the equipment's nominal airflow
 * @param compete competition group name (empty: first match wins silently)
 * @param dictionary abbreviations local to this rule, falling back to the file's
 * @param literalPrefix text every matching name starts with, for the cheap pre-filter (empty: none known)
 */
public record Rule(String id, String label, int index, Optional<Pattern> name, Optional<Pattern> description,
        Optional<Pattern> units, Optional<Pattern> device, Set<String> types, Optional<String> pointClass, Template tagSource,
        List<String> extraTags, Optional<EquipmentSpec> equipment, List<PartSpec> parts, List<LinkSpec> locations,
        List<LinkSpec> feeds, List<LinkSpec> fedBy, Optional<String> unit, List<Map.Entry<String, String>> unitDefaults,
        Optional<AirflowSpec> airflow,
        Optional<String> compete, Dictionary dictionary, Optional<String> literalPrefix) {

    /** Equipment id template and Brick class. */
    public record EquipmentSpec(Template id, String className) {
    }

    /**
     * A sub-equipment part ({@code brick:hasPart} of the equipment).
     *
     * @param id part id template; the part's full id is "equipment-id/part-id"
     * @param className its Brick class (e.g. Chilled_Water_Valve)
     * @param when tags the point must carry for the part to apply (empty: always)
     * @param qualifiers tags that describe the part, not the point (the part class's tags and the {@code when}
     *     tags, minus Equipment and the part's kind, e.g. Chilled, Water, Cool for a chilled-water valve); they
     *     are removed before the point's class is resolved
     * @param line file line, for messages
     */
    public record PartSpec(Template id, String className, Set<String> when, Set<String> qualifiers, int line) {
    }

    /** A location, feeds or fed-by target: Brick class and id template. */
    public record LinkSpec(String className, Template id) {
    }

    /** Nominal airflow: value (number or template) and QUDT unit. */
    public record AirflowSpec(Template value, String unit) {
    }
}
