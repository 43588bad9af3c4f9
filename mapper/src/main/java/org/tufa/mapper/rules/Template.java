package org.tufa.mapper.rules;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.function.Function;

/**
 * An id template such as {@code FCU-{floor}-{unit}}: literal text with {@code {group}} slots filled from the
 * rule's named regex groups or the point's fields. A slot may carry one filter: {@code {floor|int}} drops leading
 * zeros ("03" -> "3"), {@code |upper}, {@code |lower}. Write {@code {{} and {@code {}}} for literal braces.
 */
public record Template(String source, List<Part> parts) {

    /** A literal piece or a slot. */
    public record Part(String literal, String slot, String filter) {
        boolean isSlot() {
            return slot != null;
        }
    }

    /** Filters a slot may carry. */
    public static final Set<String> FILTERS = Set.of("int", "upper", "lower");

    public Template {
        parts = List.copyOf(parts);
    }

    /** Parses; throws IllegalArgumentException with a short reason on a malformed template. */
    public static Template parse(String s) {
        List<Part> parts = new ArrayList<>();
        StringBuilder lit = new StringBuilder();
        int i = 0;
        while (i < s.length()) {
            char c = s.charAt(i);
            if (c == '{' && s.startsWith("{{}", i)) {
                lit.append('{');
                i += 3;
            } else if (c == '{' && s.startsWith("{}}", i)) {
                lit.append('}');
                i += 3;
            } else if (c == '{') {
                int end = s.indexOf('}', i);
                if (end < 0) {
                    throw new IllegalArgumentException("'{' without a closing '}' in template '" + s + "'");
                }
                String inner = s.substring(i + 1, end).trim();
                String filter = "";
                int bar = inner.indexOf('|');
                if (bar >= 0) {
                    filter = inner.substring(bar + 1).trim();
                    inner = inner.substring(0, bar).trim();
                    if (!FILTERS.contains(filter)) {
                        throw new IllegalArgumentException("unknown filter '|" + filter + "' in template '" + s
                                + "'; filters: int, upper, lower");
                    }
                }
                if (!inner.matches("[A-Za-z][A-Za-z0-9]*")) {
                    throw new IllegalArgumentException("'{" + inner + "}' in template '" + s
                            + "' is not a group name (letters and digits, starting with a letter)");
                }
                if (lit.length() > 0) {
                    parts.add(new Part(lit.toString(), null, null));
                    lit.setLength(0);
                }
                parts.add(new Part(null, inner, filter));
                i = end + 1;
            } else if (c == '}') {
                throw new IllegalArgumentException("'}' without an opening '{' in template '" + s + "'");
            } else {
                lit.append(c);
                i++;
            }
        }
        if (lit.length() > 0) {
            parts.add(new Part(lit.toString(), null, null));
        }
        return new Template(s, parts);
    }

    /** Slot names used, sorted. */
    public Set<String> slots() {
        Set<String> out = new TreeSet<>();
        for (Part p : parts) {
            if (p.isSlot()) {
                out.add(p.slot());
            }
        }
        return out;
    }

    /** Fills the slots; a slot whose value is null (group did not take part in the match) renders empty. */
    public String render(Function<String, String> values) {
        StringBuilder b = new StringBuilder();
        for (Part p : parts) {
            if (!p.isSlot()) {
                b.append(p.literal());
                continue;
            }
            String v = values.apply(p.slot());
            if (v == null) {
                continue;
            }
            switch (p.filter()) {
                case "int" -> {
                    String t = v.replaceFirst("^0+(?=.)", "");
                    b.append(t);
                }
                case "upper" -> b.append(v.toUpperCase(Locale.ROOT));
                case "lower" -> b.append(v.toLowerCase(Locale.ROOT));
                default -> b.append(v);
            }
        }
        return b.toString();
    }
}
