package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.TreeMap;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.tufa.common.InputException;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.model.BuiltModel;
import org.tufa.mapper.model.IriMinter;
import org.tufa.mapper.model.ModelBuilder;
import org.tufa.mapper.points.ExportUnits;
import org.tufa.mapper.points.PointListReader;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.points.ReadOptions;
import org.tufa.mapper.report.MappingReport;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;
import org.tufa.vocabulary.QudtUnits;

/** Units, ids and links the mapper refuses or repairs, and the messages it gives for broken files. */
class MapperValidationTest {
    static BrickVocabulary vocab;

    @BeforeAll
    static void load() {
        vocab = BrickVocabulary.bundled();
    }

    private static RuleSet rules(String text) {
        return RuleFileParser.parse(Path.of("t.tufa"), "building T\n" + text, vocab);
    }

    private static PointRecord point(long line, String name) {
        return new PointRecord(line, name, "", "", "", "", "", "", new TreeMap<>());
    }

    private static BuiltModel build(String ruleText, String... names) {
        List<PointRecord> points = new java.util.ArrayList<>();
        for (int i = 0; i < names.length; i++) {
            points.add(point(i + 2, names[i]));
        }
        MappingResult result = Mapper.fit(rules(ruleText), vocab).map(points);
        return ModelBuilder.build(result, IriMinter.DEFAULT_BASE);
    }

    private static final String RULE = "rule r\n  match name ^(?<u>[^ ]+) T$\n  class Zone_Air_Temperature_Sensor\n"
            + "  equipment {u} Fan_Coil_Unit\n";

    @Test
    void unknownQudtUnitsAreRefusedWithTheNearestNames() {
        InputException e = assertThrows(InputException.class, () -> rules(RULE + "  unit BANANAS\n"));
        assertTrue(e.getMessage().startsWith("t.tufa:6: unknown QUDT unit 'BANANAS'"), e.getMessage());
        assertTrue(e.getMessage().contains("nearest: "), e.getMessage());
        e = assertThrows(InputException.class, () -> rules(RULE + "  unit DEG_FF\n"));
        assertTrue(e.getMessage().contains("nearest: DEG_F"), e.getMessage());
        // QUDT 3.1.0 spells these so (qudt.org unit vocabulary); case is repaired.
        assertEquals(Optional.of("DEG_F"), QudtUnits.canonical("deg_f"));
        assertEquals(Optional.of("FT3-PER-MIN"), QudtUnits.canonical("unit:FT3-PER-MIN"));
        assertEquals(Optional.of("KiloW-HR"), QudtUnits.canonical("http://qudt.org/vocab/unit/KILOW-HR"));
        assertEquals(Optional.empty(), ExportUnits.toQudt("unit:BANANAS"));
        assertEquals(Optional.of("DEG_C"), ExportUnits.toQudt("unit:DEG_C"));
    }

    @Test
    void everyUnitTheExportSpellingsNameIsAQudtUnit() {
        for (String spelling : List.of("°F", "degC", "K", "%", "%RH", "cfm", "l/s", "gpm", "W", "kW", "kWh", "Pa",
                "in wc", "kPa", "psi", "MWh", "ppm", "rpm", "btu/h")) {
            String unit = ExportUnits.toQudt(spelling).orElseThrow();
            assertEquals(Optional.of(unit), QudtUnits.canonical(unit), spelling);
        }
    }

    @Test
    void dotSegmentIdsAreEncodedSoTheyStayDistinctAfterReadingBack() {
        Model m = build(RULE, ". T", ".. T", "... T", "a.b T").model();
        java.util.Set<String> units = new java.util.TreeSet<>();
        m.listSubjectsWithProperty(org.apache.jena.vocabulary.RDF.type,
                m.createResource("https://brickschema.org/schema/Brick#Fan_Coil_Unit"))
                .forEachRemaining(r -> units.add(r.getURI()));
        assertEquals(4, units.size(), units.toString());
        assertTrue(units.contains(IriMinter.DEFAULT_BASE + "equipment/%2E"), units.toString());
        assertTrue(units.contains(IriMinter.DEFAULT_BASE + "equipment/%2E%2E"), units.toString());
        assertTrue(units.contains(IriMinter.DEFAULT_BASE + "equipment/a.b"), units.toString());
        // Resolved against a base (RFC 3986 section 5.2.4), an encoded dot segment is not removed.
        assertNotEquals(java.net.URI.create("https://x/equipment/").resolve("%2E").toString(),
                java.net.URI.create("https://x/equipment/").resolve(".").toString());
    }

    @Test
    void aUnitThatIsItsOwnPartOrFeedsItselfIsRefusedWithTheRuleLine() {
        InputException part = assertThrows(InputException.class,
                () -> build(RULE + "  part {u} Fan_Coil_Unit\n", "FCU1 T"));
        assertTrue(part.getMessage().startsWith("t.tufa:2: equipment 'FCU1' would be its own part"), part.getMessage());
        InputException feeds = assertThrows(InputException.class,
                () -> build(RULE + "  feeds Fan_Coil_Unit {u}\n", "FCU1 T"));
        assertTrue(feeds.getMessage().startsWith("t.tufa:2: equipment 'FCU1' would feed itself"), feeds.getMessage());
        InputException fedBy = assertThrows(InputException.class,
                () -> build(RULE + "  fed-by Fan_Coil_Unit {u}\n", "FCU1 T"));
        assertTrue(fedBy.getMessage().contains("would be fed by itself"), fedBy.getMessage());
    }

