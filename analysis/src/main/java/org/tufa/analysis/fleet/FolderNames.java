package org.tufa.analysis.fleet;

import java.util.HashSet;
import java.util.Locale;
import java.util.Set;

/**
 * Safe, unique folder names for units. A unit IRI comes from someone else's model and may hold anything
 * ({@code urn:x#../../etc}); the folder name keeps only letters, digits, '-', '_' and '.', never starts with a dot,
 * is at most 80 characters, and is made unique with a numeric suffix after a collision. Not thread-safe: one
 * instance names the units of one run, in the run's fixed unit order, so names are deterministic.
 */
public final class FolderNames {

    private static final int MAX_LENGTH = 80;
    private final Set<String> used = new HashSet<>();

    /** The local name of an IRI: the text after the last '#', '/' or ':'. */
    public static String localName(String iri) {
        int cut = Math.max(iri.lastIndexOf('#'), Math.max(iri.lastIndexOf('/'), iri.lastIndexOf(':')));
        String local = iri.substring(cut + 1);
        return local.isEmpty() ? iri : local;
    }

    /** A folder name for the unit, unique among those this instance has given. */
    public String next(String unitIri) {
        String base = sanitize(localName(unitIri));
        String name = base;
        for (int k = 2; !used.add(name.toLowerCase(Locale.ROOT)); k++) {
            // Compared case-insensitively: two units must not share a folder on case-insensitive file systems.
            name = base + "_" + k;
        }
        return name;
    }

    static String sanitize(String raw) {
        StringBuilder b = new StringBuilder(raw.length());
        for (int i = 0; i < raw.length() && b.length() < MAX_LENGTH; i++) {
            char c = raw.charAt(i);
            boolean ok = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9')
                    || c == '-' || c == '_' || c == '.';
            b.append(ok ? c : '_');
        }
        String s = b.toString();
        while (s.startsWith(".")) {
            s = "_" + s.substring(1);
        }
        return s.isEmpty() ? "unit" : s;
    }
}
