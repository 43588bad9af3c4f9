package org.tufa.mapper.match;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;
import org.tufa.mapper.rules.RuleSet;

/**
 * Everything {@link Mapper#map} produced.
 *
 * @param rules the rule set used
 * @param mappings one per input row, in input order
 * @param expectations the rule file's inline tests, checked
 * @param warnings accepted-but-suspicious things, one line each, in a fixed order
 */
public record MappingResult(RuleSet rules, List<PointMapping> mappings, List<ExpectationResult> expectations,
        List<String> warnings) {
    public MappingResult {
        mappings = List.copyOf(mappings);
        expectations = List.copyOf(expectations);
        warnings = List.copyOf(warnings);
    }

    /** Rows per status (every status present, zero included). */
    public Map<Status, Integer> countByStatus() {
        Map<Status, Integer> m = new EnumMap<>(Status.class);
        for (Status s : Status.values()) {
            m.put(s, 0);
        }
        for (PointMapping p : mappings) {
            m.merge(p.status(), 1, Integer::sum);
        }
        return m;
    }

    /** Distinct equipment ids per equipment class, over classified points. */
    public SortedMap<String, Integer> equipmentByClass() {
        SortedMap<String, java.util.SortedSet<String>> ids = new TreeMap<>();
        for (PointMapping p : mappings) {
            if (p.classified()) {
                p.assignment().flatMap(Assignment::equipment).ifPresent(e -> ids.computeIfAbsent(e.className(),
                        k -> new java.util.TreeSet<>()).add(e.id()));
            }
        }
        SortedMap<String, Integer> out = new TreeMap<>();
        ids.forEach((k, v) -> out.put(k, v.size()));
        return out;
    }

    /** Number of failed expectations. */
    public long failedExpectations() {
        return expectations.stream().filter(e -> !e.passed()).count();
    }
}
