package org.tufa.analysis.review;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.tufa.analysis.findings.Finding;

/**
 * The analyst's verdicts applied to the fleet stage's decided findings, before the minimum-confidence filter. Pure:
 * findings and verdicts in, findings with their review status out.
 *
 * <p>A verdict is a finding's own when it names the same unit, mode and kind and either the finding's id or a period
 * that overlaps the finding's (so a verdict follows its finding when a re-run on more data moves its start). A
 * finding whose own verdict is
 * <ul>
 *   <li><b>rejected</b> is treated as normal operation of its unit: it is not listed, and counted as suppressed by
 *       the review (the same signature, mode and kind, over a period the analyst called normal);</li>
 *   <li><b>confirmed</b> stays listed whatever its confidence (a person verified it) and is marked;</li>
 *   <li><b>not sure</b> stays as it is, marked.</li>
 * </ul>
 * When several verdicts are a finding's own, the one naming its id decides, else a confirmation, else a rejection.
 * Verdicts of the same unit whose period overlaps the finding's but which name another mode or kind are shown beside
 * it ({@link Mark#overlapping}): the finding is listed with both. A verdict that is no finding's own is unmatched:
 * the command says which, nothing is dropped unsaid.
 */
public final class ReviewStep {

    /** A listed finding's review: its own verdict (null when none) and the other verdicts that overlap it. */
    public record Mark(String findingId, Verdict own, List<Verdict> overlapping) implements java.io.Serializable {
        public Mark {
            overlapping = List.copyOf(overlapping);
        }

        /** The review status word: confirmed, rejected, not_sure, or empty. */
        public String status() {
            return own == null ? "" : own.decision().word();
        }
    }

    /** A finding not listed because its own verdict rejected it. */
    public record Suppressed(String findingId, Finding finding, Verdict verdict) implements java.io.Serializable {
    }

    /**
     * One unit after the review.
     *
     * @param findings   the decided findings that remain, in their order
     * @param marks      the review marks of those findings, by finding id
     * @param suppressed the findings the review took out
     */
    public record UnitReview(List<Finding> findings, Map<String, Mark> marks, List<Suppressed> suppressed)
            implements java.io.Serializable {
        public static final UnitReview NONE = new UnitReview(List.of(), Map.of(), List.of());

        public UnitReview {
            findings = List.copyOf(findings);
            marks = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(marks));
            suppressed = List.copyOf(suppressed);
        }

        /** The mark of one of the unit's findings (an empty mark when it has no verdict near it). */
        public Mark mark(String findingId) {
            Mark m = marks.get(findingId);
            return m == null ? new Mark(findingId, null, List.of()) : m;
        }

        /** Whether an analyst confirmed the finding. */
        public boolean confirmed(String findingId) {
            Mark m = marks.get(findingId);
            return m != null && m.own() != null && m.own().decision() == Verdict.Decision.CONFIRMED;
        }

