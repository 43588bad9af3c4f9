package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.Vocabulary;

/**
 * A three-speed fan's stage command logged unitless (0 off, 1-3): its values are stage numbers, not a 0-1
 * fraction, so the fraction's plausible range (at most 2) must not drop stage 3 as a logging error, while the
 * unit's other unitless points (a valve command read as a fraction) keep their range.
 */
class FanSpeedRangeTest {

    private static final String MODEL = """
            @prefix brick: <https://brickschema.org/schema/Brick#> .
            @prefix unit: <http://qudt.org/vocab/unit/> .
            @prefix ref: <https://brickschema.org/schema/Brick/ref#> .
            @prefix b: <urn:example:marrowby#> .
            b:FCU-1 a brick:Fan_Coil_Unit ;
                brick:hasPoint b:DAT, b:ZT, b:CV, b:FS, b:SPD .
            b:DAT a brick:Discharge_Air_Temperature_Sensor ; brick:hasUnit unit:DEG_C ;
                ref:hasExternalReference [ a ref:TimeseriesReference ; ref:hasTimeseriesId "dat" ] .
            b:ZT a brick:Zone_Air_Temperature_Sensor ; brick:hasUnit unit:DEG_C ;
                ref:hasExternalReference [ a ref:TimeseriesReference ; ref:hasTimeseriesId "zt" ] .
            b:CV a brick:Valve_Command ; brick:hasTag <https://brickschema.org/schema/BrickTag#Cooling> ;
                brick:hasUnit unit:UNITLESS ;
                ref:hasExternalReference [ a ref:TimeseriesReference ; ref:hasTimeseriesId "cv" ] .
            b:FS a brick:Fan_Status ;
                ref:hasExternalReference [ a ref:TimeseriesReference ; ref:hasTimeseriesId "fs" ] .
            b:SPD a brick:Fan_Speed_Command ; brick:hasUnit unit:UNITLESS ;
                ref:hasExternalReference [ a ref:TimeseriesReference ; ref:hasTimeseriesId "spd" ] .
            """;

    @Test
    void aUnitlessStageCommandHasNoFractionRange(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("marrowby.ttl");
        Files.writeString(file, MODEL);
        FleetCoverage coverage = Coverage.assess(ModelLoader.load(file), Vocabulary.standard(), Set.of());
        assertEquals("spd", coverage.units().get(0).point("fan_speed").orElseThrow().timeseriesId());
        FleetPlan plan = FleetPlan.of(coverage, AnalysisSettings.defaults());
        assertTrue(plan.wanted().containsKey("spd"), "the speed is read");
        assertFalse(plan.ranges().containsKey("spd"), "stage 3 of a unitless stage command is no logging error");
        assertEquals(2.0, plan.ranges().get("cv").max(), 0.0);
        assertEquals(1000.0, plan.ranges().get("dat").max(), 0.0);
    }
}
