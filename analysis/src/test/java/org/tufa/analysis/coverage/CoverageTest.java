package org.tufa.analysis.coverage;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.tufa.vocabulary.Namespaces;

/**
 * Coverage of Quillmoor Hall (quillmoor-hall.ttl), a hand-written model in the style of the published Brick
 * examples (brickschema.org): every role found where the model puts it, nothing invented, missing and ambiguous
 * roles reported as such. The expected mapping below was written by hand from the model's comments.
 */
class CoverageTest {
    private static final String BLDG = "https://quillmoor.example.org/building#";

    /**
     * Per unit, per role of fcu-modes (column order): the point's local name, '-' missing, ambiguous(candidates).
     * Asked for by name, fcu-modes does not apply to the reheat box, which is listed without a profile.
     */
    static final String EXPECTED = """
            FCU_101 Fan_Coil_Unit cooling=true heating=true
              discharge_air_temperature=FCU101_DAT@unit
              zone_air_temperature=FCU101_ZNT@unit
              zone_temperature_setpoint=FCU101_ZNTSP@unit
              zone_cooling_temperature_setpoint=-
              zone_heating_temperature_setpoint=-
              cooling_valve_command=FCU101_CHWV_Cmd@part
              heating_valve_command=FCU101_HWV_Cmd@part
              fan_status=FCU101_FanSts@unit
              fan_speed=-
              chilled_water_supply_temperature=CHW_Loop_SupplyTemp@upstream
              hot_water_supply_temperature=HW_Loop_SupplyTemp@upstream
              outdoor_air_temperature=QH_OAT@building
              occupancy=FCU101_Occ@unit
            FCU_102 FCU cooling=true heating=true
              discharge_air_temperature=FCU102_SAT@unit
              zone_air_temperature=Z102_ZNT@zone
              zone_temperature_setpoint=FCU102_SP@unit
              zone_cooling_temperature_setpoint=-
              zone_heating_temperature_setpoint=-
              cooling_valve_command=FCU102_CLG@unit
              heating_valve_command=FCU102_HTG@unit
              fan_status=FCU102_Fan_OnOff@part
              fan_speed=-
              chilled_water_supply_temperature=CHW_Loop_SupplyTemp@upstream
              hot_water_supply_temperature=HW_Loop_SupplyTemp@upstream
              outdoor_air_temperature=QH_OAT@building
              occupancy=Z102_OCC@zone
            FCU_103 Fan_Coil_Unit cooling=false heating=false
              discharge_air_temperature=-
              zone_air_temperature=R103a_ZNT@zone
              zone_temperature_setpoint=-
              zone_cooling_temperature_setpoint=-
              zone_heating_temperature_setpoint=-
              cooling_valve_command=FCU103_CV_Cmd@part
              heating_valve_command=-
              fan_status=FCU103_FanSpd@unit
              fan_speed=FCU103_FanSpd@unit
              chilled_water_supply_temperature=CHW_Loop_SupplyTemp@upstream
              hot_water_supply_temperature=-
              outdoor_air_temperature=QH_OAT@building
              occupancy=-
            FCU_104 Fan_Coil_Unit cooling=false heating=false
              discharge_air_temperature=FCU104_DAT@unit
              zone_air_temperature=FCU104_ZNT@unit
              zone_temperature_setpoint=-
              zone_cooling_temperature_setpoint=-
              zone_heating_temperature_setpoint=-
              cooling_valve_command=-
              heating_valve_command=-
              fan_status=-
              fan_speed=-
              chilled_water_supply_temperature=CHW_Loop_SupplyTemp@upstream
              hot_water_supply_temperature=-
              outdoor_air_temperature=QH_OAT@building
              occupancy=-
            FCU_105 Fan_Coil_Unit cooling=false heating=false
              discharge_air_temperature=FCU105_DAT@unit
              zone_air_temperature=ambiguous(FCU105_ZNT_A,FCU105_ZNT_B)@unit
              zone_temperature_setpoint=-
              zone_cooling_temperature_setpoint=-
              zone_heating_temperature_setpoint=-
              cooling_valve_command=FCU105_CHWV_Cmd@part
              heating_valve_command=-
              fan_status=-
              fan_speed=-
              chilled_water_supply_temperature=CHW_Loop_SupplyTemp@upstream
              hot_water_supply_temperature=-
              outdoor_air_temperature=QH_OAT@building
              occupancy=-
            VAV_201 Variable_Air_Volume_Box_With_Reheat (no profile)
            """;

