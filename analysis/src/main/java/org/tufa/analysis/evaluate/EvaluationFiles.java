package org.tufa.analysis.evaluate;

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
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.tufa.analysis.tables.SampleTableReader;
import org.tufa.common.CsvCells;
import org.tufa.common.InputException;

/**
 * Reads the analysis output directory ({@code fleet.csv}, {@code findings.csv}, {@code units/<folder>/modes.csv})
 * and {@code truth.csv}. Every problem is a one-line {@link InputException} naming the file and line.
 */
public final class EvaluationFiles {
    public static final List<String> FLEET_HEADER = List.of("unit", "label", "folder", "status", "reason", "modes",
            "samples_used", "clusters", "fault_clusters", "fault_hours", "energy_kwh");
    public static final List<String> FINDINGS_HEADER = List.of("unit", "mode", "kind", "cluster", "start", "end",
            "hours", "energy_kwh", "shift", "candidate_causes");
    public static final List<String> MODES_HEADER = List.of("timestamp", "mode", "in_band");
    public static final List<String> TRUTH_HEADER = List.of("unit", "fault", "start", "end", "severity");

    private EvaluationFiles() {
    }

    /** Reads everything; checks that every truth and findings unit is in the fleet. */
    public static EvaluationInput read(Path findingsDir, Path truthFile) {
        return read(findingsDir, truthFile, 0);
    }

    /**
     * As {@link #read(Path, Path)}, keeping only findings with at least {@code minConfidence} (read from the
     * confidence column; files without one keep every finding).
     */
    public static EvaluationInput read(Path findingsDir, Path truthFile, double minConfidence) {
        Path fleetFile = findingsDir.resolve("fleet.csv");
        List<FleetUnit> fleet = new ArrayList<>();
        Map<String, FleetUnit> byUnit = new TreeMap<>();
        forEachRecord(fleetFile, FLEET_HEADER, (r, line) -> {
            String status = r.get("status");
            if (!status.equals("analyzed") && !status.equals("skipped") && !status.equals("failed")) {
                throw InputException.at(fleetFile, line, "column status: '" + status
                        + "' is not one of analyzed, skipped, failed");
            }
            FleetUnit u = new FleetUnit(CsvCells.restore(r.get("unit")), CsvCells.restore(r.get("label")),
                    CsvCells.restore(r.get("folder")), status);
            if (byUnit.put(u.unit(), u) != null) {
                throw InputException.at(fleetFile, line, "unit " + u.unit() + " is listed twice");
            }
            fleet.add(u);
        });

        Path findingsFile = findingsDir.resolve("findings.csv");
        Map<String, List<FlaggedInterval>> findings = new TreeMap<>();
        forEachRecord(findingsFile, FINDINGS_HEADER, (r, line) -> {
            String unit = CsvCells.restore(r.get("unit"));
            if (!byUnit.containsKey(unit)) {
                throw InputException.at(findingsFile, line, "unit " + unit + " is not in " + fleetFile);
            }
            Instant start = time(findingsFile, line, "start", r.get("start"));
            Instant end = time(findingsFile, line, "end", r.get("end"));
            if (end.isBefore(start)) {
                throw InputException.at(findingsFile, line, "end is before start");
            }
            if (minConfidence > 0 && r.isMapped("confidence")) {
                double c = number(findingsFile, line, "confidence", r.get("confidence"));
                if (c < minConfidence) {
                    return;
                }
            }
            findings.computeIfAbsent(unit, k -> new ArrayList<>()).add(new FlaggedInterval(unit, r.get("kind"),
                    start, end));
        });

        Map<String, UnitSamples> samples = new TreeMap<>();
        for (FleetUnit u : fleet) {
            if (!u.analyzed()) {
                continue;
            }
            if (u.folder().isEmpty() || u.folder().contains("/") || u.folder().contains("\\")
                    || u.folder().equals("..")) {
                throw InputException.in(fleetFile, "unit " + u.unit() + ": folder '" + u.folder()
                        + "' is not a plain folder name under units/");
            }
            Path unitDir = findingsDir.resolve("units").resolve(u.folder());
            Path parquet = unitDir.resolve("modes.parquet");
            if (Files.isRegularFile(parquet)) {
                SampleTableReader.TimedTexts t = SampleTableReader.read(parquet, "timestamp", "mode");
                for (int i = 0; i < t.texts().size(); i++) {
                    if (!UnitSamples.MODES.contains(t.texts().get(i))) {
                        throw InputException.in(parquet, "row " + (i + 1) + ": mode '" + t.texts().get(i)
                                + "' is not one of " + new java.util.TreeSet<>(UnitSamples.MODES));
                    }
                }
                samples.put(u.unit(), new UnitSamples(t.times(), t.texts()));
                continue;
            }
            Path modesFile = unitDir.resolve("modes.csv");
            List<Instant> times = new ArrayList<>();
            List<String> modes = new ArrayList<>();
            forEachRecord(modesFile, MODES_HEADER, (r, line) -> {
                String mode = r.get("mode");
                if (!UnitSamples.MODES.contains(mode)) {
                    throw InputException.at(modesFile, line, "column mode: '" + mode + "' is not one of "
                            + new java.util.TreeSet<>(UnitSamples.MODES));
                }
                times.add(time(modesFile, line, "timestamp", r.get("timestamp")));
                modes.add(mode);
            });
            samples.put(u.unit(), new UnitSamples(times, modes));
        }

        List<TruthEpisode> truth = new ArrayList<>();
        java.util.Set<String> seen = new java.util.HashSet<>();
        int[] repeated = {0};
        forEachRecord(truthFile, TRUTH_HEADER, (r, line) -> {
            String unit = resolveUnit(r.get("unit"), fleet, byUnit, truthFile, line, fleetFile);
            Instant start = time(truthFile, line, "start", r.get("start"));
            Instant end = time(truthFile, line, "end", r.get("end"));
            if (!end.isAfter(start)) {
                throw InputException.at(truthFile, line, "end must be after start");
            }
            double severity = number(truthFile, line, "severity", r.get("severity"));
            if (r.get("fault").isBlank()) {
                throw InputException.at(truthFile, line, "column fault is empty");
            }
            // A row listed twice is one episode: scored once, counted in repeatedEpisodes.
            if (!seen.add(unit + "\u0000" + r.get("fault") + "\u0000" + start + "\u0000" + end)) {
                repeated[0]++;
                return;
            }
            truth.add(new TruthEpisode(unit, r.get("fault"), start, end, severity));
        });
        // The unit kinds, when the analysis wrote the coverage file beside fleet.csv (tufa analyze does).
        Map<String, String> kinds = new TreeMap<>();
        Path coverageFile = findingsDir.resolve("coverage.csv");
        if (Files.isRegularFile(coverageFile) && hasColumn(coverageFile, "unit_kind")) {
            forEachRecord(coverageFile, List.of("unit", "unit_kind"), (r, line) -> kinds.put(r.get("unit"),
                    r.get("unit_kind")));
        }
        return new EvaluationInput(List.copyOf(fleet), findings, samples, List.copyOf(truth), kinds,
                repeated[0]);
    }

