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

    /**
     * The unit's signals for every role its kind reads ({@link UnitInputs#kind()}), in the kind's order, each in
     * its canonical unit.
     */
    public static Prepared prepare(UnitInputs inputs, SeriesSource source, java.time.Instant gridStart,
                                   java.time.Duration interval, int length) {
        List<String> notes = new ArrayList<>();
        UnitSignals.Builder b = UnitSignals.builder(gridStart, interval, length).fanSignal(inputs.fanSignal())
                .nominalAirflow(inputs.nominalAirflow());
        List<String> roles = inputs.kind() == null ? List.of() : inputs.kind().roles();
        for (String role : roles) {
            b.with(role, switch (quantityOf(role)) {
                case ZONE_TEMPERATURE -> temperature(inputs, role, source, length, notes, TemperatureRole.ZONE_AIR);
                case TEMPERATURE -> temperature(inputs, role, source, length, notes, TemperatureRole.OTHER);
                case COMMAND -> command(inputs, role, source, length, notes);
                case FAN -> fan(inputs, source, length, notes);
                case AIRFLOW -> airflow(inputs, role, source, length, notes);
                case PRESSURE -> pressure(inputs, role, source, length, notes);
                case FRACTION, AS_REPORTED -> raw(inputs, role, source, length, notes);
            });
        }
        return new Prepared(b.build(), notes);
    }

    /** What a role measures, which sets its canonical unit. */
    enum Quantity { ZONE_TEMPERATURE, TEMPERATURE, COMMAND, FAN, AIRFLOW, PRESSURE, FRACTION, AS_REPORTED }

    static Quantity quantityOf(String role) {
        return switch (role) {
            case UnitSignals.ZONE_AIR_TEMPERATURE -> Quantity.ZONE_TEMPERATURE;
            case UnitSignals.COOLING_VALVE_COMMAND, UnitSignals.HEATING_VALVE_COMMAND, UnitSignals.DAMPER_POSITION,
                    UnitSignals.DAMPER_COMMAND, UnitSignals.REHEAT_VALVE_COMMAND, UnitSignals.ELECTRIC_REHEAT_COMMAND
                    -> Quantity.COMMAND;
            case UnitSignals.FAN_STATUS -> Quantity.FAN;
            case UnitSignals.AIRFLOW, UnitSignals.AIRFLOW_SETPOINT -> Quantity.AIRFLOW;
            case UnitSignals.AHU_SUPPLY_STATIC_PRESSURE -> Quantity.PRESSURE;
            case UnitSignals.OCCUPANCY -> Quantity.FRACTION;
            case UnitSignals.FAN_SPEED -> Quantity.AS_REPORTED;
            default -> Quantity.TEMPERATURE;
        };
    }

    /** Roles whose temperature is of air in or near an occupied space (16-28 C), for guessing a missing unit. */
    private static boolean airTemperature(String role) {
        return switch (role) {
            case UnitSignals.ZONE_AIR_TEMPERATURE, UnitSignals.DISCHARGE_AIR_TEMPERATURE,
                    UnitSignals.ZONE_TEMPERATURE_SETPOINT, UnitSignals.ZONE_COOLING_TEMPERATURE_SETPOINT,
                    UnitSignals.ZONE_HEATING_TEMPERATURE_SETPOINT -> true;
            default -> false;
        };
    }

    /**
     * Airflow in m3/s: 1 L/s = 0.001 m3/s, 1 ft3/min = 0.000 471 947 4 m3/s, 1 m3/h = 1/3600 m3/s (NIST SP 811
     * (2008), appendix B.8). Without a unit the model can be read by, the magnitude tells: a terminal box moves
     * 0.02-2 m3/s, 20-2000 L/s or 40-4000 cfm, so a median above 5 is read as L/s and one below as m3/s, with a
     * note (common practice, no source).
     */
    private static double[] airflow(UnitInputs inputs, String role, SeriesSource source, int length,
                                    List<String> notes) {
        return converted(inputs, role, source, length, notes, (p, v) -> switch (localName(p.unitOfMeasureIri())) {
            case "M3-PER-SEC" -> 1.0;
            case "L-PER-SEC" -> 0.001;
            case "FT3-PER-MIN" -> 0.0004719474;
            case "M3-PER-HR" -> 1.0 / 3600;
            default -> {
                double median = org.tufa.analysis.band.Quantiles.median(v);
                boolean litres = median > 5;
                notes.add(String.format(Locale.ROOT, "%s: the model gives no airflow unit tufa reads for %s; read"
                        + " as %s (median %.3g); add brick:hasUnit (unit:L-PER-SEC, unit:FT3-PER-MIN or"
                        + " unit:M3-PER-SEC) to the point", role, p.label(), litres ? "L/s" : "m3/s", median));
                yield litres ? 0.001 : 1.0;
            }
        });
    }

    /** Static pressure in Pa: 1 inch of water (conventional) = 249.0889 Pa (NIST SP 811 (2008), appendix B.8). */
    private static double[] pressure(UnitInputs inputs, String role, SeriesSource source, int length,
                                     List<String> notes) {
        return converted(inputs, role, source, length, notes, (p, v) -> switch (localName(p.unitOfMeasureIri())) {
            case "PA" -> 1.0;
            case "IN_H2O" -> 249.0889;
            case "KILOPA" -> 1000.0;
            default -> {
                notes.add(role + ": the model gives no pressure unit tufa reads for " + p.label() + "; read as Pa;"
                        + " add brick:hasUnit (unit:PA or unit:IN_H2O) to the point");
                yield 1.0;
            }
        });
    }

    /** The factor to a role's canonical unit, from its point and its values (which a guess may look at). */
    @FunctionalInterface
    private interface Factor {
        double of(PointRef point, double[] values);
    }

    private static double[] converted(UnitInputs inputs, String role, SeriesSource source, int length,
                                      List<String> notes, Factor factor) {
        double[] v = raw(inputs, role, source, length, notes);
        if (!UnitSignals.present(v)) {
            return v;
        }
        return scaled(v, factor.of(inputs.points().get(role), v));
    }

    private static String localName(String iri) {
        if (iri == null) {
            return "";
        }
        int cut = Math.max(Math.max(iri.lastIndexOf('/'), iri.lastIndexOf('#')), iri.lastIndexOf(':'));
        return iri.substring(cut + 1).toUpperCase(Locale.ROOT);
    }

    private static double[] scaled(double[] v, double factor) {
        if (factor == 1.0) {
            return v;
        }
        double[] out = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            out[i] = v[i] * factor;
        }
        return out;
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
            boolean air = airTemperature(role);
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
