package org.tufa.analysis.review;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.util.HexFormat;

/**
 * The id of a finding: the first 12 hexadecimal digits (48 bits) of the SHA-256 (FIPS 180-4) of its unit IRI, mode,
 * kind and start instant (UTC, {@link Instant#toString}), joined by the unit separator U+001F. It depends on nothing
 * else, so a re-run on the same data, or on data extended at either end, gives a finding that starts at the same time
 * the same id, and a verdict follows its finding. 48 bits keep the chance that two of a million findings share an id
 * below 2 in a million (the birthday bound n^2 / 2^49). The format is fixed: review files carry these ids.
 */
public final class FindingIds {

    /** Hex digits of an id. */
    public static final int LENGTH = 12;

    private FindingIds() {
    }

    public static String of(String unit, String mode, String kind, Instant start) {
        String key = unit + '\u001f' + mode + '\u001f' + kind + '\u001f' + start;
        try {
            byte[] d = MessageDigest.getInstance("SHA-256").digest(key.getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(d).substring(0, LENGTH);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java runtime", e);
        }
    }

    /** The id of a unit's finding. */
    public static String of(String unit, org.tufa.analysis.findings.Finding f) {
        return of(unit, f.mode(), f.kind(), f.start());
    }

    /** Whether the text has the form of an id (12 lowercase hexadecimal digits). */
    public static boolean wellFormed(String text) {
        return text.length() == LENGTH && text.chars().allMatch(c -> c >= '0' && c <= '9' || c >= 'a' && c <= 'f');
    }
}
