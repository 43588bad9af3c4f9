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

    /** Upper-cased name to the name as QUDT spells it (QUDT names do not collide ignoring case). */
    private static final Map<String, String> NAMES = load();

    private QudtUnits() {
    }

    /** Every unit name, sorted. */
    public static List<String> names() {
        return List.copyOf(new java.util.TreeSet<>(NAMES.values()));
    }

    /**
     * The unit as QUDT spells it, for a local name, a {@code unit:} name or a QUDT IRI, ignoring case
     * ({@code deg_f} gives {@code DEG_F}); empty when QUDT has no such unit.
     */
    public static Optional<String> canonical(String name) {
        String n = name.strip();
        for (String prefix : List.of("http://qudt.org/vocab/unit/", "https://qudt.org/vocab/unit/", "unit:")) {
            if (n.startsWith(prefix)) {
                n = n.substring(prefix.length());
            }
        }
        return Optional.ofNullable(NAMES.get(n.toUpperCase(Locale.ROOT)));
    }

    /** Up to three QUDT unit names nearest to an unknown one. */
    public static List<String> nearest(String unknown) {
        return NameSuggester.nearestAlways(unknown, NAMES.values(), 3);
    }

    private static Map<String, String> load() {
        Map<String, String> names = new TreeMap<>();
        try (InputStream in = QudtUnits.class.getClassLoader().getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("classpath resource " + RESOURCE + " missing: broken build");
            }
            BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            for (String line; (line = r.readLine()) != null; ) {
                if (!line.isBlank() && !line.startsWith("#")) {
                    names.put(line.strip().toUpperCase(Locale.ROOT), line.strip());
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return java.util.Collections.unmodifiableMap(names);
    }
}
