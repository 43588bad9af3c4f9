package org.tufa.mapper.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.tufa.common.OutputFiles;
import org.tufa.mapper.match.Assignment;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;

/**
 * The mapping report: a CSV with exactly one row per input row, in input order. Columns: line, point, status
 * (mapped, unmapped, conflict, duplicate, rejected), reason, rule ("file:line"), class, equipment, part.
 */
public final class MappingReport {

    /** The header row. */
    public static final List<String> HEADER = List.of("line", "point", "status", "reason", "rule", "class",
            "equipment", "part");

    private MappingReport() {
    }

    /** Writes the report to a file (UTF-8, RFC 4180 quoting, LF line ends). */
    public static void write(MappingResult result, Path file) {
        OutputFiles.writeText(file, w -> write(result, w));
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
                    a.flatMap(Assignment::part).map(Assignment.Part::localId).orElse(""));
        }
        p.flush();
    }
}
