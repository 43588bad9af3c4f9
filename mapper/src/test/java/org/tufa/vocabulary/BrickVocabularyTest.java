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

/** Checks against the Brick 1.4.4 vocabulary (the bundled index is generated from it; the file in ../shared/vocab). */
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
    void theBundledIndexIsTheWholeBrickFile() throws Exception {
        Optional<Path> full = fullBrick();
        Assumptions.assumeTrue(full.isPresent(), "../shared/vocab/Brick.ttl not found above the working directory; "
                + "skipping the bundled-versus-Brick check");
        BrickVocabulary brick = BrickVocabulary.load(full.get());
        // Brick 1.4.4 (owl:versionInfo "1.4.4"): 1,430 owl:Class in its namespace, 532 tags
        assertEquals("1.4.4", subset.version());
        assertEquals(brick.classNames(), subset.classNames());
        assertEquals(brick.tagNames(), subset.tagNames());
        for (String c : brick.classNames()) {
            assertEquals(brick.info(c), subset.info(c), "class " + c);
        }
        assertEquals(brick.terms(), subset.terms());
        assertEquals(brick.unitQuantities(), subset.unitQuantities());
        // same input, same bytes: regenerating the index reproduces the committed resource exactly
        String committed;
        try (var in = BrickVocabulary.class.getClassLoader().getResourceAsStream(Namespaces.BRICK_INDEX_RESOURCE)) {
            committed = new String(in.readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
        }
        assertEquals(committed, BundleBrick.indexText(full.get()), "rerun BundleBrick (see its comment)");
    }

    @Test
    void theRdfViewStatesWhatBrickStates() {
        Optional<Path> full = fullBrick();
        Assumptions.assumeTrue(full.isPresent(), "../shared/vocab/Brick.ttl absent: RDF view check skipped");
        org.apache.jena.graph.Graph brick = org.apache.jena.sparql.graph.GraphFactory.createDefaultGraph();
        org.apache.jena.riot.RDFParser.source(full.get()).parse(brick);
        org.apache.jena.graph.Graph view = BrickGraph.of(subset);
        // every rdfs:subClassOf and brick:hasAssociatedTag the view states between Brick terms is in Brick.ttl,
        // and none of Brick's between Brick classes is missing
        for (var p : List.of(org.apache.jena.vocabulary.RDFS.subClassOf.asNode(),
                org.apache.jena.graph.NodeFactory.createURI(Namespaces.BRICK + "hasAssociatedTag"))) {
            Set<org.apache.jena.graph.Triple> ours = new java.util.HashSet<>(view.find(null, p, null).toList());
            Set<org.apache.jena.graph.Triple> theirs = new java.util.HashSet<>();
            brick.find(null, p, null).forEachRemaining(t -> {
                if (t.getSubject().isURI() && t.getObject().isURI()
                        && subset.isClass(t.getSubject().getURI())
                        && (subset.isClass(t.getObject().getURI()) || t.getObject().getURI().startsWith(Namespaces.TAG))) {
                    theirs.add(t);
                }
            });
            assertEquals(theirs, ours, p.getLocalName());
        }
        // Floor -> rec:Level (Brick 1.4.0): the replacement is writable
        assertTrue(subset.isReplacementClass("rec:Level"));
        assertTrue(subset.isReplacementClass("rec:HVACZone"));
        assertEquals(Optional.of("Target_Zone_Air_Temperature_Setpoint"), subset.current("Zone_Air_Temperature_Setpoint"));
    }
}
