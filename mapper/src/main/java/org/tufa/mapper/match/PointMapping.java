package org.tufa.mapper.match;

import java.util.Optional;
import org.tufa.mapper.points.PointRecord;

/**
 * The outcome for one input row: exactly one per row, in input order.
 *
 * @param point the row
 * @param status what happened
 * @param reason why (for every status but mapped) or notes (ignored tokens, unknown units); may be ""
 * @param assignment the class and equipment, when a rule produced them (also kept for duplicates, conflicts and
 *     ambiguous rows, so the report can show what the rules proposed)
 * @param occurrence 1 for the first row with this name, 2 for the second, ...
 * @param outcome the status the row has on its own (for a duplicate: what its rules made of it; else = status)
 */
public record PointMapping(PointRecord point, Status status, String reason, Optional<Assignment> assignment,
        int occurrence, Status outcome) {

    /** A row whose status is its own outcome. */
    public PointMapping(PointRecord point, Status status, String reason, Optional<Assignment> assignment,
            int occurrence) {
        this(point, status, reason, assignment, occurrence, status);
    }

    /** Is there a class to write to the model (mapped, or a duplicate that mapped)? */
    public boolean classified() {
        return assignment.isPresent() && outcome == Status.MAPPED;
    }
}
