package org.tufa.analysis.fleet;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.trends.ResampledSeries;
import org.tufa.analysis.units.MeasureUnit;
import org.tufa.analysis.units.NormalisedSeries;
import org.tufa.analysis.units.TemperatureRole;
import org.tufa.analysis.units.UnitNormaliser;

/**
 * Turns a unit's resampled series into {@link UnitSignals} in canonical units (degrees C, percent, fan fraction)
 * and collects the notes a reader should see (a unit that contradicts its values, a unit the model does not give).
 */
public final class SignalPreparation {

    /** A unit's signals and the notes made while preparing them. */
    public record Prepared(UnitSignals signals, List<String> notes) {
        public Prepared {
            notes = List.copyOf(notes);
        }
    }

    /** Where a series comes from: the trend store in the pipeline, a map in tests. */
    @FunctionalInterface
    public interface SeriesSource {
        /** The resampled series of a series id, or empty when the trends do not hold it. */
        Optional<ResampledSeries> series(String seriesId);
    }

    private SignalPreparation() {
    }

    public static Prepared prepare(UnitInputs inputs, SeriesSource source, java.time.Instant gridStart,
                                   java.time.Duration interval, int length) {
        List<String> notes = new ArrayList<>();
        double[] zone = temperature(inputs, "zone_air_temperature", source, length, notes, TemperatureRole.ZONE_AIR);
        double[] discharge = temperature(inputs, "discharge_air_temperature", source, length, notes,
                TemperatureRole.OTHER);
        double[] cooling = command(inputs, "cooling_valve_command", source, length, notes);
        double[] heating = command(inputs, "heating_valve_command", source, length, notes);
        double[] fan = fan(inputs, source, length, notes);
        double[] setpoint = temperature(inputs, "zone_temperature_setpoint", source, length, notes,
                TemperatureRole.OTHER);
        double[] chw = temperature(inputs, "chilled_water_supply_temperature", source, length, notes,
                TemperatureRole.OTHER);
        double[] hw = temperature(inputs, "hot_water_supply_temperature", source, length, notes,
                TemperatureRole.OTHER);
        double[] outdoor = temperature(inputs, "outdoor_air_temperature", source, length, notes,
                TemperatureRole.OTHER);
        return new Prepared(new UnitSignals(gridStart, interval, zone, discharge, cooling, heating, fan, setpoint,
                chw, hw, outdoor), notes);
    }

    private static double[] raw(UnitInputs inputs, String role, SeriesSource source, int length, List<String> notes) {
        PointRef p = inputs.points().get(role);
        if (p == null) {
            return UnitSignals.absent(length);
        }
        Optional<ResampledSeries> s = source.series(p.timeseriesId());
        if (s.isEmpty() || !UnitSignals.present(s.get().values())) {
            notes.add(role + ": no trend data for series '" + p.timeseriesId() + "' (point " + p.label() + ")");
            return UnitSignals.absent(length);
        }
        return s.get().values();
    }

    private static double[] temperature(UnitInputs inputs, String role, SeriesSource source, int length,
                                        List<String> notes, TemperatureRole kind) {
        double[] v = raw(inputs, role, source, length, notes);
        if (!UnitSignals.present(v)) {
            return v;
        }
        PointRef p = inputs.points().get(role);
        Optional<MeasureUnit> unit = unitOf(p);
        MeasureUnit declared;
        if (unit.isPresent() && (unit.get() == MeasureUnit.DEG_C || unit.get() == MeasureUnit.DEG_F
                || unit.get() == MeasureUnit.KELVIN)) {
            declared = unit.get();
        } else {
            // No usable unit in the model: air temperatures of occupied spaces sit at 16-28 C or 61-82 F, so the
            // median tells them apart (notes on units, common practice, no source); water is assumed to be C.
            double median = org.tufa.analysis.band.Quantiles.median(v);
            boolean air = role.equals("zone_air_temperature") || role.equals("discharge_air_temperature")
                    || role.equals("zone_temperature_setpoint");
            declared = air && median > 45 ? MeasureUnit.DEG_F : MeasureUnit.DEG_C;
            notes.add(String.format(Locale.ROOT, "%s: the model gives no temperature unit for %s; assumed %s"
                    + " (median %.1f); add brick:hasUnit to the point", role, p.label(), declared.name(), median));
        }
        NormalisedSeries n = UnitNormaliser.temperature(p.label(), v, declared, kind);
        notes.addAll(n.notes());
        return n.values();
    }

    private static double[] command(UnitInputs inputs, String role, SeriesSource source, int length,
                                    List<String> notes) {
        double[] v = raw(inputs, role, source, length, notes);
        if (!UnitSignals.present(v)) {
            return v;
        }
        PointRef p = inputs.points().get(role);
        MeasureUnit declared = unitOf(p).filter(u -> u == MeasureUnit.PERCENT || u == MeasureUnit.FRACTION)
                .orElseGet(() -> {
                    MeasureUnit guess = max(v) <= 1.0 ? MeasureUnit.FRACTION : MeasureUnit.PERCENT;
                    notes.add(role + ": the model gives no unit for " + p.label() + "; read as "
                            + (guess == MeasureUnit.FRACTION ? "a 0-1 fraction" : "percent")
                            + " from its range; add brick:hasUnit to the point");
                    return guess;
                });
        NormalisedSeries n = UnitNormaliser.command(p.label(), v, declared);
        notes.addAll(n.notes());
        return n.values();
    }

    /** Fan as a running fraction 0..1: a binary status is already an on-fraction; a speed in percent is scaled. */
    private static double[] fan(UnitInputs inputs, SeriesSource source, int length, List<String> notes) {
        double[] v = raw(inputs, "fan_status", source, length, notes);
        if (!UnitSignals.present(v) || inputs.fanSignal() != FanSignal.SPEED) {
            return v;
        }
        double[] percent = command(inputs, "fan_status", source, length, notes);
        double[] fraction = new double[percent.length];
        for (int i = 0; i < percent.length; i++) {
            fraction[i] = percent[i] / 100.0;
        }
        return fraction;
    }

    private static Optional<MeasureUnit> unitOf(PointRef p) {
        return p.unitOfMeasureIri() == null ? Optional.empty() : MeasureUnit.fromQudt(p.unitOfMeasureIri());
    }

    private static double max(double[] v) {
        double m = Double.NEGATIVE_INFINITY;
        for (double x : v) {
            if (!Double.isNaN(x) && x > m) {
                m = x;
            }
        }
        return m;
    }
}
