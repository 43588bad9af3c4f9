package org.tufa.analysis.simulate;

import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;

/**
 * The series one fan coil unit writes, by role (see {@link SimulationRoles#UNIT_ROLES}). The simulator knows
 * nothing of the Brick model: the caller maps each unit to its series. Roles without a target are not written
 * (a unit without a discharge sensor gets no discharge series), but are still simulated.
 *
 * @param unitIri the unit's IRI, written as is into {@code truth.csv}
 * @param unitName a readable name (for messages)
 * @param targets role name to target; unknown role names are rejected
 */
public record UnitSeriesTargets(String unitIri, String unitName, Map<String, SeriesTarget> targets) {
    public UnitSeriesTargets {
        Objects.requireNonNull(unitIri, "unitIri");
        Objects.requireNonNull(unitName, "unitName");
        for (String role : targets.keySet()) {
            if (!SimulationRoles.UNIT_ROLES.contains(role)) {
                throw new IllegalArgumentException("unit " + unitName + ": unknown role '" + role
                        + "', expected one of " + SimulationRoles.UNIT_ROLES);
            }
        }
        // Sorted copy: whatever map the caller passes, nothing downstream depends on its iteration order.
        targets = Collections.unmodifiableMap(new TreeMap<>(targets));
    }
}
