package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A requirement profile (a tufa:Profile of tufa.ttl): an analysis, the unit classes it is tried on, the roles it
 * needs per operating mode, and the evidence that makes it the right profile for a unit among those that apply.
 *
 * @param name the name used on the command line, e.g. {@code fcu-modes}
 * @param iri the profile's IRI
 * @param description the profile's rdfs:comment, or empty
 * @param unitKind which detection the profile's units are for ({@link #FAN_COIL}, {@link #VAV}, or a user's own)
 * @param appliesTo unit classes the profile is tried on (subclasses and equivalent classes too); empty: every
 *     terminal unit, and then the profile is used only when asked for by name
 * @param onRequest true when the profile is used only when asked for by name, never chosen automatically
 * @param specificity higher wins among the profiles that fit a unit (a reheat box over a cooling-only one)
 * @param evidenceRoles roles whose presence on a unit says this profile fits it (e.g. a reheat valve command)
 * @param evidenceClasses classes that say so when the unit or one of its parts is an instance (e.g. a reheat box,
 *     a hot-water coil part)
 * @param modes the modes, sorted by name
 * @param roles every role a mode requires or uses and every evidence role, in column order
 */
public record Profile(String name, String iri, String description, String unitKind, List<String> appliesTo,
        boolean onRequest, int specificity, List<String> evidenceRoles, List<String> evidenceClasses, List<ModeRequirement> modes,
        List<Role> roles) {
    /** The unit kind of fan coil units: the detection tufa has today. */
    public static final String FAN_COIL = "fan_coil";
    /** The unit kind of VAV boxes (all variants). */
    public static final String VAV = "vav";

    public Profile {
        appliesTo = List.copyOf(appliesTo);
        evidenceRoles = List.copyOf(evidenceRoles);
        evidenceClasses = List.copyOf(evidenceClasses);
        modes = List.copyOf(modes);
        roles = List.copyOf(roles);
    }

    /** The role names in column order. */
    public List<String> roleNames() {
        return roles.stream().map(Role::name).toList();
    }

    /** True when the profile may be chosen for a unit without being named. */
    public boolean automatic() {
        return !onRequest && !appliesTo.isEmpty();
    }

    /**
     * Every distinct requirement of the modes (required or optional), ordered by the column order of its first
     * role, then by name.
     */
    public List<Requirement> requirements() {
        Map<String, Requirement> byName = new LinkedHashMap<>();
        for (ModeRequirement m : modes) {
            m.required().forEach(r -> byName.putIfAbsent(r.name(), r));
            m.optional().forEach(r -> byName.putIfAbsent(r.name(), r));
        }
        Map<String, Integer> order = new LinkedHashMap<>();
        for (int i = 0; i < roles.size(); i++) {
            order.put(roles.get(i).name(), i);
        }
        List<Requirement> out = new ArrayList<>(byName.values());
        out.sort(java.util.Comparator.<Requirement>comparingInt(r -> r.roleNames().stream()
                .mapToInt(n -> order.getOrDefault(n, Integer.MAX_VALUE)).min().orElse(Integer.MAX_VALUE))
                .thenComparing(Requirement::name));
        return out;
    }
}
