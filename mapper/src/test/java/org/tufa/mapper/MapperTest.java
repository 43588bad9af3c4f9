package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.TreeMap;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;
import org.tufa.mapper.match.Status;
import org.tufa.mapper.match.UnmappedExplainer;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;

class MapperTest {

    static BrickVocabulary vocab;

    @BeforeAll
    static void load() {
        vocab = BrickVocabulary.bundled();
    }

    static MappingResult map(String rules, List<PointRecord> points) {
        RuleSet rs = RuleFileParser.parse(Path.of("t.tufa"), "building T\n" + rules, vocab);
        return Mapper.fit(rs, vocab).map(points);
    }

    static PointRecord p(long line, String name, String type, String units) {
        return new PointRecord(line, name, "", units, type, type, "", "", new TreeMap<>());
    }

    static final String FCU = "abbr ZN = Zone Air\nabbr T = Temperature\nabbr CHW = Chilled Water\n"
            + "abbr VLV = Valve Position\nabbr CMD = Command\nabbr SP = Temperature Setpoint\nabbr CLG = Cool\n"
            + "part CHWV Chilled_Water_Valve when Chilled Valve\n"
            + "rule fcu\n  match name ^FCU-(?<f>\\d+)-(?<u>\\d+)\\.(?<what>.+)$\n  class tags {what}\n"
            + "  equipment FCU-{f}-{u} Fan_Coil_Unit\n  unit DEG_C\n";

    @Test
    void resolvesClassEquipmentPartAndUnit() {
        MappingResult r = map(FCU, List.of(p(2, "FCU-3-07.ZN-T", "AI", ""), p(3, "FCU-3-07.CHW-VLV-CMD", "AO", "%"),
                p(4, "FCU-3-07.ZN-CLG-SP", "AV", "°F"), p(5, "AHU-1.SA-T", "AI", "")));
        PointMapping zt = r.mappings().get(0);
        assertEquals(Status.MAPPED, zt.status());
        assertEquals("Zone_Air_Temperature_Sensor", zt.assignment().get().className());
        assertEquals("FCU-3-07", zt.assignment().get().equipmentId());
        assertEquals("DEG_C", zt.assignment().get().unit().get(), "rule default when the export has no units");
        PointMapping cv = r.mappings().get(1);
        assertEquals("Valve_Position_Command", cv.assignment().get().className());
        assertEquals("CHWV", cv.assignment().get().partId());
        assertEquals("Chilled_Water_Valve", cv.assignment().get().part().get().className());
        assertEquals("PERCENT", cv.assignment().get().unit().get());
        assertEquals("Cooling_Zone_Air_Temperature_Setpoint", r.mappings().get(2).assignment().get().className());
        assertEquals("DEG_F", r.mappings().get(2).assignment().get().unit().get(), "export units win");
        assertEquals(Status.UNMAPPED, r.mappings().get(3).status());
        assertEquals("no rule matches", r.mappings().get(3).reason());
    }

    @Test
    void firstMatchWinsAndCompetingRulesConflict() {
        String rules = "rule a\n  match name ^X-(?<n>\\d)\n  class Fan_Status\n  equipment E{n} Fan_Coil_Unit\n"
                + "rule b\n  match name ^X-\n  class Zone_Air_Temperature_Sensor\n  equipment E Fan_Coil_Unit\n";
        MappingResult plain = map(rules, List.of(p(2, "X-1", "", "")));
        assertEquals(Status.MAPPED, plain.mappings().get(0).status());
        assertEquals("Fan_Status", plain.mappings().get(0).assignment().get().className());
        assertEquals("t.tufa:2", plain.mappings().get(0).assignment().get().ruleLabel());

        String competing = rules.replace("  equipment E{n} Fan_Coil_Unit\n", "  equipment E{n} Fan_Coil_Unit\n"
                + "  compete g\n") + "  compete g\n";
        MappingResult c = map(competing, List.of(p(2, "X-1", "", "")));
        assertEquals(Status.CONFLICT, c.mappings().get(0).status());
        assertTrue(c.mappings().get(0).reason().contains("t.tufa:2 says Fan_Status on E1")
                && c.mappings().get(0).reason().contains("t.tufa:7 says Zone_Air_Temperature_Sensor on E"),
                c.mappings().get(0).reason());
        assertFalse(c.mappings().get(0).classified());
    }

