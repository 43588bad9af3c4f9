package org.tufa.mapper.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Locale;
import org.tufa.mapper.learn.ExampleLearner;
import org.tufa.mapper.match.ExpectationResult;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.Status;
import org.tufa.mapper.match.UnmappedExplainer;
import org.tufa.vocabulary.BrickVocabulary;

/** Console text for a mapping run, as lines (the command prints them; the library never prints). */
public final class Summary {

    /** At most this many warnings and explain groups are listed; the rest are counted. */
    public static final int MAX_LISTED = 20;

    private Summary() {
    }

    /** Counts, equipment by class, expectations, warnings. */
    public static List<String> lines(MappingResult r, List<String> extraWarnings) {
        List<String> out = new ArrayList<>();
        Map<Status, Integer> c = r.countByStatus();
        out.add("points read: " + r.mappings().size());
        StringBuilder counts = new StringBuilder(" ");
        for (Status s : Status.values()) {
            counts.append(counts.length() > 1 ? ", " : " ").append(s.label()).append(' ').append(c.get(s));
        }
        out.add(counts.toString());
        if (!r.equipmentByClass().isEmpty()) {
            out.add("equipment by class:");
            r.equipmentByClass().forEach((k, v) -> out.add("  " + k + ": " + v));
        }
        long failed = r.failedExpectations();
        out.add("expectations: " + (r.expectations().size() - failed) + " passed, " + failed + " failed");
        for (ExpectationResult e : r.expectations()) {
            if (!e.passed()) {
                out.add("  FAILED " + e.expectation().label() + ": '" + e.expectation().sample().name()
                        + "' should be " + e.expectation().expectedClass()
                        + e.expectation().expectedEquipment().map(x -> " on " + x).orElse("")
                        + e.expectation().expectedPart().map(x -> " part " + x).orElse("") + ", got " + e.actual());
            }
        }
        List<String> warnings = new ArrayList<>(r.warnings());
        warnings.addAll(extraWarnings);
        if (!warnings.isEmpty()) {
            out.add("warnings: " + warnings.size());
            warnings.stream().limit(MAX_LISTED).forEach(w -> out.add("  " + w));
            if (warnings.size() > MAX_LISTED) {
                out.add("  ... and " + (warnings.size() - MAX_LISTED) + " more");
            }
        }
        return out;
    }

    /** The --explain section: open points by shape, unknown tokens, which points to label next. */
    public static List<String> explain(MappingResult r, BrickVocabulary vocabulary) {
        UnmappedExplainer.Explanation x = UnmappedExplainer.explain(r.mappings(), r.rules().dictionary(), vocabulary,
                10);
        List<String> out = new ArrayList<>();
        if (x.groups().isEmpty()) {
            out.add("points that need a person: none");
            return out;
        }
        out.add("points that need a person (" + x.open() + "), by the shape of their own name segment (ids and "
                + "ordinals as #), most frequent first:");
        x.groups().stream().limit(MAX_LISTED).forEach(g -> out.add(String.format(Locale.ROOT,
                "  %6d  %-40s e.g. %s (line %d; %s)", g.count(), g.shape(), g.example(), g.exampleLine(),
                statuses(g.statuses()))));
        if (x.groups().size() > MAX_LISTED) {
            out.add("  ... and " + (x.groups().size() - MAX_LISTED) + " more shapes (see the report's rows)");
        }
        if (!x.unknownTokens().isEmpty()) {
            StringBuilder b = new StringBuilder("most frequent unknown tokens (points holding them):");
            x.unknownTokens().stream().limit(MAX_LISTED).forEach(e -> b.append(' ').append(e.getKey()).append(' ')
                    .append(e.getValue()).append(','));
            b.setLength(b.length() - 1);
            out.add(b.toString());
        }
        if (!x.labelNext().isEmpty()) {
            out.add("label these next (each settles the most open points; give them to --examples):");
            int i = 1;
            for (UnmappedExplainer.LabelNext l : x.labelNext()) {
                out.add(String.format(Locale.ROOT, "  %2d. %s (line %d): settles about %d more", i++, l.name(),
                        l.line(), l.settles()));
            }
        }
        return out;
    }

    private static String statuses(java.util.SortedMap<String, Integer> s) {
        StringBuilder b = new StringBuilder();
        s.forEach((k, v) -> b.append(b.length() > 0 ? ", " : "").append(k).append(' ').append(v));
        return b.toString();
    }

    /** The --examples section: what the rules reproduce, and the lines that would make them reproduce more. */
    public static List<String> learned(ExampleLearner.Learned l) {
        List<String> out = new ArrayList<>();
        out.add("examples: " + l.examples() + "; the rules reproduce " + l.before() + " of them"
                + (l.after() > l.before() ? ", and " + l.after() + " with these lines:" : "; no line found that "
                + "reproduces more"));
        if (!l.newRules().isEmpty()) {
            out.add("  # new rules (add at the end of the file)");
            l.newRules().forEach(x -> out.add("  " + x));
        }
        l.ruleLines().forEach((rule, lines) -> {
            out.add("  # in rule " + rule + " (indented under its 'rule' line)");
            lines.forEach(x -> out.add("    " + x));
        });
        if (!l.stillWrong().isEmpty()) {
            out.add("  still not reproduced (" + l.stillWrong().size() + "):");
            l.stillWrong().stream().limit(MAX_LISTED).forEach(x -> out.add("    " + x));
            if (l.stillWrong().size() > MAX_LISTED) {
                out.add("    ... and " + (l.stillWrong().size() - MAX_LISTED) + " more");
            }
        }
        return out;
    }
}
