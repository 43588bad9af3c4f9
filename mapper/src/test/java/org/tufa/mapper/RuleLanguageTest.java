package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.TreeMap;
import org.apache.jena.query.QueryExecutionFactory;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;
import org.tufa.mapper.cli.MapCommand;
import org.tufa.mapper.learn.Example;
import org.tufa.mapper.learn.ExampleLearner;
import org.tufa.mapper.match.Assignment;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;
import org.tufa.mapper.match.Status;
import org.tufa.mapper.match.UnmappedExplainer;
import org.tufa.mapper.model.ModelBuilder;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.report.MappingReport;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.mapper.rules.Tokenizer;
import org.tufa.mapper.rules.TradeAbbreviations;
import org.tufa.vocabulary.BrickVocabulary;
import picocli.CommandLine;

/**
 * The rule-language additions of issue 12, each on a small invented list (fictional names; the expected classes
 * are Brick 1.4.4's, worked by hand from its tag sets and deprecations).
 */
class RuleLanguageTest {

    static BrickVocabulary vocab;

    @BeforeAll
    static void load() {
        vocab = BrickVocabulary.bundled();
    }

    static RuleSet rules(String text) {
        return RuleFileParser.parse(Path.of("t.tufa"), "building T\n" + text, vocab);
    }

    static MappingResult map(String text, String... names) {
        List<PointRecord> points = new java.util.ArrayList<>();
        for (int i = 0; i < names.length; i++) {
            points.add(new PointRecord(i + 2, names[i], "", "", "", "", "", "", new TreeMap<>()));
        }
        return Mapper.fit(rules(text), vocab).map(points);
    }

    static Assignment a(MappingResult r, int i) {
        return r.mappings().get(i).assignment().orElseThrow();
    }

    @Test
    void skipLinesLeaveThePointOutWithTheirReasonAndExplainIgnoresThem() {
        MappingResult r = map("skip _REQ$ because request points are not modelled\n"
                + "rule v\n  match name ^VAV(?<n>\\d+)_(?<w>.+)$\n  class tags {w}\n  equipment VAV{n} "
                + "Variable_Air_Volume_Box\n", "VAV1_ZN_T_REQ", "VAV1_QQQ");
        assertEquals(Status.SKIPPED, r.mappings().get(0).status());
        assertEquals("skip t.tufa:2: request points are not modelled", r.mappings().get(0).reason());
        var x = UnmappedExplainer.explain(r.mappings(), r.rules().dictionary(), vocab, 5);
        assertEquals(1, x.open(), "the skipped point is not open");
        assertEquals("VAV#_QQQ", x.groups().get(0).shape());
    }

    @Test
    void matchLinesCombineWithAndAndNot() {
        String text = "rule v\n  match name ^VAV(?<n>\\d+)\n  match name _T$\n  match not name _SP_\n"
                + "  class Zone_Air_Temperature_Sensor\n  equipment VAV{n} Variable_Air_Volume_Box\n";
        MappingResult r = map(text, "VAV3_ZN_T", "VAV3_ZN_SP_T", "VAV3_ZN_H", "AHU1_T");
        assertEquals(Status.MAPPED, r.mappings().get(0).status());
        assertEquals("VAV3", a(r, 0).equipmentId());
        assertEquals(List.of(Status.UNMAPPED, Status.UNMAPPED, Status.UNMAPPED),
                r.mappings().subList(1, 4).stream().map(PointMapping::status).toList());
        // the pre-filter uses the name pattern's literal prefix: ^VAV
        assertEquals(java.util.Optional.of("VAV"), r.rules().rules().get(0).literalPrefix());
    }

    @Test
    void tablesGiveEquipmentAndPartClassesFromAGroup() {
        String text = "table KINDS SF=Supply_Fan RF=Return_Fan\n"
                + "rule fans\n  match name ^(?<k>[A-Za-z]+)(?<n>\\d)_(?<w>.+)$\n  class tags {w}\n"
                + "  equipment {k}{n} KINDS[{k}]\ntable KINDS EF=Exhaust_Fan\n";
        MappingResult r = map(text, "SF1_STS", "ef2_STS", "XF3_STS");
        assertEquals("Supply_Fan", a(r, 0).equipment().orElseThrow().className());
        assertEquals("Exhaust_Fan", a(r, 1).equipment().orElseThrow().className(), "keys ignore case");
        assertEquals(Status.UNCLASSIFIED, r.mappings().get(2).status());
        assertTrue(r.mappings().get(2).reason().contains("'XF' is not in table KINDS"), r.mappings().get(2).reason());
        InputException e = assertThrows(InputException.class, () -> rules("rule a\n  match name ^A\n"
                + "  equipment A NOPE[{name}]\n"));
        assertTrue(e.getMessage().startsWith("t.tufa:4: no table 'NOPE' above this line"), e.getMessage());
    }

