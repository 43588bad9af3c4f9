package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * What the model offers one terminal unit for the profile chosen for it.
 *
 * @param unit the unit's IRI
 * @param label its rdfs:label, or empty
 * @param unitClass its most specific terminal-unit class (IRI)
 * @param profile the profile chosen for the unit; empty when no profile applies to its class
 * @param roles per role name of the profile, in the profile's column order (empty without a profile)
 * @param nominalAirflow the design airflow when the model gives one
 * @param modes per mode name of the profile (sorted): true when all its requirements are met
 * @param problems model defects found on this unit (e.g. an airflow in an unknown unit), one line each
 */
public record UnitCoverage(String unit, String label, String unitClass, Optional<Profile> profile,
        Map<String, RoleMatch> roles, Optional<NominalAirflow> nominalAirflow, Map<String, Boolean> modes,
        List<String> problems) {
    public UnitCoverage {
        roles = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(roles));
        modes = java.util.Collections.unmodifiableMap(new java.util.TreeMap<>(modes));
        problems = List.copyOf(problems);
    }

    /** True when at least one mode can be analysed. */
    public boolean analyzable() {
        return modes.containsValue(Boolean.TRUE);
    }

    /** The profile's name, or empty. */
    public String profileName() {
        return profile.map(Profile::name).orElse("");
    }

    /** The profile's unit kind, or empty. */
    public String unitKind() {
        return profile.map(Profile::unitKind).orElse("");
    }

    /** Whether a requirement is met: all roles of one of its alternatives found. */
    public boolean met(Requirement r) {
        return r.metBy(role -> {
            RoleMatch m = roles.get(role);
            return m != null && m.found();
        });
    }

    /** The profile's requirements that are not met, in the profile's order. */
    public List<Requirement> unmet() {
        List<Requirement> out = new ArrayList<>();
        profile.ifPresent(p -> p.requirements().stream().filter(r -> !met(r)).forEach(out::add));
        return out;
    }

    /**
     * The names of the profile's requirements not met because nothing qualifies (no role of theirs is ambiguous),
     * in the profile's order.
     */
    public List<String> missing() {
        return unmet().stream().filter(r -> r.roleNames().stream().noneMatch(n -> roles.get(n).status()
                == MatchStatus.AMBIGUOUS)).map(Requirement::name).toList();
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
