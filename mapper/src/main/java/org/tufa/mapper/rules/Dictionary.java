package org.tufa.mapper.rules;

import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SortedSet;
import java.util.TreeSet;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * Abbreviations -> Brick tags, in levels: a rule's own lines, then the file's, then tufa's built-in trade
 * abbreviations ({@link TradeAbbreviations}). Lookup walks the tokens of a text left to right; at each position
 * the nearest level that has a key starting there decides, and within a level the longest such key wins (greedy
 * longest match): a rule's {@code SP} beats the file's {@code SP T}. A token no key covers counts as the Brick tag
 * of the same name when there is one ("Fan", "temperature"), is skipped when it is all digits, and is otherwise
 * reported as unknown.
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
    /** Key words of this level and the levels below that mix letters and digits, kept whole by the tokenizer. */
    private final List<String> wholeWords;
    /** This level's whole words merged with a vocabulary's (cached for the last vocabulary seen). */
    private volatile Object[] wholeCache;

    private Dictionary(List<Entry> entries, Dictionary fallback) {
        Map<String, List<Entry>> m = new HashMap<>();
        int longest = 0;
        TreeSet<String> whole = new TreeSet<>();
        for (Entry e : entries) {
            // later lines override earlier ones with the same key: keep the last, remove the first
            List<Entry> list = m.computeIfAbsent(e.key().get(0), k -> new ArrayList<>());
            list.removeIf(x -> x.key().equals(e.key()));
            list.add(e);
            longest = Math.max(longest, e.key().size());
            for (String k : e.key()) {
                if (Tokenizer.mixesLettersAndDigits(k)) {
                    whole.add(k);
                }
            }
        }
        for (List<Entry> list : m.values()) {
            list.sort((a, b) -> Integer.compare(b.key().size(), a.key().size()));
        }
        if (fallback != null) {
            whole.addAll(fallback.wholeWords);
        }
        this.byFirstToken = Collections.unmodifiableMap(m);
        this.longestKey = longest;
        this.fallback = fallback;
        this.wholeWords = longestFirst(whole);
    }

    private static List<String> longestFirst(java.util.Collection<String> words) {
        List<String> out = new ArrayList<>(words);
        out.sort(Comparator.comparingInt(String::length).reversed().thenComparing(Comparator.naturalOrder()));
        return List.copyOf(out);
    }

    /** A dictionary of these entries; keys not found fall through to {@code fallback} (may be null). */
    public static Dictionary of(List<Entry> entries, Dictionary fallback) {
        return new Dictionary(entries, fallback);
    }

    /** Is there no entry at all (including the fallback)? */
    public boolean isEmpty() {
        return byFirstToken.isEmpty() && (fallback == null || fallback.isEmpty());
    }

    /** The tokens of a text as this dictionary sees them (its mixed letter-digit keys and the vocabulary's kept whole). */
    public List<String> tokens(String text, BrickVocabulary vocabulary) {
        return Tokenizer.tokens(text, wholeWords(vocabulary));
    }

    private List<String> wholeWords(BrickVocabulary vocabulary) {
        Object[] c = wholeCache;
        if (c != null && c[0] == vocabulary) {
            @SuppressWarnings("unchecked")
            List<String> w = (List<String>) c[1];
            return w;
        }
        TreeSet<String> all = new TreeSet<>(wholeWords);
        for (String t : vocabulary.tagNames()) {
            if (Tokenizer.mixesLettersAndDigits(t)) {
                all.add(t.toUpperCase(Locale.ROOT));
            }
        }
        List<String> w = longestFirst(all);
        wholeCache = new Object[] {vocabulary, w};
        return w;
    }

    /** Tags for the tokens of {@code text}. */
    public Lookup lookup(String text, BrickVocabulary vocabulary) {
        List<String> tokens = tokens(text, vocabulary);
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

    /** The entry that decides at position i: this level's longest key there, else the fallback's. */
    private Entry longestAt(List<String> keys, int i) {
        List<Entry> candidates = byFirstToken.get(keys.get(i));
        if (candidates != null) {
            for (Entry e : candidates) {
                if (e.key().size() <= keys.size() - i && keys.subList(i, i + e.key().size()).equals(e.key())) {
                    return e;
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