    @Test
    void aFeedsCycleOfSeveralUnitsIsAWarning() {
        // A feeds B (rule a), B feeds A (rule b): worked example of a two-node cycle.
        String text = "rule a\n  match name ^A T$\n  class Zone_Air_Temperature_Sensor\n  equipment A Fan_Coil_Unit\n"
                + "  feeds Fan_Coil_Unit B\n"
                + "rule b\n  match name ^B T$\n  class Zone_Air_Temperature_Sensor\n  equipment B Fan_Coil_Unit\n"
                + "  feeds Fan_Coil_Unit A\n";
        BuiltModel m = build(text, "A T", "B T");
        assertTrue(m.warnings().stream().anyMatch(w -> w.contains("brick:feeds goes round in a circle")),
                m.warnings().toString());
        assertFalse(build(RULE, "A T", "B T").warnings().stream().anyMatch(w -> w.contains("circle")));
    }

    @Test
    void reportCellsThatASpreadsheetWouldRunAreNeutralised() throws Exception {
        MappingResult result = Mapper.fit(rules(RULE), vocab).map(List.of(point(2, "=HYPERLINK(\"http://x\")"),
                point(3, "+SUM(A1)"), point(4, "@cmd"), point(5, "-1 T"), point(6, "FCU1 T")));
        StringWriter w = new StringWriter();
        MappingReport.write(result, w);
        List<String> lines = w.toString().lines().toList();
        // OWASP CSV injection guidance: a leading = + - @ TAB CR gets an apostrophe.
        assertTrue(lines.get(1).startsWith("2,\"'=HYPERLINK(\"\"http://x\"\")\""), lines.get(1));
        assertTrue(lines.get(2).startsWith("3,'+SUM(A1)"), lines.get(2));
        assertTrue(lines.get(3).startsWith("4,'@cmd"), lines.get(3));
        assertTrue(lines.get(4).contains(",'-1,"), lines.get(4));
        assertTrue(lines.get(5).startsWith("6,FCU1 T,mapped"), lines.get(5));
        assertEquals("=x", org.tufa.common.CsvCells.restore(org.tufa.common.CsvCells.neutral("=x")));
        assertEquals("'quoted", org.tufa.common.CsvCells.restore("'quoted"));
    }

    @Test
    void ruleFileMessagesNameTheNearestTagAndThePositiveAirflow() {
        InputException tag = assertThrows(InputException.class, () -> rules("abbr T = Wibble\n"));
        assertTrue(tag.getMessage().startsWith("t.tufa:2: unknown Brick tag 'Wibble'"), tag.getMessage());
        assertTrue(tag.getMessage().contains("; nearest: "), tag.getMessage());
        for (String v : List.of("-400", "0")) {
            InputException air = assertThrows(InputException.class, () -> rules(RULE + "  airflow " + v
                    + " FT3-PER-MIN\n"));
            assertTrue(air.getMessage().contains("a nominal airflow is a positive volume flow"), air.getMessage());
            assertFalse(air.getMessage().contains("not a number"), air.getMessage());
        }
        assertTrue(rules(RULE + "  airflow 400 FT3-PER-MIN\n").rules().get(0).airflow().isPresent());
    }

    @Test
    void pointListEncodingQuotesAndBinaryAreNamedPrecisely() {
        byte[] utf16 = "Point Name,Units\nA,degF\n".getBytes(StandardCharsets.UTF_16LE);
        InputException e = assertThrows(InputException.class,
                () -> PointListReader.parse(Path.of("p.csv"), utf16, ReadOptions.detect()));
        assertTrue(e.getMessage().contains("UTF-16LE"), e.getMessage());
        byte[] quote = "Point Name,Units\nA,degF\nB,degF\nC,degF\n\"D,degF\nE,degF\nF,degF\nG,degF\n"
                .getBytes(StandardCharsets.UTF_8);
        e = assertThrows(InputException.class,
                () -> PointListReader.parse(Path.of("p.csv"), quote, ReadOptions.detect()));
        assertTrue(e.getMessage().startsWith("p.csv:5: a double quote opened on this line is never closed"),
                e.getMessage());
        byte[] binary = {0x7f, 'E', 'L', 'F', 2, 1, 1, 0, 0, 0, 0x1b, '[', '2', 'J', '\n'};
        e = assertThrows(InputException.class,
                () -> PointListReader.parse(Path.of("p.csv"), binary, ReadOptions.detect()));
        assertTrue(e.getMessage().contains("binary data"), e.getMessage());
        assertTrue(e.getMessage().chars().noneMatch(c -> c < 0x20), e.getMessage());
    }

    @Test
    void ruleFilesInUtf16OrBinaryAreNamedAsSuch(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        Path utf16 = dir.resolve("r.tufa");
        java.nio.file.Files.write(utf16, "building B\n".getBytes(StandardCharsets.UTF_16LE));
        InputException e = assertThrows(InputException.class, () -> RuleFileParser.parse(utf16, vocab));
        assertTrue(e.getMessage().contains("UTF-16LE"), e.getMessage());
        Path bin = dir.resolve("b.tufa");
        java.nio.file.Files.write(bin, new byte[] {0x7f, 'E', 'L', 'F', 2, 1, 1, 0, 0, 0});
        e = assertThrows(InputException.class, () -> RuleFileParser.parse(bin, vocab));
        assertTrue(e.getMessage().contains("binary data"), e.getMessage());
    }
}
