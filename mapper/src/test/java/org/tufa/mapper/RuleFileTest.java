package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.tufa.common.InputException;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.mapper.rules.Template;
import org.tufa.mapper.rules.Tokenizer;
import org.tufa.vocabulary.BrickVocabulary;

class RuleFileTest {

    static BrickVocabulary vocab;
    static final Path FILE = Path.of("site.tufa");

    @BeforeAll
    static void load() {
        vocab = BrickVocabulary.bundled();
    }

    static RuleSet parse(String text) {
        return RuleFileParser.parse(FILE, text, vocab);
    }

    static String error(String text) {
        return assertThrows(InputException.class, () -> parse(text)).getMessage();
    }

    static final String HEAD = "building Test Hall\n";

    @Test
    void parsesAFullRule() {
        RuleSet rs = parse(HEAD + "abbr ZN = Zone Air\nabbr T = Temperature\n"
                + "part CHWV Chilled_Water_Valve when Cool Valve\n"
                + "rule fcu\n  match name ^FCU-(?<f>\\d)-(?<u>\\d+)\\.(?<what>.+)$\n  match type AI AV\n"
                + "  class tags {what}\n  equipment FCU-{f}-{u} Fan_Coil_Unit\n  location Floor F{f}\n"
                + "  fed-by Chilled_Water_Loop CHW\n  airflow 400 cfm\n  unit degF\n  compete zone\n"
                + "expect FCU-1-2.ZN-T type AI => Zone_Air_Temperature_Sensor on FCU-1-2\n");
        assertEquals("Test Hall", rs.building());
        assertEquals(1, rs.rules().size());
        var r = rs.rules().get(0);
        assertEquals("site.tufa:5", r.label());
        assertEquals(Optional.of("FCU-"), r.literalPrefix());
        assertEquals("FT3-PER-MIN", r.airflow().orElseThrow().unit());
        assertEquals(Optional.of("DEG_F"), r.unit());
        assertEquals(java.util.Set.of("AI", "AV"), r.types());
        assertEquals(1, rs.expectations().size());
        assertEquals("Chilled_Water_Valve", rs.parts().get(0).className().fixed());
        assertEquals(java.util.Set.of("Cool", "Valve"), rs.parts().get(0).when());
    }

    @Test
    void syntaxErrorsNameFileLineAndWhatToDo() {
        assertTrue(error(HEAD + "rul fcu\n").startsWith("site.tufa:2: unknown keyword 'rul' (did you mean 'rule'?)"));
        assertTrue(error(HEAD + "rule a\n  match name ^A\n  equipmnt X Fan_Coil_Unit\n")
                .startsWith("site.tufa:4: unknown rule keyword 'equipmnt' (did you mean 'equipment'?)"));
        assertTrue(error(HEAD + "  match name ^A\n").startsWith("site.tufa:2: indented line outside a rule"));
        assertTrue(error(HEAD + "equipment X Fan_Coil_Unit\n").contains("belongs inside a rule"));
        assertTrue(error("rule a\n  match name x\n").contains("no 'building NAME' line"));
        assertTrue(error(HEAD + "rule a\n  class Fan_Status\n").startsWith("site.tufa:2: rule 'a' has no 'match name"));
        assertTrue(error(HEAD + "abbr ZN Zone\n").startsWith("site.tufa:2: 'abbr' needs"));
        assertTrue(error(HEAD + "expect A Fan_Status\n").startsWith("site.tufa:2: 'expect' needs"));
        assertTrue(error(HEAD + "rule a\nrule a\n").contains("already used at line 2"));
        assertTrue(error(HEAD + "min-score 2\n").contains("(0, 1]"));
    }

    @Test
    void invalidRegexIsReportedWithItsPosition() {
        String m = error(HEAD + "rule a\n  match name ^FCU-(?<f>\\d+\n");
        assertTrue(m.startsWith("site.tufa:3: invalid regular expression: Unclosed group"), m);
    }

    @Test
    void templateNamingAnUnknownGroupIsAnError() {
        String m = error(HEAD + "rule a\n  match name ^FCU-(?<floor>\\d)-(?<unit>\\d)$\n"
                + "  equipment FCU-{flor}-{unit} Fan_Coil_Unit\n");
        assertTrue(m.startsWith("site.tufa:4: template 'FCU-{flor}-{unit}' names group 'flor'")
                && m.contains("its groups: floor, unit"), m);
        assertTrue(error(HEAD + "rule a\n  match name ^A\n  equipment FCU-{x Fan_Coil_Unit\n").contains("closing"));
    }