    @Test
    void pointsWithoutEquipmentAreWrittenIntoTheirLocation() {
        MappingResult r = map("default-role Sensor\nrule rooms\n  match name ^RM(?<r>\\d+)_(?<w>.+)$\n"
                + "  class tags {w}\n  location rec:Level L{r|int}\n  location Room R{r}\n", "RM0312_CO2");
        assertEquals("CO2_Sensor", a(r, 0).className());
        Model m = ModelBuilder.build(r, "https://x.example.org/b/").model();
        String q = "PREFIX brick: <https://brickschema.org/schema/Brick#> PREFIX rec: <https://w3id.org/rec#> "
                + "ASK { ?p a brick:CO2_Sensor ; brick:isPointOf ?room . ?room a brick:Room ; brick:isPartOf ?lvl . "
                + "?lvl a rec:Level ; brick:isPartOf ?b . ?b a brick:Building }";
        try (var qe = QueryExecutionFactory.create(q, m)) {
            assertTrue(qe.execAsk(), "point -> room -> rec:Level -> building");
        }
    }

    @Test
    void tokenizerKeepsLetterDigitTagsAndStripsDeclaredControllerSuffixes() {
        List<String> whole = List.of("PM2.5", "PM10", "CO2");
        assertEquals(List.of("Space", "CO2", "Sensor"), Tokenizer.tokens("SpaceCO2Sensor", whole));
        assertEquals(List.of("ZN", "PM2.5"), Tokenizer.tokens("ZN_PM2.5", whole));
        assertEquals(List.of("PM10", "A"), Tokenizer.tokens("PM10A", whole));
        assertEquals(List.of("CO", "25"), Tokenizer.tokens("CO25", whole), "CO2 followed by a digit is not CO2");
        MappingResult r = map("default-role Sensor\nstrip (?:dac|pgm)\\d+(?:UIP\\d+)?\n"
                + "rule d\n  match name ^(?<w>Discharge_Air_\\w+)$\n  class tags {w}\n",
                "Discharge_Air_Temperaturedac1", "Discharge_Air_Temppgm2UIP09");
        assertEquals("Discharge_Air_Temperature_Sensor", vocab.sameClass(a(r, 0).className(),
                "Discharge_Air_Temperature_Sensor") ? "Discharge_Air_Temperature_Sensor" : a(r, 0).className());
        assertTrue(vocab.sameClass(a(r, 1).className(), "Discharge_Air_Temperature_Sensor"), a(r, 1).className());
    }

    @Test
    void abbrWithADashIgnoresEachTokenAndTheRulesDictionaryComesFirst() {
        RuleSet rs = rules("abbr PGM DAC UIP = -\nabbr ZN T = Zone Air Temperature Setpoint\n"
                + "rule a\n  match name ^A_(?<w>.+)$\n  class tags {w}\n  abbr ZN = Zone Air\n  abbr T = Temperature\n");
        var lookup = rs.rules().get(0).dictionary().lookup("ZN T DAC UIP", vocab);
        // the rule's one-token ZN beats the file's two-token ZN T (the format's order: rule, then file)
        assertEquals(new java.util.TreeSet<>(List.of("Air", "Temperature", "Zone")), lookup.tags());
        assertEquals(List.of(), lookup.unknownTokens(), "DAC and UIP are ignored one by one");
    }

