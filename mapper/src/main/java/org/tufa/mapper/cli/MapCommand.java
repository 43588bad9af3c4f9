package org.tufa.mapper.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.LinkedHashMap;
import java.util.Map;
import org.tufa.common.InputException;
import org.tufa.common.OutputFiles;
import org.tufa.mapper.learn.Example;
import org.tufa.mapper.learn.ExampleLearner;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.model.BuiltModel;
import org.tufa.mapper.model.IriMinter;
import org.tufa.mapper.model.ModelBuilder;
import org.tufa.mapper.model.ModelFiles;
import org.tufa.mapper.points.PointList;
import org.tufa.mapper.points.PointListReader;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.points.ReadOptions;
import org.tufa.mapper.report.MappingReport;
import org.tufa.mapper.report.Summary;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tufa map}: point list + rule file -> Brick model (+ mapping report). Thin: the work is in the library. */
@Command(name = "map", mixinStandardHelpOptions = true,
        description = {"Map a building's point list (CSV) to a Brick model with a rule file.",
            "Exit codes: 0 done, 1 bad input, 3 a rule-file expectation failed (outputs are still written).",
            "A run that fails with bad input writes nothing and removes the --out and --report files it would "
                    + "have replaced, so no stale output is mistaken for this run's."})
public final class MapCommand implements Callable<Integer> {

    /** Exit code when an inline expectation fails (same value as org.tufa.cli.ExitCodes.CHECK_FAILED). */
    static final int CHECK_FAILED = 3;

    @Spec
    CommandSpec spec;

    @Option(names = "--points", required = true, paramLabel = "CSV", description = "the BAS point-list export")
    Path points;

    @Option(names = "--rules", required = true, paramLabel = "FILE", description = "the rule file "
            + "(format: mapper/RULES-FORMAT.md)")
    Path rules;

    @Option(names = "--out", required = true, paramLabel = "FILE",
            description = "model to write: .ttl Turtle (default), .nt N-Triples, .jsonld JSON-LD")
    Path out;

    @Option(names = "--report", paramLabel = "CSV", description = "mapping report, one row per input row")
    Path report;

    @Option(names = "--base-iri", paramLabel = "IRI", description = "prefix of every IRI minted (overrides the "
            + "rule file's base-iri; default " + IriMinter.DEFAULT_BASE + ")")
    String baseIri;

    @Option(names = "--vocabulary", paramLabel = "TTL", description = "a Brick vocabulary file (another release) "
            + "instead of the bundled Brick 1.4.4")
    Path vocabulary;

    @Option(names = "--explain", description = "list the points that need a person (unmapped, unclassified, "
            + "ambiguous) grouped by the shape of their own name segment, the most frequent unknown tokens, and "
            + "which points to label next")
    boolean explain;

    @Option(names = "--examples", paramLabel = "CSV", description = "labelled examples (point_name, brick_class "
            + "[, equipment, equipment_class]): propose rule-file lines that reproduce them")
    Path examples;

    @Option(names = "--delimiter", paramLabel = "C", description = "CSV delimiter: , ; tab (default: detect)")
    String delimiter;

    @Option(names = "--name-column", paramLabel = "HEADER", description = "header of the point-name column")
    String nameColumn;

    @Option(names = "--description-column", paramLabel = "HEADER", description = "header of the description "
            + "column")
    String descriptionColumn;

    @Option(names = "--units-column", paramLabel = "HEADER", description = "header of the units column")
    String unitsColumn;

    @Option(names = "--type-column", paramLabel = "HEADER", description = "header of the BACnet object-type column")
    String typeColumn;

    @Option(names = "--device-column", paramLabel = "HEADER", description = "header of the device / controller "
            + "column")
    String deviceColumn;

    @Option(names = "--series-column", paramLabel = "HEADER", description = "header of the trend / series id column")
    String seriesColumn;

