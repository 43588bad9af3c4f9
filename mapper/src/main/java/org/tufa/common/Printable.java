package org.tufa.common;

/**
 * Text from a user's file made safe to echo in a one-line message: control characters, invalid bytes (decoded as
 * U+FFFD) and line breaks become {@code ?}, and long text is cut, so a binary file never prints its raw bytes
 * into the terminal.
 */
public final class Printable {

    /** Longest excerpt of user text quoted in a message. */
    public static final int MAX_EXCERPT = 60;

    private Printable() {
    }

    /** At most {@link #MAX_EXCERPT} characters of {@code text}, made printable. */
    public static String excerpt(String text) {
        String s = line(text);
        return s.length() <= MAX_EXCERPT ? s : s.substring(0, MAX_EXCERPT - 3) + "...";
    }

    /** The whole text on one line, every control or undecodable character replaced by {@code ?}. */
    public static String line(String text) {
        if (text == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(text.length());
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            b.append(c < 0x20 || c == 0x7f || (c >= 0x80 && c < 0xa0) || c == '\uFFFD' ? '?' : c);
        }
        return b.toString();
    }

    /**
     * Whether the first bytes look like a binary file rather than text: a NUL byte, or more than a tenth of
     * control characters other than tab, CR and LF. Common practice (the heuristic of file(1) and git), no source.
     */
    public static boolean looksBinary(byte[] bytes, int from, int to) {
        int control = 0;
        int n = 0;
        for (int i = from; i < to && n < 4096; i++, n++) {
            int c = bytes[i] & 0xff;
            if (c == 0) {
                return true;
            }
            if (c < 0x20 && c != '\t' && c != '\n' && c != '\r' && c != 0x0c) {
                control++;
            }
        }
        return n > 0 && control * 10 > n;
    }

    /**
     * The byte order of UTF-16 text without a byte-order mark, from where the NUL bytes of ASCII characters fall:
     * "UTF-16LE" when mostly at odd positions, "UTF-16BE" when mostly at even ones, null otherwise.
     */
    public static String utf16WithoutBom(byte[] bytes, int from, int to) {
        int even = 0;
        int odd = 0;
        int n = Math.min(to, from + 4096);
        for (int i = from; i < n; i++) {
            if (bytes[i] == 0) {
                if (((i - from) & 1) == 0) {
                    even++;
                } else {
                    odd++;
                }
            }
        }
        int pairs = (n - from) / 2;
        if (pairs >= 2 && odd * 10 >= pairs * 6 && even * 10 < pairs) {
            return "UTF-16LE";
        }
        if (pairs >= 2 && even * 10 >= pairs * 6 && odd * 10 < pairs) {
            return "UTF-16BE";
        }
        return null;
    }
}
