package org.tufa.vocabulary;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;

/** Checks against the Brick 1.4.4 vocabulary (the subset is generated from it; the full file in ../shared/vocab). */
class BrickVocabularyTest {

    static BrickVocabulary subset;

    @BeforeAll
    static void load() {
        subset = BrickVocabulary.bundled();
    }

    /** ../shared/vocab/Brick.ttl relative to the repository root, searched upwards from the working directory. */
    static Optional<Path> fullBrick() {
        for (Path p = Path.of("").toAbsolutePath(); p != null; p = p.getParent()) {
            Path f = p.resolve("shared/vocab/Brick.ttl");
            if (Files.isRegularFile(f)) {
                return Optional.of(f);
            }
        }
        return Optional.empty();
    }

    @Test
    void classesTagsAndSuperclassesAsBrickStatesThem() {
        // Brick 1.4.4: Zone_Air_Temperature_Sensor rdfs:subClassOf Air_Temperature_Sensor, itself under
        // Temperature_Sensor, Sensor, Point; tags Air, Point, Sensor, Temperature, Zone.
        assertTrue(subset.isClass("Zone_Air_Temperature_Sensor"));
        assertTrue(subset.isClass("brick:Fan_Coil_Unit"));
        assertFalse(subset.isClass("Zone_Air_Temp_Sensor"));
        assertTrue(subset.superclasses("Zone_Air_Temperature_Sensor").containsAll(
                Set.of("Air_Temperature_Sensor", "Temperature_Sensor", "Sensor", "Point")));
        assertEquals(new TreeSet<>(Set.of("Air", "Point", "Sensor", "Temperature", "Zone")),
                subset.associatedTags("Zone_Air_Temperature_Sensor"));
        assertTrue(subset.isTag("Temperature"));
        assertFalse(subset.isTag("Temp"));
        assertEquals(Optional.of("Temperature"), subset.tagIgnoringCase("TEMPERATURE"));
        // Brick declares Discharge_ and Supply_Air_Temperature_Sensor owl:equivalentClass
        assertTrue(subset.sameClass("Discharge_Air_Temperature_Sensor", "Supply_Air_Temperature_Sensor"));
        assertTrue(subset.isA("Discharge_Air_Temperature_Sensor", "Air_Temperature_Sensor"));
        assertTrue(subset.isA("Fan_Coil_Unit", "Terminal_Unit"));
        assertTrue(subset.depth("Zone_Air_Temperature_Sensor") > subset.depth("Sensor"));
    }

    @Test
    void deprecationsCarryTheReplacement() {
        // Brick 1.3.0 deprecated Zone_Air_Temperature_Setpoint in favour of Target_Zone_Air_Temperature_Setpoint
        // (notes section 1, from Brick's deprecations); 1.4.0 deprecated Speed_Status for Speed_Mode_Status.
        Deprecation d = subset.deprecation("Zone_Air_Temperature_Setpoint").orElseThrow();
        assertEquals("Target_Zone_Air_Temperature_Setpoint", d.replacementName());
        assertEquals("1.3.0", d.version());
        assertEquals("Speed_Mode_Status", subset.deprecation("Speed_Status").orElseThrow().replacementName());
        assertTrue(subset.deprecation("Zone_Air_Temperature_Sensor").isEmpty());
    }

    @Test
    void suggestsNearestExistingNames() {
        assertEquals("Zone_Air_Temperature_Sensor", subset.nearestClasses("Zone_Air_Temp_Sensor").get(0));
        assertTrue(subset.nearestClasses("Fan_Coil").contains("Fan_Coil_Unit"));
        assertEquals("Temperature", subset.nearestTags("Temprature").get(0));
        assertTrue(subset.nearestClasses("Zone_Air_Temp_Sensor").size() <= 3);
        // classic example: kitten -> sitting needs 3 edits (Levenshtein distance; textbook example)
        assertEquals(3, NameSuggester.levenshtein("kitten", "sitting"));
        assertEquals(0, NameSuggester.levenshtein("", ""));
    }

