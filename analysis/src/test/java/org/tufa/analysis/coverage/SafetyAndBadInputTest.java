package org.tufa.analysis.coverage;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.apache.jena.query.Query;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.sparql.syntax.ElementData;
import org.apache.jena.sparql.syntax.ElementGroup;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;
import org.tufa.vocabulary.Namespaces;

/** Parameterised queries cannot be bent by the values; bad input gives one-line messages. */
class SafetyAndBadInputTest {
    private static final String INJECTION = Namespaces.BRICK + "Fan_Coil_Unit> } UNION { ?unit ?p ?type . } #\"'";

    @Test
    void aClassValueWithQuotesAndBracesStaysOneValue() {
        Query q = Sparql.build("SELECT ?unit WHERE { VALUES ?type { } ?unit a ?type . }", Map.of("type", List.of(INJECTION)));
        ElementData data = (ElementData) ((ElementGroup) q.getQueryPattern()).getElements().get(0);
        assertEquals(1, data.getRows().size());
        assertEquals(INJECTION, data.getRows().get(0).get(data.getVars().get(0)).getURI());
        // Pasted into the text, the same value would add a UNION branch matching every subject with any property;
        // built as a node, the pattern keeps its two elements (the VALUES block and the one triple).
        List<?> elements = ((ElementGroup) q.getQueryPattern()).getElements();
        assertEquals(2, elements.size());
        assertTrue(elements.get(1) instanceof org.apache.jena.sparql.syntax.ElementPathBlock, elements.toString());
    }

    @Test
    void anInjectedUnitClassFindsNothing() {
        Vocabulary v = Vocabulary.standard();
        Model all = v.unionWith(ModelLoader.load(Fixtures.resource("quillmoor-hall.ttl")));
        assertEquals(Map.of(), Coverage.findUnits(all, Set.of(INJECTION)));
        assertEquals(5, Coverage.findUnits(all, Set.of(Namespaces.BRICK + "Fan_Coil_Unit")).size());
    }

    @Test
    void anInjectedUnitClassOptionIsRejectedWithNearestNames() {
        Vocabulary v = Vocabulary.standard();
        Model all = v.unionWith(ModelLoader.load(Fixtures.resource("quillmoor-hall.ttl")));
        InputException e = assertThrows(InputException.class,
                () -> UnitClasses.resolve(List.of("brick:Fan_Coil_Unit> } UNION { ?unit ?p ?o"), all, StandardPrefixes.mapping()));
        assertTrue(e.getMessage().contains("nearest: brick:Fan_Coil_Unit"), e.getMessage());
    }

    @Test
    void unknownUnitClassNamesTheNearestKnownOnes() {
        Vocabulary v = Vocabulary.standard();
        Model all = v.unionWith(ModelLoader.load(Fixtures.resource("quillmoor-hall.ttl")));
        InputException e = assertThrows(InputException.class,
                () -> UnitClasses.resolve(List.of("brick:Fan_Coil_Unti"), all, StandardPrefixes.mapping()));
        assertTrue(e.getMessage().startsWith("--unit-class brick:Fan_Coil_Unti: not a terminal-unit class"), e.getMessage());
        assertTrue(e.getMessage().contains("nearest: brick:Fan_Coil_Unit"), e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
        // A real class that is not a terminal unit is refused too.
        assertThrows(InputException.class, () -> UnitClasses.resolve(List.of("brick:Chiller"), all, StandardPrefixes.mapping()));
        assertEquals(Set.of(Namespaces.BRICK + "Fan_Coil_Unit", Namespaces.BRICK + "FCU"),
                UnitClasses.resolve(List.of("brick:Fan_Coil_Unit", "<" + Namespaces.BRICK + "FCU>"), all, StandardPrefixes.mapping()));
        assertEquals(Set.of(Namespaces.BRICK + "Variable_Air_Volume_Box"),
                UnitClasses.resolve(List.of("Variable_Air_Volume_Box"), all, StandardPrefixes.mapping()));
    }

    @Test
    void missingModelFileNamesTheFile(@TempDir Path dir) {
        Path missing = dir.resolve("nowhere.ttl");
        InputException e = assertThrows(InputException.class, () -> ModelLoader.load(missing));
        assertEquals(missing + ": no such file; check the path", e.getMessage());
    }

    @Test
    void turtleSyntaxErrorNamesLineAndColumn(@TempDir Path dir) throws IOException {
        Path bad = dir.resolve("bad.ttl");
        Files.writeString(bad, """
                @prefix brick: <https://brickschema.org/schema/Brick#> .
                <urn:a> a brick:Fan_Coil_Unit .
                <urn:b> a brick:Fan_Coil_Unit
                <urn:c> a brick:Fan_Coil_Unit .
                """);
        InputException e = assertThrows(InputException.class, () -> ModelLoader.load(bad));
        assertTrue(e.getMessage().startsWith(bad + ":4: column 1: "), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), e.getMessage());
    }

    @Test
    void unknownFileTypeSaysWhichAreKnown(@TempDir Path dir) throws IOException {
        Path odd = dir.resolve("model.txt");
        Files.writeString(odd, "x");
        InputException e = assertThrows(InputException.class, () -> ModelLoader.load(odd));
        assertTrue(e.getMessage().contains(".ttl (Turtle)"), e.getMessage());
    }

    @Test
    void unknownProfileListsTheKnownOnes() {
        InputException e = assertThrows(InputException.class, () -> Vocabulary.standard().profiles().profile("fcu"));
        assertTrue(e.getMessage().startsWith("unknown profile 'fcu'; known profiles: cooling-only, fcu-modes"),
                e.getMessage());
    }

    @Test
    void aRoleWithoutLookupsIsRefusedWithItsName(@TempDir Path dir) throws IOException {
        Path broken = dir.resolve("broken.ttl");
        Files.writeString(broken, """
                @prefix tufa: <https://tufa.example.org/ns#> .
                <urn:my:role> a tufa:Role ; tufa:roleName "supply_fan_current" .
                """);
        InputException e = assertThrows(InputException.class, () -> Vocabulary.load(List.of(broken)));
        assertEquals("vocabulary: role <urn:my:role> has no tufa:lookups list; add tufa:lookups ( [ tufa:place ... ] )",
                e.getMessage());
    }

    @Test
    void zeroLengthSubclassPathReturnsTheClassItself() {
        // A class the vocabulary does not declare must still match its own instances (a model may use classes of a
        // newer Brick than the bundled one).
        Model all = Vocabulary.standard().unionWith(ModelLoader.load(Fixtures.resource("quillmoor-hall.ttl")));
        assertTrue(Sparql.subclassClosure(all, List.of(Namespaces.BRICK + "Weather_Station"))
                .contains(Namespaces.BRICK + "Weather_Station"));
        assertTrue(Sparql.subclassClosure(all, List.of(Namespaces.BRICK + "Discharge_Air_Temperature_Sensor"))
                .contains(Namespaces.BRICK + "Supply_Air_Temperature_Sensor"));
    }
}
