package org.tufa.mapper.rules;

import java.util.ArrayList;
import java.util.List;

/**
 * Splits a line into words at white space; a word in double quotes may hold spaces, and inside quotes {@code \"}
 * is a quote and {@code \\} a backslash.
 */
final class QuotedWords {
    private QuotedWords() {
    }

    static List<String> split(String s) {
        List<String> out = new ArrayList<>();
        int i = 0;
        while (i < s.length()) {
            char c = s.charAt(i);
            if (Character.isWhitespace(c)) {
                i++;
                continue;
            }
            StringBuilder b = new StringBuilder();
            if (c == '"') {
                i++;
                boolean closed = false;
                while (i < s.length()) {
                    char d = s.charAt(i);
                    if (d == '\\' && i + 1 < s.length()) {
                        b.append(s.charAt(i + 1));
                        i += 2;
                    } else if (d == '"') {
                        closed = true;
                        i++;
                        break;
                    } else {
                        b.append(d);
                        i++;
                    }
                }
                if (!closed) {
                    throw new IllegalArgumentException("a double quote is not closed; close it or escape it as \\\"");
                }
            } else {
                while (i < s.length() && !Character.isWhitespace(s.charAt(i))) {
                    b.append(s.charAt(i));
                    i++;
                }
            }
            out.add(b.toString());
        }
        return out;
    }
}
