package org.tufa.analysis.coverage;

import java.util.List;

/**
 * What one operating mode of a profile needs.
 *
 * @param name mode name, e.g. {@code cooling}
 * @param required role names that must all be found for the mode to be analysable
 * @param optional role names used when found
 */
public record ModeRequirement(String name, List<String> required, List<String> optional) {
    public ModeRequirement {
        required = List.copyOf(required);
        optional = List.copyOf(optional);
    }
}