    private static Model model;
    private static Vocabulary standard;

    @BeforeAll
    static void load() {
        model = ModelLoader.load(Fixtures.resource("quillmoor-hall.ttl"));
        standard = Vocabulary.standard();
    }

    static String render(FleetCoverage coverage) {
        StringBuilder sb = new StringBuilder();
        for (UnitCoverage u : coverage.units()) {
            sb.append(local(u.unit())).append(' ').append(local(u.unitClass()));
            if (u.profile().isEmpty()) {
                sb.append(" (no profile)");
            }
            u.modes().forEach((m, ok) -> sb.append(' ').append(m).append('=').append(ok));
            sb.append('\n');
            for (RoleMatch m : u.roles().values()) {
                sb.append("  ").append(m.role()).append('=');
                switch (m.status()) {
                    case FOUND -> sb.append(local(m.point().orElseThrow().iri()));
                    case MISSING -> sb.append('-');
                    case AMBIGUOUS -> sb.append("ambiguous(")
                            .append(m.candidates().stream().map(p -> local(p.iri())).collect(Collectors.joining(",")))
                            .append(')');
                }
                if (m.place() != null) {
                    sb.append('@').append(m.place().label());
                }
                sb.append('\n');
            }
        }
        return sb.toString();
    }

    private static String local(String iri) {
        return iri.substring(iri.indexOf('#') + 1);
    }

    @Test
    void everyRoleFoundWhereTheModelPutsItAndNothingInvented() {
        FleetCoverage c = Coverage.assess(model, standard, standard.profiles().profile("fcu-modes"), Set.of());
        assertEquals(EXPECTED, render(c));
        assertEquals(2, c.analyzableCount());
        assertEquals(2, c.modeCount("cooling"));
        assertEquals(2, c.modeCount("heating"));
    }

    @Test
    void automaticChoiceGivesTheReheatBoxAVavProfileInItsOwnWords() {
        FleetCoverage c = Coverage.assess(model, standard, Set.of());
        assertTrue(c.automatic());
        UnitCoverage vav = unit(c, "VAV_201");
        assertEquals("vav-hot-water-reheat", vav.profileName(), "its class says reheat and it has a reheat valve");
        assertEquals(Profile.VAV, vav.unitKind());
        assertEquals(BLDG + "VAV201_RHV_Cmd", vav.point("reheat_valve_command").orElseThrow().iri());
        assertEquals(Place.ON_PART, vav.roles().get("reheat_valve_command").place());
        assertFalse(vav.roles().containsKey("cooling_valve_command"), "fan coil words stay with fan coil units");
        String reason = CoverageSummary.reason(c, vav);
        assertTrue(reason.contains("reheat lacks airflow"), reason);
        assertFalse(reason.contains("cooling_valve_command"), reason);
        // The fan coil units get the same points as with fcu-modes named.
        FleetCoverage named = Coverage.assess(model, standard, standard.profiles().profile("fcu-modes"), Set.of());
        for (UnitCoverage u : named.units()) {
            if (u.profile().isPresent()) {
                assertEquals(u.roles(), unit(c, local(u.unit())).roles(), u.unit());
            }
        }
    }

    @Test
    void sameMappingWithTheFullBrickVocabulary() {
        Optional<Path> brick = Fixtures.fullBrick();
        assumeTrue(brick.isPresent(), "../shared/vocab/Brick.ttl absent: full-vocabulary check skipped");
        Vocabulary full = Vocabulary.load(List.of(brick.get()));
        FleetCoverage c = Coverage.assess(model, full, full.profiles().profile("fcu-modes"), Set.of());
        assertEquals(EXPECTED, render(c));
    }

