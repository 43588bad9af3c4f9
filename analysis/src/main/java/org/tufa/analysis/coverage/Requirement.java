package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.function.Predicate;

/**
 * What one operating mode needs or uses: a single role, or a choice (a tufa:RoleChoice of tufa.ttl) between
 * alternatives, each alternative a set of roles that together stand in (the zone setpoint: one target setpoint, or
 * the cooling and heating pair).
 *
 * @param name the role's name, or the choice's tufa:choiceName; what the coverage files list when it is not met
 * @param options the alternatives in order, each a non-empty list of role names
 */
public record Requirement(String name, List<List<String>> options) {
    public Requirement {
        List<List<String>> copy = new ArrayList<>();
        for (List<String> o : options) {
            if (o.isEmpty()) {
                throw new IllegalArgumentException("requirement " + name + ": empty alternative");
            }
            copy.add(List.copyOf(o));
        }
        if (copy.isEmpty()) {
            throw new IllegalArgumentException("requirement " + name + ": no alternative");
        }
        options = List.copyOf(copy);
    }

    /** A requirement met by one role alone. */
    public static Requirement of(String role) {
        return new Requirement(role, List.of(List.of(role)));
    }

    /** True for a choice, false for a plain role. */
    public boolean isChoice() {
        return !(options.size() == 1 && options.get(0).equals(List.of(name)));
    }

    /** Every role any alternative names, in the order they appear. */
    public List<String> roleNames() {
        Set<String> out = new LinkedHashSet<>();
        options.forEach(out::addAll);
        return List.copyOf(out);
    }

    /** True when all roles of at least one alternative are found. */
    public boolean metBy(Predicate<String> found) {
        return options.stream().anyMatch(o -> o.stream().allMatch(found));
    }

    /**
     * The requirement in words: the role name, or for a choice its name and alternatives, e.g.
     * {@code damper (damper_position or damper_command)}.
     */
    public String describe() {
        if (!isChoice()) {
            return name;
        }
        List<String> alternatives = new ArrayList<>();
        for (List<String> o : options) {
            alternatives.add(String.join(" + ", o));
        }
        return name + " (" + String.join(" or ", alternatives) + ")";
    }
}
