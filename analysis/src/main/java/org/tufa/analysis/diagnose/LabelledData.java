package org.tufa.analysis.diagnose;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.tufa.analysis.labels.DataCard;
import org.tufa.analysis.tables.SampleTableReader;
import org.tufa.common.InputException;

/**
 * A folder {@code tufa labels} wrote, read back: its index ({@code labels.json}: the tables, their features, the
 * verdicts) and each table's samples. Every problem is a one-line error naming the file.
 */
public final class LabelledData {

    /** A confirmed or rejected verdict of the review the labels came from. */
    public record Reviewed(long line, String unit, String mode, String kind, Instant start, Instant end,
                           String findingId, String verdict, String cause) {
    }

    /** One table's place in the index. */
    public record Table(String unit, String label, String mode, String file, List<String> features,
                        boolean reviewed) {
        public Table {
            features = List.copyOf(features);
        }
    }

    private final Path dir;
    private final List<Table> tables;
    private final List<Reviewed> verdicts;

    private LabelledData(Path dir, List<Table> tables, List<Reviewed> verdicts) {
        this.dir = dir;
        this.tables = List.copyOf(tables);
        this.verdicts = List.copyOf(verdicts);
    }

    public static LabelledData open(Path dir) {
        Path index = dir.resolve(DataCard.INDEX);
        if (!Files.isRegularFile(index)) {
            throw InputException.in(index, "file not found; pass the folder tufa labels wrote (--out)");
        }
        List<Table> tables = new ArrayList<>();
        List<Reviewed> verdicts = new ArrayList<>();
        try (Reader r = Files.newBufferedReader(index, StandardCharsets.UTF_8)) {
            JsonObject root = JsonParser.parseReader(r).getAsJsonObject();
            for (JsonElement e : root.getAsJsonArray("files")) {
                JsonObject f = e.getAsJsonObject();
                List<String> features = new ArrayList<>();
                f.getAsJsonArray("features").forEach(x -> features.add(x.getAsString()));
                tables.add(new Table(f.get("unit").getAsString(), f.get("label").getAsString(),
                        f.get("mode").getAsString(), f.get("file").getAsString(), features,
                        f.get("reviewed").getAsBoolean()));
            }
            for (JsonElement e : root.getAsJsonArray("verdicts")) {
                JsonObject v = e.getAsJsonObject();
                verdicts.add(new Reviewed(v.get("line").getAsLong(), v.get("unit").getAsString(),
                        v.get("mode").getAsString(), v.get("kind").getAsString(),
                        OffsetDateTime.parse(v.get("start").getAsString()).toInstant(),
                        OffsetDateTime.parse(v.get("end").getAsString()).toInstant(),
                        v.get("finding_id").getAsString(), v.get("verdict").getAsString(),
                        v.get("cause").getAsString()));
            }
        } catch (IOException e) {
            throw InputException.in(index, "cannot read: " + e.getMessage());
        } catch (RuntimeException e) {
            throw InputException.in(index, "not an index tufa labels wrote (not JSON, or a field missing or of "
                    + "the wrong kind); run tufa labels again with this version");
        }
        for (Table t : tables) {
            if (t.file().contains("..") || t.file().startsWith("/")) {
                throw InputException.in(index, "table path " + t.file() + " leaves the folder");
            }
        }
        return new LabelledData(dir, tables, verdicts);
    }

    public List<Table> tables() {
        return tables;
    }

    public List<Reviewed> verdicts() {
        return verdicts;
    }

    /** The samples of one table. */
    public Samples.Part read(Table t) {
        Path file = dir.resolve(t.file());
        List<String> texts = List.of("label", "cause", "source");
        Instant[] times;
        double[][] values;
        String[][] text;
        double[] confidence;
        if (t.file().endsWith(".parquet")) {
            List<String> numbers = new ArrayList<>(t.features());
            numbers.add("confidence");
            SampleTableReader.TimedColumns c = SampleTableReader.readColumns(file, "timestamp", numbers, texts);
            times = c.times();
            int n = c.size();
            values = new double[n][t.features().size()];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < values[i].length; j++) {
                    values[i][j] = c.numbers()[j][i];
                }
            }
            confidence = c.numbers()[t.features().size()];
            text = c.texts();
        } else {
            List<Instant> ts = new ArrayList<>();
            List<double[]> rows = new ArrayList<>();
            List<String[]> labels = new ArrayList<>();
            List<Double> conf = new ArrayList<>();
            csv(file, t, ts, rows, labels, conf);
            times = ts.toArray(Instant[]::new);
            values = rows.toArray(double[][]::new);
            text = new String[3][times.length];
            confidence = new double[times.length];
            for (int i = 0; i < times.length; i++) {
                for (int j = 0; j < 3; j++) {
                    text[j][i] = labels.get(i)[j];
                }
                confidence[i] = conf.get(i);
            }
        }
        return new Samples.Part(t.unit(), t.mode(), t.features(), times, values, text[0], text[1], text[2],
                confidence);
    }

    private static void csv(Path file, Table t, List<Instant> times, List<double[]> rows, List<String[]> labels,
                            List<Double> confidence) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "file not found; the labels folder is incomplete (run tufa labels again)");
        }
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get();
        try (Reader reader = Files.newBufferedReader(file, StandardCharsets.UTF_8);
                CSVParser parser = CSVParser.builder().setReader(reader).setFormat(format).get()) {
            List<String> need = new ArrayList<>(t.features());
            need.addAll(List.of("timestamp", "label", "cause", "source", "confidence"));
            List<String> missing = need.stream().filter(h -> !parser.getHeaderNames().contains(h)).toList();
            if (!missing.isEmpty()) {
                throw InputException.at(file, 1, "header lacks column(s) " + String.join(", ", missing));
            }
            for (CSVRecord r : parser) {
                long line = r.getRecordNumber() + 1;
                try {
                    times.add(OffsetDateTime.parse(r.get("timestamp")).toInstant());
                    double[] v = new double[t.features().size()];
                    for (int j = 0; j < v.length; j++) {
                        v[j] = number(r.get(t.features().get(j)));
                    }
                    rows.add(v);
                    confidence.add(number(r.get("confidence")));
                } catch (DateTimeParseException | NumberFormatException e) {
                    throw InputException.at(file, line, "not a time stamp or number: " + e.getMessage());
                }
                labels.add(new String[] {r.get("label"), r.get("cause"), r.get("source")});
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        }
    }

    private static double number(String cell) {
        return switch (cell) {
            case "nan", "" -> Double.NaN;
            case "inf" -> Double.POSITIVE_INFINITY;
            case "-inf" -> Double.NEGATIVE_INFINITY;
            default -> Double.parseDouble(cell);
        };
    }
}
