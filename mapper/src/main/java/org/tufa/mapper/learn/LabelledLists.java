package org.tufa.mapper.learn;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;
import org.tufa.mapper.match.Status;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * Scores a mapping against a labelled point list (columns {@code point_name,brick_class,equipment,
 * equipment_class}, as in shared/brick-examples: the classes a building's modellers gave its points).
 *
 * <p>Rules of the score (shared/brick-examples/README.md): a point is a terminal-unit point when its labelled
 * equipment class is a brick:Terminal_Unit (VAV, an alias of Variable_Air_Volume_Box, included). A label may list
 * several classes joined by '|' (any is right); a label with ':' is not a Brick 1.4.4 class and cannot be scored
 * (counted apart); a deprecated label counts through its replacement. Exact: the mapped class is a label class, an
 * owl:equivalentClass partner, or the label's current replacement. Parent/child: the mapped class is a superclass
 * or subclass of a label class (exact included). Wrong-but-mapped: status mapped and not exact.
 */
public final class LabelledLists {

    /** One labelled row. */
    public record Labelled(long line, String name, List<String> classes, boolean scorable, String equipment,
            String equipmentClass, boolean terminalUnit) {
    }

    /**
     * The score of one list.
     *
     * @param terminalPoints terminal-unit points in the list
     * @param scorable of those, the ones whose label names a Brick 1.4.4 class
     * @param exact scorable points given exactly their class
     * @param parentOrChild scorable points given their class, a superclass or a subclass of it
     * @param ambiguous scorable points left ambiguous
     * @param unclassified scorable points left unclassified, unmapped or skipped
     * @param wrongButMapped scorable points mapped to a class that is not exact
     * @param wrong the names of the scorable points not given exactly their class, with what they got
     */
    public record Score(int terminalPoints, int scorable, int exact, int parentOrChild, int ambiguous,
            int unclassified, int wrongButMapped, List<String> wrong) {
        public double exactShare() {
            return scorable == 0 ? 0 : (double) exact / scorable;
        }

        public double parentOrChildShare() {
            return scorable == 0 ? 0 : (double) parentOrChild / scorable;
        }
    }

    /** What a mapping said about one point: status and class ("" when none). */
    public record Answer(String status, String className) {
    }

    private LabelledLists() {
    }

    /** Reads a labelled list. */
    public static List<Labelled> read(Path csv, BrickVocabulary vocabulary) throws IOException {
        List<Labelled> out = new ArrayList<>();
        try (Reader r = Files.newBufferedReader(csv, StandardCharsets.UTF_8)) {
            for (CSVRecord rec : CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(r)) {
                String label = rec.get("brick_class");
                List<String> classes = new ArrayList<>();
                boolean scorable = true;
                for (String c : label.split("\\|")) {
                    if (c.contains(":") || !vocabulary.isClass(c)) {
                        scorable = false;
                    } else {
                        classes.add(c);
                    }
                }
                scorable &= !classes.isEmpty();
                String eqClass = rec.get("equipment_class");
                boolean terminal = !eqClass.isEmpty() && !eqClass.contains(":")
                        && vocabulary.isA(eqClass, "Terminal_Unit");
                out.add(new Labelled(rec.getRecordNumber() + 1, rec.get("point_name"), List.copyOf(classes), scorable,
                        rec.get("equipment"), eqClass, terminal));
            }
        }
        return out;
    }

    /** The point list a labelled list stands for: its names only (no descriptions, units or object types). */
    public static List<PointRecord> points(List<Labelled> labelled) {
        List<PointRecord> out = new ArrayList<>(labelled.size());
        for (Labelled l : labelled) {
            out.add(new PointRecord(l.line(), l.name(), "", "", "", "", "", "", new TreeMap<>()));
        }
        return out;
    }

    /** Answers by point name from a mapping. */
    public static Map<String, Answer> answers(MappingResult result) {
        Map<String, Answer> out = new TreeMap<>();
        for (PointMapping m : result.mappings()) {
            Status s = m.outcome();
            String cls = m.assignment().map(a -> a.className()).orElse("");
            out.putIfAbsent(m.point().name(), new Answer(s.label(), s == Status.UNCLASSIFIED ? "" : cls));
        }
        return out;
    }

    /** Maps a labelled list's names with a rule file. */
    public static MappingResult map(Path ruleFile, List<Labelled> labelled, BrickVocabulary vocabulary) {
        RuleSet rs = RuleFileParser.parse(ruleFile, vocabulary);
        return Mapper.fit(rs, vocabulary).map(points(labelled));
    }

    /** Lines of a rule file that say something: not blank, not a comment. */
    public static int statementLines(Path ruleFile) throws IOException {
        return (int) Files.readAllLines(ruleFile, StandardCharsets.UTF_8).stream().map(String::strip)
                .filter(l -> !l.isEmpty() && !l.startsWith("#")).count();
    }

    /** shared/brick-examples above the working directory, where the published lists are. */
    public static Optional<Path> findLists() {
        for (Path p = Path.of("").toAbsolutePath(); p != null; p = p.getParent()) {
            Path f = p.resolve("shared/brick-examples");
            if (Files.isDirectory(f)) {
                return Optional.of(f);
            }
        }
        return Optional.empty();
    }

    /** Scores the answers on the list's terminal-unit points. */
    public static Score score(List<Labelled> labelled, Map<String, Answer> answers, BrickVocabulary vocabulary) {
        int terminal = 0;
        int scorable = 0;
        int exact = 0;
        int near = 0;
        int ambiguous = 0;
        int unclassified = 0;
        int wrongMapped = 0;
        List<String> wrong = new ArrayList<>();
        for (Labelled l : labelled) {
            if (!l.terminalUnit()) {
                continue;
            }
            terminal++;
            if (!l.scorable()) {
                continue;
            }
            scorable++;
            Answer a = answers.getOrDefault(l.name(), new Answer("unmapped", ""));
            String got = a.className();
            boolean isExact = !got.isEmpty() && l.classes().stream().anyMatch(c -> exact(vocabulary, got, c));
            boolean isNear = isExact || !got.isEmpty() && l.classes().stream().anyMatch(c -> related(vocabulary,
                    got, c));
            if (isExact && a.status().equals("mapped")) {
                exact++;
            }
            if (isNear && a.status().equals("mapped")) {
                near++;
            }
            switch (a.status()) {
                case "mapped" -> {
                    if (!isExact) {
                        wrongMapped++;
                    }
                }
                case "ambiguous", "conflict" -> ambiguous++;
                default -> unclassified++;
            }
            if (!(isExact && a.status().equals("mapped"))) {
                wrong.add(l.name() + " (" + String.join("|", l.classes()) + ") -> " + a.status()
                        + (got.isEmpty() ? "" : " " + got));
            }
        }
        return new Score(terminal, scorable, exact, near, ambiguous, unclassified, wrongMapped, List.copyOf(wrong));
    }

    /** The label's class, an equivalent, or the current replacement of a deprecated label. */
    static boolean exact(BrickVocabulary v, String got, String label) {
        if (v.sameClass(got, label)) {
            return true;
        }
        Optional<String> current = v.current(label);
        return current.isPresent() && v.sameClass(got, current.get());
    }

    private static boolean related(BrickVocabulary v, String got, String label) {
        String l = v.current(label).orElse(label);
        return v.isA(got, l) || v.isA(l, got) || v.isA(got, label) || v.isA(label, got);
    }
}
