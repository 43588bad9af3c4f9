package org.tufa.analysis.simulate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class CoilModelTest {

    @Test
    void counterflowEffectivenessMatchesTextbookFormulaWorkedByHand() {
        // Incropera and DeWitt, Fundamentals of Heat and Mass Transfer, eq. 11.29a (counterflow), worked by hand:
        // NTU = 1, Cr = 0.5: (1 - e^-0.5) / (1 - 0.5 e^-0.5) = 0.3934693 / 0.6967347 = 0.564733.
        assertEquals(0.564733, CoilModel.counterflowEffectiveness(1.0, 0.5), 1e-6);
        // Cr = 0 (eq. 11.35a): 1 - e^-NTU = 0.632121 for NTU = 1.
        assertEquals(0.632121, CoilModel.counterflowEffectiveness(1.0, 0.0), 1e-6);
        // Cr = 1 (eq. 11.29b): NTU / (1 + NTU) = 0.5 for NTU = 1.
        assertEquals(0.5, CoilModel.counterflowEffectiveness(1.0, 1.0), 1e-12);
        // The inverse gives back the NTU.
        assertEquals(1.0, CoilModel.counterflowNtu(0.564733, 0.5), 1e-5);
    }

    @Test
    void airSideConstantIsTheHandbookValue() {
        // ASHRAE Handbook Fundamentals: rho = 1.2 kg/m3, cp = 1.006 kJ/(kg K), so rho*cp = 1.2072 W/(L/s K),
        // the SI twin of the I-P 1.08 Btu/(h cfm F) (field notes section 3): 1.08 * 0.293071 / 0.471947 / (5/9).
        double siPerLps = CoilModel.AIR_DENSITY * CoilModel.AIR_CP / 1000.0;
        assertEquals(1.2072, siPerLps, 1e-9);
        assertEquals(1.08 * 0.293071 / 0.471947 * 9.0 / 5.0, siPerLps, 2e-4);
    }

    @Test
    void coilNeverCoolsAirBelowItsWaterTemperature() {
        // Physics (second law; field notes section 4): the leaving air stays at or above the entering water.
        SeededRandom r = new SeededRandom(7);
        for (int i = 0; i < 10_000; i++) {
            double cAir = r.uniform(1, 400);
            double cWater = r.uniform(0.1, 1000);
            double ua = r.uniform(0, 5000);
            double airIn = r.uniform(10, 40);
            double waterIn = r.uniform(4, 10);
            double q = CoilModel.heatFromAir(cAir, cWater, ua, airIn, waterIn);
            double airOut = airIn - q / cAir;
            assertTrue(airOut >= waterIn - 1e-9, "air out " + airOut + " below water " + waterIn);
            assertTrue(q >= 0);
        }
    }

    @Test
    void equalPercentageValvePassesNothingClosedAndAllOpen() {
        assertEquals(0.0, CoilModel.equalPercentageFlow(0, 25), 1e-12);
        assertEquals(1.0, CoilModel.equalPercentageFlow(1, 25), 1e-12);
        // Half open: (25^0.5 - 1) / 24 = 4 / 24, worked by hand.
        assertEquals(4.0 / 24.0, CoilModel.equalPercentageFlow(0.5, 25), 1e-12);
    }

    @Test
    void drawnUnitsDischargeAt12To13CAtFullCooling() {
        // Field notes section 3: cooling DAT about 55 F (12.8 C), coil air dT 10-12 K, with a 24 C zone and
        // 6.7 C (44 F) chilled water; our design range is 12-13.1 C. Airflow 150-250 L/s as designed.
        for (int i = 0; i < 300; i++) {
            UnitParameters p = UnitParameters.draw(99, "https://example.org/u" + i);
            double q = p.fullCoolingCapacityW(24.0, 6.7);
            double dat = 24.0 - q / p.airCapacityRate() + FanCoilSimulation.FAN_HEAT_K;
            assertTrue(dat > 12.0 && dat < 13.4, "full-cooling DAT " + dat);
            assertTrue(p.nominalAirflowLps() >= 150 && p.nominalAirflowLps() < 250);
        }
    }
}
