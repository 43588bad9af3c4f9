package org.tufa.analysis.coverage;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import org.apache.jena.query.QuerySolution;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.tufa.vocabulary.Namespaces;

/**
 * Coverage on Brick models of real buildings that this project did not write: the Brick Consortium's published
 * examples (github.com/BrickSchema/Brick, BSD-3-Clause; ../shared/brick-examples/README.md names files and commits).
 * The counts below were read from the models (units per class with `tufa query`; which boxes carry which points
 * from the models' own hasPoint / hasPart links), not from tufa's output. Skipped where ../shared is absent.
 *
 * <p>The targets of issue 11: every terminal unit is in the table with a profile that fits its class, and every
 * VAV box that carries (a) discharge temperature, airflow and a damper point, or (b) airflow, its setpoint, a
 * damper point and zone temperature, is analysable in at least one mode. The (a)/(b) check uses a query of its
 * own, written independently of tufa's lookups.
 */
class PublishedModelsCoverageTest {
    private static final String VAV = Namespaces.BRICK + "VAV";
    private static Vocabulary standard;

    @BeforeAll
    static void load() {
        standard = Vocabulary.standard();
    }

    /** Per model: units per class, per profile the analysable units, per profile and mode the analysable units. */
    private record Expected(Map<String, Integer> unitsByClass, Map<String, Integer> unitsByProfile,
            Map<String, Integer> analysableByProfile, Map<String, Integer> byProfileMode, int targetBoxes) {
    }

    @Test
    void sodaHall() {
        // 243 boxes typed brick:VAV; none has a damper point, a discharge sensor or a flow setpoint, so neither
        // target (a) nor (b) applies. 227 carry a supply air flow sensor, 232 a zone temperature and 231 a zone
        // setpoint (counted in soda-points-labelled.csv); 216 carry all three: the zone mode.
        check("soda_brick.ttl", new Expected(Map.of(VAV, 243), Map.of("vav-cooling-only", 243),
                Map.of("vav-cooling-only", 216),
                Map.of("vav-cooling-only/cooling", 0, "vav-cooling-only/deadband", 0, "vav-cooling-only/airflow", 0,
                        "vav-cooling-only/zone", 216), 0));
    }

    @Test
    void riceCampusBuilding() {
        // 8 boxes without airflow or damper points (room sensors mostly typed Air_Temperature_Sensor).
        check("rice_brick.ttl", new Expected(Map.of(VAV, 8), Map.of("vav-cooling-only", 8),
                Map.of("vav-cooling-only", 0), Map.of("vav-cooling-only/zone", 0), 0));
    }

    @Test
    void gtcWithLocalClassesAndPathIris() {
        // 12 boxes: a cooling valve command and a chilled-water "Flow" on the box, two dampers as parts without
        // points, a downstream temperature sensor modelled as a part of a local class (gtc:Celcius_Temperature_Sensor,
        // a plain brick:Sensor): no airflow, no damper point, so no mode; in the table all the same.
        check("gtc_brick.ttl", new Expected(Map.of(VAV, 12), Map.of("vav-cooling-only", 12),
                Map.of("vav-cooling-only", 0), Map.of("vav-cooling-only/cooling", 0), 0));
    }

    @Test
    void guideline36BoxA2() {
        // ASHRAE Guideline 36 example A2 as modelled: supply air flow and temperature sensors on the box, a damper
        // part with its position command, a hot-water coil part holding a heating valve with its command.
        Expected e = new Expected(Map.of(VAV, 1), Map.of("vav-hot-water-reheat", 1), Map.of("vav-hot-water-reheat", 1),
                Map.of("vav-hot-water-reheat/cooling", 1, "vav-hot-water-reheat/deadband", 1,
                        "vav-hot-water-reheat/reheat", 1, "vav-hot-water-reheat/airflow", 0,
                        "vav-hot-water-reheat/zone", 0), 1);
        FleetCoverage c = check("g36-vav-a2.ttl", e);
        UnitCoverage box = c.units().get(0);
        assertEquals("http://example.org#vlvcmd1", box.point("reheat_valve_command").orElseThrow().iri());
        assertEquals("http://example.org#dmppos1", box.point("damper_command").orElseThrow().iri());
        assertEquals("http://example.org#sats1", box.point("discharge_air_temperature").orElseThrow().iri());
    }

    @Test
    void guideline36AirHandlerFeedingABox() {
        FleetCoverage c = check("g36-combined-ahu-vav.ttl", new Expected(Map.of(VAV, 1),
                Map.of("vav-hot-water-reheat", 1), Map.of("vav-hot-water-reheat", 1),
                Map.of("vav-hot-water-reheat/cooling", 1, "vav-hot-water-reheat/reheat", 1), 1));
        assertTrue(c.units().get(0).point("ahu_supply_air_temperature").isPresent(),
                "the AHU's supply air temperature, found upstream");
    }

    @Test
    void reheatBoxWithConnectionsOnly() {
        // No points at all; a hot-water coil part shows the reheat.
        check("rvav.ttl", new Expected(Map.of(VAV, 1), Map.of("vav-hot-water-reheat", 1),
                Map.of("vav-hot-water-reheat", 0), Map.of("vav-hot-water-reheat/reheat", 0), 0));
    }

