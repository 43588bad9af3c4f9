package org.tufa.mapper.report;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.tufa.common.InputException;
import org.tufa.mapper.match.Assignment;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;

/**
 * The mapping report: a CSV with exactly one row per input row, in input order. Columns: line, point, status
 * (mapped, ambiguous, unclassified, unmapped, skipped, conflict, duplicate, rejected), reason, rule ("file:line"),
 * class, equipment, part, score (the tag-match score, 1 for a class the rule names), runner_up and
 * runner_up_score (the best rival class of a tag-matched point, when there is one).
 */
public final class MappingReport {

    /** The header row. */
    public static final List<String> HEADER = List.of("line", "point", "status", "reason", "rule", "class",
            "equipment", "part", "score", "runner_up", "runner_up_score");

    private MappingReport() {
    }

    /** Writes the report to a file (UTF-8, RFC 4180 quoting, LF line ends). */
    public static void write(MappingResult result, Path file) {
        try {
            Path parent = file.toAbsolutePath().getParent();
            if (parent != null) {
                Files.createDirectories(parent);
            }
            try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
                write(result, w);
            }
        } catch (IOException e) {
            throw InputException.in(file, "cannot write the report (" + e.getClass().getSimpleName() + ": "
                    + e.getMessage() + "); check the --report path");
        }
    }

    /** A score with three decimals, the same on every machine. */
    static String score(double s) {
        return String.format(java.util.Locale.ROOT, "%.3f", s);
    }

    /** Writes the report to a writer. */
    public static void write(MappingResult result, Writer out) throws IOException {
        CSVFormat format = CSVFormat.RFC4180.builder().setRecordSeparator('\n').get();
        CSVPrinter p = new CSVPrinter(out, format);
        p.printRecord(HEADER);
        for (PointMapping m : result.mappings()) {
            var a = m.assignment();
            p.printRecord(m.point().line(), m.point().name(), m.status().label(), m.reason(),
                    a.map(Assignment::ruleLabel).orElse(""), a.map(Assignment::className).orElse(""),
                    a.map(Assignment::equipmentId).orElse(""),
                    a.flatMap(Assignment::part).map(Assignment.Part::localId).orElse(""),
                    a.map(x -> score(x.score())).orElse(""), a.flatMap(Assignment::runnerUp).orElse(""),
                    a.filter(x -> x.runnerUp().isPresent()).map(x -> score(x.runnerUpScore())).orElse(""));
        }
        p.flush();
    }
}
