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
 * Picks the Brick class whose associated tags (brick:hasAssociatedTag) best match a set of tags, and the best rival
 * answer, so that a caller can tell a clear answer from a close call.
 *
 * <p>Score: the Jaccard index |T ∩ A| / |T ∪ A| of the query tags T and a class's tags A (P. Jaccard, Bulletin
 * de la Société Vaudoise des Sciences Naturelles 37, 1901). Candidates are the subclasses of a root (brick:Point
 * for points) that carry tags. A deprecated class takes part under its old name when Brick names a current Brick
 * class as its replacement: its tag set is its own, or, when Brick 1.4 gives it none and every word of its name is a
 * Brick tag, those words ("Chilled_Water_Supply_Temperature_Sensor" -> Chilled, Water, Supply, Temperature, Sensor), and
 * it answers with the replacement (Leaving_Chilled_Water_Temperature_Sensor): the supply/return to
 * leaving/entering renames of Brick 1.3 are resolved for the user. Ties break, in order, on a current class over
 * a deprecated one, the deeper class (longer rdfs:subClassOf chain: the more specific one), fewer tags, then the
 * name alphabetically, so the answer never depends on hash order.
 *
 * <p>The runner-up is the best candidate whose answer is a different concept: not the winner's class, an
 * owl:equivalentClass partner or a superclass of it (a parent is the same answer said less precisely). The use of
 * Jaccard over Brick tag sets is common practice, no source; the deprecated-name candidates, tie-break order and
 * runner-up rule are our choice.
 *
 * <p>Immutable after {@link #fit}; results are memoised per tag set in a concurrent map (values are a pure
 * function of the key), so one resolver can be shared between threads.
 */
public final class TagClassResolver {

    /**
     * The best class for a tag set and its score, the best rival answer and its score (0 when none), and the
     * deprecated class whose name matched when the answer is its replacement.
     */
    public record Resolution(String className, double score, Optional<String> runnerUp, double runnerUpScore,
            Optional<String> viaDeprecated) {
        /** How far the winner is ahead of the rival (the winner's score when there is none). */
        public double margin() {
            return score - runnerUpScore;
        }
    }

    /** A candidate: the name that matched, its tags, what it answers, whether it is deprecated, its depth. */
    private record Candidate(String name, Set<String> tags, String answer, boolean deprecated, int depth) {
    }

    private final BrickVocabulary vocabulary;
    private final List<Candidate> candidates;
    private final ConcurrentHashMap<SortedSet<String>, Optional<Resolution>> memo = new ConcurrentHashMap<>();

    private TagClassResolver(BrickVocabulary vocabulary, List<Candidate> candidates) {
        this.vocabulary = vocabulary;
        this.candidates = candidates;
    }

    /** Prepares a resolver over the tagged subclasses of {@code root} (e.g. "Point"). */
    public static TagClassResolver fit(BrickVocabulary vocabulary, String root) {
        List<Candidate> list = new ArrayList<>();
        for (String c : vocabulary.classNames()) {
            if (!vocabulary.isA(c, root)) {
                continue;
            }
            SortedSet<String> tags = vocabulary.associatedTags(c);
            if (vocabulary.deprecation(c).isEmpty()) {
                if (!tags.isEmpty()) {
                    list.add(new Candidate(c, Collections.unmodifiableSet(new TreeSet<>(tags)), c, false,
                            vocabulary.depth(c)));
                }
                continue;
            }
            Optional<String> current = vocabulary.current(c);
            if (current.isEmpty() || !vocabulary.isA(current.get(), root)) {
                continue;
            }
            SortedSet<String> own = new TreeSet<>(tags);
            if (own.isEmpty()) {
                // only a name made wholly of tags says what the class is; one word short would match too much
                for (String w : c.split("_")) {
                    if (!vocabulary.isTag(w)) {
                        own.clear();
                        break;
                    }
                    own.add(w);
                }
                if (!own.isEmpty() && vocabulary.isTag(root)) {
                    own.add(root);
                }
            }
            if (!own.isEmpty()) {
                list.add(new Candidate(c, Collections.unmodifiableSet(own), current.get(), true,
                        vocabulary.depth(current.get())));
            }
        }
        return new TagClassResolver(vocabulary, List.copyOf(list));
    }

    /** Number of candidate classes (current ones and deprecated names). */
    public int size() {
        return candidates.size();
    }

    /** The best-matching class; empty when no candidate shares a tag with {@code tags}. */
    public Optional<Resolution> resolve(SortedSet<String> tags) {
        return memo.computeIfAbsent(Collections.unmodifiableSortedSet(new TreeSet<>(tags)), this::compute);
    }

    private Optional<Resolution> compute(SortedSet<String> tags) {
        List<Candidate> ranked = new ArrayList<>();
        List<Double> scores = new ArrayList<>();
        Candidate best = null;
        double bestScore = 0;
        for (Candidate c : candidates) {
            double s = jaccard(tags, c.tags());
            if (s <= 0) {
                continue;
            }
            ranked.add(c);
            scores.add(s);
            if (best == null || better(c, s, best, bestScore)) {
                best = c;
                bestScore = s;
            }
        }
        if (best == null) {
            return Optional.empty();
        }
        String answer = best.answer();
        Candidate rival = null;
        double rivalScore = 0;
        for (int i = 0; i < ranked.size(); i++) {
            Candidate c = ranked.get(i);
            double s = scores.get(i);
            if (sameAnswer(c.answer(), answer)) {
                continue;
            }
            if (rival == null || better(c, s, rival, rivalScore)) {
                rival = c;
                rivalScore = s;
            }
        }
        return Optional.of(new Resolution(answer, bestScore, Optional.ofNullable(rival).map(Candidate::answer),
                rivalScore, best.deprecated() ? Optional.of(best.name()) : Optional.empty()));
    }

    /** Is {@code other} the winner's answer, an equivalent, or a superclass of it? */
    private boolean sameAnswer(String other, String winner) {
        return other.equals(winner) || vocabulary.sameClass(other, winner) || vocabulary.isA(winner, other);
    }

    private static boolean better(Candidate c, double s, Candidate than, double thanScore) {
        if (s != thanScore) {
            return s > thanScore;
        }
        if (c.deprecated() != than.deprecated()) {
            return !c.deprecated();
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
