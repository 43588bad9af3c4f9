package org.tufa.analysis.fleet;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.trends.SeriesKind;

/**
 * What the analysis reads for one unit: for each role the unit has, the point (series id, unit of measure, class),
 * how the fan signal is to be read, and the nominal airflow.
 */
public record UnitInputs(String unit, String label, Map<String, PointRef> points, FanSignal fanSignal,
                         double nominalAirflow, boolean airflowFromModel) implements java.io.Serializable {

    /** Roles the per-unit analysis reads. */
    public static final java.util.List<String> ROLES = java.util.List.of(
            "zone_air_temperature", "discharge_air_temperature", "cooling_valve_command", "heating_valve_command",
            "fan_status", "zone_temperature_setpoint", "chilled_water_supply_temperature",
            "hot_water_supply_temperature", "outdoor_air_temperature");

    public UnitInputs {
        points = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(points));
    }

    /** The inputs of a unit from its coverage row; ambiguous roles are left out (the coverage report lists them). */
    public static UnitInputs of(UnitCoverage coverage, double defaultAirflow) {
        Map<String, PointRef> points = new LinkedHashMap<>();
        for (String role : ROLES) {
            coverage.point(role).ifPresent(p -> points.put(role, p));
        }
        if (!points.containsKey("zone_temperature_setpoint")) {
            // A unit modelled with the cooling/heating pair: the zone error is judged in cooling only, against the
            // cooling setpoint, so that one stands in for the single setpoint.
            coverage.point("zone_cooling_temperature_setpoint").ifPresent(p -> points.put("zone_temperature_setpoint", p));
        }
        Optional<PointRef> fan = Optional.ofNullable(points.get("fan_status"));
        FanSignal signal = fan.map(p -> isSpeed(p) ? FanSignal.SPEED : FanSignal.STATUS).orElse(FanSignal.NONE);
        double airflow = coverage.nominalAirflow().map(a -> a.cubicMetresPerSecond()).orElse(defaultAirflow);
        return new UnitInputs(coverage.unit(), coverage.label(), points, signal, airflow,
                coverage.nominalAirflow().isPresent());
    }

    /** How each series of this unit is resampled: binary status as an on-fraction, everything else as a mean. */
    public Map<String, SeriesKind> seriesKinds() {
        Map<String, SeriesKind> kinds = new LinkedHashMap<>();
        points.forEach((role, p) -> kinds.put(p.timeseriesId(),
                role.equals("fan_status") && fanSignal == FanSignal.STATUS ? SeriesKind.BINARY : SeriesKind.ANALOG));
        return kinds;
    }

    private static boolean isSpeed(PointRef p) {
        String c = p.brickClass() == null ? "" : p.brickClass();
        return c.contains("Speed") || c.contains("Frequency");
    }
}
