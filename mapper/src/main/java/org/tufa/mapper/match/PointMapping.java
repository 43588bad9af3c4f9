package org.tufa.mapper.match;

import java.util.Optional;
import org.tufa.mapper.points.PointRecord;

/**
 * The outcome for one input row: exactly one per row, in input order.
 *
 * @param point the row
 * @param status what happened
 * @param reason why (for unmapped, conflict, duplicate, rejected) or notes (ignored tokens, unknown units); may be ""
 * @param assignment the class and equipment, when a rule produced them (also kept for duplicates and conflicts)
 * @param occurrence 1 for the first row with this name, 2 for the second, ...
 */
public record PointMapping(PointRecord point, Status status, String reason, Optional<Assignment> assignment,
        int occurrence) {

    /** Is there a class to write to the model (mapped, or a duplicate that mapped)? */
    public boolean classified() {
        return assignment.isPresent() && (status == Status.MAPPED || status == Status.DUPLICATE);
    }
}
