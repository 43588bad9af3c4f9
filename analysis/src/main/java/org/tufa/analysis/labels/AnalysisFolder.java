package org.tufa.analysis.labels;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.fleet.Csv;
import org.tufa.analysis.fleet.UnitAnalysis;
import org.tufa.analysis.review.KnownUnits;
import org.tufa.analysis.tables.SampleTableReader;
import org.tufa.common.CsvCells;
import org.tufa.common.InputException;

/**
 * A folder {@code tufa analyze} wrote, as the labelled-data stages read it: the units ({@code fleet.csv}), the listed
 * findings ({@code findings.csv}), the run's zone and engineering gates ({@code run.json}), each unit's modes
 * ({@code units/<folder>/summary.json}) and each clustered mode's samples ({@code features} with the cluster of
 * each sample from {@code reachability}, Parquet or CSV). Every problem is a one-line error naming the file and line.
 */
public final class AnalysisFolder {

    /** A unit of fleet.csv. */
    public record Unit(String iri, String label, String folder, String status) {
        public boolean analyzed() {
            return status.equals("analyzed");
        }

        public String name() {
            return label.isEmpty() ? iri : label;
        }
    }

    /** A finding of findings.csv. */
    public record Listed(String unit, String mode, String kind, Instant start, Instant end, List<String> causes,
                         double confidence, String id, String review) {
        public Listed {
            causes = List.copyOf(causes);
        }
    }

    /**
     * A unit's mode from summary.json.
     *
     * @param normalClusters cluster labels of the normal reference (the largest cluster and the regimes that agree
     *                       with it)
     */
    public record Mode(String mode, boolean analyzed, List<String> features, List<String> units,
                       List<String> healthFeatures, List<Integer> normalClusters) {
        public Mode {
            features = List.copyOf(features);
            units = List.copyOf(units);
            healthFeatures = List.copyOf(healthFeatures);
            normalClusters = List.copyOf(normalClusters);
        }
    }

    /**
     * The clustered samples of a unit's mode.
     *
     * @param timeText each sample's time stamp as written
     * @param times    each sample's start
     * @param values   samples x features, engineering units, in {@link Mode#features} order
     * @param cluster  each sample's cluster (-1 noise)
     */
    public record Samples(String[] timeText, Instant[] times, double[][] values, int[] cluster) {
        public int size() {
            return times.length;
        }
    }

    private final Path dir;
    private final List<Unit> units;
    private final List<Listed> findings;
    private final ZoneId zone;
    private final AnalysisSettings gates;

    private AnalysisFolder(Path dir, List<Unit> units, List<Listed> findings, ZoneId zone, AnalysisSettings gates) {
        this.dir = dir;
        this.units = List.copyOf(units);
        this.findings = List.copyOf(findings);
        this.zone = zone;
        this.gates = gates;
    }

    public static AnalysisFolder open(Path dir) {
        if (!Files.isDirectory(dir)) {
            throw InputException.in(dir, "not a folder; pass the folder tufa analyze wrote (--out)");
        }
        List<Unit> units = new ArrayList<>();
        Map<String, Unit> byIri = new HashMap<>();
        Path fleet = dir.resolve("fleet.csv");
        records(fleet, List.of("unit", "label", "folder", "status"), (r, line) -> {
            Unit u = new Unit(CsvCells.restore(r.get("unit")), CsvCells.restore(r.get("label")),
                    CsvCells.restore(r.get("folder")), r.get("status"));
            if (u.analyzed() && (u.folder().isEmpty() || u.folder().contains("/") || u.folder().contains("\\")
                    || u.folder().startsWith("."))) {
                throw InputException.at(fleet, line, "folder '" + u.folder() + "' is not a plain folder name");
            }
            if (byIri.put(u.iri(), u) != null) {
                throw InputException.at(fleet, line, "unit " + u.iri() + " is listed twice");
            }
            units.add(u);
        });
        List<Listed> findings = new ArrayList<>();
        Path findingsFile = dir.resolve("findings.csv");
        records(findingsFile, List.of("unit", "mode", "kind", "start", "end", "candidate_causes", "confidence",
                "finding_id", "review"), (r, line) -> {
                    String unit = CsvCells.restore(r.get("unit"));
                    if (!byIri.containsKey(unit)) {
                        throw InputException.at(findingsFile, line, "unit " + unit + " is not in " + fleet);
                    }
                    String causes = CsvCells.restore(r.get("candidate_causes"));
                    String confidence = r.get("confidence");
                    findings.add(new Listed(unit, r.get("mode"), r.get("kind"), time(findingsFile, line, r.get("start")),
                            time(findingsFile, line, r.get("end")), causes.isEmpty() ? List.of()
                            : Arrays.asList(causes.split(" \\| ")), confidence.isEmpty() ? Double.NaN
                            : number(findingsFile, line, confidence), r.get("finding_id"), r.get("review")));
                });
        Path run = dir.resolve("run.json");
        JsonObject parameters = json(run).getAsJsonObject().getAsJsonObject("parameters");
        if (parameters == null) {
            throw InputException.in(run, "no \"parameters\" object; pass a folder tufa analyze wrote");
        }
        ZoneId zone;
        try {
            zone = ZoneId.of(string(parameters, "timezone", "UTC"));
        } catch (java.time.DateTimeException e) {
            throw InputException.in(run, "parameter timezone is not a time zone: " + e.getMessage());
        }
        AnalysisSettings d = AnalysisSettings.defaults();
        AnalysisSettings gates = d.withGates(gate(run, parameters, "residual_gate_k", d.residualGate()),
                gate(run, parameters, "activity_gate_percent", d.activityGate()),
                gate(run, parameters, "zone_error_gate_k", d.zoneErrorGate()));
        return new AnalysisFolder(dir, units, findings, zone, gates);
    }

