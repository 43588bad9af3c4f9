package org.tufa.analysis.simulate;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.Profile;
import org.tufa.analysis.coverage.UnitCoverage;

/**
 * What the demo simulator writes, read from a mapped model's coverage: per fan coil unit and per VAV box (by the
 * unit kind of the profile coverage chose), the series id and unit of measure of each role the unit has (a unit
 * without a discharge sensor gets no discharge series), and the building-wide series (outdoor air, supply-water
 * temperatures, the boxes' air handler) found for any unit. A box has reheat when its profile is a reheat one.
 * Units of other kinds, or without a profile, are not simulated.
 */
public record DemoTargets(List<UnitSeriesTargets> units, List<VavSeriesTargets> vavUnits,
        Map<String, SeriesTarget> building) {

    public DemoTargets {
        units = List.copyOf(units);
        vavUnits = List.copyOf(vavUnits);
        building = java.util.Collections.unmodifiableMap(new TreeMap<>(building));
    }

    /** Fan coil units only (the targets before the VAV wing). */
    public DemoTargets(List<UnitSeriesTargets> units, Map<String, SeriesTarget> building) {
        this(units, List.of(), building);
    }

    public static DemoTargets from(FleetCoverage coverage) {
        List<UnitSeriesTargets> units = new ArrayList<>();
        Map<String, SeriesTarget> building = new TreeMap<>();
        List<UnitCoverage> sorted = new ArrayList<>(coverage.units());
        sorted.sort(java.util.Comparator.comparing(UnitCoverage::unit));
        List<VavSeriesTargets> boxes = new ArrayList<>();
        for (UnitCoverage u : sorted) {
            boolean vav = u.unitKind().equals(Profile.VAV);
            if (!vav && !u.unitKind().equals(Profile.FAN_COIL)) {
                continue;
            }
            Map<String, SeriesTarget> targets = new TreeMap<>();
            for (String role : vav ? SimulationRoles.VAV_ROLES : SimulationRoles.UNIT_ROLES) {
                u.point(role).ifPresent(p -> targets.put(role, target(p)));
            }
            for (String role : SimulationRoles.BUILDING_ROLES) {
                u.point(role).ifPresent(p -> building.putIfAbsent(role, target(p)));
            }
            if (vav) {
                for (String role : SimulationRoles.AHU_ROLES) {
                    u.point(role).ifPresent(p -> building.putIfAbsent(role, target(p)));
                }
                // Hot-water reheat when the profile has a reheat mode and a reheat valve (the simulator has no
                // electric reheat: such boxes are simulated cooling-only).
                boolean reheat = u.profile().map(p -> p.roleNames().contains(SimulationRoles.REHEAT_VALVE_COMMAND)
                        && p.modes().stream().anyMatch(m -> m.name().equals("reheat"))).orElse(false);
                boxes.add(new VavSeriesTargets(u.unit(), u.label(), reheat, targets));
            } else {
                units.add(new UnitSeriesTargets(u.unit(), u.label(), targets));
            }
        }
        return new DemoTargets(units, boxes, building);
    }

    private static SeriesTarget target(PointRef p) {
        return new SeriesTarget(p.timeseriesId(), p.unitOfMeasureIri());
    }
}