    @Test
    void theFullBrickFileChangesNothingHere() {
        Optional<Path> brick = Fixtures.fullBrick();
        Optional<Path> gtc = Fixtures.brickExample("gtc_brick.ttl");
        assumeTrue(brick.isPresent() && gtc.isPresent(), "../shared absent: published-model check skipped");
        Model model = ModelLoader.load(gtc.get());
        FleetCoverage bundled = Coverage.assess(model, standard, Set.of());
        Vocabulary full = Vocabulary.load(List.of(brick.get()));
        FleetCoverage withFull = Coverage.assess(model, full, Set.of());
        assertEquals(CoverageFiles.csv(bundled), CoverageFiles.csv(withFull));
        // tufa bundles all of Brick 1.4.4 (issue 12): the standard vocabulary already is the whole ontology
        assertTrue(bundled.fullBrick());
        assertTrue(withFull.fullBrick());
        // gtc uses brick:Flow and brick:Chilled_Supply_Water, which no Brick version 1.x defines as classes.
        assertTrue(withFull.undeclaredBrickClasses().containsKey(Namespaces.BRICK + "Flow"));
        assertEquals(withFull.undeclaredBrickClasses(), bundled.undeclaredBrickClasses());
        String text = String.join("\n", CoverageSummary.lines(bundled, Vocabulary.prefixesFor(model), 5));
        assertFalse(text.contains(CoverageSummary.FULL_BRICK_HINT), text);
        assertTrue(text.contains("the loaded Brick vocabulary does not define"), text);
    }

    private static FleetCoverage check(String file, Expected expected) {
        Optional<Path> path = Fixtures.brickExample(file);
        assumeTrue(path.isPresent(), "../shared/brick-examples/" + file + " absent: published-model check skipped");
        Model model = ModelLoader.load(path.get());
        FleetCoverage c = Coverage.assess(model, standard, Set.of());
        assertEquals(expected.unitsByClass(), c.unitsByClass(), file + ": units per class");
        Map<String, Integer> byProfile = new TreeMap<>();
        Map<String, Integer> analysable = new TreeMap<>();
        for (UnitCoverage u : c.units()) {
            assertTrue(u.profile().isPresent(), file + ": " + u.unit() + " has no profile");
            assertEquals(Profile.VAV, u.unitKind(), file + ": " + u.unit() + " is a VAV box");
            byProfile.merge(u.profileName(), 1, Integer::sum);
            analysable.merge(u.profileName(), u.analyzable() ? 1 : 0, Integer::sum);
        }
        assertEquals(expected.unitsByProfile(), byProfile, file + ": units per profile");
        assertEquals(expected.analysableByProfile(), analysable, file + ": analysable units per profile");
        expected.byProfileMode().forEach((key, count) -> {
            String[] pm = key.split("/");
            Profile p = standard.profiles().profile(pm[0]);
            assertEquals((long) count, c.modeCount(p, pm[1]), file + ": " + key);
        });
        Set<String> mustBeAnalysable = boxesMeetingTheTargets(model);
        assertEquals(expected.targetBoxes(), mustBeAnalysable.size(), file + ": boxes with the points of (a) or (b)");
        for (UnitCoverage u : c.units()) {
            if (mustBeAnalysable.contains(u.unit())) {
                assertTrue(u.analyzable(), file + ": " + u.unit() + " carries the points of target (a) or (b): "
                        + CoverageSummary.reason(c, u));
            }
        }
        return c;
    }

    /**
     * The boxes that carry (a) discharge temperature, airflow and a damper point, or (b) airflow, its setpoint, a
     * damper point and a zone temperature: points of the box or of its parts (any depth), the zone temperature
     * also on a space the box feeds. Written from the Brick class names, without tufa's lookups.
     */
    private static Set<String> boxesMeetingTheTargets(Model model) {
        Model all = standard.unionWith(model);
        String has = "?box (brick:hasPart|^brick:isPartOf)* ?host . ?host brick:hasPoint|^brick:isPointOf ?%1$s . "
                + "?%1$s a/rdfs:subClassOf* ?%1$sc . VALUES ?%1$sc { %2$s } ";
        String dat = String.format(has, "dat", "brick:Discharge_Air_Temperature_Sensor brick:Supply_Air_Temperature_Sensor");
        String flow = String.format(has, "flow", "brick:Discharge_Air_Flow_Sensor brick:Supply_Air_Flow_Sensor");
        String damper = String.format(has, "dmp", "brick:Damper_Position_Sensor brick:Damper_Command");
        String setpoint = String.format(has, "sp", "brick:Discharge_Air_Flow_Setpoint brick:Supply_Air_Flow_Setpoint");
        String zone = "{ ?box brick:hasPoint|^brick:isPointOf ?znt } UNION { ?box brick:feeds ?z . "
                + "?z (brick:hasPart)* ?room . ?room brick:hasPoint|^brick:isPointOf ?znt } "
                + "?znt a/rdfs:subClassOf* brick:Zone_Air_Temperature_Sensor . ";
        String select = "SELECT DISTINCT ?box WHERE { ?box a/rdfs:subClassOf* brick:Variable_Air_Volume_Box . "
                + "{ { " + dat + flow.replace("?host", "?host2") + damper.replace("?host", "?host3") + " } UNION { "
                + flow + setpoint.replace("?host", "?host2") + damper.replace("?host", "?host3") + zone + " } } }";
        Set<String> out = new TreeSet<>();
        for (QuerySolution row : Sparql.select(all, Sparql.build(select.replace("a/rdfs:subClassOf*",
                "a/" + Sparql.SUBCLASS_STEP + "*"), Map.of()))) {
            out.add(row.getResource("box").getURI());
        }
        return out;
    }
}