    @Test
    void closeCallsAreAmbiguousBarePointsUnclassifiedAndTheReportShowsScoreAndRunnerUp() throws Exception {
        // no object type and no role word: {Zone, Air, Temperature, Point} fits Zone_Air_Temperature_Sensor (4/5)
        // and the deprecated Zone_Air_Temperature_Setpoint (4/5, answering Target_Zone_Air_Temperature_Setpoint)
        MappingResult r = map("rule a\n  match name ^FCU1_(?<w>.+)$\n  class tags {w}\n  equipment FCU1 "
                + "Fan_Coil_Unit\n", "FCU1_ZN_T", "FCU1_QQQ_PT", "FCU1_ZN_T_STS");
        PointMapping amb = r.mappings().get(0);
        assertEquals(Status.AMBIGUOUS, amb.status());
        assertEquals(0.8, amb.assignment().orElseThrow().score(), 1e-12);
        assertEquals(0.8, amb.assignment().orElseThrow().runnerUpScore(), 1e-12);
        assertTrue(amb.reason().contains("too close to call"), amb.reason());
        assertFalse(amb.classified(), "an ambiguous point is written as a plain brick:Point");
        assertEquals(Status.UNCLASSIFIED, r.mappings().get(1).status(), "no tag at all");
        StringWriter csv = new StringWriter();
        MappingReport.write(r, csv);
        String[] lines = csv.toString().split("\n");
        assertEquals("line,point,status,reason,rule,class,equipment,part,score,runner_up,runner_up_score", lines[0]);
        assertTrue(lines[1].startsWith("2,FCU1_ZN_T,ambiguous,"), lines[1]);
        assertTrue(lines[1].endsWith(",FCU1,,0.800,Zone_Air_Temperature_Sensor,0.800")
                || lines[1].endsWith(",FCU1,,0.800,Target_Zone_Air_Temperature_Setpoint,0.800"), lines[1]);
        // default-role settles it for an export without object types
        MappingResult d = map("default-role Sensor\nrule a\n  match name ^FCU1_(?<w>.+)$\n  class tags {w}\n",
                "FCU1_ZN_T");
        assertEquals(Status.MAPPED, d.mappings().get(0).status());
        assertEquals("Zone_Air_Temperature_Sensor", a(d, 0).className());
    }

    @Test
    void waterSupplyAndReturnResolveToLeavingAndEntering() {
        // Brick 1.3.0 deprecated Chilled_Water_Supply_Temperature_Sensor (isReplacedBy
        // Leaving_Chilled_Water_Temperature_Sensor) and the return/entering pair likewise (Brick.ttl, 1.4.4)
        MappingResult r = map("default-role Sensor\nrule p\n  match name ^PLANT_(?<w>.+)$\n  class tags {w}\n",
                "PLANT_CHW_SUPPLY_TEMP", "PLANT_CHW_RETURN_TEMP", "PLANT_HWS_TEMP");
        assertEquals("Leaving_Chilled_Water_Temperature_Sensor", a(r, 0).className());
        assertEquals("Entering_Chilled_Water_Temperature_Sensor", a(r, 1).className());
        assertEquals("Leaving_Hot_Water_Temperature_Sensor", a(r, 2).className(), "built-in HWS, then the rename");
        assertTrue(r.mappings().get(0).reason().contains("deprecated; written as"), r.mappings().get(0).reason());
    }

    @Test
    void everyBuiltInAbbreviationNamesItsSourceAndUsesBrickTags() {
        var all = TradeAbbreviations.all();
        assertTrue(all.size() >= 60, "a useful list: " + all.size());
        java.util.Set<List<String>> keys = new java.util.HashSet<>();
        for (var e : all) {
            assertFalse(e.source().isBlank(), "line " + e.line() + " names no source");
            assertTrue(keys.add(e.key()), "key " + e.key() + " twice");
            for (String t : e.tags()) {
                assertTrue(vocab.isTag(t), "line " + e.line() + ": " + t + " is not a Brick 1.4.4 tag");
            }
        }
        for (String k : List.of("ZN", "RM", "SPC", "DA", "SA", "RA", "OA", "MA", "TEMP", "TMP", "T", "STPT", "SP",
                "CLG", "HTG", "VLV", "DMPR", "DPR", "CMD", "STS", "FLW", "CFM", "CO2", "OCC")) {
            assertTrue(keys.contains(List.of(k)), "the issue's list names " + k);
        }
        // a file with no abbr lines still reads common names
        MappingResult r = map("default-role Sensor\nrule a\n  match name ^VAV1-(?<w>.+)$\n  class tags {w}\n",
                "VAV1-DA-TEMP");
        assertTrue(vocab.isA(a(r, 0).className(), "Discharge_Air_Temperature_Sensor")
                || vocab.sameClass(a(r, 0).className(), "Supply_Air_Temperature_Sensor"), a(r, 0).className());
    }

    @Test
    void explainCollapsesOrdinalsAndRoomSuffixesAndProposesWhatToLabel() {
        MappingResult r = map("rule a\n  match name ^NEVER$\n  class Point\n", "RM_1_QQ", "RM_B2_QQ", "RM_3A_QQ",
                "RM_4_QQ", "AHU-1/BLORP", "AHU-2/BLORP", "X9_ZORK");
        var x = UnmappedExplainer.explain(r.mappings(), r.rules().dictionary(), vocab, 3);
        assertEquals("RM_#_QQ", x.groups().get(0).shape());
        assertEquals(4, x.groups().get(0).count());
        assertEquals("BLORP", x.groups().get(1).shape(), "a path's own segment");
        assertEquals(java.util.Map.entry("QQ", 4), x.unknownTokens().get(0));
        assertEquals("RM_1_QQ", x.labelNext().get(0).name());
        assertEquals(4, x.labelNext().get(0).settles());
    }