    @Test
    void unknownClassesAndTagsSuggestTheNearest() {
        String m = error(HEAD + "rule a\n  match name ^A\n  class Zone_Air_Temp_Sensor\n");
        assertTrue(m.startsWith("site.tufa:4: unknown Brick class 'Zone_Air_Temp_Sensor'")
                && m.contains("nearest: Zone_Air_Temperature_Sensor"), m);
        String t = error(HEAD + "abbr T = Temprature\n");
        assertTrue(t.startsWith("site.tufa:2: unknown Brick tag 'Temprature'") && t.contains("nearest: Temperature"), t);
    }

    @Test
    void deprecatedClassesAreReplacedOrExplainedWithAWarning() {
        // Brick 1.4.4: Zone_Air_Temperature_Setpoint deprecated in 1.3.0, brick:isReplacedBy
        // Target_Zone_Air_Temperature_Setpoint; Floor deprecated in 1.4.0, brick:isReplacedBy rec:Level.
        RuleSet rs = parse(HEAD + "rule a\n  match name ^A\n  class Zone_Air_Temperature_Setpoint\n"
                + "  equipment E Fan_Coil_Unit\n  location Floor F1\n"
                + "rule b\n  match name ^B\n  equipment E Fan_Coil_Unit\n  location rec:Level L1\n");
        assertEquals(List.of("site.tufa:4: class Zone_Air_Temperature_Setpoint is deprecated in Brick 1.3.0; written "
                + "as Target_Zone_Air_Temperature_Setpoint (its replacement)",
                "site.tufa:6: class Floor is deprecated in Brick 1.4.0; write rec:Level to follow Brick; accepted as "
                + "written"), rs.warnings());
        assertEquals("Target_Zone_Air_Temperature_Setpoint", rs.rules().get(0).pointClass().orElseThrow().fixed());
        assertEquals("rec:Level", rs.rules().get(1).locations().get(0).className().fixed());
    }

    @Test
    void literalPrefixIsConservative() {
        assertEquals(Optional.of("MQ.T1.L"), RuleFileParser.literalPrefix(Pattern.compile("^MQ\\.T1\\.L(?<f>\\d)")));
        assertEquals(Optional.of("AB"), RuleFileParser.literalPrefix(Pattern.compile("^ABC?D")));
        assertEquals(Optional.of("ABC"), RuleFileParser.literalPrefix(Pattern.compile("^ABC+D")));
        assertEquals(Optional.empty(), RuleFileParser.literalPrefix(Pattern.compile("^A|^B")));
        assertEquals(Optional.of("BYD2"), RuleFileParser.literalPrefix(Pattern.compile("^BYD2(X|Y)")));
        assertEquals(Optional.empty(), RuleFileParser.literalPrefix(Pattern.compile("FCU")));
        assertEquals(Optional.empty(), RuleFileParser.literalPrefix(Pattern.compile("^fcu", Pattern.CASE_INSENSITIVE)));
        assertEquals(Optional.empty(), RuleFileParser.literalPrefix(Pattern.compile("^\\d+")));
    }

    @Test
    void theAnnotatedExampleInRulesFormatParses() throws Exception {
        String md = java.nio.file.Files.readString(Path.of("RULES-FORMAT.md"));
        String example = md.split("## Annotated example")[1].split("```")[1];
        RuleSet rs = parse(example.strip() + "\n");
        assertEquals("Marlow Quay Tower 1", rs.building());
        assertEquals(2, rs.expectations().size());
        assertEquals(4, rs.parts().size());
        assertEquals(List.of("Zone", "Air"), rs.dictionary().lookup("ZN", vocab).tags().stream()
                .sorted(java.util.Comparator.reverseOrder()).toList(), "trailing comment stripped");
    }

    @Test
    void tokenizerAndTemplates() {
        assertEquals(List.of("Zone", "Temp"), Tokenizer.tokens("ZoneTemp"));
        assertEquals(List.of("DA", "Temp"), Tokenizer.tokens("DATemp"));
        assertEquals(List.of("FCU", "07", "ZN", "T"), Tokenizer.tokens("FCU07.ZN-T"));
        assertEquals(List.of("Fan", "S", "S"), Tokenizer.tokens("Fan S/S"));
        assertEquals("HVN.B#.F#.AHU-#.SA-T", Tokenizer.shape("HVN.B1.F03.AHU-01.SA-T"));
        Template t = Template.parse("FCU-{floor|int}-{unit}{{}x{}}");
        assertEquals("FCU-3-07{x}", t.render(s -> s.equals("floor") ? "03" : "07"));
        assertEquals("0", Template.parse("{a|int}").render(s -> "000"));
    }
}
