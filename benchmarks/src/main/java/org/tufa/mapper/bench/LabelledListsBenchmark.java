package org.tufa.mapper.bench;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.tufa.mapper.learn.LabelledLists;
import org.tufa.mapper.match.MappingResult;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * Maps the labelled point lists of shared/brick-examples ({@code soda}, {@code rice}, {@code gtc}) with our rule
 * files and prints one table row per list (scoring rules in {@link LabelledLists}). Run from the repository root:
 * <pre>
 * java -cp benchmarks/target/tufa-benchmarks.jar org.tufa.mapper.bench.LabelledListsBenchmark \
 *     [--lists ../shared/brick-examples] [--rules mapper/src/test/resources/labelled] [--misses] \
 *     [--report NAME=mapping.csv ...]
 * </pre>
 * {@code --report NAME=FILE} scores a mapping report written by any tufa version instead of mapping (columns
 * point, status, class), so older versions can be measured the same way. {@code --misses} lists every point not
 * given exactly its class.
 */
public final class LabelledListsBenchmark {

    /** The lists, in table order. */
    public static final List<String> LISTS = List.of("soda", "rice", "gtc");

    private LabelledListsBenchmark() {
    }

    /** One table row. */
    public record Row(String list, int ruleLines, LabelledLists.Score score) {
    }

    public static void main(String[] args) throws IOException {
        Path lists = null;
        Path rules = Path.of("mapper/src/test/resources/labelled");
        boolean misses = false;
        Map<String, Path> reports = new TreeMap<>();
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--lists" -> lists = Path.of(args[++i]);
                case "--rules" -> rules = Path.of(args[++i]);
                case "--misses" -> misses = true;
                case "--report" -> {
                    String[] kv = args[++i].split("=", 2);
                    reports.put(kv[0], Path.of(kv[1]));
                }
                default -> {
                    System.err.println("unknown argument " + args[i]);
                    System.exit(2);
                }
            }
        }
        if (lists == null) {
            lists = LabelledLists.findLists().orElse(null);
        }
        if (lists == null || !Files.isDirectory(lists)) {
            System.err.println("shared/brick-examples not found; give --lists DIR");
            System.exit(1);
        }
        BrickVocabulary vocabulary = BrickVocabulary.bundled();
        List<Row> rows = new ArrayList<>();
        for (String name : LISTS) {
            Path csv = lists.resolve(name + "-points-labelled.csv");
            List<LabelledLists.Labelled> labelled = LabelledLists.read(csv, vocabulary);
            Map<String, LabelledLists.Answer> answers;
            int lines;
            if (reports.containsKey(name)) {
                answers = readReport(reports.get(name));
                lines = -1;
            } else {
                Path ruleFile = rules.resolve(name + ".tufa");
                long t0 = System.nanoTime();
                MappingResult result = LabelledLists.map(ruleFile, labelled, vocabulary);
                System.out.printf(Locale.ROOT, "%s: %d points mapped in %.0f ms (parse, match)%n", name,
                        labelled.size(), (System.nanoTime() - t0) / 1e6);
                answers = LabelledLists.answers(result);
                lines = LabelledLists.statementLines(ruleFile);
            }
            rows.add(new Row(name, lines, LabelledLists.score(labelled, answers, vocabulary)));
        }
        table(rows).forEach(System.out::println);
        if (misses) {
            for (Row r : rows) {
                r.score().wrong().forEach(w -> System.out.println(r.list() + ": " + w));
            }
        }
    }



    /** The markdown table of the rows. */
    public static List<String> table(List<Row> rows) {
        List<String> out = new ArrayList<>();
        out.add("| list | terminal-unit points (scored) | rule-file lines | exact | parent/child | ambiguous "
                + "| unclassified | wrong but mapped |");
        out.add("|---|---|---|---|---|---|---|---|");
        for (Row r : rows) {
            LabelledLists.Score s = r.score();
            out.add(String.format(Locale.ROOT, "| %s | %d (%d) | %s | %.1f %% | %.1f %% | %d | %d | %d |", r.list(),
                    s.terminalPoints(), s.scorable(), r.ruleLines() < 0 ? "-" : Integer.toString(r.ruleLines()),
                    100 * s.exactShare(), 100 * s.parentOrChildShare(), s.ambiguous(), s.unclassified(),
                    s.wrongButMapped()));
        }
        return out;
    }

    /** A mapping report's answers (point, status, class columns; any tufa version). */
    static Map<String, LabelledLists.Answer> readReport(Path report) throws IOException {
        Map<String, LabelledLists.Answer> out = new LinkedHashMap<>();
        try (Reader r = Files.newBufferedReader(report, StandardCharsets.UTF_8)) {
            for (CSVRecord rec : CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(r)) {
                String status = rec.get("status");
                String cls = rec.get("class");
                out.putIfAbsent(rec.get("point"), new LabelledLists.Answer(status, cls));
            }
        }
        return out;
    }

}
