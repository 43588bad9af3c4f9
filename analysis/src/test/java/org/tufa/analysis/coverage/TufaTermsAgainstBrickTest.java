package org.tufa.analysis.coverage;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.RDFNode;
import org.apache.jena.vocabulary.OWL;
import org.apache.jena.vocabulary.RDF;
import org.junit.jupiter.api.Test;
import org.tufa.vocabulary.Namespaces;

/** tufa.ttl against the published Brick 1.4.4 file (../shared/vocab/Brick.ttl) and the role names other stages use. */
class TufaTermsAgainstBrickTest {

    @Test
    void everyBrickClassAndTagNamedInTufaTermsExistsInBrick() {
        Optional<Path> brickFile = Fixtures.fullBrick();
        assumeTrue(brickFile.isPresent(), "../shared/vocab/Brick.ttl absent: Brick class check skipped");
        Model brick = ModelLoader.load(brickFile.get());
        Model tufa = ModelLoader.loadResource(Namespaces.TUFA_TERMS_RESOURCE);
        Set<String> named = new TreeSet<>();
        tufa.listObjects().forEachRemaining((RDFNode o) -> {
            if (o.isURIResource() && (o.asResource().getURI().startsWith(Namespaces.BRICK)
                    || o.asResource().getURI().startsWith(Namespaces.TAG))) {
                named.add(o.asResource().getURI());
            }
        });
        assertTrue(named.size() > 60, "expected the role lookups to name many Brick terms, got " + named.size());
        Set<String> unknown = new TreeSet<>();
        for (String iri : named) {
            boolean isClass = brick.contains(brick.createResource(iri), RDF.type, OWL.Class);
            boolean isTag = brick.contains(brick.createResource(iri), RDF.type, brick.createResource(Namespaces.BRICK + "Tag"));
            if (!(iri.startsWith(Namespaces.TAG) ? isTag : isClass)) {
                unknown.add(iri);
            }
        }
        assertEquals(Set.of(), unknown, "terms in tufa.ttl that Brick 1.4.4 does not define");
    }

    @Test
    void roleNamesAreTheIdentifiersOtherStagesUse() {
        ProfileCatalog catalog = Vocabulary.standard().profiles();
        assertEquals(new TreeSet<>(List.of("discharge_air_temperature", "zone_air_temperature",
                "zone_temperature_setpoint", "cooling_valve_command", "heating_valve_command", "fan_status",
                "chilled_water_supply_temperature", "hot_water_supply_temperature", "outdoor_air_temperature",
                "occupancy")), catalog.roles().keySet());
        Profile fcu = catalog.profile(ProfileCatalog.DEFAULT_PROFILE);
        assertEquals(List.of("cooling", "heating"), fcu.modes().stream().map(ModeRequirement::name).toList());
        assertEquals(List.of("discharge_air_temperature", "zone_air_temperature", "cooling_valve_command"),
                fcu.modes().get(0).required());
        assertEquals(List.of("discharge_air_temperature", "zone_air_temperature", "heating_valve_command"),
                fcu.modes().get(1).required());
    }
}
