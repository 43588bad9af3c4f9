package org.tufa.readers;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;

/**
 * Inputs for the readers: a valid seed with a few random edits (the way mutation fuzzers such as AFL work:
 * flip, insert, delete, duplicate, truncate; Zalewski, "american fuzzy lop" technical notes, 2014), or plain
 * random bytes, or random text built from the characters CSV and rule-file syntax care about.
 */
final class Mutations {

    /** Bytes that matter to the readers' syntax, inserted more often than others. */
    private static final byte[] INTERESTING = (",;\t\"\n\r =+-.:#{}()[]\\|^$*?eE0123456789TZ%'@")
            .getBytes(StandardCharsets.US_ASCII);
    private static final byte[][] TOKENS = {
        "\uFEFF".getBytes(StandardCharsets.UTF_8), "NaN".getBytes(StandardCharsets.US_ASCII),
        "1e400".getBytes(StandardCharsets.US_ASCII), "-0".getBytes(StandardCharsets.US_ASCII),
        "2031-03-09 02:30".getBytes(StandardCharsets.US_ASCII), "2031-11-02 01:30".getBytes(StandardCharsets.US_ASCII),
        "1938000000".getBytes(StandardCharsets.US_ASCII), "\"\"".getBytes(StandardCharsets.US_ASCII),
        "rule x\n".getBytes(StandardCharsets.US_ASCII), "  match name (".getBytes(StandardCharsets.US_ASCII),
        "{".getBytes(StandardCharsets.US_ASCII), "\u00e9".getBytes(StandardCharsets.UTF_8),
        {(byte) 0xff, (byte) 0xfe}, {0}, {(byte) 0xc3}, "\u2028".getBytes(StandardCharsets.UTF_8),
        "timestamp".getBytes(StandardCharsets.US_ASCII), "unit BANANAS\n".getBytes(StandardCharsets.US_ASCII),
    };

    private Mutations() {
    }

    static Arbitrary<byte[]> pointLists() {
        return of(Readers.POINT_LIST);
    }

    static Arbitrary<byte[]> ruleFiles() {
        return of(Readers.RULE_FILE);
    }

    static Arbitrary<byte[]> trendFiles() {
        return of(Readers.TRENDS_LONG, Readers.TRENDS_WIDE);
    }

    static Arbitrary<byte[]> truthFiles() {
        return of(Readers.TRUTH);
    }

    /** Mostly mutated seeds, some random bytes and random syntax-heavy text. */
    static Arbitrary<byte[]> of(byte[]... seeds) {
        Arbitrary<byte[]> mutated = Arbitraries.randomValue(r -> mutate(r, seeds[r.nextInt(seeds.length)]));
        Arbitrary<byte[]> random = Arbitraries.bytes().array(byte[].class).ofMaxSize(300);
        Arbitrary<byte[]> syntax = Arbitraries.randomValue(r -> {
            byte[] b = new byte[r.nextInt(400)];
            for (int i = 0; i < b.length; i++) {
                b[i] = r.nextInt(4) == 0 ? (byte) (32 + r.nextInt(95)) : INTERESTING[r.nextInt(INTERESTING.length)];
            }
            return b;
        });
        return Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(8, mutated), net.jqwik.api.Tuple.of(1, random), net.jqwik.api.Tuple.of(1, syntax));
    }

    /** One to eight random edits of the seed. */
    static byte[] mutate(Random r, byte[] seed) {
        byte[] b = seed.clone();
        int edits = 1 + r.nextInt(8);
        for (int k = 0; k < edits; k++) {
            b = edit(r, b);
        }
        return b;
    }

    private static byte[] edit(Random r, byte[] b) {
        int n = b.length;
        int at = n == 0 ? 0 : r.nextInt(n + 1);
        ByteArrayOutputStream out = new ByteArrayOutputStream(n + 16);
        switch (r.nextInt(7)) {
            case 0 -> { // flip one bit
                if (n == 0) {
                    return b;
                }
                byte[] c = b.clone();
                c[Math.min(at, n - 1)] ^= (byte) (1 << r.nextInt(8));
                return c;
            }
            case 1 -> { // insert a syntax byte
                out.write(b, 0, at);
                out.write(INTERESTING[r.nextInt(INTERESTING.length)]);
                out.write(b, at, n - at);
            }
            case 2 -> { // insert a token
                byte[] t = TOKENS[r.nextInt(TOKENS.length)];
                out.write(b, 0, at);
                out.write(t, 0, t.length);
                out.write(b, at, n - at);
            }
            case 3 -> { // delete a range
                int len = Math.min(n - at, 1 + r.nextInt(12));
                out.write(b, 0, at);
                out.write(b, at + len, n - at - len);
            }
            case 4 -> { // duplicate a range (a line, a field)
                int len = Math.min(n - at, 1 + r.nextInt(60));
                out.write(b, 0, at + len);
                out.write(b, at, n - at);
            }
            case 5 -> { // truncate
                return java.util.Arrays.copyOf(b, at);
            }
            default -> { // overwrite with a random byte
                if (n == 0) {
                    return b;
                }
                byte[] c = b.clone();
                c[Math.min(at, n - 1)] = (byte) r.nextInt(256);
                return c;
            }
        }
        return out.toByteArray();
    }
}
