package org.tufa.analysis.units;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.tufa.analysis.band.Quantiles;

/**
 * Converts a unit's series to working units and flags values that contradict the declared unit. It never
 * silently re-interprets the unit: the values are converted as declared and a note says what looks wrong, so an
 * engineer can fix the point list or rule file.
 *
 * <p>Checks (notes section 9, common practice): a zone temperature declared in C whose median lies in 64..80 looks
 * like F (and one declared in F with a median in 16..28 looks like C; one in K below 200 is not kelvin); a command
 * declared in percent whose maximum over the window is above 0 but at most 1 looks like a 0-1 fraction; one
 * declared as a fraction that exceeds 1 looks like percent.
 */
public final class UnitNormaliser {

    private UnitNormaliser() {
    }

    /** A temperature series in degrees Celsius. */
    public static NormalisedSeries temperature(String label, double[] values, MeasureUnit declared, TemperatureRole role) {
        List<String> notes = new ArrayList<>();
        double median = Quantiles.median(values);
        if (role == TemperatureRole.ZONE_AIR && !Double.isNaN(median)) {
            if (declared == MeasureUnit.DEG_C && median >= 64 && median <= 80) {
                notes.add(String.format(Locale.ROOT, "%s: declared in degrees C but its median is %.1f, typical of"
                        + " a zone temperature in degrees F; check the point's unit", label, median));
            } else if (declared == MeasureUnit.DEG_F && median >= 16 && median <= 28) {
                notes.add(String.format(Locale.ROOT, "%s: declared in degrees F but its median is %.1f, typical of"
                        + " a zone temperature in degrees C; check the point's unit", label, median));
            } else if (declared == MeasureUnit.KELVIN && median < 200) {
                notes.add(String.format(Locale.ROOT, "%s: declared in kelvin but its median is %.1f, far below any"
                        + " room temperature in kelvin; check the point's unit", label, median));
            }
        }
        return new NormalisedSeries(UnitConversions.toCelsius(values, declared), declared, notes);
    }

    /** A temperature-difference series in kelvin (factor only, never the offset). */
    public static NormalisedSeries temperatureDifference(String label, double[] values, MeasureUnit declared) {
        return new NormalisedSeries(UnitConversions.differenceToKelvin(values, declared), declared, List.of());
    }

    /** A command (valve, damper, speed) in percent 0..100. */
    public static NormalisedSeries command(String label, double[] values, MeasureUnit declared) {
        List<String> notes = new ArrayList<>();
        double max = Double.NEGATIVE_INFINITY;
        for (double v : values) {
            if (!Double.isNaN(v) && v > max) {
                max = v;
            }
        }
        if (declared == MeasureUnit.PERCENT && max > 0 && max <= 1) {
            notes.add(String.format(Locale.ROOT, "%s: declared in percent but never exceeds %.3g over the window,"
                    + " which looks like a 0-1 fraction; check the point's unit (values kept as percent)", label, max));
        } else if (declared == MeasureUnit.FRACTION && max > 1) {
            notes.add(String.format(Locale.ROOT, "%s: declared as a 0-1 fraction but reaches %.3g, which looks like"
                    + " percent; check the point's unit (values multiplied by 100 as declared)", label, max));
        }
        return new NormalisedSeries(UnitConversions.toPercent(values, declared), declared, notes);
    }
}
