package org.tufa.vocabulary;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * The unit names of QUDT 3.1.0 (http://qudt.org/vocab/unit/, the units Brick's {@code brick:hasUnit} points to):
 * the resource {@code qudt-units.txt}, written by {@code mapper/tools/qudt_units.py} from the published unit
 * vocabulary. A unit name outside it is a typing error, refused with the nearest names.
 */
public final class QudtUnits {

    private static final String RESOURCE = "org/tufa/vocabulary/qudt-units.txt";

    /** Every name, as QUDT spells it. */
    private static final java.util.SortedSet<String> NAMES = load();
    /** Upper-cased name to the names QUDT spells that way (a dozen pairs differ only in case: DA and Da). */
    private static final Map<String, List<String>> BY_UPPER_CASE = byUpperCase(NAMES);

    private QudtUnits() {
    }

    /** Every unit name, sorted. */
    public static List<String> names() {
        return List.copyOf(NAMES);
    }

    /**
     * The unit as QUDT spells it, for a local name, a {@code unit:} name or a QUDT IRI: the exact name, or else
     * the one name that matches ignoring case ({@code deg_f} gives {@code DEG_F}); empty when QUDT has no such
     * unit or the case does not tell two apart.
     */
    public static Optional<String> canonical(String name) {
        String n = name.strip();
        for (String prefix : List.of("http://qudt.org/vocab/unit/", "https://qudt.org/vocab/unit/", "unit:")) {
            if (n.startsWith(prefix)) {
                n = n.substring(prefix.length());
            }
        }
        if (NAMES.contains(n)) {
            return Optional.of(n);
        }
        List<String> same = BY_UPPER_CASE.getOrDefault(n.toUpperCase(Locale.ROOT), List.of());
        return same.size() == 1 ? Optional.of(same.get(0)) : Optional.empty();
    }

    /** Up to three QUDT unit names nearest to an unknown one. */
    public static List<String> nearest(String unknown) {
        return NameSuggester.nearestAlways(unknown, NAMES, 3);
    }

    private static Map<String, List<String>> byUpperCase(java.util.SortedSet<String> names) {
        Map<String, List<String>> map = new TreeMap<>();
        for (String n : names) {
            map.computeIfAbsent(n.toUpperCase(Locale.ROOT), k -> new java.util.ArrayList<>()).add(n);
        }
        return java.util.Collections.unmodifiableMap(map);
    }

    private static java.util.SortedSet<String> load() {
        java.util.SortedSet<String> names = new java.util.TreeSet<>();
        try (InputStream in = QudtUnits.class.getClassLoader().getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("classpath resource " + RESOURCE + " missing: broken build");
            }
            BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            for (String line; (line = r.readLine()) != null; ) {
                if (!line.isBlank() && !line.startsWith("#")) {
                    names.add(line.strip());
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return java.util.Collections.unmodifiableSortedSet(names);
    }
}