    @Test
    void pointDetailsComeFromTheExternalReferenceElseTheLabel() {
        FleetCoverage c = Coverage.assess(model, standard, standard.profiles().profile("fcu-modes"), Set.of());
        UnitCoverage fcu101 = c.units().get(0);
        PointRef dat = fcu101.point("discharge_air_temperature").orElseThrow();
        assertEquals(new PointRef(BLDG + "FCU101_DAT", "FCU101.DAT", "ts-101-dat", Namespaces.UNIT + "DEG_C",
                Namespaces.BRICK + "Discharge_Air_Temperature_Sensor"), dat);
        PointRef chws = fcu101.point("chilled_water_supply_temperature").orElseThrow();
        assertEquals("ts-chw-supply", chws.timeseriesId());
        assertEquals(Namespaces.BRICK + "Chilled_Water_Supply_Temperature_Sensor", chws.brickClass());
        PointRef znt = fcu101.point("zone_air_temperature").orElseThrow();
        assertEquals("FCU101.ZNT", znt.timeseriesId(), "no reference: the label stands in");
        assertEquals(null, znt.unitOfMeasureIri());
    }

    @Test
    void untaggedValveCommandsAreHintsNotGuesses() {
        FleetCoverage c = Coverage.assess(model, standard, standard.profiles().profile("fcu-modes"), Set.of());
        UnitCoverage fcu104 = unit(c, "FCU_104");
        RoleMatch cooling = fcu104.roles().get("cooling_valve_command");
        assertEquals(MatchStatus.MISSING, cooling.status());
        assertEquals(List.of(BLDG + "FCU104_V1", BLDG + "FCU104_V2"),
                cooling.untagged().stream().map(PointRef::iri).toList());
        assertEquals(List.of("zone_setpoint", "cooling_valve_command", "heating_valve_command",
                "fan_status", "hot_water_supply_temperature", "occupancy"), fcu104.missing());
    }

    @Test
    void nominalAirflowConvertedToCubicMetresPerSecond() {
        FleetCoverage c = Coverage.assess(model, standard, standard.profiles().profile("fcu-modes"), Set.of());
        // NIST SP 811 (2008), appendix B.8: 1 ft3/min = 4.719 474 E-04 m3/s (7 digits, so +-5E-11 per ft3/min);
        // 1 L = 1E-03 m3.
        assertEquals(400 * 4.719474e-4, unit(c, "FCU_101").nominalAirflow().orElseThrow().cubicMetresPerSecond(),
                400 * 5e-11);
        assertEquals(0.150, unit(c, "FCU_102").nominalAirflow().orElseThrow().cubicMetresPerSecond(), 1e-12);
        UnitCoverage fcu105 = unit(c, "FCU_105");
        assertTrue(fcu105.nominalAirflow().isEmpty());
        assertEquals(1, fcu105.problems().size());
        assertTrue(fcu105.problems().get(0).contains("GAL_US-PER-MIN"), fcu105.problems().get(0));
        assertTrue(unit(c, "FCU_103").problems().isEmpty());
    }

    @Test
    void unitClassFilterIncludesSubclassesAndEquivalentClasses() {
        Profile p = standard.profiles().profile("fcu-modes");
        FleetCoverage fcus = Coverage.assess(model, standard, p, Set.of(Namespaces.BRICK + "Fan_Coil_Unit"));
        assertEquals(List.of("FCU_101", "FCU_102", "FCU_103", "FCU_104", "FCU_105"),
                fcus.units().stream().map(u -> local(u.unit())).toList());
        FleetCoverage vavs = Coverage.assess(model, standard, p, Set.of(Namespaces.BRICK + "Variable_Air_Volume_Box"));
        assertEquals(List.of("VAV_201"), vavs.units().stream().map(u -> local(u.unit())).toList());
    }

