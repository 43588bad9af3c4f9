package org.tufa.mapper.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.tufa.common.CsvCells;
import org.tufa.common.OutputFiles;
import org.tufa.mapper.match.Assignment;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;

/**
 * The mapping report: a CSV with exactly one row per input row, in input order. Columns: line, point, status
 * (mapped, ambiguous, unclassified, unmapped, skipped, conflict, duplicate, rejected), reason, rule ("file:line"),
 * class, equipment, part, score (the tag-match score, 1 for a class the rule names), runner_up and
 * runner_up_score (the best rival class of a tag-matched point, when there is one).
 * Text cells that a spreadsheet would run as a formula get a leading apostrophe ({@link CsvCells}).
 */
public final class MappingReport {

    /** The header row. */
    public static final List<String> HEADER = List.of("line", "point", "status", "reason", "rule", "class",
            "equipment", "part", "score", "runner_up", "runner_up_score");

    private MappingReport() {
    }

    /** Writes the report to a file (UTF-8, RFC 4180 quoting, LF line ends). */
    public static void write(MappingResult result, Path file) {
        OutputFiles.writeText(file, w -> write(result, w));
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
            // Point names, reasons and ids come from the export: neutralised against formula injection.
            p.printRecord(m.point().line(), CsvCells.neutral(m.point().name()), m.status().label(),
                    CsvCells.neutral(m.reason()), CsvCells.neutral(a.map(Assignment::ruleLabel).orElse("")),
                    a.map(Assignment::className).orElse(""),
                    CsvCells.neutral(a.map(Assignment::equipmentId).orElse("")),
                    CsvCells.neutral(a.flatMap(Assignment::part).map(Assignment.Part::localId).orElse("")),
                    a.map(x -> score(x.score())).orElse(""), a.flatMap(Assignment::runnerUp).orElse(""),
                    a.filter(x -> x.runnerUp().isPresent()).map(x -> score(x.runnerUpScore())).orElse(""));
        }
        p.flush();
    }
}
