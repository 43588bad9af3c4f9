package org.tufa.mapper.learn;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.tufa.common.InputException;
import org.tufa.mapper.points.PointRecord;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * One labelled example: a point and the Brick class (and equipment) a person says it has.
 *
 * @param point the point (from the point list when the name is in it, else the name alone)
 * @param className the Brick class, checked against the vocabulary (a deprecated class stands for its replacement)
 * @param equipment the equipment id, or ""
 * @param equipmentClass the equipment's Brick class, or ""
 * @param line the example's line in its file
 */
public record Example(PointRecord point, String className, String equipment, String equipmentClass, long line) {

    /**
     * Reads an examples CSV: a header with a name column ({@code point_name}, {@code point} or {@code name}), a
     * class column ({@code brick_class} or {@code class}) and optionally {@code equipment} and
     * {@code equipment_class}. A class cell may list several classes joined by '|': the first that Brick defines is
     * taken. Rows whose class is not a Brick class are an error naming the line.
     */
    public static List<Example> read(Path csv, BrickVocabulary vocabulary, Map<String, PointRecord> byName) {
        if (!Files.isRegularFile(csv)) {
            throw InputException.in(csv, "examples file not found; check the path given with --examples");
        }
        List<Example> out = new ArrayList<>();
        try (Reader r = Files.newBufferedReader(csv, StandardCharsets.UTF_8)) {
            var parser = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true)
                    .setIgnoreHeaderCase(true).setTrim(true).get().parse(r);
            List<String> header = parser.getHeaderNames().stream().map(h -> h.toLowerCase(Locale.ROOT)).toList();
            String nameCol = first(header, "point_name", "point", "name");
            String classCol = first(header, "brick_class", "class");
            if (nameCol == null || classCol == null) {
                throw InputException.in(csv, "examples need a header with point_name (or point, name) and "
                        + "brick_class (or class) columns; found " + header);
            }
            boolean hasEq = header.contains("equipment");
            boolean hasEqClass = header.contains("equipment_class");
            for (CSVRecord rec : parser) {
                long line = rec.getRecordNumber() + 1;
                String name = rec.get(nameCol);
                if (name.isEmpty()) {
                    continue;
                }
                String cls = null;
                for (String c : rec.get(classCol).split("\\|")) {
                    String n = BrickVocabulary.className(c.strip());
                    if (vocabulary.isClass(n)) {
                        cls = vocabulary.current(n).orElse(n);
                        break;
                    }
                }
                if (cls == null) {
                    throw InputException.at(csv, line, "'" + rec.get(classCol) + "' is not a Brick class in "
                            + vocabulary.source() + "; write a Brick class name (or delete the row)");
                }
                String eqClass = hasEqClass ? BrickVocabulary.className(rec.get("equipment_class")) : "";
                if (!eqClass.isEmpty() && !vocabulary.isClass(eqClass)) {
                    eqClass = "";
                }
                PointRecord p = byName.getOrDefault(name, PointRecord.named(name));
                out.add(new Example(p, cls, hasEq ? rec.get("equipment") : "", eqClass, line));
            }
        } catch (IOException | java.io.UncheckedIOException | IllegalArgumentException e) {
            throw InputException.in(csv, "cannot read the examples (" + e.getClass().getSimpleName() + "); save "
                    + "them as UTF-8 CSV with a header row");
        }
        return out;
    }

    private static String first(List<String> header, String... names) {
        for (String n : names) {
            if (header.contains(n)) {
                return n;
            }
        }
        return null;
    }
}
