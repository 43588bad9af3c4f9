package org.tufa.mapper.match;

import java.util.Locale;

/** What happened to one input row. */
public enum Status {
    /** A rule gave it a Brick class (and equipment, when the rule names one). */
    MAPPED,
    /** No rule matched, or the matching rule's tags fit no class well enough. */
    UNMAPPED,
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
}
