package org.tufa.mapper.points;

import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * BACnet object types as exports spell them ("AI", "analog-input", "Analog Input", "analogInput", "AI:3",
 * "analog-input,3") to their usual abbreviation. Object-type names from ASHRAE 135 (BACnet) clause 12
 * (from memory); the abbreviations are trade usage.
 */
public final class ObjectTypes {
    private static final Map<String, String> BY_SPELLING = Map.ofEntries(
            Map.entry("ai", "AI"), Map.entry("analoginput", "AI"),
            Map.entry("ao", "AO"), Map.entry("analogoutput", "AO"),
            Map.entry("av", "AV"), Map.entry("analogvalue", "AV"),
            Map.entry("bi", "BI"), Map.entry("binaryinput", "BI"),
            Map.entry("bo", "BO"), Map.entry("binaryoutput", "BO"),
            Map.entry("bv", "BV"), Map.entry("binaryvalue", "BV"),
            Map.entry("mi", "MSI"), Map.entry("msi", "MSI"), Map.entry("multistateinput", "MSI"),
            Map.entry("mo", "MSO"), Map.entry("mso", "MSO"), Map.entry("multistateoutput", "MSO"),
            Map.entry("mv", "MSV"), Map.entry("msv", "MSV"), Map.entry("multistatevalue", "MSV"));

    /** The abbreviations tufa knows, for messages. */
    public static final String KNOWN = "AI AO AV BI BO BV MSI MSO MSV";

    private ObjectTypes() {
    }

    /** The abbreviation for an export spelling; empty when the spelling is not a known object type. */
    public static Optional<String> normalise(String raw) {
        String s = raw.trim().toLowerCase(Locale.ROOT);
        String hit = BY_SPELLING.get(s);
        if (hit != null) {
            return Optional.of(hit);
        }
        // drop an instance number ("AI:3", "analog-input,3", "AI 3", "AI3"), then everything but letters
        s = INSTANCE.matcher(s).replaceAll("");
        s = NON_LETTERS.matcher(s).replaceAll("");
        return Optional.ofNullable(BY_SPELLING.get(s));
    }

    private static final java.util.regex.Pattern INSTANCE = java.util.regex.Pattern.compile("[\\s:,_#-]*\\d+$");
    private static final java.util.regex.Pattern NON_LETTERS = java.util.regex.Pattern.compile("[^a-z]");
}
