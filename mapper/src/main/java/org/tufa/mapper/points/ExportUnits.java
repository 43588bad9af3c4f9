package org.tufa.mapper.points;

import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Units as BAS exports write them -> QUDT unit local names (http://qudt.org/vocab/unit/).
 *
 * <p>Numeric spellings are BACnet engineering-unit enumeration values (ASHRAE 135, BACnetEngineeringUnits; the
 * values listed in ../shared/field/notes.md section 9: 62 °C, 63 K, 64 °F, 98 percent, 29 %RH, 84 cfm, 87 L/s,
 * 89 US gpm, 47 W, 48 kW, 53 Pa, 96 ppm, 104 rpm, 95 no units). QUDT local names from the QUDT unit vocabulary
 * (from memory: DEG_F, DEG_C, K, PERCENT, PERCENT_RH, FT3-PER-MIN, L-PER-SEC, GAL_US-PER-MIN, W, KiloW, PA,
 * PPM, REV-PER-MIN, KiloW-HR, IN_H2O, BTU_IT-PER-HR). Text spellings are common practice, no source.
 */
public final class ExportUnits {
    private static final Map<String, String> QUDT = new HashMap<>();

    static {
        put("DEG_F", "°f", "ºf", "degf", "deg f", "f", "fahrenheit", "degreesfahrenheit", "degrees fahrenheit",
                "deg. f", "°fahrenheit", "64");
        put("DEG_C", "°c", "ºc", "degc", "deg c", "c", "celsius", "degreescelsius", "degrees celsius", "deg. c",
                "62");
        put("K", "k", "kelvin", "kelvins", "63");
        put("PERCENT", "%", "percent", "pct", "98");
        put("PERCENT_RH", "%rh", "rh", "percentrelativehumidity", "percent relative humidity", "29");
        put("FT3-PER-MIN", "cfm", "ft3/min", "ft³/min", "cubicfeetperminute", "cubic feet per minute", "84");
        put("L-PER-SEC", "l/s", "lps", "litersperseconds", "litres per second", "liters per second", "87");
        put("GAL_US-PER-MIN", "gpm", "usgpm", "us gpm", "89");
        put("W", "w", "watt", "watts", "47");
        put("KiloW", "kw", "kilowatt", "kilowatts", "48");
        put("KiloW-HR", "kwh", "kw-h", "kilowatt-hours", "kilowatthours", "19");
        put("PA", "pa", "pascal", "pascals", "53");
        put("IN_H2O", "inh2o", "in h2o", "\"wc", "in. w.c.", "inwc", "in. wc", "in.wc", "inches of water", "58");
        put("KiloPA", "kpa", "kilopascal", "kilopascals", "54");
        put("PSI", "psi", "pounds per square inch", "56");
        put("MegaW-HR", "mwh", "megawatt-hours", "megawatthours", "146");
        put("PPM", "ppm", "partspermillion", "96");
        put("REV-PER-MIN", "rpm", "revolutionsperminute", "104");
        put("BTU_IT-PER-HR", "btu/h", "btu/hr", "btuh", "50");
    }

    /** Spellings that mean "no unit" (BACnet 95 "no-units"). */
    private static final java.util.Set<String> NONE = java.util.Set.of("", "-", "none", "no units", "no-units",
            "nounits", "n/a", "95", "null");

    private ExportUnits() {
    }

    private static void put(String qudt, String... spellings) {
        for (String s : spellings) {
            QUDT.put(s, qudt);
        }
    }

    /** Does this spelling mean "no unit"? */
    public static boolean isNone(String raw) {
        return NONE.contains(raw.trim().toLowerCase(Locale.ROOT));
    }

    /** The QUDT local name for an export spelling; empty when unknown or "no unit". */
    public static Optional<String> toQudt(String raw) {
        String s = raw.trim().toLowerCase(Locale.ROOT);
        String hit = QUDT.get(s);
        if (hit == null) {
            hit = QUDT.get(s.replace(" ", ""));
        }
        if (hit == null && s.startsWith("unit:")) {
            // A QUDT name written out; only a real one (QUDT 3.1.0) counts, so unit:BANANAS is an unknown spelling.
            return org.tufa.vocabulary.QudtUnits.canonical(raw.trim());
        }
        return Optional.ofNullable(hit);
    }
}
