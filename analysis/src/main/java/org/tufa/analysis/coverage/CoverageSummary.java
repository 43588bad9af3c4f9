package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.jena.shared.PrefixMapping;

/**
 * The console view of a fleet's coverage: units per class and profile, per profile the analysable share by mode
 * and the most common unmet requirements (in that profile's words), then the units that cannot be analysed.
 */
public final class CoverageSummary {
    /**
     * The advice when the loaded vocabulary is not the whole Brick ontology; tufa bundles all of Brick 1.4.4, so
     * it shows only for a vocabulary assembled without it.
     */
    public static final String FULL_BRICK_HINT = "pass the full Brick file with --vocabulary";

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
        out.add("Unit classes " + String.join(", ", coverage.unitClasses().stream().map(prefixes::shortForm).toList())
                + "; " + (coverage.automatic() ? "each unit gets the best fitting of the profiles "
                : "profiles asked for: ") + String.join(", ", coverage.profiles().stream().map(Profile::name).toList()));
        if (!coverage.undeclaredBrickClasses().isEmpty()) {
            List<String> named = new ArrayList<>();
            coverage.undeclaredBrickClasses().forEach((c, k) -> named.add(prefixes.shortForm(c) + " (" + k + ")"));
            String list = String.join(", ", named.subList(0, Math.min(named.size(), maxUnits)))
                    + (named.size() > maxUnits ? " ... and " + (named.size() - maxUnits) + " more" : "");
            out.add(coverage.fullBrick()
                    ? "Brick-namespace classes the loaded Brick vocabulary does not define (names of older Brick "
                            + "versions, local or misspelt names; their instances are not recognised): " + list
                    : "Classes the vocabulary does not declare (their instances are not recognised; "
                            + FULL_BRICK_HINT + "): " + list);
        }
        if (n == 0) {
            out.add("No terminal units found.");
            return out;
        }
        out.add("Terminal units found: " + n);
        Map<String, Map<String, Integer>> byClass = coverage.unitsByClassAndProfile();
        int width = byClass.keySet().stream().mapToInt(c -> prefixes.shortForm(c).length()).max().orElse(10);
        byClass.forEach((c, profiles) -> {
            int k = profiles.values().stream().mapToInt(Integer::intValue).sum();
            List<String> parts = new ArrayList<>();
            profiles.forEach((p, m) -> parts.add((p.isEmpty() ? "no profile" : p) + " " + m));
            out.add(String.format(Locale.ROOT, "  %-" + width + "s %6d  %s", prefixes.shortForm(c), k,
                    String.join(", ", parts)));
        });
        long ok = coverage.analyzableCount();
        out.add(String.format(Locale.ROOT, "Analysable (at least one mode): %d of %d (%s)", ok, n, percent(ok, n)));
        for (Profile p : coverage.profilesUsed()) {
            List<UnitCoverage> units = coverage.unitsOf(p);
            long pk = units.stream().filter(UnitCoverage::analyzable).count();
            out.add(String.format(Locale.ROOT, "Profile %s: %d unit%s, %d analysable (%s)", p.name(), units.size(),
                    units.size() == 1 ? "" : "s", pk, percent(pk, units.size())));
            int mw = p.modes().stream().mapToInt(m -> m.name().length()).max().orElse(8);
            for (ModeRequirement m : p.modes()) {
                long k = coverage.modeCount(p, m.name());
                out.add(String.format(Locale.ROOT, "  %-" + mw + "s %6d (%s)  needs %s", m.name(), k,
                        percent(k, units.size()), String.join(", ", m.required().stream()
                                .map(Requirement::describe).toList())));
            }
            Map<String, Integer> unmet = coverage.unmetCounts(p);
            if (!unmet.isEmpty()) {
                out.add("  Not available (missing or ambiguous), most common first:");
                int rw = unmet.keySet().stream().mapToInt(String::length).max().orElse(10);
                unmet.entrySet().stream()
                        .sorted(Map.Entry.<String, Integer>comparingByValue(Comparator.reverseOrder())
                                .thenComparing(Map.Entry.comparingByKey()))
                        .forEach(e -> out.add(String.format(Locale.ROOT, "    %-" + rw + "s %6d %s (%s)", e.getKey(),
                                e.getValue(), e.getValue() == 1 ? "unit " : "units", percent(e.getValue(),
                                        units.size()))));
            }
        }
        List<UnitCoverage> blocked = coverage.units().stream().filter(u -> !u.analyzable()).toList();
        if (!blocked.isEmpty()) {
            out.add("Units that cannot be analysed:");
            blocked.stream().limit(maxUnits).forEach(u -> out.add("  " + name(u, prefixes) + ": "
                    + reason(coverage, u, prefixes)));
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

    /** Why a unit cannot be analysed, in its profile's words: per mode, its unmet requirements. */
    public static String reason(FleetCoverage coverage, UnitCoverage u) {
        return reason(coverage, u, org.apache.jena.shared.PrefixMapping.Standard);
    }

    /** As {@link #reason(FleetCoverage, UnitCoverage)}, with IRIs shortened by the prefixes. */
    public static String reason(FleetCoverage coverage, UnitCoverage u, PrefixMapping prefixes) {
        if (u.profile().isEmpty()) {
            return (coverage.automatic() ? "no requirement profile applies to " : "none of the profiles asked for ("
                    + String.join(", ", coverage.profiles().stream().map(Profile::name).toList()) + ") applies to ")
                    + prefixes.shortForm(u.unitClass()) + "; add a profile for it in a Turtle file passed with "
                    + "--vocabulary (see DEVELOPERS.md)";
        }
        // Modes that lack the same things are named together: "cooling, deadband lack airflow, damper".
        Map<String, List<String>> modesByLack = new java.util.LinkedHashMap<>();
        for (ModeRequirement m : u.profile().get().modes()) {
            List<String> lacking = new ArrayList<>();
            for (Requirement r : m.required()) {
                if (!u.met(r)) {
                    lacking.add(lacking(u, r));
                }
            }
            modesByLack.computeIfAbsent(String.join(", ", lacking), k -> new ArrayList<>()).add(m.name());
        }
        List<String> parts = new ArrayList<>();
        modesByLack.forEach((lack, modes) -> parts.add(String.join(", ", modes) + (modes.size() == 1 ? " lacks "
                : " lack ") + lack));
        return String.join("; ", parts);
    }

    /** An unmet requirement in words, with the ambiguous candidates or untagged hints that explain it. */
    private static String lacking(UnitCoverage u, Requirement r) {
        List<String> notes = new ArrayList<>();
        for (String role : r.roleNames()) {
            RoleMatch match = u.roles().get(role);
            String prefix = r.isChoice() ? role + " " : "";
            if (match.status() == MatchStatus.AMBIGUOUS) {
                notes.add(prefix + "ambiguous: " + match.candidates().size() + " points on the " + match.place().label());
            } else if (match.status() == MatchStatus.MISSING && !match.untagged().isEmpty()) {
                notes.add(prefix + match.untagged().size() + " untagged candidate(s): add a tag or a part");
            }
        }
        return notes.isEmpty() ? r.name() : r.name() + " (" + String.join("; ", notes) + ")";
    }

    private static String name(UnitCoverage u, PrefixMapping prefixes) {
        return prefixes.shortForm(u.unit()) + (u.label().isEmpty() ? "" : " (" + u.label() + ")");
    }

    private static String percent(long k, long n) {
        return n == 0 ? "-" : String.format(Locale.ROOT, "%.1f %%", 100.0 * k / n);
    }
}