        /** The unit's note on what the review took out (empty when nothing). */
        public List<String> notes() {
            if (suppressed.isEmpty()) {
                return List.of();
            }
            List<String> where = suppressed.stream().map(s -> s.verdict().where()).distinct().toList();
            return List.of(suppressed.size() + " finding(s) not listed: an analyst rejected their period and "
                    + "signature as normal operation of this unit (review " + String.join(", ", where) + ")");
        }
    }

    /** Why a verdict matched no finding. */
    public record Unmatched(Verdict verdict, String reason) {
    }

    /**
     * The whole review.
     *
     * @param units     per unit (every unit of the input, in its order)
     * @param verdicts  every verdict given
     * @param applied   verdicts that are some finding's own
     * @param unmatched the others, with the reason
     */
    public record Result(Map<String, UnitReview> units, List<Verdict> verdicts, List<Verdict> applied,
                         List<Unmatched> unmatched) {
        public static final Result NONE = new Result(Map.of(), List.of(), List.of(), List.of());

        public Result {
            units = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(units));
            verdicts = List.copyOf(verdicts);
            applied = List.copyOf(applied);
            unmatched = List.copyOf(unmatched);
        }

        /** The unit's review; for a unit without decided findings its verdicts find nothing to apply to. */
        public UnitReview unit(String unit, List<Finding> decidedIfAbsent) {
            UnitReview r = units.get(unit);
            return r != null ? r : new UnitReview(decidedIfAbsent, Map.of(), List.of());
        }

        /** Findings the review took out, over all units. */
        public int suppressedCount() {
            return units.values().stream().mapToInt(u -> u.suppressed().size()).sum();
        }

        public boolean any() {
            return !verdicts.isEmpty();
        }
    }

    private ReviewStep() {
    }

    /**
     * @param decided  every unit's decided findings, by unit IRI, in unit order (the fleet stage's output)
     * @param verdicts the review file's verdicts
     */
    public static Result apply(Map<String, List<Finding>> decided, List<Verdict> verdicts) {
        Map<String, List<Verdict>> byUnit = new TreeMap<>();
        for (Verdict v : verdicts) {
            byUnit.computeIfAbsent(v.unit(), k -> new ArrayList<>()).add(v);
        }
        Map<String, UnitReview> units = new LinkedHashMap<>();
        java.util.Set<Verdict> used = java.util.Collections.newSetFromMap(new java.util.IdentityHashMap<>());
        for (Map.Entry<String, List<Finding>> e : decided.entrySet()) {
            String unit = e.getKey();
            List<Verdict> mine = byUnit.getOrDefault(unit, List.of());
            List<Finding> kept = new ArrayList<>();
            Map<String, Mark> marks = new LinkedHashMap<>();
            List<Suppressed> suppressed = new ArrayList<>();
            for (Finding f : e.getValue()) {
                String id = FindingIds.of(unit, f);
                List<Verdict> own = new ArrayList<>();
                List<Verdict> other = new ArrayList<>();
                for (Verdict v : mine) {
                    boolean sameSignature = v.mode().equals(f.mode()) && v.kind().equals(f.kind());
                    boolean near = v.findingId().equals(id) || v.overlaps(f.start(), f.end());
                    if (sameSignature && near) {
                        own.add(v);
                    } else if (v.overlaps(f.start(), f.end())) {
                        other.add(v);
                    }
                }
                used.addAll(own);
                Verdict decisive = decisive(own, id);
                if (decisive != null && decisive.decision() == Verdict.Decision.REJECTED) {
                    suppressed.add(new Suppressed(id, f, decisive));
                    continue;
                }
                kept.add(f);
                if (decisive != null || !other.isEmpty()) {
                    marks.put(id, new Mark(id, decisive, other));
                }
            }
            units.put(unit, new UnitReview(kept, marks, suppressed));
        }
        List<Verdict> applied = new ArrayList<>();
        List<Unmatched> unmatched = new ArrayList<>();
        for (Verdict v : verdicts) {
            if (used.contains(v)) {
                applied.add(v);
            } else if (!decided.containsKey(v.unit())) {
                unmatched.add(new Unmatched(v, "the unit has no decided findings in this run (not analysed, or "
                        + "nothing found)"));
            } else {
                unmatched.add(new Unmatched(v, "no finding of this unit with mode " + v.mode() + " and kind "
                        + v.kind() + " has its id or overlaps its period in this run"));
            }
        }
        return new Result(units, verdicts, applied, unmatched);
    }

    /** The verdict that decides among a finding's own: the one naming its id, else a confirmation, else a rejection. */
    private static Verdict decisive(List<Verdict> own, String id) {
        for (Verdict v : own) {
            if (v.findingId().equals(id)) {
                return v;
            }
        }
        for (Verdict.Decision d : List.of(Verdict.Decision.CONFIRMED, Verdict.Decision.REJECTED,
                Verdict.Decision.NOT_SURE)) {
            for (Verdict v : own) {
                if (v.decision() == d) {
                    return v;
                }
            }
        }
        return null;
    }
}
