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
 * @param matches the rule's {@code match} lines on text fields: all must hold (a negated one must not match)
 * @param types object types the point must have (empty: any)
 * @param pointClass a fixed Brick class or a table look-up, or empty to resolve the class from tags
 * @param tagSource the text whose tokens give the tags, when the class is resolved from tags
 * @param extraTags tags added to every point of this rule before resolution
 * @param equipment the equipment the point belongs to (empty: none)
 * @param parts rule-local parts, tried before the file's global parts
 * @param locations location chain, outermost first (first isPartOf the building, each next isPartOf the previous);
 *     the equipment's location, or the point's own when the rule names no equipment
 * @param feeds things the equipment feeds
 * @param fedBy things that feed the equipment
 * @param unit default QUDT unit for points of this rule when the export gives none
 * @param unitDefaults this rule's own {@code unit-for} lines (tag -> QUDT unit), tried before the file's
 * @param airflow the equipment's nominal airflow
 * @param compete competition group name (empty: first match wins silently)
 * @param dictionary abbreviations local to this rule, falling back to the file's
 * @param strip patterns removed from the tag text before it is split into tokens (the rule's, then the file's)
 * @param literalPrefix text every matching name starts with, for the cheap pre-filter (empty: none known)
 */
public record Rule(String id, String label, int index, List<FieldMatch> matches, Set<String> types,
        Optional<ClassRef> pointClass, Template tagSource, List<String> extraTags, Optional<EquipmentSpec> equipment,
        List<PartSpec> parts, List<LinkSpec> locations, List<LinkSpec> feeds, List<LinkSpec> fedBy,
        Optional<String> unit, List<Map.Entry<String, String>> unitDefaults, Optional<AirflowSpec> airflow,
        Optional<String> compete, Dictionary dictionary, List<Pattern> strip, Optional<String> literalPrefix) {

    /** The point fields a {@code match} line can test. */
    public enum Field {
        NAME, DESCRIPTION, UNITS, DEVICE;

        /** The word used in rule files. */
        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /**
     * One {@code match [not] FIELD REGEX} line.
     *
     * @param field the point field tested
     * @param pattern Java regex, find() semantics
     * @param negated true for {@code match not ...}: the rule applies only when the pattern does not match
     * @param groups the pattern's named groups, in order (none for a negated line: nothing matched to read)
     */
    public record FieldMatch(Field field, Pattern pattern, boolean negated, List<String> groups) {
    }

    /** Equipment id template and Brick class. */
    public record EquipmentSpec(Template id, ClassRef className) {
    }

    /**
     * A sub-equipment part ({@code brick:hasPart} of the equipment).
     *
     * @param id part id template; the part's full id is "equipment-id/part-id"
     * @param className its Brick class (e.g. Chilled_Water_Valve), fixed or from a table
     * @param when tags the point must carry for the part to apply (empty: always)
     * @param line file line, for messages
     */
    public record PartSpec(Template id, ClassRef className, Set<String> when, int line) {
    }

    /** A location, feeds or fed-by target: Brick class and id template. */
    public record LinkSpec(ClassRef className, Template id) {
    }

    /** Nominal airflow: value (number or template) and QUDT unit. */
    public record AirflowSpec(Template value, String unit) {
    }
}