    @Override
    public Integer call() {
        Map<String, Path> inputs = new LinkedHashMap<>();
        inputs.put("--points", points);
        inputs.put("--rules", rules);
        inputs.put("--examples", examples);
        inputs.put("--vocabulary", vocabulary);
        Map<String, Path> outputs = new LinkedHashMap<>();
        outputs.put("--out", out);
        outputs.put("--report", report);
        OutputFiles.checkDistinct(inputs, outputs);
        try {
            return run();
        } catch (InputException e) {
            removeStaleOutputs();
            throw e;
        }
    }

    /** After a failed run: the outputs a successful run would have replaced are removed (never an input file). */
    private void removeStaleOutputs() {
        for (Path o : Arrays.asList(out, report)) {
            if (o == null || isInput(o)) {
                continue;
            }
            try {
                Files.deleteIfExists(o);
            } catch (IOException ignored) {
                // best effort: the error being reported matters more
            }
        }
    }

    private boolean isInput(Path o) {
        for (Path in : Arrays.asList(points, rules, examples, vocabulary)) {
            try {
                if (in != null && Files.exists(o) && Files.exists(in)
                        && Files.isSameFile(o, in)) {
                    return true;
                }
            } catch (IOException e) {
                return true;
            }
        }
        return false;
    }

    private Integer run() {
        BrickVocabulary vocab = vocabulary == null ? BrickVocabulary.bundled() : BrickVocabulary.load(vocabulary);
        RuleSet ruleSet = RuleFileParser.parse(rules, vocab);
        ReadOptions options = new ReadOptions(parseDelimiter(delimiter), Optional.ofNullable(nameColumn),
                Optional.ofNullable(descriptionColumn), Optional.ofNullable(unitsColumn),
                Optional.ofNullable(typeColumn), Optional.ofNullable(deviceColumn), Optional.ofNullable(seriesColumn));
        PointList list = PointListReader.read(points, options);
        List<Example> labelled = List.of();
        if (examples != null) {
            Map<String, PointRecord> byName = new HashMap<>();
            list.points().forEach(p -> byName.putIfAbsent(p.name(), p));
            labelled = Example.read(examples, vocab, byName);
        }
        MappingResult result = Mapper.fit(ruleSet, vocab).map(list);
        String base = baseIri != null ? baseIri : ruleSet.baseIri().orElse(IriMinter.DEFAULT_BASE);
        if (!base.matches("[A-Za-z][A-Za-z0-9+.\\-]*:[^\\s<>\"{}|\\\\^`]+")) {
            throw new InputException("--base-iri '" + base + "' is not an absolute IRI; write e.g. "
                    + "https://example.org/my-building/");
        }
        BuiltModel model = ModelBuilder.build(result, base);
        ModelFiles.write(model.model(), out);
        if (report != null) {
            MappingReport.write(result, report);
        }
        PrintWriter w = spec.commandLine().getOut();
        Summary.lines(result, model.warnings()).forEach(w::println);
        if (explain) {
            Summary.explain(result, vocab).forEach(w::println);
        }
        if (examples != null) {
            String text = readText(rules);
            Summary.learned(ExampleLearner.fit(rules, text, vocab, labelled)).forEach(w::println);
        }
        w.println("model: " + out + (report != null ? ", report: " + report : ""));
        w.flush();
        return result.failedExpectations() > 0 ? CHECK_FAILED : 0;
    }

    private static String readText(Path file) {
        try {
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw InputException.in(file, "rule file cannot be read (" + e.getClass().getSimpleName() + ")");
        }
    }

    static Optional<Character> parseDelimiter(String d) {
        if (d == null) {
            return Optional.empty();
        }
        switch (d.toLowerCase(java.util.Locale.ROOT)) {
            case "tab", "\\t", "\t" -> {
                return Optional.of('\t');
            }
            case "comma" -> {
                return Optional.of(',');
            }
            case "semicolon" -> {
                return Optional.of(';');
            }
            default -> {
                if (d.length() == 1 && d.charAt(0) != '"' && d.charAt(0) != '\n' && d.charAt(0) != '\r') {
                    return Optional.of(d.charAt(0));
                }
                throw new InputException("--delimiter '" + d + "' is not one character; write , ; tab or |");
            }
        }
    }
}
