package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.InputStream;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.mapper.match.Assignment;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;
import org.tufa.mapper.points.PointListReader;
import org.tufa.mapper.points.ReadOptions;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * The demo building's rule file against the demo's answer key (demo-data; the key was written with the point list
 * by make_points.py, from what each point was generated as). Two naming conventions, misspellings, spares,
 * duplicates, units written three ways: every row must be classed as the key says (class, equipment, part, unit),
 * spares must stay unmapped, and every rule-file expectation must pass.
 */
class DemoRulesTest {

    private static Path resource(String name, Path dir) throws Exception {
        Path target = dir.resolve(name);
        try (InputStream in = DemoRulesTest.class.getClassLoader().getResourceAsStream("org/tufa/demo/" + name)) {
            Files.copy(in, target);
        }
        return target;
    }

    @Test
    void demoRuleFileMatchesTheAnswerKey(@TempDir Path dir) throws Exception {
        BrickVocabulary vocabulary = BrickVocabulary.bundled();
        Path points = resource("points.csv", dir);
        RuleSet rules = RuleFileParser.parse(resource("rules.tufa", dir), vocabulary);
        MappingResult result = org.tufa.mapper.match.Mapper.fit(rules, vocabulary)
                .map(PointListReader.read(points, ReadOptions.detect()));
        List<String> misses = new ArrayList<>();
        int rows = 0;
        try (Reader r = Files.newBufferedReader(resource("answer-key.csv", dir), StandardCharsets.UTF_8)) {
            for (CSVRecord k : CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(r)) {
                PointMapping m = result.mappings().get(rows++);
                assertEquals(k.get("point"), m.point().name(), "answer key and point list in the same order");
                Optional<Assignment> a = m.classified() ? m.assignment() : Optional.empty();
                String expectedClass = k.get("expected_class");
                boolean ok;
                if (expectedClass.isEmpty()) {
                    ok = a.isEmpty(); // spares and unused points map to nothing
                } else {
                    String part = k.get("expected_part_class");
                    String unit = k.get("expected_unit");
                    ok = a.isPresent() && vocabulary.sameClass(a.get().className(), expectedClass)
                            && a.get().equipmentId().equals(k.get("expected_equipment"))
                            && (part.isEmpty() ? a.get().part().isEmpty()
                                    : a.get().part().map(p -> p.className().equals(part)).orElse(false))
                            && (unit.isEmpty() || a.get().unit().map(unit::equals).orElse(false));
                }
                if (!ok) {
                    misses.add(k.get("point") + " -> " + a.map(x -> x.className() + " on " + x.equipmentId()
                            + " unit " + x.unit().orElse("-")).orElse(m.status().label()));
                }
            }
        }
        assertEquals(result.mappings().size(), rows, "rows in = rows out");
        assertEquals(2104, rows);
        assertEquals(List.of(), misses);
        assertEquals(0, result.failedExpectations(), "inline expectations: " + result.expectations());

        // The roof weather sensor belongs to no equipment: it must be a point of the building, where the
        // fleet analysis looks for the building-wide outdoor air temperature.
        org.apache.jena.rdf.model.Model model = org.tufa.mapper.model.ModelBuilder.build(result,
                rules.baseIri().orElse("https://tufa.example.org/building/")).model();
        String ask = "PREFIX brick: <https://brickschema.org/schema/Brick#> PREFIX rdfs: "
                + "<http://www.w3.org/2000/01/rdf-schema#> ASK { ?b a brick:Building ; brick:hasPoint ?p . "
                + "?p a brick:Outside_Air_Temperature_Sensor ; rdfs:label \"WCH.ROOF.WX.OutdoorAir.Temp\" ; "
                + "brick:isPointOf ?b }";
        try (var exec = org.apache.jena.query.QueryExecutionFactory.create(ask, model)) {
            assertTrue(exec.execAsk(), "roof outdoor air sensor is a point of the building");
        }
    }
}
