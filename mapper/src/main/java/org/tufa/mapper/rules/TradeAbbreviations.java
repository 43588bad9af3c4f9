package org.tufa.mapper.rules;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * tufa's built-in dictionary of building-automation abbreviations (resource {@value #RESOURCE}): the level under
 * every rule file's own {@code abbr} lines. Each entry names its source; an entry whose tags the vocabulary in use
 * does not define (an older Brick passed with --vocabulary) is left out.
 */
public final class TradeAbbreviations {

    /** Classpath location of the list. */
    public static final String RESOURCE = "org/tufa/mapper/rules/trade-abbreviations.txt";

    /** One entry: key tokens (upper case), tags, where it comes from, and its line in the list. */
    public record Abbreviation(List<String> key, List<String> tags, String source, int line) {
    }

    private TradeAbbreviations() {
    }

    /** Every entry of the list, in order (tags as written, not checked). */
    public static List<Abbreviation> all() {
        List<Abbreviation> out = new ArrayList<>();
        try (InputStream in = TradeAbbreviations.class.getClassLoader().getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("classpath resource missing: " + RESOURCE);
            }
            BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            String line;
            int n = 0;
            while ((line = r.readLine()) != null) {
                n++;
                String t = line.strip();
                if (t.isEmpty() || t.startsWith("#")) {
                    continue;
                }
                int bar = t.indexOf('|');
                int eq = t.indexOf('=');
                if (bar < 0 || eq < 0 || eq > bar) {
                    throw new IllegalStateException(RESOURCE + ":" + n + ": expected 'KEY = Tags | source'");
                }
                List<String> tags = List.of(t.substring(eq + 1, bar).strip().split("\\s+"));
                out.add(new Abbreviation(Tokenizer.keys(t.substring(0, eq)), tags, t.substring(bar + 1).strip(), n));
            }
        } catch (IOException e) {
            throw new IllegalStateException("cannot read " + RESOURCE, e);
        }
        return out;
    }

    /** The entries whose tags all exist in {@code vocabulary}, as a dictionary level with no fallback. */
    public static Dictionary dictionary(BrickVocabulary vocabulary) {
        List<Dictionary.Entry> entries = new ArrayList<>();
        for (Abbreviation a : all()) {
            if (a.tags().stream().allMatch(vocabulary::isTag)) {
                entries.add(new Dictionary.Entry(a.key(), a.tags(), -a.line()));
            }
        }
        return Dictionary.of(entries, null);
    }
}
