package org.tufa.analysis.load;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.units.MeasureUnit;
import org.tufa.analysis.units.UnitConversions;

class SensibleLoadTest {

    @Test
    void fourHundredCfmAndTwentyFahrenheitIs8640BtuPerHour() {
        // ASHRAE Handbook - Fundamentals, sensible air equation q = 1.08 * cfm * dT[F]; 400 cfm x 20 F = 8 640 Btu/h
        // = 2.532 kW (notes section 3, "calc", 1 Btu/h = 0.293071 W).
        double airflow = SensibleLoad.cfmToCubicMetresPerSecond(400);
        double kw = SensibleLoad.kilowatts(airflow, 20 + UnitConversions.differenceToKelvin(20, MeasureUnit.DEG_F), 20);
        assertEquals(2.532, kw, 0.0005);
        assertEquals(8640, SensibleLoad.wattsToBtuPerHour(kw * 1000), 1.0);
        assertEquals(1.08 * 400 * 20, SensibleLoad.wattsToBtuPerHour(kw * 1000), 1.0);
    }

    @Test
    void ipFactorEqualsSiRhoCp() {
        // Notes section 3: 1.08 Btu/(h cfm F) == 1.2072 W/(L/s K) == 1.2 kg/m3 x 1.006 kJ/(kg K).
        double wattsPerLitrePerSecondKelvin = 1.08 * SensibleLoad.WATTS_PER_BTU_PER_HOUR
                / (SensibleLoad.CUBIC_METRES_PER_SECOND_PER_CFM * 1000) / (5.0 / 9.0);
        assertEquals(1.2072, wattsPerLitrePerSecondKelvin, 0.0001);
        assertEquals(1.2072, SensibleLoad.RHO_CP, 1e-12);
        // 1 cfm = 0.471947 L/s; 1 Btu/h = 0.293071 W (notes section 3, conversions).
        assertEquals(0.471947, SensibleLoad.CUBIC_METRES_PER_SECOND_PER_CFM * 1000, 1e-6);
        assertEquals(0.293071, SensibleLoad.WATTS_PER_BTU_PER_HOUR, 1e-6);
    }

    @Test
    void perSampleLoadSignAndEnergyPerInterval() {
        // 0.2 m3/s nominal; fan fractions 1, 0.5, 1, NaN; zone 24 C; discharge 14, 14, 34, 14.
        double[] kw = SensibleLoad.kilowatts(0.2, new double[] {1, 0.5, 1, Double.NaN},
                new double[] {24, 24, 24, 24}, new double[] {14, 14, 34, 14});
        // 1.2072 x 0.2 x 10 = 2.4144 kW cooling; half flow 1.2072; heating -2.4144; NaN.
        assertEquals(2.4144, kw[0], 1e-9);
        assertEquals(1.2072, kw[1], 1e-9);
        assertEquals(-2.4144, kw[2], 1e-9);
        assertTrue(Double.isNaN(kw[3]));
        SensibleLoad.Energy e = SensibleLoad.energy(kw, Duration.ofMinutes(15));
        // 15 min = 0.25 h: cooling (2.4144 + 1.2072) x 0.25 = 0.9054 kWh; heating 0.6036 kWh.
        assertEquals(0.9054, e.coolingKwh(), 1e-9);
        assertEquals(0.6036, e.heatingKwh(), 1e-9);
        assertEquals(3, e.validSamples());
        assertEquals(1, e.missingSamples());
    }
}
