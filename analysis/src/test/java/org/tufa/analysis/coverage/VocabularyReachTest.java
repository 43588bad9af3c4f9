package org.tufa.analysis.coverage;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.Test;
import org.tufa.vocabulary.Namespaces;

/** Units of classes the vocabulary does not define are reported, never silently dropped. */
class VocabularyReachTest {
    private static final String CASSETTE = Namespaces.BRICK + "Cassette_Fan_Coil_Unit";

    @Test
    void undeclaredClassesAreReported() {
        Model model = ModelLoader.load(Fixtures.resource("unknown-class-wing.ttl"));
        Vocabulary standard = Vocabulary.standard();
        FleetCoverage c = Coverage.assess(model, standard, standard.profiles().profile("fcu-modes"), Set.of());
        assertEquals(List.of(), c.units());
        assertEquals(Map.of(Namespaces.BRICK + "Fan_Coil_Unti", 2), c.undeclaredBrickClasses());
    }

    @Test
    void theBundledBrickKnowsEveryClassOfTheRelease() {
        // Brick 1.4.4 (bundled whole since issue 12): Cassette_Fan_Coil_Unit rdfs:subClassOf Fan_Coil_Unit, itself a
        // Terminal_Unit; no extra vocabulary file needed.
        Model model = ModelLoader.load(Fixtures.resource("cassette-wing.ttl"));
        Vocabulary standard = Vocabulary.standard();
        FleetCoverage c = Coverage.assess(model, standard, standard.profiles().profile("fcu-modes"), Set.of());
        assertEquals(2, c.units().size());
        assertEquals(CASSETTE, c.units().get(0).unitClass());
        assertEquals(Map.of(), c.undeclaredBrickClasses());
    }

    @Test
    void theFullBrickFileMakesThemUnits() {
        Optional<Path> brick = Fixtures.fullBrick();
        assumeTrue(brick.isPresent(), "../shared/vocab/Brick.ttl absent: full-vocabulary check skipped");
        Model model = ModelLoader.load(Fixtures.resource("cassette-wing.ttl"));
        Vocabulary full = Vocabulary.load(List.of(brick.get()));
        FleetCoverage c = Coverage.assess(model, full, full.profiles().profile("fcu-modes"), Set.of());
        // Brick 1.4.4: Cassette_Fan_Coil_Unit is a subclass of Fan_Coil_Unit, itself a Terminal_Unit.
        assertEquals(List.of("https://quillmoor.example.org/building#CFCU_301",
                "https://quillmoor.example.org/building#CFCU_302"), c.units().stream().map(UnitCoverage::unit).toList());
        assertEquals(CASSETTE, c.units().get(0).unitClass());
        assertEquals(MatchStatus.FOUND, c.units().get(0).roles().get("discharge_air_temperature").status());
        assertEquals(Map.of(), c.undeclaredBrickClasses());
    }
}
