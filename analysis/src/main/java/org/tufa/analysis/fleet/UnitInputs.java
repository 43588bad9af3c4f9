package org.tufa.analysis.fleet;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.kinds.UnitKind;
import org.tufa.analysis.kinds.UnitKinds;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.trends.SeriesKind;

/**
 * What the analysis reads for one unit: its kind's detection, for each role the kind reads and the unit has, the
 * point (series id, unit of measure, class), how the fan signal is to be read, and the nominal airflow.
 *
 * @param unitKind the {@code tufa:unitKind} of the unit's profile (its detection: {@link #kind()})
 */
public record UnitInputs(String unit, String label, String unitKind, Map<String, PointRef> points,
                         FanSignal fanSignal, double nominalAirflow, boolean airflowFromModel)
        implements java.io.Serializable {

    public UnitInputs {
        points = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(points));
    }

    /**
     * The inputs of a unit from its coverage row, for the roles its kind reads ({@link UnitKind#points}); ambiguous
     * roles are left out (the coverage report lists them). A unit of a kind without detection (null) reads nothing.
     */
    public static UnitInputs of(UnitCoverage coverage, UnitKind kind, double defaultAirflow) {
        Map<String, PointRef> points = kind == null ? Map.of() : kind.points(coverage);
        Optional<PointRef> fan = Optional.ofNullable(points.get("fan_status"));
        FanSignal signal = fan.map(p -> isSpeed(p) ? FanSignal.SPEED : FanSignal.STATUS).orElse(FanSignal.NONE);
        double airflow = coverage.nominalAirflow().map(a -> a.cubicMetresPerSecond()).orElse(defaultAirflow);
        return new UnitInputs(coverage.unit(), coverage.label(), kind == null ? coverage.unitKind() : kind.name(),
                points, signal, airflow,
                coverage.nominalAirflow().isPresent());
    }

    /** The detection for the unit's kind ({@link UnitKinds}), or null when this version has none for it. */
    public UnitKind kind() {
        return UnitKinds.of(unitKind).orElse(null);
    }

    /** How each series of this unit is resampled: binary status as an on-fraction, everything else as a mean. */
    public Map<String, SeriesKind> seriesKinds() {
        Map<String, SeriesKind> kinds = new LinkedHashMap<>();
        points.forEach((role, p) -> kinds.put(p.timeseriesId(),
                role.equals("fan_status") && fanSignal == FanSignal.STATUS ? SeriesKind.BINARY : SeriesKind.ANALOG));
        return kinds;
    }

    /**
     * Whether a role's values are checked against the plausible range of their unit. Not a fan's speed: a stage
     * number 0-3 is logged unitless, and a fraction's range (at most 2) would drop the top stages as logging errors.
     */
    public boolean hasPlausibleRange(String role) {
        boolean speed = role.equals(UnitSignals.FAN_SPEED)
                || role.equals(UnitSignals.FAN_STATUS) && fanSignal == FanSignal.SPEED;
        return !speed;
    }

    private static boolean isSpeed(PointRef p) {
        String c = p.brickClass() == null ? "" : p.brickClass();
        return c.contains("Speed") || c.contains("Frequency");
    }
}
