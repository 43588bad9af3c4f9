package org.tufa.analysis.coverage;

import java.util.List;

/**
 * What one operating mode of a profile needs.
 *
 * @param name mode name, e.g. {@code cooling}
 * @param required requirements that must all be met for the mode to be analysable
 * @param optional requirements used when met
 */
public record ModeRequirement(String name, List<Requirement> required, List<Requirement> optional) {
    public ModeRequirement {
        required = List.copyOf(required);
        optional = List.copyOf(optional);
    }

    /** The names of the required requirements (role or choice names), in order. */
    public List<String> requiredNames() {
        return required.stream().map(Requirement::name).toList();
    }
}
