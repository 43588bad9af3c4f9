package org.tufa.analysis.coverage;

import java.util.List;
import java.util.Optional;

/**
 * The point (or points) found for one role on one unit.
 *
 * @param role the role name
 * @param status found, missing or ambiguous
 * @param point the point when found
 * @param candidates the qualifying points at the deciding lookup, sorted by IRI (one when found, several when
 *     ambiguous, none when missing)
 * @param place where the deciding lookup looked, or null when missing
 * @param untagged when missing: points of a qualifying class that lacked the tag the lookup asks for (a hint
 *     for the model author), sorted by IRI
 */
public record RoleMatch(String role, MatchStatus status, Optional<PointRef> point, List<PointRef> candidates,
        Place place, List<PointRef> untagged) {
    public RoleMatch {
        candidates = List.copyOf(candidates);
        untagged = List.copyOf(untagged);
    }

    static RoleMatch decide(String role, Place place, List<PointRef> candidates) {
        if (candidates.size() == 1) {
            return new RoleMatch(role, MatchStatus.FOUND, Optional.of(candidates.get(0)), candidates, place, List.of());
        }
        return new RoleMatch(role, MatchStatus.AMBIGUOUS, Optional.empty(), candidates, place, List.of());
    }

    static RoleMatch missing(String role, List<PointRef> untagged) {
        return new RoleMatch(role, MatchStatus.MISSING, Optional.empty(), List.of(), null, untagged);
    }

    public boolean found() {
        return status == MatchStatus.FOUND;
    }
}
