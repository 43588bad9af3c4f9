package org.tufa.analysis.simulate;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.UnitCoverage;

/**
 * What the demo simulator writes, read from a mapped model's coverage: per unit, the series id and unit of
 * measure of each role the unit has (a unit without a discharge sensor gets no discharge series), and the
 * building-wide series (outdoor air, supply-water temperatures) found for any unit.
 */
public record DemoTargets(List<UnitSeriesTargets> units, Map<String, SeriesTarget> building) {

    public DemoTargets {
        units = List.copyOf(units);
        building = java.util.Collections.unmodifiableMap(new TreeMap<>(building));
    }

    public static DemoTargets from(FleetCoverage coverage) {
        List<UnitSeriesTargets> units = new ArrayList<>();
        Map<String, SeriesTarget> building = new TreeMap<>();
        List<UnitCoverage> sorted = new ArrayList<>(coverage.units());
        sorted.sort(java.util.Comparator.comparing(UnitCoverage::unit));
        for (UnitCoverage u : sorted) {
            Map<String, SeriesTarget> targets = new TreeMap<>();
            for (String role : SimulationRoles.UNIT_ROLES) {
                u.point(role).ifPresent(p -> targets.put(role, target(p)));
            }
            for (String role : SimulationRoles.BUILDING_ROLES) {
                u.point(role).ifPresent(p -> building.putIfAbsent(role, target(p)));
            }
            units.add(new UnitSeriesTargets(u.unit(), u.label(), targets));
        }
        return new DemoTargets(units, building);
    }

    private static SeriesTarget target(PointRef p) {
        return new SeriesTarget(p.timeseriesId(), p.unitOfMeasureIri());
    }
}
