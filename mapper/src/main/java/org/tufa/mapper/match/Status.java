package org.tufa.mapper.match;

import java.util.Locale;

/** What happened to one input row. */
public enum Status {
    /** A rule gave it a Brick class with a clear lead over any rival (and equipment, when the rule names one). */
    MAPPED,
    /** A rule took it, but the best class and a different runner-up scored within the margin: a person decides. */
    AMBIGUOUS,
    /** A rule took it, but its tags give no class (only brick:Point, or nothing scoring min-score). */
    UNCLASSIFIED,
    /** No rule matched. */
    UNMAPPED,
    /** A {@code skip} line left it out on purpose, with its reason. */
    SKIPPED,
    /** Two competing rules matched with different classes or equipment. */
    CONFLICT,
    /** Its name occurs on more than one row; every occurrence is kept and mapped as if alone. */
    DUPLICATE,
    /** The row cannot be a point (empty name). */
    REJECTED;

    /** Lower-case word used in reports. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Does this outcome need a person (a rule to write, a class to choose)? */
    public boolean unsettled() {
        return this == AMBIGUOUS || this == UNCLASSIFIED || this == UNMAPPED || this == CONFLICT;
    }
}
