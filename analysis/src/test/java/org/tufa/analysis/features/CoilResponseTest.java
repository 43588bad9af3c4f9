package org.tufa.analysis.features;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class CoilResponseTest {

    /**
     * A coil with effectiveness e(v) = 0.6 v/100 against a 17 K air-to-water difference (zone 24 C, chilled water
     * 7 C: ASHRAE-typical design values, see AHRI 440 rating conditions, from memory). A sensor reading 3 K high
     * in 20 % of the samples must not move the learned response (median) and must show as a -3 K residual.
     */
    @Test
    void minorityFaultShowsAsResidualWithoutMovingTheResponse() {
        int n = 1000;
        double[] valve = new double[n];
        double[] air = new double[n];
        double[] water = new double[n];
        for (int i = 0; i < n; i++) {
            valve[i] = (i * 37 % 100) + 0.5;
            water[i] = 17.0;
            air[i] = 0.6 * valve[i] / 100 * water[i] - (i % 5 == 0 ? 3.0 : 0.0);
        }
        CoilResponse r = CoilResponse.fit(valve, air, water);
        double healthy = r.residual(55.5, 0.6 * 0.555 * 17, 17);
        double faulty = r.residual(55.5, 0.6 * 0.555 * 17 - 3.0, 17);
        // Within one band the true response varies by up to 0.6 * 17 * 0.05 = 0.51 K around the band median.
        assertEquals(0.0, healthy, 0.6);
        assertEquals(-3.0, faulty, 0.6);
    }

    @Test
    void withoutWaterTemperatureTheResponseIsTheAirChange() {
        double[] valve = new double[200];
        double[] air = new double[200];
        for (int i = 0; i < 200; i++) {
            valve[i] = i % 100;
            air[i] = 8.0;
        }
        CoilResponse r = CoilResponse.fit(valve, air, null);
        assertEquals(-2.0, r.residual(35, 6.0, Double.NaN), 1e-12);
    }

    @Test
    void valveActivityOfASteadyAndAHuntingCommand() {
        double[] steady = new double[40];
        double[] hunting = new double[40];
        for (int i = 0; i < 40; i++) {
            steady[i] = 50;
            hunting[i] = i % 2 == 0 ? 20 : 80;
        }
        assertEquals(0.0, ValveActivity.of(steady, 4)[20], 1e-12);
        assertEquals(60.0, ValveActivity.of(hunting, 4)[20], 1e-12);
    }
}