    public Path dir() {
        return dir;
    }

    public List<Unit> units() {
        return units;
    }

    public List<Listed> findings() {
        return findings;
    }

    /** The zone of the run's times. */
    public ZoneId zone() {
        return zone;
    }

    /** The units' names a review file may use. */
    public KnownUnits knownUnits() {
        Map<String, String> labels = new TreeMap<>();
        units.forEach(u -> labels.put(u.iri(), u.label()));
        return new KnownUnits(labels);
    }

    /** The engineering gate a health feature is scaled by (what the clustering divided it by). */
    public double gate(String healthFeature) {
        return UnitAnalysis.gate(healthFeature, gates);
    }

    /** The unit's modes from its summary.json, in the file's order. */
    public List<Mode> modes(Unit u) {
        Path file = dir.resolve("units").resolve(u.folder()).resolve("summary.json");
        JsonElement root = json(file);
        List<Mode> out = new ArrayList<>();
        try {
            for (JsonElement e : root.getAsJsonObject().getAsJsonArray("modes")) {
                JsonObject m = e.getAsJsonObject();
                boolean analyzed = m.get("analyzed").getAsBoolean();
                List<Integer> normal = new ArrayList<>();
                if (analyzed) {
                    for (JsonElement c : m.getAsJsonArray("clusters")) {
                        JsonObject co = c.getAsJsonObject();
                        String role = co.get("role").getAsString();
                        if (role.equals("normal") || role.equals("regime")) {
                            normal.add(co.get("cluster").getAsInt());
                        }
                    }
                }
                out.add(new Mode(m.get("mode").getAsString(), analyzed, analyzed ? strings(m, "features") : List.of(),
                        analyzed ? strings(m, "feature_units") : List.of(), analyzed ? strings(m, "health_features")
                        : List.of(), normal));
            }
        } catch (RuntimeException e) {
            throw InputException.in(file, "not a summary tufa analyze wrote (" + e.getMessage() + "); rerun the "
                    + "analysis with this version");
        }
        return out;
    }

    /**
     * The clustered samples of a unit's mode, from its Parquet tables ({@code features.parquet},
     * {@code reachability.parquet}) or, for a run with {@code --sample-files csv}, its CSV tables.
     */
    public Samples samples(Unit u, Mode m) {
        Path modeDir = dir.resolve("units").resolve(u.folder()).resolve(m.mode());
        return Files.isRegularFile(modeDir.resolve("features.parquet")) ? parquetSamples(modeDir, m)
                : csvSamples(modeDir, m);
    }

    private Samples parquetSamples(Path modeDir, Mode m) {
        Path features = modeDir.resolve("features.parquet");
        Path reach = modeDir.resolve("reachability.parquet");
        SampleTableReader.TimedNumbers r = SampleTableReader.readNumbers(reach, "timestamp", List.of("cluster"));
        Map<Instant, Integer> clusterOf = new HashMap<>();
        for (int i = 0; i < r.size(); i++) {
            clusterOf.put(r.times()[i], (int) r.columns()[0][i]);
        }
        SampleTableReader.TimedNumbers f = SampleTableReader.readNumbers(features, "timestamp", m.features());
        int n = f.size();
        String[] text = new String[n];
        double[][] values = new double[n][m.features().size()];
        int[] cluster = new int[n];
        for (int i = 0; i < n; i++) {
            text[i] = Csv.time(f.times()[i], zone);
            for (int j = 0; j < values[i].length; j++) {
                values[i][j] = f.columns()[j][i];
            }
            Integer c = clusterOf.get(f.times()[i]);
            if (c == null) {
                throw InputException.in(features, "sample " + text[i] + " (row " + (i + 1) + ") is not in " + reach);
            }
            cluster[i] = c;
        }
        return new Samples(text, f.times(), values, cluster);
    }