    @Test
    void duplicatesAreKeptAndFlaggedEmptyNamesRejectedRowsInEqualsRowsOut() {
        List<PointRecord> in = new ArrayList<>();
        in.add(p(2, "FCU-1-1.ZN-T", "AI", ""));
        in.add(p(3, "", "AI", ""));
        in.add(p(4, "FCU-1-1.ZN-T", "AI", ""));
        in.add(p(5, "junk", "", ""));
        MappingResult r = map(FCU, in);
        assertEquals(in.size(), r.mappings().size());
        assertEquals(Status.DUPLICATE, r.mappings().get(0).status());
        assertTrue(r.mappings().get(0).reason().startsWith("name also on line 4 (mapped"));
        assertTrue(r.mappings().get(0).classified());
        assertEquals(1, r.mappings().get(0).occurrence());
        assertEquals(2, r.mappings().get(2).occurrence());
        assertEquals(Status.REJECTED, r.mappings().get(1).status());
        assertEquals(Status.UNMAPPED, r.mappings().get(3).status());
        assertTrue(r.warnings().stream().anyMatch(w -> w.contains("more than one row")));
        var counts = r.countByStatus();
        assertEquals(2, counts.get(Status.DUPLICATE));
        assertEquals(in.size(), counts.values().stream().mapToInt(Integer::intValue).sum());
    }

    @Test
    void expectationsAreCheckedOnEveryRun() {
        MappingResult ok = map(FCU + "expect FCU-1-2.ZN-T type AI => Zone_Air_Temperature_Sensor on FCU-1-2\n",
                List.of());
        assertEquals(0, ok.failedExpectations());
        MappingResult bad = map(FCU + "expect FCU-1-2.ZN-T type AI => Fan_Status on FCU-1-2\n"
                + "expect FCU-1-2.CHW-VLV-CMD type AO => Valve_Position_Command on FCU-1-2 part HWV\n"
                + "expect NOPE => Fan_Status\n", List.of());
        assertEquals(3, bad.failedExpectations());
        assertTrue(bad.expectations().get(0).actual().contains("Zone_Air_Temperature_Sensor on FCU-1-2"));
        assertTrue(bad.expectations().get(2).actual().startsWith("unmapped"));
    }

    @Test
    void pointsWithoutUsableTagsAreUnclassifiedWithAReason() {
        MappingResult r = map(FCU, List.of(p(2, "FCU-1-1.QQ-ZZ", "", "")));
        PointMapping m = r.mappings().get(0);
        assertEquals(Status.UNCLASSIFIED, m.status());
        assertTrue(m.reason().contains("tokens not in the dictionary: QQ ZZ"), m.reason());
    }

    @Test
    void explainGroupsUnmappedNamesByShapeMostFrequentFirst() {
        MappingResult r = map(FCU, List.of(p(2, "AHU-1.SA-T", "", ""), p(3, "AHU-2.SA-T", "", ""),
                p(4, "AHU-3.RA-T", "", ""), p(5, "OAT", "", ""), p(6, "AHU-4.SA-T", "", "")));
        var groups = UnmappedExplainer.group(r.mappings());
        assertEquals("AHU-#.SA-T", groups.get(0).shape());
        assertEquals(3, groups.get(0).count());
        assertEquals("AHU-1.SA-T", groups.get(0).example());
        assertEquals(3, groups.size());
        assertEquals(5, groups.stream().mapToInt(UnmappedExplainer.Group::count).sum());
    }
}
