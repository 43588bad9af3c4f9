package org.tufa.vocabulary;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.RDFNode;
import org.apache.jena.riot.RDFDataMgr;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

/** The QUDT unit list tufa checks names against: QUDT 3.1.0, and every unit Brick 1.4.4 names is in it. */
class QudtUnitsTest {

    @Test
    void theListIsQudt310() {
        List<String> names = QudtUnits.names();
        // qudt_units.py counted 2,798 qudt:Unit individuals in QUDT 3.1.0's unit vocabulary.
        assertEquals(2798, names.size());
        for (String unit : List.of("DEG_F", "DEG_C", "K", "PERCENT", "FT3-PER-MIN", "L-PER-SEC", "M3-PER-SEC",
                "KiloW-HR", "UNITLESS")) {
            assertEquals(Optional.of(unit), QudtUnits.canonical(unit), unit);
        }
        assertEquals(Optional.empty(), QudtUnits.canonical("BANANAS"));
        assertTrue(QudtUnits.nearest("DEG_FF").contains("DEG_F"), QudtUnits.nearest("DEG_FF").toString());
    }

    @Test
    void everyUnitBrickNamesIsInTheList() {
        Optional<Path> brick = BrickVocabularyTest.fullBrick();
        Assumptions.assumeTrue(brick.isPresent(), "../shared/vocab/Brick.ttl not found; skipping the Brick check");
        Model m = RDFDataMgr.loadModel(brick.get().toString());
        Set<String> named = new TreeSet<>();
        m.listObjects().forEachRemaining((RDFNode n) -> {
            if (n.isURIResource() && n.asResource().getURI().startsWith("http://qudt.org/vocab/unit/")) {
                named.add(n.asResource().getURI().substring("http://qudt.org/vocab/unit/".length()));
            }
        });
        assertTrue(named.size() > 150, "Brick 1.4.4 names about 200 units: " + named.size());
        Set<String> missing = new TreeSet<>(named);
        missing.removeAll(QudtUnits.names());
        assertEquals(Set.of(), missing);
    }
}
