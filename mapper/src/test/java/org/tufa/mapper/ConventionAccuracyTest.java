package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.Reader;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.tufa.mapper.match.Assignment;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;
import org.tufa.mapper.points.PointListReader;
import org.tufa.mapper.points.ReadOptions;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * The design target: for one consistent naming convention, a short rule file (dictionary plus a few structural
 * rules, about 40 lines) classes at least 95 % of terminal-unit points correctly, class and equipment (and part).
 * Six invented conventions (fictional sites, patterns from ../shared/field/notes.md section 7), each with a hand-
 * written rules.tufa and an answer key written by make_conventions.py from what each point was generated as.
 */
class ConventionAccuracyTest {

    private static BrickVocabulary vocabulary;

    @BeforeAll
    static void load() {
        vocabulary = BrickVocabulary.bundled();
    }

    static Path dir(String name) throws URISyntaxException {
        return Path.of(ConventionAccuracyTest.class.getResource("/conventions/" + name + "/rules.tufa").toURI())
                .getParent();
    }

    @ParameterizedTest
    @ValueSource(strings = {"dotted", "underscore", "nodelim", "tree", "descriptive", "objectid"})
    void shortRuleFileClassesAtLeast95PercentOfTerminalUnitPoints(String convention) throws Exception {
        Path dir = dir(convention);
        List<String> ruleLines = Files.readAllLines(dir.resolve("rules.tufa"));
        RuleSet rules = RuleFileParser.parse(dir.resolve("rules.tufa"), vocabulary);
        MappingResult result = org.tufa.mapper.match.Mapper.fit(rules, vocabulary)
                .map(PointListReader.read(dir.resolve("points.csv"), ReadOptions.detect()));

        int total = 0;
        int classOk = 0;
        int equipmentOk = 0;
        int allOk = 0;
        List<String> misses = new ArrayList<>();
        try (Reader r = Files.newBufferedReader(dir.resolve("answer-key.csv"), StandardCharsets.UTF_8)) {
            for (CSVRecord k : CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(r)) {
                total++;
                String device = k.get("device");
                String name = k.get("point");
                List<PointMapping> found = result.mappings().stream()
                        .filter(m -> m.point().name().equals(name)
                                && (device.isEmpty() || m.point().device().equals(device))).toList();
                assertEquals(1, found.size(), "answer-key point " + device + " " + name + " in the point list");
                PointMapping m = found.get(0);
                Optional<Assignment> a = m.classified() ? m.assignment() : Optional.empty();
                boolean c = a.isPresent() && vocabulary.sameClass(a.get().className(), k.get("expected_class"));
                boolean e = a.isPresent() && a.get().equipmentId().equals(k.get("expected_equipment"));
                String expectedPart = k.get("expected_part_class");
                boolean p = a.isPresent() && (expectedPart.isEmpty() ? a.get().part().isEmpty()
                        : a.get().part().map(x -> x.className().equals(expectedPart)).orElse(false));
                classOk += c ? 1 : 0;
                equipmentOk += e ? 1 : 0;
                if (c && e && p) {
                    allOk++;
                } else {
                    misses.add(name + " -> " + a.map(x -> x.className() + " on " + x.equipmentId() + " part "
                            + x.part().map(Assignment.Part::className).orElse("-")).orElse(m.status().label() + " "
                            + m.reason()));
                }
            }
        }
        double classAcc = (double) classOk / total;
        double eqAcc = (double) equipmentOk / total;
        double allAcc = (double) allOk / total;
        long ruleFileLines = ruleLines.stream().filter(l -> !l.isBlank()).count();
        System.out.printf("convention %-12s rule-file lines %3d  terminal points %4d  class %.1f %%  equipment "
                + "%.1f %%  class+equipment+part %.1f %%  misses %s%n", convention, ruleFileLines, total,
                100 * classAcc, 100 * eqAcc, 100 * allAcc, misses);
        assertTrue(total >= 100, "each answer key holds 10-20 units' points");
        assertTrue(ruleFileLines <= 45, "about 40 lines of rules, got " + ruleFileLines);
        assertTrue(classAcc >= 0.95, convention + " class accuracy " + classAcc + "; misses " + misses);
        assertTrue(eqAcc >= 0.95, convention + " equipment accuracy " + eqAcc + "; misses " + misses);
        assertTrue(allAcc >= 0.95, convention + " class+equipment+part accuracy " + allAcc + "; misses " + misses);
        assertEquals(0, result.failedExpectations(), "inline expectations: " + result.expectations());
        assertEquals(result.mappings().size(), PointListReader.read(dir.resolve("points.csv"), ReadOptions.detect())
                .points().size(), "rows in = rows out");
    }
}
