package org.tufa.mapper.rules;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SortedSet;
import java.util.TreeSet;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * Abbreviations -> Brick tags. A key is one or more tokens ("DA", "S/S", "Disch Air"); lookup walks the tokens
 * of a text left to right and takes the longest key that starts at each position (greedy longest match). A
 * token no key covers counts as the Brick tag of the same name when there is one ("Fan", "temperature"), is
 * skipped when it is all digits, and is otherwise reported as unknown.
 */
public final class Dictionary {

    /** One abbreviation line: key tokens (upper case), tags (empty when the key is ignored), file line. */
    public record Entry(List<String> key, List<String> tags, int line) {
        public Entry {
            key = List.copyOf(key);
            tags = List.copyOf(tags);
        }
    }

    /** The tags a text yields, and the tokens that meant nothing. */
    public record Lookup(SortedSet<String> tags, List<String> unknownTokens) {
    }

    private final Map<String, List<Entry>> byFirstToken;
    private final int longestKey;
    private final Dictionary fallback;

    private Dictionary(List<Entry> entries, Dictionary fallback) {
        Map<String, List<Entry>> m = new HashMap<>();
        int longest = 0;
        for (Entry e : entries) {
            // later lines override earlier ones with the same key: keep the last, remove the first
            List<Entry> list = m.computeIfAbsent(e.key().get(0), k -> new ArrayList<>());
            list.removeIf(x -> x.key().equals(e.key()));
            list.add(e);
            longest = Math.max(longest, e.key().size());
        }
        for (List<Entry> list : m.values()) {
            list.sort((a, b) -> Integer.compare(b.key().size(), a.key().size()));
        }
        this.byFirstToken = Collections.unmodifiableMap(m);
        this.longestKey = longest;
        this.fallback = fallback;
    }

    /** A dictionary of these entries; keys not found fall through to {@code fallback} (may be null). */
    public static Dictionary of(List<Entry> entries, Dictionary fallback) {
        return new Dictionary(entries, fallback);
    }

    /** Is there no entry at all (including the fallback)? */
    public boolean isEmpty() {
        return byFirstToken.isEmpty() && (fallback == null || fallback.isEmpty());
    }

    /** Tags for the tokens of {@code text}. */
    public Lookup lookup(String text, BrickVocabulary vocabulary) {
        List<String> tokens = Tokenizer.tokens(text);
        List<String> keys = new ArrayList<>(tokens.size());
        for (String t : tokens) {
            keys.add(t.toUpperCase(Locale.ROOT));
        }
        SortedSet<String> tags = new TreeSet<>();
        List<String> unknown = new ArrayList<>();
        int i = 0;
        while (i < keys.size()) {
            Entry hit = longestAt(keys, i);
            if (hit != null) {
                tags.addAll(hit.tags());
                i += hit.key().size();
                continue;
            }
            String tok = tokens.get(i);
            var tag = vocabulary.tagIgnoringCase(tok);
            if (tag.isPresent()) {
                tags.add(tag.get());
            } else if (!tok.chars().allMatch(Character::isDigit)) {
                unknown.add(tok);
            }
            i++;
        }
        return new Lookup(tags, unknown);
    }

    private Entry longestAt(List<String> keys, int i) {
        List<Entry> candidates = byFirstToken.get(keys.get(i));
        if (candidates != null) {
            for (Entry e : candidates) {
                if (e.key().size() <= keys.size() - i && keys.subList(i, i + e.key().size()).equals(e.key())) {
                    // a longer fallback key still beats a shorter local one
                    Entry fb = fallback == null ? null : fallback.longestAt(keys, i);
                    return fb != null && fb.key().size() > e.key().size() ? fb : e;
                }
            }
        }
        return fallback == null ? null : fallback.longestAt(keys, i);
    }

    /** Longest key length in tokens (for tests and diagnostics). */
    public int longestKey() {
        return longestKey;
    }
}
