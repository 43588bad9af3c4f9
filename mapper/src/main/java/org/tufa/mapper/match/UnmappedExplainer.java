package org.tufa.mapper.match;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.tufa.mapper.rules.Tokenizer;

/**
 * Groups points that no rule took by the shape of their names (digit runs -> '#', see
 * {@link Tokenizer#shape}), most frequent first, so the integrator sees which rule to write next.
 */
public final class UnmappedExplainer {

    /** One shape: how many unmapped points have it, and the first of them as an example. */
    public record Group(String shape, int count, String example, long exampleLine) {
    }

    private UnmappedExplainer() {
    }

    /** Groups the unmapped and conflicting rows; ties in count break on the shape text. */
    public static List<Group> group(List<PointMapping> mappings) {
        Map<String, int[]> counts = new HashMap<>();
        Map<String, PointMapping> first = new HashMap<>();
        for (PointMapping m : mappings) {
            if (m.status() != Status.UNMAPPED && m.status() != Status.CONFLICT
                    && !(m.status() == Status.DUPLICATE && m.assignment().isEmpty())) {
                continue;
            }
            String shape = Tokenizer.shape(m.point().name());
            counts.computeIfAbsent(shape, k -> new int[1])[0]++;
            first.putIfAbsent(shape, m);
        }
        List<Group> out = new ArrayList<>();
        counts.forEach((k, v) -> out.add(new Group(k, v[0], first.get(k).point().name(), first.get(k).point().line())));
        out.sort(Comparator.comparingInt(Group::count).reversed().thenComparing(Group::shape));
        return out;
    }
}
