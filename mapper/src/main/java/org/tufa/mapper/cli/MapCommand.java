package org.tufa.mapper.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.tufa.common.InputException;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.model.BuiltModel;
import org.tufa.mapper.model.IriMinter;
import org.tufa.mapper.model.ModelBuilder;
import org.tufa.mapper.model.ModelFiles;
import org.tufa.mapper.points.PointList;
import org.tufa.mapper.points.PointListReader;
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
            "Exit codes: 0 done, 1 bad input, 3 a rule-file expectation failed (outputs are still written)."})
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

    @Option(names = "--explain", description = "group unmapped points by name shape, most frequent first")
    boolean explain;

    @Option(names = "--delimiter", paramLabel = "C", description = "CSV delimiter: , ; tab (default: detect)")
    String delimiter;

    @Option(names = "--name-column", paramLabel = "HEADER", description = "header of the point-name column")
    String nameColumn;

    @Option(names = "--description-column", paramLabel = "HEADER")
    String descriptionColumn;

    @Option(names = "--units-column", paramLabel = "HEADER")
    String unitsColumn;

    @Option(names = "--type-column", paramLabel = "HEADER", description = "header of the BACnet object-type column")
    String typeColumn;

    @Option(names = "--device-column", paramLabel = "HEADER")
    String deviceColumn;

    @Option(names = "--series-column", paramLabel = "HEADER", description = "header of the trend / series id column")
    String seriesColumn;

    @Override
    public Integer call() {
        BrickVocabulary vocab = vocabulary == null ? BrickVocabulary.bundled() : BrickVocabulary.load(vocabulary);
        RuleSet ruleSet = RuleFileParser.parse(rules, vocab);
        ReadOptions options = new ReadOptions(parseDelimiter(delimiter), Optional.ofNullable(nameColumn),
                Optional.ofNullable(descriptionColumn), Optional.ofNullable(unitsColumn),
                Optional.ofNullable(typeColumn), Optional.ofNullable(deviceColumn), Optional.ofNullable(seriesColumn));
        PointList list = PointListReader.read(points, options);
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
            Summary.explain(result).forEach(w::println);
        }
        w.println("model: " + out + (report != null ? ", report: " + report : ""));
        w.flush();
        return result.failedExpectations() > 0 ? CHECK_FAILED : 0;
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
