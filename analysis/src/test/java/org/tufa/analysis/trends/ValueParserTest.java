package org.tufa.analysis.trends;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The hand-written number reader must agree bit for bit with the JDK's {@link Double#parseDouble}. */
class ValueParserTest {

    private static double number(String s) {
        byte[] b = s.getBytes(StandardCharsets.US_ASCII);
        return ValueParser.number(b, 0, b.length);
    }

    private static double binary(String s) {
        byte[] b = s.getBytes(StandardCharsets.US_ASCII);
        return ValueParser.binary(b, 0, b.length);
    }

    @Test
    void agreesWithParseDoubleOnRandomDecimals() {
        // Reference: java.lang.Double.parseDouble (correctly rounded, JLS / Double.valueOf javadoc).
        SplittableRandom random = new SplittableRandom(7);
        for (int i = 0; i < 200_000; i++) {
            int decimals = random.nextInt(0, 8);
            long mantissa = random.nextLong(0, 1_000_000_000_000L);
            String text = (random.nextBoolean() ? "-" : "") + mantissa / pow(decimals)
                    + (decimals == 0 ? "" : "." + pad(mantissa % pow(decimals), decimals));
            assertEquals(Double.doubleToLongBits(Double.parseDouble(text)), Double.doubleToLongBits(number(text)), text);
        }
        for (String s : new String[] {"1e3", "-2.5E-2", "12345678901234567890.5", ".5", "5.", "+7", "0.1", "72.35"}) {
            assertEquals(Double.parseDouble(s), number(s), s);
        }
    }

    @Test
    void rejectsWhatIsNotAPlainNumber() {
        for (String s : new String[] {"abc", "1,5", "NaN", "Infinity", "1e", "--1", "1.2.3", "0x10", "1d", "12 5", "."}) {
            assertTrue(Double.isNaN(number(s)), s);
        }
    }

    @Test
    void binaryWordsAreReadCaseInsensitively() {
        // Export spellings of BACnet binary values (notes section 9): active/inactive, on/off, true/false, run/stop.
        assertEquals(1, binary("Active"));
        assertEquals(0, binary("INACTIVE"));
        assertEquals(1, binary("on"));
        assertEquals(0, binary("Off"));
        assertEquals(1, binary("TRUE"));
        assertEquals(0, binary("false"));
        assertEquals(1, binary("Run"));
        assertEquals(0, binary("stop"));
        assertEquals(1, binary("1"));
        assertTrue(Double.isNaN(binary("maybe")));
        assertTrue(Double.isNaN(number("on")), "analog series do not accept words");
    }

    private static long pow(int n) {
        long p = 1;
        for (int i = 0; i < n; i++) {
            p *= 10;
        }
        return p;
    }

    private static String pad(long v, int width) {
        String s = Long.toString(v);
        return "0".repeat(width - s.length()) + s;
    }
}
