package org.tufa.analysis.simulate;

import java.util.Collections;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;

/**
 * What to simulate: the fan coil units and the VAV boxes (each in writing order) with their series targets, the
 * building-level targets (roles in {@link SimulationRoles#BUILDING_ROLES} and, for the boxes' air handler,
 * {@link SimulationRoles#AHU_ROLES}), the season, the seed and the fault episodes to inject (at most one active at a
 * time per unit). Build a demo plan with {@link DemoSimulation#plan}.
 */
public record SimulationPlan(
        List<UnitSeriesTargets> units,
        List<VavSeriesTargets> vavUnits,
        Map<String, SeriesTarget> buildingTargets,
        Season season,
        long seed,
        List<FaultEpisode> faults) {

    /** A plan of fan coil units only. */
    public SimulationPlan(List<UnitSeriesTargets> units, Map<String, SeriesTarget> buildingTargets, Season season,
            long seed, List<FaultEpisode> faults) {
        this(units, List.of(), buildingTargets, season, seed, faults);
    }

    public SimulationPlan {
        units = List.copyOf(units);
        vavUnits = List.copyOf(vavUnits);
        faults = List.copyOf(faults);
        Objects.requireNonNull(season);
        for (String role : buildingTargets.keySet()) {
            if (!SimulationRoles.BUILDING_ROLES.contains(role) && !SimulationRoles.AHU_ROLES.contains(role)) {
                throw new IllegalArgumentException("unknown building role '" + role + "', expected one of "
                        + SimulationRoles.BUILDING_ROLES + " or " + SimulationRoles.AHU_ROLES);
            }
        }
        buildingTargets = Collections.unmodifiableMap(new TreeMap<>(buildingTargets));
        Set<String> iris = new HashSet<>();
        Set<String> seriesIds = new HashSet<>();
        for (SeriesTarget t : buildingTargets.values()) {
            requireUnique(seriesIds, t.seriesId());
        }
        for (UnitSeriesTargets u : units) {
            if (!iris.add(u.unitIri())) {
                throw new IllegalArgumentException("unit listed twice: " + u.unitIri());
            }
            for (SeriesTarget t : u.targets().values()) {
                requireUnique(seriesIds, t.seriesId());
            }
        }
        for (VavSeriesTargets u : vavUnits) {
            if (!iris.add(u.unitIri())) {
                throw new IllegalArgumentException("unit listed twice: " + u.unitIri());
            }
            for (SeriesTarget t : u.targets().values()) {
                requireUnique(seriesIds, t.seriesId());
            }
        }
        Set<String> boxes = new HashSet<>();
        vavUnits.forEach(u -> boxes.add(u.unitIri()));
        for (FaultEpisode f : faults) {
            if ((f.fault().kind() == FaultType.Kind.VAV) != boxes.contains(f.unitIri())) {
                throw new IllegalArgumentException("fault " + f.fault().id() + " does not fit the kind of unit "
                        + f.unitIri());
            }
            if (!iris.contains(f.unitIri())) {
                throw new IllegalArgumentException("fault on a unit that is not simulated: " + f.unitIri());
            }
            for (FaultEpisode g : faults) {
                if (f != g && f.unitIri().equals(g.unitIri()) && f.start().isBefore(g.end())
                        && g.start().isBefore(f.end())) {
                    throw new IllegalArgumentException("overlapping fault episodes on " + f.unitIri());
                }
            }
        }
    }

    private static void requireUnique(Set<String> seen, String seriesId) {
        if (!seen.add(seriesId)) {
            throw new IllegalArgumentException("series id used twice: " + seriesId);
        }
    }
}