    @Test
    void coolingOnlyProfileJudgesOnlyTheCoolingMode() {
        Profile p = standard.profiles().profile("cooling-only");
        FleetCoverage c = Coverage.assess(model, standard, p, Set.of());
        assertEquals(List.of("FCU_101", "FCU_102"),
                c.units().stream().filter(UnitCoverage::analyzable).map(u -> local(u.unit())).toList());
        assertFalse(p.roleNames().contains("heating_valve_command"));
    }

    @Test
    void aUserProfileInATurtleFileNeedsNoJava() {
        Vocabulary withMine = Vocabulary.load(List.of(Fixtures.resource("user-profile.ttl")));
        assertEquals(List.of("cooling-only", "dat-watch", "fcu-modes", "vav-cooling-only", "vav-electric-reheat",
                "vav-hot-water-reheat", "vav-parallel-fan", "vav-series-fan"), withMine.profiles().names());
        assertFalse(withMine.profiles().automatic().stream().anyMatch(p -> p.name().equals("dat-watch")),
                "a profile without tufa:appliesTo is used only when named");
        FleetCoverage c = Coverage.assess(model, withMine, withMine.profiles().profile("dat-watch"), Set.of());
        assertEquals(List.of("FCU_101", "FCU_102", "FCU_104", "FCU_105", "VAV_201"),
                c.units().stream().filter(UnitCoverage::analyzable).map(u -> local(u.unit())).toList());
        assertEquals(List.of("discharge_air_temperature", "outdoor_air_temperature"),
                withMine.profiles().profile("dat-watch").roleNames());
    }

    @Test
    void sameInputSameBytes() {
        Profile p = standard.profiles().profile("fcu-modes");
        FleetCoverage a = Coverage.assess(model, standard, p, Set.of());
        FleetCoverage b = Coverage.assess(ModelLoader.load(Fixtures.resource("quillmoor-hall.ttl")),
                Vocabulary.standard(), p, Set.of());
        assertEquals(CoverageFiles.csv(a), CoverageFiles.csv(b));
        assertEquals(CoverageFiles.json(a), CoverageFiles.json(b));
    }

    @Test
    void csvHasOneRowPerUnitWithRoleColumns() {
        FleetCoverage c = Coverage.assess(model, standard, standard.profiles().profile("fcu-modes"), Set.of());
        List<String> lines = CoverageFiles.csv(c).lines().toList();
        assertEquals("unit,label,unit_class,profile,unit_kind,discharge_air_temperature,zone_air_temperature,"
                + "zone_temperature_setpoint,zone_cooling_temperature_setpoint,zone_heating_temperature_setpoint,"
                + "cooling_valve_command,heating_valve_command,fan_status,fan_speed,chilled_water_supply_temperature,"
                + "hot_water_supply_temperature,outdoor_air_temperature,occupancy,analyzable,missing,"
                + "cooling_analyzable,heating_analyzable,nominal_airflow_m3s", lines.get(0));
        assertEquals(7, lines.size());
        String fcu105 = lines.get(5);
        assertTrue(fcu105.startsWith(BLDG + "FCU_105,FCU-105,"), fcu105);
        assertTrue(fcu105.contains(",fcu-modes,fan_coil," + BLDG + "FCU105_DAT,ambiguous,,"), fcu105);
        assertTrue(fcu105.endsWith(",false,zone_setpoint;heating_valve_command;fan_status;"
                + "hot_water_supply_temperature;occupancy,false,false,"), fcu105);
        String vav = lines.get(6);
        assertTrue(vav.startsWith(BLDG + "VAV_201,VAV-201,"
                + Namespaces.BRICK + "Variable_Air_Volume_Box_With_Reheat,,,,,,"), "no profile, no roles: " + vav);
        String json = CoverageFiles.json(c);
        assertTrue(json.contains("\"candidates\": ["), json);
        assertTrue(json.contains(BLDG + "FCU105_ZNT_B"), json);
    }

    private static UnitCoverage unit(FleetCoverage c, String local) {
        return c.units().stream().filter(u -> u.unit().equals(BLDG + local)).findFirst().orElseThrow();
    }
}
