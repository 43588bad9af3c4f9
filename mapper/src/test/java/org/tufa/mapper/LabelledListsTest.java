package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.tufa.mapper.learn.LabelledLists;
import org.tufa.mapper.match.MappingResult;
import org.tufa.vocabulary.BrickVocabulary;

/**
 * Our rule files for the three published labelled point lists (shared/brick-examples: soda, rice, gtc, the classes
 * the buildings' own modellers gave each point) must give at least 95 % of terminal-unit points exactly their
 * class, from at most 40 statement lines, and never leave a wrong class silently mapped. Skips where ../shared is
 * absent.
 */
class LabelledListsTest {

    private static BrickVocabulary vocabulary;

    @BeforeAll
    static void load() {
        vocabulary = BrickVocabulary.bundled();
    }

    @ParameterizedTest
    @ValueSource(strings = {"soda", "rice", "gtc"})
    void shortRuleFileGivesTerminalUnitPointsTheirModellersClass(String list) throws Exception {
        Optional<Path> lists = LabelledLists.findLists();
        assumeTrue(lists.isPresent(), "../shared/brick-examples absent: labelled-list check skipped");
        Path rules = ruleFile(list);
        List<LabelledLists.Labelled> labelled = LabelledLists.read(
                lists.get().resolve(list + "-points-labelled.csv"), vocabulary);
        MappingResult result = LabelledLists.map(rules, labelled, vocabulary);
        LabelledLists.Score s = LabelledLists.score(labelled, LabelledLists.answers(result), vocabulary);
        int lines = LabelledLists.statementLines(rules);
        System.out.printf("labelled %-5s terminal-unit points %d (scored %d), rule lines %d, exact %.1f %%, "
                + "ambiguous %d, unclassified %d, wrong but mapped %d%n", list, s.terminalPoints(), s.scorable(),
                lines, 100 * s.exactShare(), s.ambiguous(), s.unclassified(), s.wrongButMapped());
        assertTrue(s.scorable() >= 12, "the list's terminal-unit points were found: " + s);
        assertTrue(lines <= 40, list + ": " + lines + " statement lines");
        assertTrue(s.exactShare() >= 0.95, list + " exact " + s.exactShare() + "; not exact: " + s.wrong());
        assertEquals(0, s.wrongButMapped(), list + ": a wrong class was mapped: " + s.wrong());
        assertEquals(0, result.failedExpectations(), "the rule file's expect lines: " + result.expectations());
        assertEquals(labelled.size(), result.mappings().size(), "rows in = rows out");
    }

    static Path ruleFile(String list) throws URISyntaxException {
        return Path.of(LabelledListsTest.class.getResource("/labelled/" + list + ".tufa").toURI());
    }
}
