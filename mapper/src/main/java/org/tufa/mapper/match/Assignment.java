package org.tufa.mapper.match;

import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import java.util.SortedSet;

/**
 * What a rule made of a point.
 *
 * @param ruleLabel the rule's "file:line"
 * @param ruleId the rule's name
 * @param className the point's Brick class
 * @param score the tag-match score (1 for a class the rule names)
 * @param tags the tags the class was resolved from
 * @param equipment the equipment the point belongs to
 * @param part the sub-equipment part the point hangs on
 * @param locations the equipment's location chain, outermost first
 * @param feeds what the equipment feeds
 * @param fedBy what feeds the equipment
 * @param unit the QUDT unit local name
 * @param airflow the equipment's nominal airflow
 * @param ignoredTokens tokens that meant nothing to the dictionary
 * @param runnerUp the best rival class of a tag-matched point (a different concept, see TagClassResolver)
 * @param runnerUpScore its score (0 when there is none)
 */
public record Assignment(String ruleLabel, String ruleId, String className, double score, SortedSet<String> tags,
        Optional<Equipment> equipment, Optional<Part> part, List<Link> locations, List<Link> feeds, List<Link> fedBy,
        Optional<String> unit, Optional<Airflow> airflow, List<String> ignoredTokens, Optional<String> runnerUp,
        double runnerUpScore) {

    /** An equipment id and its Brick class. */
    public record Equipment(String id, String className) {
    }

    /** A part: id "equipment-id/part-id", its own short id, its Brick class. */
    public record Part(String id, String localId, String className) {
    }

    /** A location, feeds or fed-by target. */
    public record Link(String className, String id) {
    }

    /** Nominal airflow value and QUDT unit. */
    public record Airflow(BigDecimal value, String unit) {
    }

    /** The equipment id, or "" when none. */
    public String equipmentId() {
        return equipment.map(Equipment::id).orElse("");
    }

    /** The part's short id, or "" when none. */
    public String partId() {
        return part.map(Part::localId).orElse("");
    }
}
