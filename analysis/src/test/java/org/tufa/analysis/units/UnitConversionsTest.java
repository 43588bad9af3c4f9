package org.tufa.analysis.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;

class UnitConversionsTest {

    @Test
    void fahrenheitTemperaturesMatchTheFieldNotes() {
        // Check values from notes section 3 ("calc"): 44 F = 6.67 C, 55 F = 12.78 C, 75 F = 23.89 C, 180 F = 82.22 C.
        assertEquals(6.67, UnitConversions.toCelsius(44, MeasureUnit.DEG_F), 0.005);
        assertEquals(12.78, UnitConversions.toCelsius(55, MeasureUnit.DEG_F), 0.005);
        assertEquals(23.89, UnitConversions.toCelsius(75, MeasureUnit.DEG_F), 0.005);
        assertEquals(82.22, UnitConversions.toCelsius(180, MeasureUnit.DEG_F), 0.005);
        // Fixed points of the scales (SI definitions): 32 F = 0 C, 212 F = 100 C, 273.15 K = 0 C.
        assertEquals(0, UnitConversions.toCelsius(32, MeasureUnit.DEG_F), 1e-12);
        assertEquals(100, UnitConversions.toCelsius(212, MeasureUnit.DEG_F), 1e-12);
        assertEquals(0, UnitConversions.toCelsius(273.15, MeasureUnit.KELVIN), 1e-12);
    }

    @Test
    void differencesUseTheFactorOnly() {
        // Notes section 3: a difference of 10 F is 5.556 K, not -12.2 C (the offset never applies to differences).
        assertEquals(5.556, UnitConversions.differenceToKelvin(10, MeasureUnit.DEG_F), 0.0005);
        assertEquals(-12.22, UnitConversions.toCelsius(10, MeasureUnit.DEG_F), 0.005);
        assertEquals(3, UnitConversions.differenceToKelvin(3, MeasureUnit.DEG_C), 0);
        assertEquals(3, UnitConversions.differenceToKelvin(3, MeasureUnit.KELVIN), 0);
    }

    @Test
    void commandsNormaliseToPercent() {
        assertEquals(37.5, UnitConversions.toPercent(0.375, MeasureUnit.FRACTION), 1e-12);
        assertEquals(37.5, UnitConversions.toPercent(37.5, MeasureUnit.PERCENT), 0);
        assertTrue(Double.isNaN(UnitConversions.toPercent(Double.NaN, MeasureUnit.PERCENT)));
    }

    @Test
    void qudtIrisAndPrefixedNamesAreRecognised() {
        // QUDT unit vocabulary local names (http://qudt.org/vocab/unit/), as used by Brick's brick:hasUnit.
        assertEquals(Optional.of(MeasureUnit.DEG_F), MeasureUnit.fromQudt("http://qudt.org/vocab/unit/DEG_F"));
        assertEquals(Optional.of(MeasureUnit.DEG_C), MeasureUnit.fromQudt("unit:DEG_C"));
        assertEquals(Optional.of(MeasureUnit.KELVIN), MeasureUnit.fromQudt("http://qudt.org/vocab/unit/K"));
        assertEquals(Optional.of(MeasureUnit.PERCENT), MeasureUnit.fromQudt("http://qudt.org/vocab/unit/PERCENT"));
        assertEquals(Optional.of(MeasureUnit.FRACTION), MeasureUnit.fromQudt("http://qudt.org/vocab/unit/UNITLESS"));
        assertEquals(Optional.of(MeasureUnit.FRACTION), MeasureUnit.fromQudt("unit:NUM"));
        assertFalse(MeasureUnit.fromQudt("http://qudt.org/vocab/unit/PA").isPresent());
        assertEquals("http://qudt.org/vocab/unit/DEG_F", MeasureUnit.DEG_F.iri());
    }
}