    @Test
    void examplesTeachARuleAndItsDictionary() {
        // an invented list: VAV boxes named <what>_box_<n>, where this site writes "hmd" for humidity
        String text = "building T\ndefault-role Sensor\n";
        List<Example> ex = List.of(
                new Example(PointRecord.named("zn_temp_box_12"), "Zone_Air_Temperature_Sensor", "VAV-12",
                        "Variable_Air_Volume_Box", 2),
                new Example(PointRecord.named("zn_hmd_box_12"), "Zone_Air_Humidity_Sensor", "VAV-12",
                        "Variable_Air_Volume_Box", 3),
                new Example(PointRecord.named("zn_temp_box_7"), "Zone_Air_Temperature_Sensor", "VAV-7",
                        "Variable_Air_Volume_Box", 4),
                new Example(PointRecord.named("zn_hmd_box_7"), "Zone_Air_Humidity_Sensor", "VAV-7",
                        "Variable_Air_Volume_Box", 5));
        ExampleLearner.Learned l = ExampleLearner.fit(Path.of("t.tufa"), text, vocab, ex);
        assertEquals(0, l.before());
        assertEquals(4, l.after(), "reproduces every example: " + l);
        assertTrue(String.join("\n", l.newRules()).contains("equipment VAV-{id} Variable_Air_Volume_Box"),
                String.join("\n", l.newRules()));
        assertTrue(l.ruleLines().values().stream().flatMap(List::stream).anyMatch(x -> x.startsWith("abbr HMD = ")),
                l.ruleLines().toString());
    }

    @Test
    void theCommandPrintsTheExplanationAndTheLearnedLines(@TempDir Path dir) throws Exception {
        Path points = dir.resolve("p.csv");
        Files.writeString(points, "Name\nzn_temp_box_3\nzn_hmd_box_3\nzn_temp_box_4\nzn_hmd_box_4\n",
                StandardCharsets.UTF_8);
        Path rules = dir.resolve("r.tufa");
        Files.writeString(rules, "building B\ndefault-role Sensor\n");
        Path examples = dir.resolve("ex.csv");
        Files.writeString(examples, "point_name,brick_class,equipment,equipment_class\n"
                + "zn_temp_box_3,Zone_Air_Temperature_Sensor,VAV-3,Variable_Air_Volume_Box\n"
                + "zn_hmd_box_3,Zone_Air_Humidity_Sensor,VAV-3,Variable_Air_Volume_Box\n");
        StringWriter console = new StringWriter();
        CommandLine cli = new CommandLine(new MapCommand());
        cli.setOut(new java.io.PrintWriter(console));
        int code = cli.execute("--points", points.toString(), "--rules", rules.toString(), "--out",
                dir.resolve("m.ttl").toString(), "--explain", "--examples", examples.toString());
        String text = console.toString();
        assertEquals(0, code, text);
        assertTrue(text.contains("points that need a person (4)"), text);
        assertTrue(text.contains("zn_temp_box_#"), text);
        assertTrue(text.contains("label these next"), text);
        assertTrue(text.contains("examples: 2; the rules reproduce 0 of them, and 2 with these lines:"), text);
        assertTrue(text.contains("equipment VAV-{id} Variable_Air_Volume_Box"), text);
    }

    @Test
    void aFailedRunRemovesTheOutputsItWouldHaveReplacedAndEveryOptionIsDescribed(@TempDir Path dir)
            throws Exception {
        Path points = dir.resolve("p.csv");
        Files.writeString(points, "Name\nFCU1_ZN_T\n", StandardCharsets.UTF_8);
        Path out = dir.resolve("m.ttl");
        Path report = dir.resolve("m.csv");
        Files.writeString(out, "stale");
        Files.writeString(report, "stale");
        Path rules = dir.resolve("bad.tufa");
        Files.writeString(rules, "building B\nrule a\n  match name ^F\n  class Not_A_Class\n");
        MapCommand cmd = new MapCommand();
        new CommandLine(cmd).parseArgs("--points", points.toString(), "--rules", rules.toString(), "--out",
                out.toString(), "--report", report.toString());
        assertThrows(InputException.class, cmd::call);
        assertFalse(Files.exists(out), "stale model removed");
        assertFalse(Files.exists(report), "stale report removed");
        assertTrue(Files.exists(points) && Files.exists(rules), "inputs untouched");
        for (var o : new CommandLine(new MapCommand()).getCommandSpec().options()) {
            assertTrue(o.description().length > 0 && !o.description()[0].isBlank(), o.longestName()
                    + " has no --help line");
        }
    }
}
