package org.tufa.analysis.simulate;

import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;

/**
 * The series one VAV box writes, by role (see {@link SimulationRoles#VAV_ROLES}), and whether the box has a
 * hot-water reheat coil (which decides its zone, perimeter or interior, and its faults). Roles without a target are
 * simulated but not written.
 *
 * @param unitIri the box's IRI, written as is into {@code truth.csv}
 * @param unitName a readable name (for messages)
 * @param reheat whether the box has hot-water reheat
 * @param targets role name to target; unknown role names are rejected
 */
public record VavSeriesTargets(String unitIri, String unitName, boolean reheat, Map<String, SeriesTarget> targets) {
    public VavSeriesTargets {
        Objects.requireNonNull(unitIri, "unitIri");
        Objects.requireNonNull(unitName, "unitName");
        for (String role : targets.keySet()) {
            if (!SimulationRoles.VAV_ROLES.contains(role)) {
                throw new IllegalArgumentException("box " + unitName + ": unknown role '" + role
                        + "', expected one of " + SimulationRoles.VAV_ROLES);
            }
        }
        targets = Collections.unmodifiableMap(new TreeMap<>(targets));
    }
}
