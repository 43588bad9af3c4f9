package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.mapper.learn.LabelledLists;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * The scoring rules of shared/brick-examples/README.md on a hand-made list (worked by hand): only points of
 * terminal units count (VAV is Brick 1.4.4's alias of Variable_Air_Volume_Box), '|' lists alternatives, a label
 * with ':' is not scored, a deprecated label counts through its replacement, a parent is near but not exact.
 */
class LabelledScoreTest {

    @Test
    void scoresAsTheListsReadmeSays(@TempDir Path dir) throws Exception {
        BrickVocabulary v = BrickVocabulary.bundled();
        Path csv = dir.resolve("l.csv");
        Files.writeString(csv, String.join("\n", "point_name,brick_class,equipment,equipment_class",
                "a,Zone_Air_Temperature_Setpoint,vav1,VAV",
                "b,Cooling_Command|Valve_Command,vav1,VAV",
                "c,Supply_Air_Flow_Sensor,vav1,VAV",
                "d,brick:Chilled_Supply_Water+brick:Flow,vav1,VAV",
                "e,Zone_Air_Temperature_Sensor,vav1,VAV",
                "f,Zone_Air_Temperature_Sensor,ahu1,AHU",
                "g,Zone_Air_Temperature_Sensor,,") + "\n");
        List<LabelledLists.Labelled> l = LabelledLists.read(csv, v);
        Map<String, LabelledLists.Answer> answers = Map.of(
                "a", new LabelledLists.Answer("mapped", "Target_Zone_Air_Temperature_Setpoint"),
                "b", new LabelledLists.Answer("mapped", "Valve_Command"),
                "c", new LabelledLists.Answer("mapped", "Air_Flow_Sensor"),
                "d", new LabelledLists.Answer("mapped", "Water_Flow_Sensor"),
                "e", new LabelledLists.Answer("ambiguous", "Zone_Air_Temperature_Sensor"));
        LabelledLists.Score s = LabelledLists.score(l, answers, v);
        assertEquals(5, s.terminalPoints(), "a-e are on a VAV; f on an AHU and g on nothing are not");
        assertEquals(4, s.scorable(), "d's label is no Brick 1.4.4 class");
        assertEquals(2, s.exact(), "a through its replacement, b through an alternative");
        assertEquals(3, s.parentOrChild(), "c's Air_Flow_Sensor is a parent of Supply_Air_Flow_Sensor");
        assertEquals(1, s.ambiguous());
        assertEquals(1, s.wrongButMapped(), "c");
        assertEquals(0, s.unclassified());
    }
}
