package org.tufa.analysis.coverage;

import java.util.List;

/**
 * A requirement profile (a tufa:Profile of tufa.ttl): an analysis and the roles it needs per operating mode.
 *
 * @param name the name used on the command line, e.g. {@code fcu-modes}
 * @param iri the profile's IRI
 * @param description the profile's rdfs:comment, or empty
 * @param modes the modes, sorted by name
 * @param roles every role a mode requires or uses, in column order
 */
public record Profile(String name, String iri, String description, List<ModeRequirement> modes, List<Role> roles) {
    public Profile {
        modes = List.copyOf(modes);
        roles = List.copyOf(roles);
    }

    /** The role names in column order. */
    public List<String> roleNames() {
        return roles.stream().map(Role::name).toList();
    }
}
