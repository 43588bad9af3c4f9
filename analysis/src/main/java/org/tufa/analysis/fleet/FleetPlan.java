package org.tufa.analysis.fleet;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.tufa.analysis.coverage.CoverageSummary;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.kinds.UnitKinds;
import org.tufa.analysis.trends.PlausibleRange;
import org.tufa.analysis.trends.SeriesKind;

/**
 * What a fleet run will do with each unit, decided from the coverage before any trend is read: the units in run
 * order (by IRI) with their output folders, which are analysed and why the others are skipped, and the series the
 * analysed ones read. Serializable, so an engine that analyses units in other processes (the Spark job) can hand
 * each its share of the plan.
 *
 * @param units  every unit of the coverage, sorted by IRI
 * @param wanted series the analysed units read, with how each is resampled
 * @param ranges plausible range per series id, from its point's unit of measure
 */
public record FleetPlan(List<Unit> units, Map<String, SeriesKind> wanted, Map<String, PlausibleRange> ranges)
        implements Serializable {

    /**
     * One unit of the plan.
     *
     * @param inputs     its points and airflow
     * @param folder     its output folder under units/
     * @param skipReason why it is not analysed (fleet.csv's reason), or null when it is
     */
    public record Unit(UnitInputs inputs, String folder, String skipReason) implements Serializable {

        public String unit() {
            return inputs.unit();
        }

        /** Whether the unit is analysed (and so reads trends). */
        public boolean analysed() {
            return skipReason == null;
        }
    }

    public FleetPlan {
        units = List.copyOf(units);
        wanted = java.util.Collections.unmodifiableMap(new TreeMap<>(wanted));
        ranges = java.util.Collections.unmodifiableMap(new TreeMap<>(ranges));
    }

    /** The plan for a fleet's coverage. */
    public static FleetPlan of(FleetCoverage coverage, AnalysisSettings settings) {
        List<UnitCoverage> sorted = new ArrayList<>(coverage.units());
        sorted.sort(Comparator.comparing(UnitCoverage::unit));
        FolderNames names = new FolderNames();
        List<Unit> units = new ArrayList<>();
        Map<String, SeriesKind> wanted = new TreeMap<>();
        Map<String, PlausibleRange> ranges = new TreeMap<>();
        for (UnitCoverage u : sorted) {
            UnitInputs in = UnitInputs.of(u, UnitKinds.of(u.unitKind()).orElse(null), settings.defaultAirflow());
            String reason = skipReason(coverage, u);
            units.add(new Unit(in, names.next(u.unit()), reason));
            if (reason == null) {
                wanted.putAll(in.seriesKinds());
                in.points().forEach((role, p) -> {
                    if (in.hasPlausibleRange(role)) {
                        PlausibleRange.forUnit(p.unitOfMeasureIri())
                                .ifPresent(r -> ranges.putIfAbsent(p.timeseriesId(), r));
                    }
                });
            }
        }
        return new FleetPlan(units, wanted, ranges);
    }

    /**
     * The series and ranges some of the analysed units read: the fleet's, restricted to theirs (so a series two
     * units share keeps the range the whole fleet gave it).
     */
    public FleetPlan part(List<Unit> some) {
        Map<String, SeriesKind> partWanted = new LinkedHashMap<>();
        Map<String, PlausibleRange> partRanges = new LinkedHashMap<>();
        for (Unit u : some) {
            if (u.analysed()) {
                for (String id : u.inputs().seriesKinds().keySet()) {
                    partWanted.put(id, wanted.get(id));
                    if (ranges.containsKey(id)) {
                        partRanges.put(id, ranges.get(id));
                    }
                }
            }
        }
        return new FleetPlan(some, partWanted, partRanges);
    }

    /** Why a unit is not analysed, or null when it is. */
    private static String skipReason(FleetCoverage coverage, UnitCoverage u) {
        if (!u.analyzable()) {
            return CoverageSummary.reason(coverage, u);
        }
        if (UnitKinds.of(u.unitKind()).isEmpty()) {
            return "no detection for units of kind " + u.unitKind() + " in this version (coverage: analysable with"
                    + " profile " + u.profileName() + ")";
        }
        return null;
    }
}
