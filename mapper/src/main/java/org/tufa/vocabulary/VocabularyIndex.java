package org.tufa.vocabulary;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * tufa's compact form of a Brick vocabulary: one UTF-8 text line per class, tag, property or unit, tab-separated,
 * sorted, so it loads in a few milliseconds without an RDF parser and its diffs stay readable when Brick changes.
 *
 * <pre>
 * # comment lines
 * version  1.4.4
 * ontology IRI     (the owl:Ontology the Brick file declares)
 * class    NAME  PARENTS  EQUIVALENTS  TAGS  DEPRECATION  LABEL  DEFINITION
 * tag      NAME
 * term     IRI   TYPES    INVERSE      LABEL  DEFINITION
 * unit     NAME  QUANTITIES
 * </pre>
 *
 * Lists are space-separated local names; DEPRECATION is empty or {@code VERSION|REPLACEMENT-IRI|MESSAGE}; LABEL
 * and DEFINITION are empty or {@code LANGUAGE:TEXT}; text escapes backslash, tab, line feed and carriage return
 * as {@code \\ \t \n \r}. The format is ours; {@link BundleBrick} writes it from a Brick file.
 */
public final class VocabularyIndex {

    private VocabularyIndex() {
    }

    /** Writes the vocabulary; {@code header} lines are written as comments first. */
    public static void write(BrickVocabulary v, List<String> header, Writer out) throws IOException {
        for (String h : header) {
            out.write("# " + h + "\n");
        }
        out.write("version\t" + escape(v.version()) + "\n");
        if (!v.ontologyIri().isEmpty()) {
            out.write("ontology\t" + v.ontologyIri() + "\n");
        }
        for (BrickVocabulary.ClassInfo c : v.classes().values()) {
            String dep = c.deprecation().map(d -> d.version() + "|" + d.replacementIri() + "|" + d.message())
                    .orElse("");
            out.write(String.join("\t", "class", c.name(), String.join(" ", c.parents()),
                    String.join(" ", c.equivalents()), String.join(" ", c.tags()), escape(dep), text(c.label()),
                    text(c.definition())) + "\n");
        }
        for (String t : v.tagNames()) {
            out.write("tag\t" + t + "\n");
        }
        for (BrickVocabulary.Term t : v.terms().values()) {
            out.write(String.join("\t", "term", t.iri(), String.join(" ", t.types()), t.inverse(), text(t.label()),
                    text(t.definition())) + "\n");
        }
        for (Map.Entry<String, SortedSet<String>> u : v.unitQuantities().entrySet()) {
            out.write("unit\t" + u.getKey() + "\t" + String.join(" ", u.getValue()) + "\n");
        }
    }

    /** Reads an index; {@code source} names it in messages ("bundled Brick"). */
    public static BrickVocabulary read(InputStream in, String source) throws IOException {
        BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8), 1 << 16);
        String version = "";
        String ontology = "";
        List<BrickVocabulary.RawClass> classes = new ArrayList<>(2048);
        SortedSet<String> tags = new TreeSet<>();
        SortedMap<String, BrickVocabulary.Term> terms = new TreeMap<>();
        SortedMap<String, SortedSet<String>> units = new TreeMap<>();
        String line;
        int n = 0;
        while ((line = r.readLine()) != null) {
            n++;
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            String[] f = line.split("\t", -1);
            switch (f[0]) {
                case "version" -> version = unescape(field(f, 1, n));
                case "ontology" -> ontology = field(f, 1, n);
                case "class" -> {
                    String dep = unescape(field(f, 5, n));
                    Optional<Deprecation> d = Optional.empty();
                    if (!dep.isEmpty()) {
                        String[] p = dep.split("\\|", 3);
                        if (p.length != 3) {
                            throw new IOException("vocabulary index line " + n + ": bad deprecation field");
                        }
                        d = Optional.of(new Deprecation(p[1], p[0], p[2]));
                    }
                    classes.add(new BrickVocabulary.RawClass(f[1], words(field(f, 2, n)), words(field(f, 3, n)),
                            words(field(f, 4, n)), d, parseText(field(f, 6, n)), parseText(field(f, 7, n))));
                }
                case "tag" -> tags.add(field(f, 1, n));
                case "term" -> terms.put(f[1], new BrickVocabulary.Term(f[1], words(field(f, 2, n)),
                        field(f, 3, n), parseText(field(f, 4, n)), parseText(field(f, 5, n))));
                case "unit" -> units.put(f[1], words(field(f, 2, n)));
                default -> throw new IOException("vocabulary index line " + n + ": unknown record '" + f[0] + "'");
            }
        }
        return new BrickVocabulary(source, version, ontology, classes, tags, terms, units);
    }

    private static String field(String[] f, int i, int line) throws IOException {
        if (i >= f.length) {
            throw new IOException("vocabulary index line " + line + ": " + f[0] + " record has " + f.length
                    + " fields, expected more than " + i);
        }
        return f[i];
    }

    private static SortedSet<String> words(String s) {
        SortedSet<String> out = new TreeSet<>();
        if (!s.isEmpty()) {
            for (String w : s.split(" ")) {
                out.add(w);
            }
        }
        return out;
    }

    private static String text(BrickVocabulary.Text t) {
        return t.isEmpty() ? "" : escape(t.language() + ":" + t.lexical());
    }

    private static BrickVocabulary.Text parseText(String s) {
        if (s.isEmpty()) {
            return BrickVocabulary.Text.NONE;
        }
        String u = unescape(s);
        int colon = u.indexOf(':');
        return new BrickVocabulary.Text(u.substring(colon + 1), u.substring(0, colon));
    }

    static String escape(String s) {
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '\\' -> b.append("\\\\");
                case '\t' -> b.append("\\t");
                case '\n' -> b.append("\\n");
                case '\r' -> b.append("\\r");
                default -> b.append(c);
            }
        }
        return b.toString();
    }

    static String unescape(String s) {
        if (s.indexOf('\\') < 0) {
            return s;
        }
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c == '\\' && i + 1 < s.length()) {
                char e = s.charAt(++i);
                b.append(switch (e) {
                    case 't' -> '\t';
                    case 'n' -> '\n';
                    case 'r' -> '\r';
                    default -> e;
                });
            } else {
                b.append(c);
            }
        }
        return b.toString();
    }
}
