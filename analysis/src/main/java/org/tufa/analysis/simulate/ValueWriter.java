package org.tufa.analysis.simulate;

import org.tufa.common.InputException;

/**
 * Converts an SI value of a role to its target's unit and formats it with fixed precision, without locale
 * (decimal point, no grouping), trailing zeros dropped: temperatures 3 decimals, percent 2, fractions 4, binary 0/1.
 * Temperature conversions: F = C * 9/5 + 32, K = C + 273.15 (NIST SP 811, appendix B). Airflow in L/s (1 decimal),
 * 1 ft3/min = 0.471 947 4 L/s, 1 m3/s = 1000 L/s; static pressure in Pa (1 decimal), 1 inch of water
 * (conventional) = 249.0889 Pa (NIST SP 811 (2008), appendix B.8).
 */
public record ValueWriter(double scale, double offset, int decimals) {

    /** The writer for a role and a QUDT unit IRI (empty = SI default). */
    public static ValueWriter forTarget(String role, SeriesTarget target) {
        String unit = localName(target.qudtUnitIri());
        switch (SimulationRoles.quantityOf(role)) {
            case TEMPERATURE:
                return switch (unit) {
                    case "", "DEG_C" -> new ValueWriter(1, 0, 3);
                    case "DEG_F" -> new ValueWriter(9.0 / 5.0, 32, 3);
                    case "K" -> new ValueWriter(1, 273.15, 3);
                    default -> throw new InputException("series " + target.seriesId() + " (" + role + "): unit "
                            + target.qudtUnitIri() + " is not a temperature unit; use DEG_C, DEG_F or K");
                };
            case COMMAND:
                return switch (unit) {
                    case "", "PERCENT" -> new ValueWriter(1, 0, 2);
                    case "UNITLESS", "FRACTION", "NUM", "ONE" -> new ValueWriter(0.01, 0, 4);
                    default -> throw new InputException("series " + target.seriesId() + " (" + role + "): unit "
                            + target.qudtUnitIri() + " does not fit a valve command; use PERCENT or UNITLESS");
                };
            case AIRFLOW:
                return switch (unit) {
                    case "", "L-PER-SEC" -> new ValueWriter(1, 0, 1);
                    case "FT3-PER-MIN" -> new ValueWriter(1 / 0.4719474, 0, 1);
                    case "M3-PER-SEC" -> new ValueWriter(0.001, 0, 5);
                    default -> throw new InputException("series " + target.seriesId() + " (" + role + "): unit "
                            + target.qudtUnitIri() + " is not an airflow unit; use L-PER-SEC, FT3-PER-MIN or M3-PER-SEC");
                };
            case PRESSURE:
                return switch (unit) {
                    case "", "PA" -> new ValueWriter(1, 0, 1);
                    case "IN_H2O" -> new ValueWriter(1 / 249.0889, 0, 4);
                    default -> throw new InputException("series " + target.seriesId() + " (" + role + "): unit "
                            + target.qudtUnitIri() + " is not a pressure unit; use PA or IN_H2O");
                };
            case BINARY:
                return switch (unit) {
                    case "", "UNITLESS", "NUM", "ONE", "FRACTION" -> new ValueWriter(1, 0, 0);
                    default -> throw new InputException("series " + target.seriesId() + " (" + role + "): unit "
                            + target.qudtUnitIri() + " does not fit a binary status; use UNITLESS or none");
                };
            default:
                throw new IllegalStateException();
        }
    }

    private static String localName(String iri) {
        int cut = Math.max(iri.lastIndexOf('/'), iri.lastIndexOf('#'));
        return iri.substring(cut + 1).toUpperCase(java.util.Locale.ROOT);
    }

    /** The converted value. */
    public double convert(double si) {
        return si * scale + offset;
    }

    /** Appends the converted, formatted value. */
    public void append(StringBuilder out, double si) {
        appendFixed(out, convert(si), decimals);
    }

    /** Fixed-point formatting, half away from zero, trailing zeros and a bare point removed, never "-0". */
    static void appendFixed(StringBuilder out, double value, int decimals) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("not a finite value: " + value);
        }
        long scaleFactor = 1;
        for (int i = 0; i < decimals; i++) {
            scaleFactor *= 10;
        }
        long scaled = Math.round(Math.abs(value) * scaleFactor);
        if (scaled == 0) {
            out.append('0');
            return;
        }
        if (value < 0) {
            out.append('-');
        }
        out.append(scaled / scaleFactor);
        long fraction = scaled % scaleFactor;
        if (fraction == 0) {
            return;
        }
        int digits = decimals;
        while (fraction % 10 == 0) {
            fraction /= 10;
            digits--;
        }
        out.append('.');
        String f = Long.toString(fraction);
        for (int i = f.length(); i < digits; i++) {
            out.append('0');
        }
        out.append(f);
    }
}
