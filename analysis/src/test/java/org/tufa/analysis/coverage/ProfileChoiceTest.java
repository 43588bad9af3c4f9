package org.tufa.analysis.coverage;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The choice of profile per unit and the role choices, on Tallowmere Annex (tallowmere-annex.ttl), written by hand:
 * the expected profile of each unit is the comment above it in the file, worked out from the rules in tufa.ttl.
 */
class ProfileChoiceTest {
    private static final String TA = "https://tallowmere.example.org/annex#";
    private static FleetCoverage coverage;

    @BeforeAll
    static void assess() {
        Model model = ModelLoader.load(Fixtures.resource("tallowmere-annex.ttl"));
        coverage = Coverage.assess(model, Vocabulary.standard(), Set.of());
    }

    @Test
    void eachUnitGetsTheMostSpecificFittingProfile() {
        Map<String, String> profiles = new TreeMap<>();
        coverage.units().forEach(u -> profiles.put(u.unit().substring(TA.length()), u.profileName()));
        assertEquals(Map.of("FCU_A1", "fcu-modes", "VAV_C1", "vav-cooling-only", "VAV_R1", "vav-hot-water-reheat",
                "VAV_R2", "vav-hot-water-reheat", "VAV_E1", "vav-electric-reheat", "VAV_F1", "vav-parallel-fan",
                "VAV_F2", "vav-series-fan", "TU_X", ""), profiles);
    }

    @Test
    void aTieOnEvidenceIsNotedForTheModelAuthor() {
        UnitCoverage f1 = unit("VAV_F1");
        assertEquals(1, f1.problems().size(), f1.problems().toString());
        assertTrue(f1.problems().get(0).startsWith("profiles vav-parallel-fan, vav-series-fan fit equally well; "
                + "vav-parallel-fan was chosen"), f1.problems().get(0));
        assertTrue(unit("VAV_F2").problems().isEmpty(), "the class tufa:SeriesFanPoweredBox decides");
        // The heating (loop) command counts as the reheat command when nothing better exists.
        assertEquals(TA + "VAVF1_HTG", f1.point("reheat_valve_command").orElseThrow().iri());
    }

    @Test
    void theCoolingAndHeatingPairStandsInForTheZoneSetpoint() {
        UnitCoverage fcu = unit("FCU_A1");
        assertFalse(fcu.missing().contains("zone_setpoint"), fcu.missing().toString());
        assertEquals(TA + "FCUA1_OCSP", fcu.point("zone_cooling_temperature_setpoint").orElseThrow().iri());
        assertEquals(TA + "FCUA1_OHSP", fcu.point("zone_heating_temperature_setpoint").orElseThrow().iri());
        UnitCoverage r1 = unit("VAV_R1");
        assertTrue(Boolean.TRUE.equals(r1.modes().get("zone")), "zone temperature and the pair on its zone");
    }

    @Test
    void modesThatNeedNoDischargeSensorAndTheDamperChoice() {
        UnitCoverage c1 = unit("VAV_C1");
        assertEquals(Map.of("airflow", false, "cooling", true, "deadband", true, "zone", false), c1.modes());
        assertEquals(TA + "VAVC1_DMP_CMD", c1.point("damper_command").orElseThrow().iri());
        assertEquals(Place.ON_PART, c1.roles().get("damper_command").place());
        UnitCoverage r1 = unit("VAV_R1");
        assertEquals(Map.of("airflow", true, "cooling", false, "deadband", false, "reheat", false, "zone", true),
                r1.modes());
        assertEquals(TA + "VAVR1_AFSP", r1.point("airflow_setpoint").orElseThrow().iri(),
                "the fixed occupied flow setpoint is configuration, not the active setpoint");
        assertEquals(TA + "VAVR1_RHV", r1.point("reheat_valve_command").orElseThrow().iri());
        assertEquals(TA + "HW_SUPPLY", r1.point("hot_water_supply_temperature").orElseThrow().iri(),
                "upstream of the reheat valve part");
        assertEquals(List.of("discharge_air_temperature"), r1.missing().stream()
                .filter(m -> m.equals("discharge_air_temperature")).toList());
        String reason = CoverageSummary.reason(coverage, unit("VAV_F2"));
        assertTrue(reason.contains("; cooling, deadband lack discharge_air_temperature, airflow, damper; "), reason);
        assertFalse(reason.contains("untagged"), "a fan status is no hint of electric reheat: " + reason);
    }

    @Test
    void upstreamAirHandlerPointsAndTheUnitWithoutProfile() {
        UnitCoverage r2 = unit("VAV_R2");
        assertEquals(TA + "AHU9_SAT", r2.point("ahu_supply_air_temperature").orElseThrow().iri());
        assertEquals(TA + "AHU9_DSP", r2.point("ahu_supply_static_pressure").orElseThrow().iri());
        assertEquals(TA + "VAVR2_HWV_CMD", r2.point("reheat_valve_command").orElseThrow().iri(),
                "on the valve, a part of the coil, a part of the box");
        UnitCoverage x = unit("TU_X");
        assertFalse(x.analyzable());
        assertTrue(x.roles().isEmpty());
        String reason = CoverageSummary.reason(coverage, x);
        assertTrue(reason.startsWith("no requirement profile applies to "), reason);
        assertEquals(1, coverage.unitsWithoutProfile().size());
        String csv = CoverageFiles.csv(coverage);
        assertTrue(csv.lines().anyMatch(l -> l.startsWith(TA + "VAV_E1,,") && l.contains(",vav-electric-reheat,vav,")),
                csv);
    }

    private static UnitCoverage unit(String local) {
        return coverage.units().stream().filter(u -> u.unit().equals(TA + local)).findFirst().orElseThrow();
    }
}
