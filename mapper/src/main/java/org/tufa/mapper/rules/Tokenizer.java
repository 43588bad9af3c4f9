package org.tufa.mapper.rules;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Locale;

/**
 * Splits a point name (or a part of one) into word tokens: at every character that is not a letter or digit,
 * at lower-to-upper case changes ("ZoneTemp" -> Zone, Temp), before the last capital of a capital run followed by
 * lower case ("DATemp" -> DA, Temp) and between letters and digits ("FCU07" -> FCU, 07). Words that mix letters
 * and digits on purpose (the Brick tags CO2, PM2.5, PM10; dictionary keys such as S1) are kept whole when they
 * start a token and end at a token boundary ("SpaceCO2Sensor" -> Space, CO2, Sensor; "CO2_PPM" -> CO2, PPM).
 * Tokens keep their spelling; dictionary look-ups ignore case. Common practice for identifier splitting, no source.
 */
public final class Tokenizer {
    private Tokenizer() {
    }

    /** The tokens of {@code s}, in order, with no word kept whole. */
    public static List<String> tokens(String s) {
        return tokens(s, List.of());
    }

    /**
     * The tokens of {@code s}, in order; {@code whole} lists words (upper case, longest first) kept as one token.
     */
    public static List<String> tokens(String s, Collection<String> whole) {
        List<String> out = new ArrayList<>();
        int n = s.length();
        int start = -1;
        int i = 0;
        while (i < n) {
            char c = s.charAt(i);
            boolean word = Character.isLetterOrDigit(c);
            if (!word) {
                if (start >= 0) {
                    out.add(s.substring(start, i));
                    start = -1;
                }
                i++;
                continue;
            }
            boolean boundary = start < 0 || boundary(s, i);
            if (boundary && !whole.isEmpty()) {
                int len = wholeAt(s, i, whole);
                if (len > 0) {
                    if (start >= 0) {
                        out.add(s.substring(start, i));
                    }
                    out.add(s.substring(i, i + len));
                    start = -1;
                    i += len;
                    continue;
                }
            }
            if (start < 0) {
                start = i;
            } else if (boundary) {
                out.add(s.substring(start, i));
                start = i;
            }
            i++;
        }
        if (start >= 0) {
            out.add(s.substring(start));
        }
        return out;
    }

    /** Is there a token boundary between s[i-1] and s[i] (both letters or digits)? */
    private static boolean boundary(String s, int i) {
        char p = s.charAt(i - 1);
        char c = s.charAt(i);
        return Character.isDigit(p) != Character.isDigit(c)
                || Character.isLowerCase(p) && Character.isUpperCase(c)
                || Character.isUpperCase(p) && Character.isUpperCase(c) && i + 1 < s.length()
                && Character.isLowerCase(s.charAt(i + 1));
    }

    /** Length of the first {@code whole} word found at i that ends at a token boundary, or 0. */
    private static int wholeAt(String s, int i, Collection<String> whole) {
        for (String w : whole) {
            int end = i + w.length();
            if (end > s.length() || !s.regionMatches(true, i, w, 0, w.length())) {
                continue;
            }
            if (end == s.length()) {
                return w.length();
            }
            char last = s.charAt(end - 1);
            char next = s.charAt(end);
            if (!Character.isLetterOrDigit(next) || Character.isDigit(last) != Character.isDigit(next)
                    || Character.isLowerCase(last) && Character.isUpperCase(next)) {
                return w.length();
            }
        }
        return 0;
    }

    /**
     * Upper-cased tokens of a dictionary key as a rule file writes it. A word that mixes letters and digits with no
     * other break ("CO2", "S1", "PM2.5") is one token, and names a word to keep whole in point names.
     */
    public static List<String> keys(String s) {
        List<String> out = new ArrayList<>();
        for (String word : s.strip().split("\\s+")) {
            if (word.isEmpty()) {
                continue;
            }
            if (mixesLettersAndDigits(word) && word.matches("[A-Za-z0-9]+(\\.[0-9]+)?")) {
                out.add(word.toUpperCase(Locale.ROOT));
                continue;
            }
            for (String x : tokens(word)) {
                out.add(x.toUpperCase(Locale.ROOT));
            }
        }
        return out;
    }

    /** Does the word mix letters and digits (a candidate to keep whole)? */
    public static boolean mixesLettersAndDigits(String w) {
        boolean letter = false;
        boolean digit = false;
        for (int i = 0; i < w.length(); i++) {
            letter |= Character.isLetter(w.charAt(i));
            digit |= Character.isDigit(w.charAt(i));
        }
        return letter && digit;
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
