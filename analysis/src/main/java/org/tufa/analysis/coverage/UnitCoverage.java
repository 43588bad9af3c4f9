package org.tufa.analysis.coverage;

import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * What the model offers one terminal unit for a profile.
 *
 * @param unit the unit's IRI
 * @param label its rdfs:label, or empty
 * @param unitClass its most specific terminal-unit class (IRI)
 * @param roles per role name, in the profile's column order
 * @param nominalAirflow the design airflow when the model gives one
 * @param modes per mode name (sorted): true when all its required roles are found
 * @param problems model defects found on this unit (e.g. an airflow in an unknown unit), one line each
 */
public record UnitCoverage(String unit, String label, String unitClass, Map<String, RoleMatch> roles,
        Optional<NominalAirflow> nominalAirflow, Map<String, Boolean> modes, List<String> problems) {
    public UnitCoverage {
        roles = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(roles));
        modes = java.util.Collections.unmodifiableMap(new java.util.TreeMap<>(modes));
        problems = List.copyOf(problems);
    }

    /** True when at least one mode can be analysed. */
    public boolean analyzable() {
        return modes.containsValue(Boolean.TRUE);
    }

    /** The profile's roles not found at all, in column order. */
    public List<String> missing() {
        return roles.values().stream().filter(m -> m.status() == MatchStatus.MISSING).map(RoleMatch::role).toList();
    }

    /** The profile's roles with several candidates, in column order. */
    public List<String> ambiguous() {
        return roles.values().stream().filter(m -> m.status() == MatchStatus.AMBIGUOUS).map(RoleMatch::role).toList();
    }

    /** The point found for a role, if any. */
    public Optional<PointRef> point(String role) {
        RoleMatch m = roles.get(role);
        return m == null ? Optional.empty() : m.point();
    }
}