    /** Whether the CSV file's header names the column (coverage files of older versions have no unit_kind). */
    private static boolean hasColumn(Path file, String column) {
        try (java.io.BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String header = r.readLine();
            return header != null && java.util.Arrays.asList(header.split(",", -1)).contains(column);
        } catch (IOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        }
    }

    /**
     * The fleet unit a truth row names: its IRI, or else its local name (after the last '#', '/' or ':') or its
     * label when exactly one unit of the fleet has it ({@code fcu-03} for {@code urn:x#fcu-03}).
     */
    static String resolveUnit(String name, List<FleetUnit> fleet, Map<String, FleetUnit> byUnit, Path truthFile,
            long line, Path fleetFile) {
        if (byUnit.containsKey(name)) {
            return name;
        }
        for (java.util.function.Function<FleetUnit, String> key : List.<java.util.function.Function<FleetUnit,
                String>>of(u -> localName(u.unit()), FleetUnit::label)) {
            List<String> hits = fleet.stream().filter(u -> name.equals(key.apply(u))).map(FleetUnit::unit).toList();
            if (hits.size() == 1) {
                return hits.get(0);
            }
            if (hits.size() > 1) {
                throw InputException.at(truthFile, line, "unit " + org.tufa.common.Printable.excerpt(name)
                        + " matches " + hits.size() + " units of " + fleetFile + " (" + hits.get(0) + ", "
                        + hits.get(1) + "); write the unit's full IRI");
            }
        }
        throw InputException.at(truthFile, line, "unit " + org.tufa.common.Printable.excerpt(name) + " is not in "
                + fleetFile + " (by IRI, local name or label); evaluate the findings of the same fleet the truth "
                + "was made for");
    }

    static String localName(String iri) {
        int cut = Math.max(iri.lastIndexOf('#'), Math.max(iri.lastIndexOf('/'), iri.lastIndexOf(':')));
        return iri.substring(cut + 1);
    }

    private interface RecordHandler {
        void accept(CSVRecord record, long line);
    }

    private static void forEachRecord(Path file, List<String> header, RecordHandler handler) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "file not found; pass the directory the analysis wrote (--findings)"
                    + " and the truth.csv the simulator wrote (--truth)");
        }
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get();
        try (Reader reader = Files.newBufferedReader(file, StandardCharsets.UTF_8);
                CSVParser parser = CSVParser.builder().setReader(reader).setFormat(format).get()) {
            List<String> names = parser.getHeaderNames();
            List<String> missing = header.stream().filter(h -> !names.contains(h)).toList();
            if (!missing.isEmpty()) {
                throw InputException.at(file, 1, "header lacks column(s) " + String.join(", ", missing)
                        + "; expected " + String.join(",", header));
            }
            for (CSVRecord r : parser) {
                long line = r.getRecordNumber() + 1;
                if (!r.isConsistent()) {
                    throw InputException.at(file, line, "expected " + names.size() + " fields, found " + r.size());
                }
                handler.accept(r, line);
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        } catch (IllegalArgumentException | IllegalStateException e) {
            throw InputException.in(file, "not a valid CSV file: " + e.getMessage().replace('\n', ' '));
        }
    }

    /** A number cell, or a one-line error naming the file, line and column. */
    private static double number(Path file, long line, String column, String value) {
        try {
            return Double.parseDouble(value);
        } catch (NumberFormatException e) {
            throw InputException.at(file, line, "column " + column + ": '" + value + "' is not a number");
        }
    }

    private static Instant time(Path file, long line, String column, String value) {
        try {
            return OffsetDateTime.parse(value).toInstant();
        } catch (DateTimeParseException e) {
            throw InputException.at(file, line, "column " + column + ": '" + value
                    + "' is not an ISO-8601 date-time with offset, e.g. 2031-06-01T00:15:00-04:00");
        }
    }
}
