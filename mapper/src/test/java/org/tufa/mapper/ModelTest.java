package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.apache.jena.query.QueryExecutionFactory;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;
import org.tufa.mapper.cli.MapCommand;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.model.IriMinter;
import org.tufa.mapper.model.ModelBuilder;
import org.tufa.mapper.model.ModelFiles;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.report.MappingReport;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.vocabulary.BrickVocabulary;
import picocli.CommandLine;

class ModelTest {

    static BrickVocabulary vocab;

    @TempDir
    Path dir;

    @BeforeAll
    static void load() {
        vocab = BrickVocabulary.bundled();
    }

    static final String RULES = "building Test Hall\nabbr ZN = Zone Air\nabbr T = Temperature\n"
            + "abbr CHW = Chilled Water\nabbr VLV = Valve Position\nabbr CMD = Command\n"
            + "part CHWV Chilled_Water_Valve when Chilled Valve\n"
            + "rule fcu\n  match name (?s)^FCU-(?<f>\\d+)-(?<u>\\d+)(?<what>.*)$\n  class tags {what}\n"
            + "  equipment FCU-{f}-{u} Fan_Coil_Unit\n  location Floor F{f}\n  fed-by Chilled_Water_Loop CHW\n"
            + "  airflow 400 FT3-PER-MIN\n  unit DEG_F\n";

    /** Names with quotes, angle brackets, a newline, a tab, non-ASCII text and a backslash. */
    static final List<String> NASTY = List.of("FCU-1-1 \"ZN\" <T>", "FCU-1-2 ZN\nT", "FCU-1-3 Zone T ÄÖ 温度",
            "FCU-1-4 ZN T \\ & # % / ?", "FCU-1-5\tZN T 😀");

    private MappingResult result() {
        List<PointRecord> points = new java.util.ArrayList<>();
        long line = 2;
        for (String n : NASTY) {
            points.add(new PointRecord(line++, n, "", "", "AI", "AI", "", "", new TreeMap<>()));
        }
        points.add(new PointRecord(line++, "FCU-2-1.CHW-VLV-CMD", "cooling valve", "%", "AO", "analog-output", "D1",
                "TL-9", new TreeMap<>(java.util.Map.of("Panel", "P3"))));
        points.add(new PointRecord(line, "orphan <x>", "", "", "", "", "", "", new TreeMap<>()));
        var rs = RuleFileParser.parse(Path.of("t.tufa"), RULES, vocab);
        return Mapper.fit(rs, vocab).map(points);
    }

    @Test
    void awkwardNamesRoundTripExactlyInEverySyntax() {
        MappingResult r = result();
        Model m = ModelBuilder.build(r, "https://example.org/b/").model();
        for (String ext : List.of("ttl", "nt", "jsonld")) {
            Path f = dir.resolve("model." + ext);
            ModelFiles.write(m, f);
            Model back = ModelFiles.read(f);
            assertTrue(back.isIsomorphicWith(m), ext);
            Set<String> labels = new TreeSet<>();
            try (var qe = QueryExecutionFactory.create("PREFIX brick: <https://brickschema.org/schema/Brick#> "
                    + "PREFIX rdfs: <http://www.w3.org/2000/01/rdf-schema#> SELECT ?l WHERE { ?p a "
                    + "brick:Zone_Air_Temperature_Sensor ; rdfs:label ?l }", back)) {
                qe.execSelect().forEachRemaining(s -> labels.add(s.getLiteral("l").getString()));
            }
            assertEquals(new TreeSet<>(NASTY), labels, ext);
        }
    }

    @Test
    void writingTwiceGivesIdenticalBytes() throws Exception {
        for (String ext : List.of("ttl", "nt", "jsonld")) {
            Path a = dir.resolve("a." + ext);
            Path b = dir.resolve("b." + ext);
            ModelFiles.write(ModelBuilder.build(result(), "https://example.org/b/").model(), a);
            ModelFiles.write(ModelBuilder.build(result(), "https://example.org/b/").model(), b);
            assertArrayEquals(Files.readAllBytes(a), Files.readAllBytes(b), ext);
        }
        String ttl = Files.readString(dir.resolve("a.ttl"));
        assertTrue(!ttl.contains("_:") && !ttl.contains("[ "), "no blank nodes in the Turtle output");
    }

