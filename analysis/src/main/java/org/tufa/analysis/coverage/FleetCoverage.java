package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Coverage of a whole fleet: every terminal unit with the profile chosen for it.
 *
 * @param profiles the profiles the units were matched against (sorted by name): the automatic ones, or those
 *     asked for by name
 * @param automatic true when the profiles were the automatic ones (no profile asked for)
 * @param unitClasses the terminal-unit classes asked for (IRIs, sorted)
 * @param units one entry per unit, sorted by unit IRI
 * @param undeclaredBrickClasses Brick classes the model uses but the loaded vocabulary does not declare, with
 *     their instance counts (sorted): their instances may be terminal units tufa cannot recognise
 * @param fullBrick true when the loaded vocabulary holds the full Brick ontology (tufa bundles all of Brick 1.4.4; a vocabulary without it would not), so
 *     an undeclared Brick class is not one the full file would add
 */
public record FleetCoverage(List<Profile> profiles, boolean automatic, List<String> unitClasses,
        List<UnitCoverage> units, Map<String, Integer> undeclaredBrickClasses, boolean fullBrick) {
    public FleetCoverage {
        profiles = List.copyOf(profiles);
        unitClasses = List.copyOf(unitClasses);
        units = List.copyOf(units);
        undeclaredBrickClasses = java.util.Collections.unmodifiableMap(new TreeMap<>(undeclaredBrickClasses));
    }

    public long analyzableCount() {
        return units.stream().filter(UnitCoverage::analyzable).count();
    }

    /** Units that can be analysed in the given mode (whatever their profile). */
    public long modeCount(String mode) {
        return units.stream().filter(u -> Boolean.TRUE.equals(u.modes().get(mode))).count();
    }

    /** Units of the profile that can be analysed in its mode. */
    public long modeCount(Profile profile, String mode) {
        return unitsOf(profile).stream().filter(u -> Boolean.TRUE.equals(u.modes().get(mode))).count();
    }

    /** The profiles at least one unit got, sorted by name. */
    public List<Profile> profilesUsed() {
        Map<String, Profile> used = new TreeMap<>();
        units.forEach(u -> u.profile().ifPresent(p -> used.put(p.name(), p)));
        return List.copyOf(used.values());
    }

    /** The units that got this profile, in unit order. */
    public List<UnitCoverage> unitsOf(Profile profile) {
        return units.stream().filter(u -> u.profileName().equals(profile.name())).toList();
    }

    /** Units without a profile (none applies to their class), in unit order. */
    public List<UnitCoverage> unitsWithoutProfile() {
        return units.stream().filter(u -> u.profile().isEmpty()).toList();
    }

    /** Per unit class (IRI, sorted): how many units. */
    public Map<String, Integer> unitsByClass() {
        Map<String, Integer> counts = new TreeMap<>();
        units.forEach(u -> counts.merge(u.unitClass(), 1, Integer::sum));
        return counts;
    }

    /** Per unit class (IRI, sorted), per profile name (sorted; empty = none): how many units. */
    public Map<String, Map<String, Integer>> unitsByClassAndProfile() {
        Map<String, Map<String, Integer>> counts = new TreeMap<>();
        units.forEach(u -> counts.computeIfAbsent(u.unitClass(), k -> new TreeMap<>())
                .merge(u.profileName(), 1, Integer::sum));
        return counts;
    }

    /** Per requirement name of the profile (sorted by name): on how many of its units it is not met. */
    public Map<String, Integer> unmetCounts(Profile profile) {
        Map<String, Integer> counts = new TreeMap<>();
        for (UnitCoverage u : unitsOf(profile)) {
            u.unmet().forEach(r -> counts.merge(r.name(), 1, Integer::sum));
        }
        return counts;
    }

    /** Per role name (sorted by name), over all units: on how many it is missing or ambiguous. */
    public Map<String, Integer> unavailableRoleCounts() {
        Map<String, Integer> counts = new TreeMap<>();
        for (UnitCoverage u : units) {
            for (RoleMatch m : u.roles().values()) {
                if (!m.found()) {
                    counts.merge(m.role(), 1, Integer::sum);
                }
            }
        }
        return counts;
    }

    /** The roles of the profiles used, in column order (then name): the columns of the coverage table. */
    public List<String> roleNames() {
        Map<String, Role> roles = new LinkedHashMap<>();
        profilesUsed().forEach(p -> p.roles().forEach(r -> roles.putIfAbsent(r.name(), r)));
        List<Role> sorted = new ArrayList<>(roles.values());
        sorted.sort(Comparator.comparingInt(Role::columnOrder).thenComparing(Role::name));
        return sorted.stream().map(Role::name).toList();
    }

    /** The mode names of the profiles used, sorted. */
    public List<String> modeNames() {
        TreeSet<String> names = new TreeSet<>();
        profilesUsed().forEach(p -> p.modes().forEach(m -> names.add(m.name())));
        return List.copyOf(names);
    }
}
