package org.tufa.mapper.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.tufa.mapper.match.ExpectationResult;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.Status;
import org.tufa.mapper.match.UnmappedExplainer;

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

    /** The --explain section: unmapped names grouped by shape, most frequent first. */
    public static List<String> explain(MappingResult r) {
        List<UnmappedExplainer.Group> groups = UnmappedExplainer.group(r.mappings());
        List<String> out = new ArrayList<>();
        if (groups.isEmpty()) {
            out.add("unmapped points by name shape: none");
            return out;
        }
        out.add("unmapped points by name shape (digits as #), most frequent first:");
        groups.stream().limit(MAX_LISTED).forEach(g -> out.add(String.format("  %6d  %s   e.g. %s (line %d)",
                g.count(), g.shape(), g.example(), g.exampleLine())));
        if (groups.size() > MAX_LISTED) {
            out.add("  ... and " + (groups.size() - MAX_LISTED) + " more shapes (see the report's unmapped rows)");
        }
        return out;
    }
}
