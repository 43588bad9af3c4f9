package org.tufa.readers;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.tufa.analysis.evaluate.EvaluationFiles;
import org.tufa.analysis.evaluate.TruthEpisode;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.analysis.trends.TrendStore;
import org.tufa.common.InputException;
import org.tufa.mapper.points.PointList;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.rules.Rule;
import org.tufa.mapper.rules.RuleSet;

/**
 * Properties of tufa's readers (jqwik; a few hundred tries each in the normal test run, the fuzz campaign runs
 * 100,000 per reader with -Pfuzz):
 * <ul>
 * <li>any input yields a result or an {@link InputException}, never another exception;</li>
 * <li>a valid file read, written and read again is unchanged (point list, trends long then wide, truth file), and
 * a generated rule file reads back as what was generated.</li>
 * </ul>
 */
class ReaderPropertiesTest {

    private static Path dir;
    private static Path findings;

    @BeforeContainer
    static void folders() throws IOException {
        dir = Files.createTempDirectory("tufa-reader-properties");
        findings = Readers.findingsFolder(Files.createDirectories(dir.resolve("findings")));
    }

    @AfterContainer
    static void clean() throws IOException {
        try (var walk = Files.walk(dir)) {
            walk.sorted(Collections.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }

    /** Runs a reader; an InputException is an answer, anything else fails the property. */
    static void answers(Runnable read) {
        try {
            read.run();
        } catch (InputException expected) {
            if (expected.getMessage() == null || expected.getMessage().lines().count() != 1) {
                throw new AssertionError("not a one-line message: " + expected.getMessage());
            }
        }
    }

    // ---- any input: a result or an InputException ----

    @Provide
    Arbitrary<byte[]> pointLists() {
        return Mutations.pointLists();
    }

    @Provide
    Arbitrary<byte[]> ruleFiles() {
        return Mutations.ruleFiles();
    }

    @Provide
    Arbitrary<byte[]> trendFiles() {
        return Mutations.trendFiles();
    }

    @Provide
    Arbitrary<byte[]> truthFiles() {
        return Mutations.truthFiles();
    }

    @Property(tries = 200)
    void anyPointListIsReadOrRefused(@ForAll("pointLists") byte[] input) {
        answers(() -> Readers.pointList(input));
    }

    @Property(tries = 200)
    void anyRuleFileIsReadOrRefused(@ForAll("ruleFiles") byte[] input) {
        answers(() -> Readers.ruleFile(input));
    }

    @Property(tries = 200)
    void anyTrendFileIsReadOrRefused(@ForAll("trendFiles") byte[] input, @ForAll boolean strict,
            @ForAll boolean naive) {
        answers(() -> Readers.trends(dir, input, strict, naive));
    }

    @Property(tries = 200)
    void anyTruthFileIsReadOrRefused(@ForAll("truthFiles") byte[] input) {
        answers(() -> Readers.truth(findings, input));
    }

    // ---- round trips ----

    /** Field text: no line breaks, no leading or trailing blanks (the reader trims), commas and quotes welcome. */
    private static Arbitrary<String> text(int minLength) {
        return Arbitraries.strings().withChars("abcXYZ019 _-.,;:\"'/%#\u00e9\u00b0=+@")
                .ofMinLength(minLength).ofMaxLength(14).map(String::strip)
                .filter(s -> s.length() >= minLength);
    }

    @Provide
    Arbitrary<List<List<String>>> pointRows() {
        Arbitrary<List<String>> row = Combinators.combine(text(1), text(0), text(0), text(0), text(0), text(0))
                .as(List::of);
        return row.list().ofMinSize(1).ofMaxSize(12);
    }

    private static final List<String> POINT_HEADER = List.of("Point Name", "Description", "Units", "Device",
            "Trend ID", "Room");

    private static byte[] pointCsv(List<List<String>> rows) {
        return csv(POINT_HEADER, rows);
    }

    /** RFC 4180 CSV (Commons CSV's printer, LF line ends) of a header and rows. */
    static byte[] csv(List<String> header, List<List<String>> rows) {
        StringWriter w = new StringWriter();
        try (CSVPrinter p = new CSVPrinter(w, CSVFormat.RFC4180.builder().setRecordSeparator('\n').get())) {
            p.printRecord(header);
            for (List<String> r : rows) {
                p.printRecord(r);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return w.toString().getBytes(StandardCharsets.UTF_8);
    }

    @Property(tries = 200)
    void aPointListReadWrittenAndReadAgainIsUnchanged(@ForAll("pointRows") List<List<String>> rows) {
        byte[] first = pointCsv(rows);
        PointList read = (PointList) Readers.pointList(first);
        List<List<String>> back = new ArrayList<>();
        for (PointRecord p : read.points()) {
            back.add(List.of(p.name(), p.description(), p.units(), p.device(), p.seriesId(),
                    p.extras().getOrDefault("Room", "")));
        }
        assertEquals(rows, back);
        assertArrayEquals(first, pointCsv(back));
    }

    @Provide
    Arbitrary<Map<String, List<Double>>> gridSeries() {
        // Per series 1..40 cells of a 15-minute grid, NaN for "no sample".
        Arbitrary<Double> analog = Arbitraries.doubles().between(5, 80).ofScale(3);
        Arbitrary<Double> maybe = Arbitraries.frequencyOf(net.jqwik.api.Tuple.of(4, analog),
                net.jqwik.api.Tuple.of(1, Arbitraries.just(Double.NaN)));
        Arbitrary<Double> binary = Arbitraries.frequencyOf(net.jqwik.api.Tuple.of(4,
                Arbitraries.of(0.0, 1.0)), net.jqwik.api.Tuple.of(1, Arbitraries.just(Double.NaN)));
        return Arbitraries.integers().between(1, 40).flatMap(n -> Combinators.combine(
                maybe.list().ofSize(n), maybe.list().ofSize(n), binary.list().ofSize(n))
                .as((z, d, f) -> Map.of("ZNT", z, "DAT", d, "FAN", f)));
    }

    private static final Instant START = Instant.parse("2031-07-01T10:00:00Z");
    /** A hold limit of one cell: each sample fills exactly its own cell, so the grid is the samples. */
    private static final TimeOptions GRID = TimeOptions.defaults(null).withMaxGap(Duration.ofMinutes(15))
            .withWindow(START, START.plus(Duration.ofMinutes(15L * 40)));

    private static String number(double v) {
        return Double.isNaN(v) ? "" : Double.toString(v);
    }

    private Map<String, double[]> read(byte[] file) {
        Path f = dir.resolve("round-trip.csv");
        Readers.write(f, file);
        try (TrendStore store = TrendStore.ingest(List.of(f), Readers.SERIES, Readers.RANGES, GRID, dir)) {
            Map<String, double[]> out = new TreeMap<>();
            for (String id : store.seriesIds()) {
                out.put(id, store.series(id).values());
            }
            var report = store.report().files().get(0);
            if (report.format() == org.tufa.analysis.trends.TrendFormat.LONG) {
                assertEquals(report.rows(), report.accounted(), "every row counted");
            }
            return out;
        }
    }

    @Property(tries = 200)
    void trendsReadWrittenWideAndReadAgainAreUnchanged(@ForAll("gridSeries") Map<String, List<Double>> series,
            @ForAll long seed) {
        // Long layout, rows in random order (readers sort per series).
        List<String> rows = new ArrayList<>();
        series.forEach((id, values) -> {
            for (int k = 0; k < values.size(); k++) {
                if (!Double.isNaN(values.get(k))) {
                    rows.add(START.plus(Duration.ofMinutes(15L * k)) + "," + id + "," + number(values.get(k)));
                }
            }
        });
        Collections.shuffle(rows, new Random(seed));
        byte[] longFile = ("timestamp,point,value\n" + String.join("\n", rows) + "\n").getBytes(StandardCharsets.UTF_8);
        Map<String, double[]> first = read(longFile);
        series.forEach((id, values) -> {
            for (int k = 0; k < values.size(); k++) {
                assertEquals(values.get(k), first.get(id)[k], 0, id + " cell " + k);
            }
        });
        // Written back as a wide file, one row per grid cell, and read again.
        StringBuilder wide = new StringBuilder("timestamp," + String.join(",", first.keySet()) + "\n");
        int cells = first.values().iterator().next().length;
        for (int k = 0; k < cells; k++) {
            wide.append(START.plus(Duration.ofMinutes(15L * k)));
            for (double[] v : first.values()) {
                wide.append(',').append(number(v[k]));
            }
            wide.append('\n');
        }
        Map<String, double[]> second = read(wide.toString().getBytes(StandardCharsets.UTF_8));
        for (String id : first.keySet()) {
            assertArrayEquals(first.get(id), second.get(id), 0, id);
        }
    }

    @Provide
    Arbitrary<List<List<String>>> episodes() {
        Arbitrary<String> unit = Arbitraries.of("urn:x#fcu-1", "urn:x#fcu-2");
        Arbitrary<String> fault = Arbitraries.strings().withChars("abc_xyz,\"' ").ofMinLength(1).ofMaxLength(12)
                .map(String::strip).filter(s -> !s.isEmpty());
        Arbitrary<Integer> hour = Arbitraries.integers().between(0, 24 * 60);
        Arbitrary<Integer> hours = Arbitraries.integers().between(1, 48);
        Arbitrary<Double> severity = Arbitraries.doubles().between(0, 1).ofScale(3);
        Arbitrary<List<String>> row = Combinators.combine(unit, fault, hour, hours, severity).as((u, f, h, d, s) ->
                List.of(u, f, START.plusSeconds(3600L * h).toString(), START.plusSeconds(3600L * (h + d)).toString(),
                        Double.toString(s)));
        return row.list().ofMaxSize(15).uniqueElements(r -> r.subList(0, 4));
    }

    private static byte[] truthCsv(List<List<String>> rows) {
        return csv(List.of("unit", "fault", "start", "end", "severity"), rows);
    }

    @Property(tries = 200)
    void aTruthFileReadWrittenAndReadAgainIsUnchanged(@ForAll("episodes") List<List<String>> rows) {
        byte[] first = truthCsv(rows);
        Path file = findings.resolve("truth.csv");
        Readers.write(file, first);
        List<List<String>> back = new ArrayList<>();
        for (TruthEpisode e : EvaluationFiles.read(findings, file).truth()) {
            back.add(List.of(e.unit(), e.fault(), e.start().toString(), e.end().toString(),
                    Double.toString(e.severity())));
        }
        assertEquals(rows, back);
        assertArrayEquals(first, truthCsv(back));
    }

    @Provide
    Arbitrary<List<Object[]>> ruleSpecs() {
        Arbitrary<String> unit = Arbitraries.of("DEG_F", "DEG_C", "PERCENT", "K", "PERCENT_RH", "PA");
        Arbitrary<Integer> airflow = Arbitraries.integers().between(1, 5000);
        Arbitrary<String> cls = Arbitraries.of("Fan_Coil_Unit", "Variable_Air_Volume_Box", "Air_Handling_Unit");
        return Combinators.combine(unit, airflow, cls).as((u, a, c) -> new Object[] {u, a, c}).list()
                .ofMinSize(1).ofMaxSize(6);
    }

    @Property(tries = 100)
    void aGeneratedRuleFileReadsBackAsGenerated(@ForAll("ruleSpecs") List<Object[]> specs,
            @ForAll("buildingNames") String building) {
        StringBuilder b = new StringBuilder("building " + building + "\nabbr T = Temperature\n");
        for (int i = 0; i < specs.size(); i++) {
            b.append("\n# rule ").append(i).append("\nrule r").append(i).append('\n')
                    .append("  match name ^R").append(i).append("-(?<u>\\d+)-T$\n")
                    .append("  class Zone_Air_Temperature_Sensor\n")
                    .append("  equipment U").append(i).append("-{u} ").append(specs.get(i)[2]).append('\n')
                    .append("  unit ").append(specs.get(i)[0]).append("   # trailing comment\n")
                    .append("  airflow ").append(specs.get(i)[1]).append(" FT3-PER-MIN\n");
        }
        RuleSet rs = (RuleSet) Readers.ruleFile(b.toString().getBytes(StandardCharsets.UTF_8));
        assertEquals(building, rs.building());
        assertEquals(specs.size(), rs.rules().size());
        for (int i = 0; i < specs.size(); i++) {
            Rule r = rs.rules().get(i);
            assertEquals("r" + i, r.id());
            assertEquals(specs.get(i)[0], r.unit().orElseThrow());
            assertEquals(specs.get(i)[2], r.equipment().orElseThrow().className().fixed());
            assertEquals(String.valueOf(specs.get(i)[1]), r.airflow().orElseThrow().value().source());
        }
    }

    @Provide
    Arbitrary<String> buildingNames() {
        return Arbitraries.strings().withChars("Pellow Row Annex 12-").ofMinLength(1).ofMaxLength(30).map(String::strip)
                .filter(s -> !s.isEmpty() && !s.contains(" #"));
    }
}
