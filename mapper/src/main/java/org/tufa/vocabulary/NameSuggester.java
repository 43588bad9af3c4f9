package org.tufa.vocabulary;

import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

/**
 * Nearest existing names for a misspelt one, so an error can say "did you mean ...".
 *
 * <p>Score of a candidate c for the query q, both lower-cased and split on '_' and spaces (higher is nearer):
 * {@code 0.5 * tokenOverlap + 0.5 * (1 - levenshtein(q, c) / max(|q|, |c|))}, where tokenOverlap is the Jaccard
 * index of the token sets with a query token counting as present when it is a prefix of a candidate token (so
 * "Temp" finds "Temperature"). Levenshtein distance: V. I. Levenshtein, Soviet Physics Doklady 10(8), 1966.
 * Ties break alphabetically, so suggestions are deterministic. The mix of the two is common practice, no source.
 */
public final class NameSuggester {
    private NameSuggester() {
    }

    /** Up to {@code max} candidates nearest to {@code query}, best first; none scoring below 0.3. */
    public static List<String> nearest(String query, Collection<String> candidates, int max) {
        return nearest(query, candidates, max, 0.3);
    }

    /**
     * Up to {@code max} candidates nearest to {@code query}, best first, the nearest 0.3-scoring ones if any, else
     * the nearest at all: a message that says "unknown" always has names to offer.
     */
    public static List<String> nearestAlways(String query, Collection<String> candidates, int max) {
        List<String> near = nearest(query, candidates, max, 0.3);
        return near.isEmpty() ? nearest(query, candidates, max, Double.NEGATIVE_INFINITY) : near;
    }

    private static List<String> nearest(String query, Collection<String> candidates, int max, double minScore) {
        String q = query.toLowerCase(Locale.ROOT);
        List<String> qTokens = tokens(q);
        record Scored(String name, double score) {
        }
        List<Scored> scored = new ArrayList<>();
        for (String c : candidates) {
            String lc = c.toLowerCase(Locale.ROOT);
            double edit = 1.0 - (double) levenshtein(q, lc) / Math.max(1, Math.max(q.length(), lc.length()));
            double score = 0.5 * tokenOverlap(qTokens, tokens(lc)) + 0.5 * edit;
            if (score >= minScore) {
                scored.add(new Scored(c, score));
            }
        }
        scored.sort(Comparator.comparingDouble(Scored::score).reversed().thenComparing(Scored::name));
        return scored.stream().limit(max).map(Scored::name).toList();
    }

    static List<String> tokens(String s) {
        List<String> out = new ArrayList<>();
        for (String t : s.split("[_\\s:]+")) {
            if (!t.isEmpty()) {
                out.add(t);
            }
        }
        return out;
    }

    static double tokenOverlap(List<String> query, List<String> candidate) {
        if (query.isEmpty() || candidate.isEmpty()) {
            return 0;
        }
        int hits = 0;
        for (String q : query) {
            for (String c : candidate) {
                if (c.startsWith(q) || q.startsWith(c)) {
                    hits++;
                    break;
                }
            }
        }
        return (double) hits / (query.size() + candidate.size() - hits);
    }

    /** Edit distance, insert, delete and substitute each costing 1 (Levenshtein, Soviet Physics Doklady 10(8), 1966). */
    public static int levenshtein(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }
}
