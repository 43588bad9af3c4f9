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
        Set<String> named = namedBrickTerms(tufa);
        Set<String> legacy = legacyNames(tufa);
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
        // The legacy names are what older Brick versions defined and published models still use: not in 1.4.4.
        assertTrue(legacy.size() >= 10, legacy.toString());
        Set<String> current = new TreeSet<>();
        for (String iri : legacy) {
            if (brick.contains(brick.createResource(iri), RDF.type, OWL.Class)) {
                current.add(iri);
            }
        }
        assertEquals(Set.of(), current, "tufa:legacyPointClass names that Brick 1.4.4 still defines (use tufa:pointClass)");
    }

    @Test
    void everyBrickClassNamedInTufaTermsIsInTheBundledBrick() {
        // The lookups reason with the Brick tufa bundles: a class missing from it would match only its own
        // instances, not its subclasses' (the bundled index is all of Brick 1.4.4, see BundleBrick).
        Model tufa = ModelLoader.loadResource(Namespaces.TUFA_TERMS_RESOURCE);
        org.tufa.vocabulary.BrickVocabulary bundled = org.tufa.vocabulary.BrickVocabulary.bundled();
        Set<String> absent = new TreeSet<>();
        for (String iri : namedBrickTerms(tufa)) {
            if (iri.startsWith(Namespaces.BRICK) && !bundled.isClass(iri)) {
                absent.add(iri);
            }
        }
        assertEquals(Set.of(), absent, "Brick classes tufa.ttl names that the bundled Brick lacks");
    }

    /** Brick classes and tags tufa.ttl names, without the legacy point classes. */
    private static Set<String> namedBrickTerms(Model tufa) {
        Set<String> legacy = legacyNames(tufa);
        Set<String> named = new TreeSet<>();
        tufa.listObjects().forEachRemaining((RDFNode o) -> {
            if (o.isURIResource() && (o.asResource().getURI().startsWith(Namespaces.BRICK)
                    || o.asResource().getURI().startsWith(Namespaces.TAG)) && !legacy.contains(o.asResource().getURI())) {
                named.add(o.asResource().getURI());
            }
        });
        return named;
    }

    private static Set<String> legacyNames(Model tufa) {
        Set<String> out = new TreeSet<>();
        tufa.listObjectsOfProperty(tufa.createProperty(Namespaces.TUFA, "legacyPointClass"))
                .forEachRemaining(o -> out.add(o.asResource().getURI()));
        return out;
    }

    @Test
    void roleNamesAreTheIdentifiersOtherStagesUse() {
        ProfileCatalog catalog = Vocabulary.standard().profiles();
        assertEquals(new TreeSet<>(List.of("discharge_air_temperature", "zone_air_temperature",
                "zone_temperature_setpoint", "zone_cooling_temperature_setpoint", "zone_heating_temperature_setpoint",
                "cooling_valve_command", "heating_valve_command", "fan_status", "fan_speed",
                "chilled_water_supply_temperature", "hot_water_supply_temperature", "outdoor_air_temperature",
                "occupancy", "airflow", "airflow_setpoint", "damper_position", "damper_command", "reheat_valve_command",
                "electric_reheat_command", "ahu_supply_air_temperature", "ahu_supply_static_pressure")),
                catalog.roles().keySet());
        assertEquals(List.of("fcu-modes", "vav-cooling-only", "vav-electric-reheat", "vav-hot-water-reheat",
                "vav-parallel-fan", "vav-series-fan"), catalog.automatic().stream().map(Profile::name).toList());
        for (Profile vav : catalog.automatic().subList(1, 6)) {
            assertEquals(Profile.VAV, vav.unitKind(), vav.name());
            // The two targets of issue 11: (a) discharge temperature, airflow and a damper point make a box
            // analysable in cooling; (b) airflow, its setpoint, a damper point and the zone temperature in airflow.
            assertEquals(List.of("discharge_air_temperature", "airflow", "damper"),
                    mode(vav, "cooling").requiredNames(), vav.name());
            assertEquals(List.of("zone_air_temperature", "airflow", "airflow_setpoint", "damper"),
                    mode(vav, "airflow").requiredNames(), vav.name());
        }
        Profile fcu = catalog.profile(ProfileCatalog.DEFAULT_PROFILE);
        assertEquals(List.of("cooling", "heating"), fcu.modes().stream().map(ModeRequirement::name).toList());
        assertEquals(List.of("discharge_air_temperature", "zone_air_temperature", "cooling_valve_command"),
                fcu.modes().get(0).requiredNames());
        assertEquals(List.of("discharge_air_temperature", "zone_air_temperature", "heating_valve_command"),
                fcu.modes().get(1).requiredNames());
    }

    private static ModeRequirement mode(Profile p, String name) {
        return p.modes().stream().filter(m -> m.name().equals(name)).findFirst().orElseThrow();
    }
}