    @Test
    void badVocabularyFileIsAnInputError(@TempDir Path dir) throws Exception {
        Path missing = dir.resolve("nope.ttl");
        InputException e = assertThrows(InputException.class, () -> BrickVocabulary.load(missing));
        assertTrue(e.getMessage().startsWith(missing.toString()), e.getMessage());
        Path bad = dir.resolve("bad.ttl");
        Files.writeString(bad, "this is not turtle <<<");
        assertThrows(InputException.class, () -> BrickVocabulary.load(bad));
        Path empty = dir.resolve("empty.ttl");
        Files.writeString(empty, "@prefix x: <http://x/> . x:a x:b x:c .");
        assertTrue(assertThrows(InputException.class, () -> BrickVocabulary.load(empty)).getMessage()
                .contains("no Brick classes"));
    }

    @Test
    void tagResolverScoresByJaccardWithDeterministicTieBreak() {
        TagClassResolver r = TagClassResolver.fit(subset, "Point");
        // exact tag set of Zone_Air_Temperature_Sensor -> score 1
        var exact = r.resolve(new TreeSet<>(Set.of("Zone", "Air", "Temperature", "Sensor", "Point"))).orElseThrow();
        assertEquals("Zone_Air_Temperature_Sensor", exact.className());
        assertEquals(1.0, exact.score(), 1e-12);
        // {Discharge, Air, Temperature, Sensor, Point} vs Supply_Air_Temperature_Sensor's 6 tags: 5/6 (hand count
        // from the Brick file; Discharge_Air_Temperature_Sensor itself carries no tags in 1.4.4)
        var dat = r.resolve(new TreeSet<>(Set.of("Discharge", "Air", "Temperature", "Sensor", "Point"))).orElseThrow();
        assertEquals("Supply_Air_Temperature_Sensor", dat.className());
        assertEquals(5.0 / 6.0, dat.score(), 1e-12);
        assertEquals(2.0 / 4.0, TagClassResolver.jaccard(Set.of("a", "b", "c"), Set.of("b", "c", "d")), 1e-12);
        // {Valve, Command, Point}: Valve_Command scores 1, and must win over deeper Valve_Position_Command (3/4)
        assertEquals("Valve_Command", r.resolve(new TreeSet<>(List.of("Valve", "Command", "Point"))).orElseThrow()
                .className());
        // deprecated classes are never proposed
        for (String c : subset.classNames()) {
            if (subset.deprecation(c).isPresent()) {
                var res = r.resolve(new TreeSet<>(subset.associatedTags(c)));
                res.ifPresent(x -> assertTrue(subset.deprecation(x.className()).isEmpty(), c));
            }
        }
    }

    @Test
    void everySubsetClassExistsInTheFullBrickFileWithTheSameParentsAndTags() {
        Optional<Path> full = fullBrick();
        Assumptions.assumeTrue(full.isPresent(), "../shared/vocab/Brick.ttl not found above the working directory; "
                + "skipping the subset-versus-full-Brick check");
        BrickVocabulary brick = BrickVocabulary.load(full.get());
        assertTrue(brick.classNames().size() > 1000, "the full Brick 1.4.4 file has over a thousand classes");
        for (String c : subset.classNames()) {
            assertTrue(brick.isClass(c), c + " missing from " + full.get());
            assertEquals(brick.associatedTags(c), subset.associatedTags(c), "tags of " + c);
            assertEquals(brick.parents(c), subset.parents(c), "parents of " + c);
            assertEquals(brick.deprecation(c).map(Deprecation::replacementIri),
                    subset.deprecation(c).map(Deprecation::replacementIri), "replacement of " + c);
        }
        for (String t : subset.tagNames()) {
            assertTrue(brick.isTag(t), "tag " + t);
        }
    }
}
