package org.tufa.vocabulary;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.SortedSet;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Picks the Brick class whose associated tags (brick:hasAssociatedTag) best match a set of tags.
 *
 * <p>Score: the Jaccard index |T ∩ A| / |T ∪ A| of the query tags T and a class's tags A (P. Jaccard, Bulletin
 * de la Société Vaudoise des Sciences Naturelles 37, 1901). Candidates are the non-deprecated subclasses of a
 * root (brick:Point for points, brick:Equipment for equipment) that carry tags. Ties break, in order, on the deeper
 * class (longer rdfs:subClassOf chain: the more specific one), then on fewer tags, then on the name
 * alphabetically, so the answer never depends on hash order. The use of Jaccard over Brick tag sets is
 * common practice, no source; the tie-break order is our choice.
 *
 * <p>Immutable after {@link #fit}; results are memoised per tag set in a concurrent map (values are a pure
 * function of the key), so one resolver can be shared between threads.
 */
public final class TagClassResolver {

    /** The best class for a tag set, its score and the runner-up (for explanations). */
    public record Resolution(String className, double score, Optional<String> runnerUp, double runnerUpScore) {
    }

    private record Candidate(String name, Set<String> tags, int depth) {
    }

    private final List<Candidate> candidates;
    private final ConcurrentHashMap<SortedSet<String>, Optional<Resolution>> memo = new ConcurrentHashMap<>();

    private TagClassResolver(List<Candidate> candidates) {
        this.candidates = candidates;
    }

    /** Prepares a resolver over the non-deprecated tagged subclasses of {@code root} (e.g. "Point"). */
    public static TagClassResolver fit(BrickVocabulary vocabulary, String root) {
        List<Candidate> list = new ArrayList<>();
        for (String c : vocabulary.classNames()) {
            SortedSet<String> tags = vocabulary.associatedTags(c);
            if (!tags.isEmpty() && vocabulary.deprecation(c).isEmpty() && vocabulary.isA(c, root)) {
                list.add(new Candidate(c, Collections.unmodifiableSet(new TreeSet<>(tags)), vocabulary.depth(c)));
            }
        }
        return new TagClassResolver(List.copyOf(list));
    }

    /** Number of candidate classes. */
    public int size() {
        return candidates.size();
    }

    /** The best-matching class; empty when no candidate shares a tag with {@code tags}. */
    public Optional<Resolution> resolve(SortedSet<String> tags) {
        return memo.computeIfAbsent(Collections.unmodifiableSortedSet(new TreeSet<>(tags)), this::compute);
    }

    private Optional<Resolution> compute(SortedSet<String> tags) {
        Candidate best = null;
        double bestScore = 0;
        Candidate second = null;
        double secondScore = 0;
        for (Candidate c : candidates) {
            double s = jaccard(tags, c.tags());
            if (s <= 0) {
                continue;
            }
            if (best == null || better(c, s, best, bestScore)) {
                second = best;
                secondScore = bestScore;
                best = c;
                bestScore = s;
            } else if (second == null || better(c, s, second, secondScore)) {
                second = c;
                secondScore = s;
            }
        }
        if (best == null) {
            return Optional.empty();
        }
        return Optional.of(new Resolution(best.name(), bestScore,
                Optional.ofNullable(second).map(Candidate::name), secondScore));
    }

    private static boolean better(Candidate c, double s, Candidate than, double thanScore) {
        if (s != thanScore) {
            return s > thanScore;
        }
        if (c.depth() != than.depth()) {
            return c.depth() > than.depth();
        }
        if (c.tags().size() != than.tags().size()) {
            return c.tags().size() < than.tags().size();
        }
        return c.name().compareTo(than.name()) < 0;
    }

    /** |a ∩ b| / |a ∪ b|; 0 when both are empty. */
    public static double jaccard(Set<String> a, Set<String> b) {
        int inter = 0;
        for (String x : a) {
            if (b.contains(x)) {
                inter++;
            }
        }
        int union = a.size() + b.size() - inter;
        return union == 0 ? 0 : (double) inter / union;
    }
}