    @Test
    void modelHasTheBrickStructure() {
        Model m = ModelBuilder.build(result(), "https://example.org/b/").model();
        String q = "PREFIX brick: <https://brickschema.org/schema/Brick#> PREFIX ref: "
                + "<https://brickschema.org/schema/Brick/ref#> PREFIX unit: <http://qudt.org/vocab/unit/> "
                + "PREFIX tufa: <https://tufa.example.org/ns#> ASK { ?b a brick:Building ; brick:hasPart ?fl . "
                + "?fl a brick:Floor . ?u a brick:Fan_Coil_Unit ; brick:hasLocation ?fl ; brick:hasPart ?v ; "
                + "brick:isFedBy ?loop ; tufa:nominalAirflow [ brick:value ?flow ; brick:hasUnit unit:FT3-PER-MIN ] . FILTER(?flow = 400) "
                + "?loop a brick:Chilled_Water_Loop ; brick:feeds ?u . ?v a brick:Chilled_Water_Valve ; "
                + "brick:isPartOf ?u ; brick:hasPoint ?p . ?p a brick:Valve_Position_Command ; brick:isPointOf ?v ; "
                + "brick:hasUnit unit:PERCENT ; ref:hasExternalReference [ a ref:TimeseriesReference ; "
                + "ref:hasTimeseriesId \"TL-9\" ] ; tufa:exportField [ tufa:fieldName \"Panel\" ; tufa:fieldValue "
                + "\"P3\" ] . ?z a brick:Zone_Air_Temperature_Sensor ; brick:hasUnit unit:DEG_F ; "
                + "ref:hasExternalReference [ ref:hasTimeseriesId \"FCU-1-2 ZN\\nT\" ] . "
                + "?o a brick:Point ; tufa:mappingStatus \"unmapped\" }";
        try (var qe = QueryExecutionFactory.create(q, m)) {
            assertTrue(qe.execAsk());
        }
    }

    @Test
    void irisArePercentEncodedSegments() {
        // RFC 3986 2.1/2.3: unreserved kept, everything else as %XX of its UTF-8 bytes (ä = C3 A4 in UTF-8)
        assertEquals("FCU-1.a_b~c", IriMinter.segment("FCU-1.a_b~c"));
        assertEquals("A%2FB%20%C3%A4%22%3C%3E", IriMinter.segment("A/B ä\"<>"));
        IriMinter m = new IriMinter("https://x.org/b");
        assertEquals("https://x.org/b/point/D%201/AI1;2", m.point("D 1", "AI1", 2));
    }

    @Test
    void reportHasOneRowPerInputRow() throws Exception {
        MappingResult r = result();
        java.io.StringWriter w = new java.io.StringWriter();
        MappingReport.write(r, w);
        List<CSVRecord> rows = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(new StringReader(w.toString())).getRecords();
        assertEquals(r.mappings().size(), rows.size());
        assertEquals(MappingReport.HEADER, List.copyOf(CSVFormat.RFC4180.parse(new StringReader(w.toString()))
                .getRecords().get(0).toList()));
        assertEquals("FCU-1-2 ZN\nT", rows.get(1).get("point"));
        assertEquals("CHWV", rows.get(5).get("part"));
        assertEquals("t.tufa:8", rows.get(5).get("rule"));
        assertEquals("unmapped", rows.get(6).get("status"));
    }

    @Test
    void commandWritesOutputsAndExitsThreeOnAFailedExpectation() throws Exception {
        Path points = dir.resolve("points.csv");
        Files.writeString(points, "Name,Units,Type\nFCU-1-1 ZN T,°F,AI\nFCU-1-1 ZN T,°F,AI\n,,\nAHU-1 SAT,°F,AI\n",
                StandardCharsets.UTF_8);
        Path rules = dir.resolve("r.tufa");
        Files.writeString(rules, RULES + "expect \"FCU-9-9 ZN T\" type AI => Zone_Air_Temperature_Sensor on FCU-9-9\n");
        Path out = dir.resolve("out/model.ttl");
        Path report = dir.resolve("out/mapping.csv");
        java.io.StringWriter console = new java.io.StringWriter();
        CommandLine cli = new CommandLine(new MapCommand());
        cli.setOut(new java.io.PrintWriter(console));
        int code = cli.execute("--points", points.toString(), "--rules", rules.toString(), "--out", out.toString(),
                "--report", report.toString(), "--explain");
        assertEquals(0, code, console.toString());
        String text = console.toString();
        assertTrue(text.contains("points read: 4") && text.contains("mapped 0, ambiguous 0, unclassified 0, unmapped 1, "
                + "skipped 0, conflict 0, duplicate 2, rejected 1") && text.contains("Fan_Coil_Unit: 1") && text.contains("AHU-# SAT"), text);
        assertEquals(5, Files.readAllLines(report).size(), "header + one row per input row");

        Files.writeString(rules, RULES + "expect \"FCU-9-9 ZN T\" type AI => Fan_Status\n");
        Files.delete(out);
        CommandLine second = new CommandLine(new MapCommand());
        java.io.StringWriter console2 = new java.io.StringWriter();
        second.setOut(new java.io.PrintWriter(console2));
        code = second.execute("--points", points.toString(), "--rules", rules.toString(),
                "--out", out.toString());
        assertEquals(3, code);
        assertTrue(console2.toString().contains("expectations: 0 passed, 1 failed"), console2.toString());
        assertTrue(Files.size(out) > 0, "outputs written even when an expectation fails");

        MapCommand bad = new MapCommand();
        new CommandLine(bad).parseArgs("--points", dir.resolve("none.csv").toString(), "--rules", rules.toString(),
                "--out", out.toString());
        assertTrue(assertThrows(InputException.class, bad::call).getMessage().contains("not found"));
    }
}
