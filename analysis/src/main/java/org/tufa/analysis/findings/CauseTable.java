package org.tufa.analysis.findings;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.tufa.common.InputException;

/**
 * The editable table of candidate causes: which evidence in a finding points at which cause. Plain text, one
 * pattern per line, tab- or two-space-separated columns:
 *
 * <pre>
 * # applies_to   evidence          direction  min_shift  candidate cause
 * cooling        coil_residual     down       1.1        low chilled-water flow, fouled coil or warm supply water
 * cooling        direction_check   fails      -          stuck cooling valve or actuator
 * simultaneous_heating_cooling  always  -  -  leaking valve, overlapping setpoints or two loops fighting
 * </pre>
 *
 * <p>{@code applies_to} is a mode (cooling, heating, ventilation) for cluster findings or a finding kind for
 * rule-based findings. It may start with a unit kind and a colon ({@code vav:reheat}): the line is then for units
 * of that kind only; a line without one is for fan coil units, the kind the table first served
 * ({@link #forKind}). {@code evidence} is a feature name (its shift must reach {@code min_shift} in the given
 * direction, up or down), {@code direction_check} (with direction {@code fails}) or {@code always}. The causes are
 * candidates to verify, never a diagnosis.
 */
public record CauseTable(List<Pattern> patterns) implements java.io.Serializable {

    /** Classpath location of the table shipped with tufa. */
    public static final String DEFAULT_RESOURCE = "org/tufa/analysis/findings/candidate-causes.txt";

    /** One line of the table. */
    public record Pattern(String appliesTo, String evidence, String direction, double minShift, String cause,
                          String source) implements java.io.Serializable {
    }

    public CauseTable {
        patterns = List.copyOf(patterns);
    }

    /** The table shipped with tufa. */
    public static CauseTable standard() {
        try (InputStream in = CauseTable.class.getClassLoader().getResourceAsStream(DEFAULT_RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("missing resource " + DEFAULT_RESOURCE);
            }
            return parse(new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8)), DEFAULT_RESOURCE);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** A user's table. */
    public static CauseTable load(Path file) {
        if (!Files.isReadable(file)) {
            throw InputException.in(file, "cannot read the candidate-cause table; check the path");
        }
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return parse(r, file.toString());
        } catch (java.nio.charset.MalformedInputException e) {
            throw InputException.in(file, "not UTF-8 text; save the table as UTF-8");
        } catch (IOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        }
    }

    static CauseTable parse(BufferedReader reader, String name) throws IOException {
        List<Pattern> out = new ArrayList<>();
        String line;
        int number = 0;
        while ((line = reader.readLine()) != null) {
            number++;
            String t = line.strip();
            if (t.isEmpty() || t.startsWith("#")) {
                continue;
            }
            String[] f = t.split("\t+| {2,}", 5);
            String where = name + ":" + number + ": ";
            if (f.length < 5) {
                throw new InputException(where + "expected 5 columns (applies_to, evidence, direction, min_shift, "
                        + "cause) separated by a tab or two spaces, found " + f.length);
            }
            String direction = f[2].toLowerCase(Locale.ROOT);
            if (!Set.of("up", "down", "fails", "-").contains(direction)) {
                throw new InputException(where + "direction must be up, down, fails or -, not '" + f[2] + "'");
            }
            double min;
            if (f[3].equals("-")) {
                min = 0;
            } else {
                try {
                    min = Double.parseDouble(f[3]);
                } catch (NumberFormatException e) {
                    throw new InputException(where + "min_shift must be a number or -, not '" + f[3] + "'");
                }
            }
            out.add(new Pattern(f[0], f[1], direction, min, f[4].strip(), name + ":" + number));
        }
        return new CauseTable(out);
    }

    /** Separates a unit kind from the mode or finding kind in {@code applies_to}. */
    public static final String KIND_SEPARATOR = ":";

    /**
     * The lines for units of one kind, with the kind taken off their {@code applies_to}: those that name the kind,
     * and for fan coil units ({@code fan_coil}) also those that name none. Order kept.
     */
    public CauseTable forKind(String unitKind) {
        List<Pattern> out = new ArrayList<>();
        for (Pattern p : patterns) {
            int colon = p.appliesTo().indexOf(KIND_SEPARATOR);
            String kind = colon < 0 ? FAN_COIL : p.appliesTo().substring(0, colon);
            if (kind.equals(unitKind)) {
                out.add(colon < 0 ? p : new Pattern(p.appliesTo().substring(colon + 1), p.evidence(), p.direction(),
                        p.minShift(), p.cause(), p.source()));
            }
        }
        return new CauseTable(out);
    }

    /** The unit kind of lines that name none. */
    private static final String FAN_COIL = "fan_coil";

    /**
     * Candidate causes for a finding, in table order, without repeats.
     *
     * @param appliesTo the mode of a cluster finding, or the kind of a rule-based finding
     * @param shifts    the cluster's shifts (empty for rule-based findings)
     * @param direction the direction check outcome, or null when it does not apply
     */
    public List<String> causes(String appliesTo, List<Shift> shifts, DirectionCheck.Outcome direction) {
        Set<String> out = new LinkedHashSet<>();
        for (Pattern p : patterns) {
            if (!p.appliesTo().equals(appliesTo)) {
                continue;
            }
            boolean match = switch (p.evidence()) {
                case "always" -> true;
                case "direction_check" -> direction == DirectionCheck.Outcome.FAILS;
                default -> shifts.stream().anyMatch(s -> s.feature().equals(p.evidence())
                        && (p.direction().equals("up") ? s.value() >= p.minShift() : s.value() <= -p.minShift()));
            };
            if (match) {
                out.add(p.cause());
            }
        }
        return List.copyOf(out);
    }
}
