package org.tufa.mapper.rules;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Splits a point name (or a part of one) into word tokens: at every character that is not a letter or digit,
 * at lower-to-upper case changes ("ZoneTemp" -> Zone, Temp), before the last capital of a capital run followed by
 * lower case ("DATemp" -> DA, Temp) and between letters and digits ("FCU07" -> FCU, 07). Tokens keep their
 * spelling; dictionary look-ups ignore case. Common practice for identifier splitting, no source.
 */
public final class Tokenizer {
    private Tokenizer() {
    }

    /** The tokens of {@code s}, in order. */
    public static List<String> tokens(String s) {
        List<String> out = new ArrayList<>();
        int n = s.length();
        int start = -1;
        for (int i = 0; i < n; i++) {
            char c = s.charAt(i);
            boolean word = Character.isLetterOrDigit(c);
            if (!word) {
                if (start >= 0) {
                    out.add(s.substring(start, i));
                    start = -1;
                }
                continue;
            }
            if (start < 0) {
                start = i;
                continue;
            }
            char p = s.charAt(i - 1);
            boolean boundary = Character.isDigit(p) != Character.isDigit(c)
                    || Character.isLowerCase(p) && Character.isUpperCase(c)
                    || Character.isUpperCase(p) && Character.isUpperCase(c) && i + 1 < n
                    && Character.isLowerCase(s.charAt(i + 1));
            if (boundary) {
                out.add(s.substring(start, i));
                start = i;
            }
        }
        if (start >= 0) {
            out.add(s.substring(start));
        }
        return out;
    }

    /** Upper-cased tokens, the form dictionary keys are stored in. */
    public static List<String> keys(String s) {
        List<String> t = tokens(s);
        List<String> out = new ArrayList<>(t.size());
        for (String x : t) {
            out.add(x.toUpperCase(Locale.ROOT));
        }
        return out;
    }

    /**
     * The token shape of a name for grouping unmapped points: digit runs become '#', delimiters stay as written,
     * letters stay ("HVN.B1.F03.AHU-01.SA-T" -> "HVN.B#.F#.AHU-#.SA-T").
     */
    public static String shape(String s) {
        StringBuilder b = new StringBuilder(s.length());
        boolean inDigits = false;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (Character.isDigit(c)) {
                if (!inDigits) {
                    b.append('#');
                }
                inDigits = true;
            } else {
                b.append(c);
                inDigits = false;
            }
        }
        return b.toString();
    }
}