    private Samples csvSamples(Path modeDir, Mode m) {
        Path features = modeDir.resolve("features.csv");
        Path reach = modeDir.resolve("reachability.csv");
        Map<Instant, Integer> clusterOf = new HashMap<>();
        lines(reach, "order,timestamp,reachability,core_distance,cluster", (cells, line) -> {
            if (cells.length != 5) {
                throw InputException.at(reach, line, "expected 5 fields, found " + cells.length);
            }
            clusterOf.put(time(reach, line, cells[1]), (int) number(reach, line, cells[4]));
        });
        List<String> text = new ArrayList<>();
        List<Instant> times = new ArrayList<>();
        List<double[]> rows = new ArrayList<>();
        List<Integer> clusters = new ArrayList<>();
        String header = "timestamp," + String.join(",", m.features());
        int width = m.features().size();
        lines(features, header, (cells, line) -> {
            if (cells.length != width + 1) {
                throw InputException.at(features, line, "expected " + (width + 1) + " fields, found " + cells.length);
            }
            double[] v = new double[width];
            for (int j = 0; j < width; j++) {
                v[j] = number(features, line, cells[j + 1]);
            }
            Instant t = time(features, line, cells[0]);
            Integer c = clusterOf.get(t);
            if (c == null) {
                throw InputException.at(features, line, "sample " + cells[0] + " is not in " + reach);
            }
            text.add(cells[0]);
            times.add(t);
            rows.add(v);
            clusters.add(c);
        });
        return new Samples(text.toArray(String[]::new), times.toArray(Instant[]::new), rows.toArray(double[][]::new),
                clusters.stream().mapToInt(Integer::intValue).toArray());
    }

    private interface RecordHandler {
        void accept(CSVRecord record, long line);
    }

    private interface LineHandler {
        void accept(String[] cells, long line);
    }

    static void records(Path file, List<String> required, RecordHandler handler) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "file not found; pass the folder tufa analyze wrote (--out)");
        }
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get();
        try (Reader reader = Files.newBufferedReader(file, StandardCharsets.UTF_8);
                CSVParser parser = CSVParser.builder().setReader(reader).setFormat(format).get()) {
            List<String> missing = required.stream().filter(h -> !parser.getHeaderNames().contains(h)).toList();
            if (!missing.isEmpty()) {
                throw InputException.at(file, 1, "header lacks column(s) " + String.join(", ", missing)
                        + "; rerun the analysis with this version of tufa");
            }
            long previousEnd = parser.getCurrentLineNumber();
            for (CSVRecord r : parser) {
                long line = previousEnd + 1;
                previousEnd = parser.getCurrentLineNumber();
                if (!r.isConsistent()) {
                    throw InputException.at(file, line, "expected " + parser.getHeaderNames().size() + " fields, found "
                            + r.size());
                }
                handler.accept(r, line);
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        } catch (IllegalArgumentException | IllegalStateException e) {
            throw InputException.in(file, "not a valid CSV file: " + String.valueOf(e.getMessage()).replace('\n', ' '));
        }
    }

    /** A per-sample file (numbers and time stamps only, no quoting): checked header, then its rows split. */
    static void lines(Path file, String header, LineHandler handler) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "file not found; the analysis folder is incomplete (rerun tufa analyze)");
        }
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String first = r.readLine();
            if (first == null || !first.equals(header)) {
                throw InputException.at(file, 1, "expected the header " + header);
            }
            long line = 1;
            for (String s; (s = r.readLine()) != null; ) {
                line++;
                if (!s.isEmpty()) {
                    handler.accept(s.split(",", -1), line);
                }
            }
        } catch (IOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        }
    }

    private static JsonElement json(Path file) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "file not found; pass the folder tufa analyze wrote (--out)");
        }
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return JsonParser.parseReader(r);
        } catch (IOException | RuntimeException e) {
            throw InputException.in(file, "not valid JSON: " + e.getMessage());
        }
    }

    private static List<String> strings(JsonObject o, String key) {
        List<String> out = new ArrayList<>();
        o.getAsJsonArray(key).forEach(e -> out.add(e.getAsString()));
        return out;
    }

    private static String string(JsonObject o, String key, String fallback) {
        JsonElement e = o.get(key);
        return e == null || e.isJsonNull() ? fallback : e.getAsString();
    }

    private static double gate(Path run, JsonObject p, String key, double fallback) {
        String v = string(p, key, Double.toString(fallback));
        try {
            return Double.parseDouble(v);
        } catch (NumberFormatException e) {
            throw InputException.in(run, "parameter " + key + ": '" + v + "' is not a number");
        }
    }

    static double number(Path file, long line, String cell) {
        switch (cell) {
            case "nan":
                return Double.NaN;
            case "inf":
                return Double.POSITIVE_INFINITY;
            case "-inf":
                return Double.NEGATIVE_INFINITY;
            default:
                try {
                    return Double.parseDouble(cell);
                } catch (NumberFormatException e) {
                    throw InputException.at(file, line, "'" + org.tufa.common.Printable.excerpt(cell)
                            + "' is not a number");
                }
        }
    }

    static Instant time(Path file, long line, String cell) {
        try {
            return OffsetDateTime.parse(cell).toInstant();
        } catch (DateTimeParseException e) {
            throw InputException.at(file, line, "'" + org.tufa.common.Printable.excerpt(cell)
                    + "' is not an ISO-8601 date-time with offset");
        }
    }

    /** The listed findings of one unit, by unit (in file order). */
    public Map<String, List<Listed>> findingsByUnit() {
        Map<String, List<Listed>> out = new LinkedHashMap<>();
        for (Listed f : findings) {
            out.computeIfAbsent(f.unit(), k -> new ArrayList<>()).add(f);
        }
        return out;
    }
}
