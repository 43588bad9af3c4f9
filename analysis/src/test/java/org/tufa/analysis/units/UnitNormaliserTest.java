package org.tufa.analysis.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Plausibility notes; ranges from notes section 9 (zone temperatures 64-80 -> F, 16-28 -> C; fractions max <= 1). */
class UnitNormaliserTest {

    @Test
    void zoneTemperatureDeclaredCelsiusButLookingFahrenheitIsFlagged() {
        double[] looksF = {70.1, 71.5, 72.0, 73.2, Double.NaN, 74.0};
        NormalisedSeries s = UnitNormaliser.temperature("FCU-3-07 zone temperature", looksF, MeasureUnit.DEG_C,
                TemperatureRole.ZONE_AIR);
        assertTrue(s.suspicious());
        assertTrue(s.notes().get(0).contains("median is 72.0"), s.notes().get(0));
        assertEquals(70.1, s.values()[0], 0, "converted as declared, never silently re-interpreted");
        NormalisedSeries fine = UnitNormaliser.temperature("z", new double[] {21, 22, 23}, MeasureUnit.DEG_C,
                TemperatureRole.ZONE_AIR);
        assertFalse(fine.suspicious());
        NormalisedSeries looksC = UnitNormaliser.temperature("z", new double[] {21, 22, 23}, MeasureUnit.DEG_F,
                TemperatureRole.ZONE_AIR);
        assertTrue(looksC.suspicious());
        // Discharge air at 70 C-declared is not range-checked (role OTHER).
        assertFalse(UnitNormaliser.temperature("d", looksF, MeasureUnit.DEG_C, TemperatureRole.OTHER).suspicious());
        // F zone temperatures convert: 75 F = 23.89 C (notes section 3).
        assertEquals(23.89, UnitNormaliser.temperature("z", new double[] {75}, MeasureUnit.DEG_F,
                TemperatureRole.ZONE_AIR).values()[0], 0.005);
    }

    @Test
    void percentValveThatNeverExceedsOneIsFlagged() {
        double[] fraction = {0, 0.2, 0.95, Double.NaN, 0.4};
        NormalisedSeries s = UnitNormaliser.command("FCU-3-07 cooling valve", fraction, MeasureUnit.PERCENT);
        assertTrue(s.suspicious());
        assertTrue(s.notes().get(0).contains("0-1 fraction"));
        assertFalse(UnitNormaliser.command("v", new double[] {0, 0, 0}, MeasureUnit.PERCENT).suspicious(),
                "a valve that never opens does not contradict percent");
        assertFalse(UnitNormaliser.command("v", new double[] {0, 40, 100}, MeasureUnit.PERCENT).suspicious());
        NormalisedSeries f = UnitNormaliser.command("v", new double[] {0, 0.5}, MeasureUnit.FRACTION);
        assertEquals(50, f.values()[1], 1e-12);
        assertFalse(f.suspicious());
        assertTrue(UnitNormaliser.command("v", new double[] {0, 60}, MeasureUnit.FRACTION).suspicious());
    }

    @Test
    void differencesAreNormalisedWithoutOffset() {
        assertEquals(5.556, UnitNormaliser.temperatureDifference("dT", new double[] {10}, MeasureUnit.DEG_F)
                .values()[0], 0.0005);
    }
}
