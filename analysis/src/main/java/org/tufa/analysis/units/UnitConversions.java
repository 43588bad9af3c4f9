package org.tufa.analysis.units;

/**
 * Temperature and command conversions. Temperatures go to degrees Celsius; temperature differences to kelvin with
 * the scale factor only (a difference of 10 F is 5.556 K; adding the 32 F offset to a difference is the classic
 * error, notes section 3); commands to percent 0..100.
 *
 * <p>Definitions: t[C] = (t[F] - 32) * 5/9 and t[C] = T[K] - 273.15; a difference of 1 F = 5/9 K, 1 C = 1 K
 * (the SI definitions as in NIST Special Publication 811, 2008; cited from memory). NaN stays NaN.
 */
public final class UnitConversions {

    private UnitConversions() {
    }

    /** A temperature in the given unit, in degrees Celsius. */
    public static double toCelsius(double value, MeasureUnit unit) {
        return switch (unit) {
            case DEG_C -> value;
            case DEG_F -> (value - 32.0) * 5.0 / 9.0;
            case KELVIN -> value - 273.15;
            default -> throw new IllegalArgumentException(unit + " is not a temperature unit");
        };
    }

    /** A temperature difference in the given unit, in kelvin (= degrees Celsius of difference): factor only. */
    public static double differenceToKelvin(double difference, MeasureUnit unit) {
        return switch (unit) {
            case DEG_C, KELVIN -> difference;
            case DEG_F -> difference * 5.0 / 9.0;
            default -> throw new IllegalArgumentException(unit + " is not a temperature unit");
        };
    }

    /** A command in percent (0..100) or as a 0..1 fraction, in percent. */
    public static double toPercent(double value, MeasureUnit unit) {
        return switch (unit) {
            case PERCENT -> value;
            case FRACTION -> value * 100.0;
            default -> throw new IllegalArgumentException(unit + " is not a command unit (percent or fraction)");
        };
    }

    /** {@link #toCelsius} for each value. */
    public static double[] toCelsius(double[] values, MeasureUnit unit) {
        double[] out = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            out[i] = toCelsius(values[i], unit);
        }
        return out;
    }

    /** {@link #differenceToKelvin} for each value. */
    public static double[] differenceToKelvin(double[] values, MeasureUnit unit) {
        double[] out = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            out[i] = differenceToKelvin(values[i], unit);
        }
        return out;
    }

    /** {@link #toPercent} for each value. */
    public static double[] toPercent(double[] values, MeasureUnit unit) {
        double[] out = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            out[i] = toPercent(values[i], unit);
        }
        return out;
    }
}
