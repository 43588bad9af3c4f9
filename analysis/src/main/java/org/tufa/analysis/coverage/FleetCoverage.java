package org.tufa.analysis.coverage;

import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Coverage of a whole fleet for one profile.
 *
 * @param profile the profile assessed
 * @param unitClasses the terminal-unit classes asked for (IRIs, sorted)
 * @param units one entry per unit, sorted by unit IRI
 * @param undeclaredBrickClasses Brick classes the model uses but the loaded vocabulary does not declare, with
 *     their instance counts (sorted): their instances may be terminal units tufa cannot recognise (a misspelt
 *     class, or one from a Brick release newer than the bundled 1.4.4)
 */
public record FleetCoverage(Profile profile, List<String> unitClasses, List<UnitCoverage> units,
        Map<String, Integer> undeclaredBrickClasses) {
    public FleetCoverage {
        unitClasses = List.copyOf(unitClasses);
        units = List.copyOf(units);
        undeclaredBrickClasses = java.util.Collections.unmodifiableMap(new TreeMap<>(undeclaredBrickClasses));
    }

    public long analyzableCount() {
        return units.stream().filter(UnitCoverage::analyzable).count();
    }

    /** Units that can be analysed in the given mode. */
    public long modeCount(String mode) {
        return units.stream().filter(u -> Boolean.TRUE.equals(u.modes().get(mode))).count();
    }

    /** Per unit class (IRI, sorted): how many units. */
    public Map<String, Integer> unitsByClass() {
        Map<String, Integer> counts = new TreeMap<>();
        units.forEach(u -> counts.merge(u.unitClass(), 1, Integer::sum));
        return counts;
    }

    /** Per role name (sorted by name): on how many units it is missing or ambiguous. */
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
}
