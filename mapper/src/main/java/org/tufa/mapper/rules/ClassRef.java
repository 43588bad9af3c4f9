package org.tufa.mapper.rules;

import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;

/**
 * Where a rule line's class comes from: a fixed class ({@code Fan_Coil_Unit}, {@code rec:Level}) or a table
 * look-up ({@code FANS[{kind}]}: the {@code table FANS} line's class for the text of group {@code kind}, compared
 * ignoring case).
 *
 * @param fixed the class, when fixed
 * @param table the table's name, when looked up
 * @param key the key template, when looked up
 * @param entries the table (upper-case key -> class), when looked up
 */
public record ClassRef(String fixed, String table, Template key, Map<String, String> entries) {

    /** A fixed class. */
    public static ClassRef of(String className) {
        return new ClassRef(className, null, null, Map.of());
    }

    /**
     * A table look-up. {@code entries} is the parser's table, seen through a read-only view so that table lines
     * further down the file count too; the parser never changes it once the file is read.
     */
    public static ClassRef lookup(String table, Template key, Map<String, String> entries) {
        return new ClassRef(null, table, key, java.util.Collections.unmodifiableMap(entries));
    }

    public boolean isFixed() {
        return fixed != null;
    }

    /** The class for a point's values; empty when the key is not in the table. */
    public Optional<String> resolve(Function<String, String> values) {
        if (isFixed()) {
            return Optional.of(fixed);
        }
        return Optional.ofNullable(entries.get(keyText(values)));
    }

    /** The key a point's values give (upper case). */
    public String keyText(Function<String, String> values) {
        return key.render(values).toUpperCase(Locale.ROOT);
    }
}
