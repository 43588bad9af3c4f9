package org.tufa.mapper.match;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeMap;
import org.tufa.mapper.rules.Dictionary;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * What the integrator should look at next: the points that need a person (unmapped, unclassified, ambiguous,
 * conflict; skipped points are left out, they were left out on purpose), grouped by the shape of the point's own
 * name segment, the tokens nothing knows, and the points whose labels would settle the most of the rest.
 *
 * <p>Shape: the text after the last '/', '\' or ':' (a path's own segment; the whole name otherwise), with every
 * digit run written '#' together with one or two letters glued to it (ids, ordinals and room numbers alike:
 * RM_B12, RM_12A and RM_1st all become RM_#; VAV07 becomes VAV#), except words kept whole such as the tag CO2.
 *
 * <p>Which to label next: greedy, one representative per shape. Labelling a point is taken to settle its whole
 * shape group and every other open point all of whose unknown tokens the chosen points hold (once the tokens'
 * meaning is known, the dictionary covers them). Each step picks the representative settling the most points not
 * yet settled (ties: larger shape, then name order). An active-learning idea in the spirit of Koh et al.,
 * BuildSys 2018 (ask for the labels that teach the most), with our own simple coverage count.
 */
public final class UnmappedExplainer {

    /** One shape: how many open points have it, by status, and the first of them as an example. */
    public record Group(String shape, int count, SortedMap<String, Integer> statuses, String example,
            long exampleLine) {
    }

    /** A point worth labelling, and how many open points its label would settle. */
    public record LabelNext(String name, long line, String shape, int settles) {
    }

    /** The whole explanation. */
    public record Explanation(List<Group> groups, List<Map.Entry<String, Integer>> unknownTokens,
            List<LabelNext> labelNext, int open) {
    }

    private UnmappedExplainer() {
    }

    /** Groups the open rows by shape (no dictionary: unknown tokens are not looked up). */
    public static List<Group> group(List<PointMapping> mappings) {
        return explain(mappings, null, null, 0).groups();
    }

    /** The explanation; {@code dictionary} and {@code vocabulary} find unknown tokens of rows no rule took. */
    public static Explanation explain(List<PointMapping> mappings, Dictionary dictionary, BrickVocabulary vocabulary,
            int maxLabels) {
        Map<String, List<PointMapping>> byShape = new HashMap<>();
        Map<PointMapping, Set<String>> unknown = new HashMap<>();
        Map<String, Integer> tokenCounts = new HashMap<>();
        int open = 0;
        for (PointMapping m : mappings) {
            Status s = m.outcome();
            if (!s.unsettled() && !(m.status() == Status.DUPLICATE && m.assignment().isEmpty())) {
                continue;
            }
            open++;
            String shape = shape(m.point().name());
            byShape.computeIfAbsent(shape, k -> new ArrayList<>()).add(m);
            Set<String> u = new LinkedHashSet<>();
            if (m.assignment().isPresent()) {
                m.assignment().get().ignoredTokens().forEach(t -> u.add(t.toUpperCase(Locale.ROOT)));
            } else if (dictionary != null && vocabulary != null) {
                dictionary.lookup(m.point().name(), vocabulary).unknownTokens()
                        .forEach(t -> u.add(t.toUpperCase(Locale.ROOT)));
            }
            u.removeIf(t -> t.chars().anyMatch(Character::isDigit) || t.length() < 2);
            unknown.put(m, u);
            u.forEach(t -> tokenCounts.merge(t, 1, Integer::sum));
        }
        List<Group> groups = new ArrayList<>();
        byShape.forEach((k, v) -> {
            SortedMap<String, Integer> st = new TreeMap<>();
            v.forEach(m -> st.merge(m.outcome().label(), 1, Integer::sum));
            groups.add(new Group(k, v.size(), st, v.get(0).point().name(), v.get(0).point().line()));
        });
        groups.sort(Comparator.comparingInt(Group::count).reversed().thenComparing(Group::shape));
        List<Map.Entry<String, Integer>> tokens = new ArrayList<>(tokenCounts.entrySet());
        tokens.sort(Map.Entry.<String, Integer>comparingByValue().reversed().thenComparing(Map.Entry.comparingByKey()));
        return new Explanation(groups, tokens, labelNext(byShape, unknown, maxLabels), open);
    }

    /** Open points that share a shape and a set of unknown tokens: settled together. */
    private record Bucket(String shape, Set<String> unknown, int count, PointMapping first) {
    }

    private static List<LabelNext> labelNext(Map<String, List<PointMapping>> byShape,
            Map<PointMapping, Set<String>> unknown, int max) {
        Map<String, Bucket> buckets = new TreeMap<>();
        List<String> shapes = new ArrayList<>(byShape.keySet());
        shapes.sort(Comparator.<String>comparingInt(k -> byShape.get(k).size()).reversed()
                .thenComparing(Comparator.naturalOrder()));
        for (String shape : shapes) {
            for (PointMapping m : byShape.get(shape)) {
                Set<String> u = new java.util.TreeSet<>(unknown.get(m));
                String key = shape + "\u0000" + String.join(" ", u);
                Bucket b = buckets.get(key);
                buckets.put(key, b == null ? new Bucket(shape, u, 1, m) : new Bucket(shape, u, b.count() + 1, b.first()));
            }
        }
        List<String> candidates = shapes.subList(0, Math.min(200, shapes.size()));
        List<LabelNext> out = new ArrayList<>();
        Set<String> settled = new java.util.HashSet<>();
        Set<String> taught = new java.util.HashSet<>();
        Set<String> chosen = new java.util.HashSet<>();
        while (out.size() < max) {
            String bestShape = null;
            int bestGain = 0;
            for (String shape : candidates) {
                if (chosen.contains(shape)) {
                    continue;
                }
                Set<String> teach = new java.util.HashSet<>(taught);
                teach.addAll(unknown.get(byShape.get(shape).get(0)));
                int gain = 0;
                for (Map.Entry<String, Bucket> e : buckets.entrySet()) {
                    Bucket b = e.getValue();
                    if (!settled.contains(e.getKey()) && (b.shape().equals(shape)
                            || !b.unknown().isEmpty() && teach.containsAll(b.unknown()))) {
                        gain += b.count();
                    }
                }
                if (gain > bestGain) {
                    bestGain = gain;
                    bestShape = shape;
                }
            }
            if (bestShape == null) {
                break;
            }
            PointMapping rep = byShape.get(bestShape).get(0);
            chosen.add(bestShape);
            taught.addAll(unknown.get(rep));
            for (Map.Entry<String, Bucket> e : buckets.entrySet()) {
                Bucket b = e.getValue();
                if (b.shape().equals(bestShape) || !b.unknown().isEmpty() && taught.containsAll(b.unknown())) {
                    settled.add(e.getKey());
                }
            }
            out.add(new LabelNext(rep.point().name(), rep.point().line(), bestShape, bestGain));
        }
        return out;
    }

    private static String collapse(String run) {
        String s = run.replaceAll("\\d+", "#");
        s = s.replaceAll("(?<![A-Za-z])[A-Za-z]{1,2}#", "#").replaceAll("#[A-Za-z]{1,2}(?![A-Za-z])", "#");
        return s.replaceAll("#+", "#");
    }

    /** The shape of a name's own segment (see the class comment). */
    public static String shape(String name) {
        int cut = Math.max(name.lastIndexOf('/'), Math.max(name.lastIndexOf('\\'), name.lastIndexOf(':')));
        String own = cut >= 0 && cut < name.length() - 1 ? name.substring(cut + 1) : name;
        StringBuilder b = new StringBuilder(own.length());
        int i = 0;
        while (i < own.length()) {
            char c = own.charAt(i);
            if (!Character.isLetterOrDigit(c)) {
                b.append(c);
                i++;
                continue;
            }
            int j = i;
            while (j < own.length() && Character.isLetterOrDigit(own.charAt(j))) {
                j++;
            }
            String run = own.substring(i, j);
            boolean keep = run.matches("(?i)CO2|NO2|PM1|PM10|PM2");
            b.append(keep ? run : collapse(run));
            i = j;
        }
        return b.toString();
    }

}
