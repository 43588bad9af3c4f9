package org.tufa.analysis.trends;

/**
 * Reads sample values straight from the bytes of a CSV field.
 *
 * <p>Numbers: optional sign, digits with an optional dot decimal part, optional exponent ({@code 1e3}); nothing
 * else (no thousands separators, no decimal comma, no NaN or Infinity). Binary series also accept the BACnet-style
 * words exported for binary points (notes section 9): true/false, on/off, active/inactive, run/stop,
 * case-insensitive, read as 1/0. A result of {@link Double#NaN} means "not readable".
 *
 * <p>The fast path builds the mantissa in a long and divides by an exact power of ten: both operands are exact
 * doubles (mantissa below 2^53, power at most 10^22), so the one IEEE division is correctly rounded and gives the
 * same double as {@link Double#parseDouble} (the classic fast path of decimal-to-binary conversion, Clinger,
 * "How to read floating point numbers accurately", PLDI 1990). Everything else falls back to
 * {@link Double#parseDouble} after a strict syntax check.
 */
public final class ValueParser {

    private static final double[] POWERS_OF_TEN = {
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18,
        1e19, 1e20, 1e21, 1e22
    };
    private static final long EXACT_MANTISSA_LIMIT = 1L << 53;

    private ValueParser() {
    }

    /**
     * A value given as text (a database column of text type, say): a number, or for a binary series also a binary
     * word; NaN when unreadable or blank.
     */
    public static double parse(String text, SeriesKind kind) {
        byte[] b = text.strip().getBytes(java.nio.charset.StandardCharsets.UTF_8);
        if (b.length == 0) {
            return Double.NaN;
        }
        return kind == SeriesKind.BINARY ? binary(b, 0, b.length) : number(b, 0, b.length);
    }

    /** The number in {@code b[start, end)} (trimmed, non-empty), or NaN when it is not a plain decimal number. */
    static double number(byte[] b, int start, int end) {
        int p = start;
        boolean negative = false;
        if (b[p] == '-' || b[p] == '+') {
            negative = b[p] == '-';
            p++;
        }
        long mantissa = 0;
        int digitCount = 0;
        int fractionDigits = 0;
        int intStart = p;
        while (p < end && b[p] >= '0' && b[p] <= '9') {
            mantissa = mantissa * 10 + (b[p] - '0');
            digitCount++;
            p++;
        }
        boolean hasIntDigits = p > intStart;
        boolean hasFractionDigits = false;
        if (p < end && b[p] == '.') {
            p++;
            while (p < end && b[p] >= '0' && b[p] <= '9') {
                mantissa = mantissa * 10 + (b[p] - '0');
                digitCount++;
                fractionDigits++;
                hasFractionDigits = true;
                p++;
            }
        }
        if (!hasIntDigits && !hasFractionDigits) {
            return Double.NaN;
        }
        if (p == end) {
            if (digitCount <= 18 && mantissa < EXACT_MANTISSA_LIMIT && fractionDigits <= 22) {
                double v = fractionDigits == 0 ? (double) mantissa : mantissa / POWERS_OF_TEN[fractionDigits];
                return negative ? -v : v;
            }
            return slow(b, start, end);
        }
        if (b[p] != 'e' && b[p] != 'E') {
            return Double.NaN;
        }
        p++;
        if (p < end && (b[p] == '-' || b[p] == '+')) {
            p++;
        }
        int expStart = p;
        while (p < end && b[p] >= '0' && b[p] <= '9') {
            p++;
        }
        if (p == expStart || p != end) {
            return Double.NaN;
        }
        return slow(b, start, end);
    }

    private static double slow(byte[] b, int start, int end) {
        double v = Double.parseDouble(new String(b, start, end - start, java.nio.charset.StandardCharsets.US_ASCII));
        return Double.isFinite(v) ? v : Double.NaN;
    }

    /** {@link #isNonFinite(byte[], int, int)} on a value given as text (a database column of text type). */
    public static boolean isNonFinite(String text) {
        byte[] b = text.strip().getBytes(java.nio.charset.StandardCharsets.UTF_8);
        return b.length > 0 && isNonFinite(b, 0, b.length);
    }

    /**
     * Whether a value that {@link #number} refused is a non-finite number rather than text: NaN, Inf or Infinity
     * (any case, optional sign), or a decimal number too large for a double (1e400).
     */
    static boolean isNonFinite(byte[] b, int start, int end) {
        String t = new String(b, start, end - start, java.nio.charset.StandardCharsets.ISO_8859_1)
                .toLowerCase(java.util.Locale.ROOT);
        if (t.startsWith("+") || t.startsWith("-")) {
            t = t.substring(1);
        }
        if (t.equals("nan") || t.equals("inf") || t.equals("infinity")) {
            return true;
        }
        if (!t.matches("[0-9]*\\.?[0-9]*(e[+-]?[0-9]+)?") || t.isEmpty() || t.equals(".")) {
            return false;
        }
        try {
            return Double.isInfinite(Double.parseDouble(t));
        } catch (NumberFormatException e) {
            return false;
        }
    }

    /** A binary value: a number, or one of the binary words; NaN when neither. */
    static double binary(byte[] b, int start, int end) {
        byte first = b[start];
        if ((first >= '0' && first <= '9') || first == '-' || first == '+' || first == '.') {
            return number(b, start, end);
        }
        int n = end - start;
        switch (n) {
            case 2:
                return is(b, start, "on") ? 1 : Double.NaN;
            case 3:
                if (is(b, start, "off")) {
                    return 0;
                }
                return is(b, start, "run") ? 1 : Double.NaN;
            case 4:
                if (is(b, start, "true")) {
                    return 1;
                }
                return is(b, start, "stop") ? 0 : Double.NaN;
            case 5:
                return is(b, start, "false") ? 0 : Double.NaN;
            case 6:
                return is(b, start, "active") ? 1 : Double.NaN;
            case 8:
                return is(b, start, "inactive") ? 0 : Double.NaN;
            default:
                return Double.NaN;
        }
    }

    /** Case-insensitive ASCII comparison of {@code b[start, start + word.length())} with a lower-case word. */
    private static boolean is(byte[] b, int start, String word) {
        for (int i = 0; i < word.length(); i++) {
            int c = b[start + i];
            if (c >= 'A' && c <= 'Z') {
                c += 'a' - 'A';
            }
            if (c != word.charAt(i)) {
                return false;
            }
        }
        return true;
    }
}
