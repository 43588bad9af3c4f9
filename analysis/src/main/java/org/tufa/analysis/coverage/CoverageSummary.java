package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.jena.shared.PrefixMapping;

/** The console view of a fleet's coverage: counts by class, analysable share, missing roles, blocked units. */
public final class CoverageSummary {
    private CoverageSummary() {
    }

    /**
     * The summary as text lines.
     *
     * @param prefixes used to shorten IRIs (e.g. brick:Fan_Coil_Unit)
     * @param maxUnits how many non-analysable units to list before "... and N more"
     */
    public static List<String> lines(FleetCoverage coverage, PrefixMapping prefixes, int maxUnits) {
        List<String> out = new ArrayList<>();
        int n = coverage.units().size();
        out.add("Profile " + coverage.profile().name() + ", unit classes "
                + String.join(", ", coverage.unitClasses().stream().map(prefixes::shortForm).toList()));
        if (!coverage.undeclaredBrickClasses().isEmpty()) {
            List<String> named = new ArrayList<>();
            coverage.undeclaredBrickClasses().forEach((c, k) -> named.add(prefixes.shortForm(c) + " (" + k + ")"));
            out.add("Classes the vocabulary does not declare (their instances are not recognised: a misspelt name, "
                    + "or a newer Brick release to pass with --vocabulary): " + String.join(", ", named.subList(0, Math.min(named.size(), maxUnits)))
                    + (named.size() > maxUnits ? " ... and " + (named.size() - maxUnits) + " more" : ""));
        }
        if (n == 0) {
            out.add("No terminal units found.");
            return out;
        }
        out.add("Terminal units found: " + n);
        Map<String, Integer> byClass = coverage.unitsByClass();
        int width = byClass.keySet().stream().mapToInt(c -> prefixes.shortForm(c).length()).max().orElse(10);
        byClass.forEach((c, k) -> out.add(String.format(Locale.ROOT, "  %-" + width + "s %6d", prefixes.shortForm(c), k)));
        long ok = coverage.analyzableCount();
        out.add(String.format(Locale.ROOT, "Analysable (at least one mode): %d of %d (%s)", ok, n, percent(ok, n)));
        for (ModeRequirement m : coverage.profile().modes()) {
            long k = coverage.modeCount(m.name());
            out.add(String.format(Locale.ROOT, "  %-10s %6d (%s)  needs %s", m.name(), k, percent(k, n),
                    String.join(", ", m.required())));
        }
        Map<String, Integer> unavailable = coverage.unavailableRoleCounts();
        if (!unavailable.isEmpty()) {
            out.add("Roles not available (missing or ambiguous), most common first:");
            int rw = unavailable.keySet().stream().mapToInt(String::length).max().orElse(10);
            unavailable.entrySet().stream()
                    .sorted(Map.Entry.<String, Integer>comparingByValue(Comparator.reverseOrder())
                            .thenComparing(Map.Entry.comparingByKey()))
                    .forEach(e -> out.add(String.format(Locale.ROOT, "  %-" + rw + "s %6d %s (%s)", e.getKey(),
                            e.getValue(), e.getValue() == 1 ? "unit " : "units", percent(e.getValue(), n))));
        }
        List<UnitCoverage> blocked = coverage.units().stream().filter(u -> !u.analyzable()).toList();
        if (!blocked.isEmpty()) {
            out.add("Units that cannot be analysed:");
            blocked.stream().limit(maxUnits).forEach(u -> out.add("  " + name(u, prefixes) + ": " + reason(coverage, u)));
            if (blocked.size() > maxUnits) {
                out.add("  ... and " + (blocked.size() - maxUnits) + " more");
            }
        }
        List<UnitCoverage> withProblems = coverage.units().stream().filter(u -> !u.problems().isEmpty()).toList();
        if (!withProblems.isEmpty()) {
            out.add("Model problems:");
            withProblems.stream().limit(maxUnits)
                    .forEach(u -> u.problems().forEach(p -> out.add("  " + name(u, prefixes) + ": " + p)));
            if (withProblems.size() > maxUnits) {
                out.add("  ... and " + (withProblems.size() - maxUnits) + " more units");
            }
        }
        return out;
    }

    /** Why a unit cannot be analysed: per mode, its unavailable required roles. */
    public static String reason(FleetCoverage coverage, UnitCoverage u) {
        List<String> parts = new ArrayList<>();
        for (ModeRequirement m : coverage.profile().modes()) {
            List<String> lacking = new ArrayList<>();
            for (String r : m.required()) {
                RoleMatch match = u.roles().get(r);
                if (match.status() == MatchStatus.MISSING) {
                    lacking.add(r + (match.untagged().isEmpty() ? "" : " (" + match.untagged().size()
                            + " untagged candidate(s): add a tag or a valve part)"));
                } else if (match.status() == MatchStatus.AMBIGUOUS) {
                    lacking.add(r + " (ambiguous: " + match.candidates().size() + " points on the " + match.place().label() + ")");
                }
            }
            parts.add(m.name() + " lacks " + String.join(", ", lacking));
        }
        return String.join("; ", parts);
    }

    private static String name(UnitCoverage u, PrefixMapping prefixes) {
        return prefixes.shortForm(u.unit()) + (u.label().isEmpty() ? "" : " (" + u.label() + ")");
    }

    private static String percent(long k, long n) {
        return String.format(Locale.ROOT, "%.1f %%", 100.0 * k / n);
    }
}
