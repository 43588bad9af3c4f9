package org.tufa.readers;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;
import org.tufa.analysis.evaluate.EvaluationFiles;
import org.tufa.analysis.trends.PlausibleRange;
import org.tufa.analysis.trends.SeriesKind;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.analysis.trends.TrendStore;
import org.tufa.mapper.points.PointListReader;
import org.tufa.mapper.points.ReadOptions;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * tufa's readers of other people's files, each as "bytes in, result or InputException out", for the property tests
 * and the fuzz campaign: point list, rule file, trends (long and wide, one reader), truth file. Also the seeds the
 * fuzzers mutate: small valid files of each kind.
 */
final class Readers {

    static final BrickVocabulary VOCABULARY = BrickVocabulary.bundled();
    static final Map<String, SeriesKind> SERIES = Map.of("ZNT", SeriesKind.ANALOG, "DAT", SeriesKind.ANALOG,
            "FAN", SeriesKind.BINARY);
    static final Map<String, PlausibleRange> RANGES = Map.of("ZNT", PlausibleRange.forUnit("DEG_F").orElseThrow(),
            "DAT", PlausibleRange.forUnit("DEG_C").orElseThrow());

    private Readers() {
    }

    static Object pointList(byte[] bytes) {
        return PointListReader.parse(Path.of("points.csv"), bytes, ReadOptions.detect());
    }

    static Object ruleFile(byte[] bytes) {
        // As RuleFileParser.parse(Path) reads a file: strict UTF-8 first.
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(java.nio.charset.CodingErrorAction.REPORT)
                    .decode(java.nio.ByteBuffer.wrap(bytes)).toString();
        } catch (java.nio.charset.CharacterCodingException e) {
            return "not UTF-8";
        }
        return RuleFileParser.parse(Path.of("rules.tufa"), text, VOCABULARY);
    }

    /** Ingests the bytes as one trend file; returns the report after reading every series. */
    static Object trends(Path dir, byte[] bytes, boolean strict, boolean naive) {
        Path file = dir.resolve("trends.csv");
        write(file, bytes);
        TimeOptions options = TimeOptions.defaults(naive ? ZoneId.of("America/Toronto") : null).withStrict(strict);
        try (TrendStore store = TrendStore.ingest(List.of(file), SERIES, RANGES, options, dir)) {
            for (String id : store.seriesIds()) {
                store.series(id);
            }
            return store.report();
        }
    }

    /** Reads the bytes as truth.csv beside the fixed findings folder {@link #findingsFolder}. */
    static Object truth(Path findings, byte[] bytes) {
        Path file = findings.resolve("truth.csv");
        write(file, bytes);
        return EvaluationFiles.read(findings, file);
    }

    /** A findings folder of two analysed units, as tufa analyze writes it. */
    static Path findingsFolder(Path dir) {
        try {
            Files.writeString(dir.resolve("fleet.csv"),
                    "unit,label,folder,status,reason,modes,samples_used,clusters,fault_clusters,fault_hours,energy_kwh\n"
                    + "urn:x#fcu-1,FCU 1,fcu-1,analyzed,,cooling,8,1,0,0.00,0.0\n"
                    + "urn:x#fcu-2,FCU 2,fcu-2,skipped,no zone sensor,,0,0,0,0.00,0.0\n");
            Files.writeString(dir.resolve("findings.csv"),
                    "unit,mode,kind,cluster,start,end,hours,energy_kwh,shift,candidate_causes\n"
                    + "urn:x#fcu-1,cooling,fault_cluster,1,2031-07-01T10:00:00Z,2031-07-01T11:00:00Z,1.00,0.5,,\n");
            Path unit = Files.createDirectories(dir.resolve("units").resolve("fcu-1"));
            StringBuilder modes = new StringBuilder("timestamp,mode,in_band\n");
            for (int h = 8; h < 16; h++) {
                modes.append(String.format(java.util.Locale.ROOT, "2031-07-01T%02d:00:00Z,cooling,true%n", h));
            }
            Files.writeString(unit.resolve("modes.csv"), modes.toString().replace("\r", ""));
            return dir;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static void write(Path file, byte[] bytes) {
        try {
            Files.write(file, bytes);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    // ---- seeds: small valid files of each kind ----

    static final byte[] POINT_LIST = resourceHead("org/tufa/demo/points.csv", 40);

    static final byte[] RULE_FILE = String.join("\n",
            "# a small rule file in the format of mapper/RULES-FORMAT.md",
            "building Pellow Row",
            "base-iri https://pellow.example.org/row/",
            "abbr ZN = Zone Air",
            "abbr DA = Discharge Air",
            "abbr T = Temperature",
            "abbr CHW = Chilled Water",
            "abbr VLV = Valve Position",
            "abbr CMD = Command",
            "unit-for Temperature DEG_F",
            "part CHWV Chilled_Water_Valve when Chilled Valve",
            "rule fcu",
            "  match name ^PR\\.FCU(?<n>\\d\\d)\\.(?<what>.+)$",
            "  class tags {what}",
            "  equipment FCU-{n} Fan_Coil_Unit",
            "  location Floor L1",
            "  fed-by Chilled_Water_Loop CHW",
            "  airflow 400 FT3-PER-MIN",
            "expect PR.FCU01.ZN-T => Zone_Air_Temperature_Sensor on FCU-01",
            "") .getBytes(StandardCharsets.UTF_8);

    static final byte[] TRENDS_LONG = ("timestamp,point,value\n"
            + "2031-07-01T10:00:00Z,ZNT,72.5\n2031-07-01T10:00:00Z,FAN,on\n2031-07-01T10:15:00Z,ZNT,73\n"
            + "2031-07-01T10:15:00-04:00,DAT,14.25\n2031-07-01 10:30,ZNT,\n\"2031-07-01T10:45:00Z\",\"DAT\",\"13\"\n"
            + "2031-07-01T11:00:00Z,OTHER,1\n").getBytes(StandardCharsets.UTF_8);

    static final byte[] TRENDS_WIDE = ("\uFEFFtimestamp,ZNT,DAT,FAN,OTHER\n"
            + "2031-07-01T10:00:00Z,72.5,14,1,0\n2031-07-01T10:15:00Z,73,,off,\n2031-11-02 01:30,71,13.5,true,2\n"
            + "2031-07-01T10:45:00.5Z,1e308,-500,2,x\n").getBytes(StandardCharsets.UTF_8);

    static final byte[] TRUTH = ("unit,fault,start,end,severity\n"
            + "urn:x#fcu-1,low_chw_flow,2031-07-01T09:00:00Z,2031-07-01T12:00:00Z,0.8\n"
            + "fcu-2,fan_failure,2031-07-01T08:00:00-04:00,2031-07-01T10:00:00-04:00,1\n"
            + "FCU 1,stuck_cooling_valve,2031-07-02T08:00:00Z,2031-07-02T09:00:00Z,0.5\n")
            .getBytes(StandardCharsets.UTF_8);

    private static byte[] resourceHead(String resource, int lines) {
        try (InputStream in = Readers.class.getClassLoader().getResourceAsStream(resource)) {
            if (in == null) {
                throw new IllegalStateException(resource + " missing");
            }
            String text = new String(in.readAllBytes(), StandardCharsets.UTF_8);
            return String.join("\n", text.lines().limit(lines).toList()).concat("\n")
                    .getBytes(StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
