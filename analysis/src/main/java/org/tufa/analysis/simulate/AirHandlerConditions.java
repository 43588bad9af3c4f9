package org.tufa.analysis.simulate;

/**
 * The air handler that feeds the VAV wing, per simulated minute: its supply air temperature and its supply duct
 * static pressure, both under control.
 *
 * <p>Supply air temperature setpoint reset (ASHRAE Guideline 36 resets it between a minimum and a maximum by trim
 * and respond on the zones' cooling requests, with the maximum limited by the outdoor temperature; from memory):
 * here the outdoor-temperature limit alone stands in, 12.8 C (55 F) at or above 21 C outdoors, 14.5 C at or below
 * 15.5 C, linear between (a narrow range, as the interior zones' cooling requests would keep it). The supply temperature follows the setpoint with a slow +/- 0.3 K wander and drifts up
 * 0.08 K per K of outdoor temperature above 30 C (the cooling coil's capacity limit on hot afternoons; chosen, no
 * source). The static pressure holds its 250 Pa (1 in. of water) setpoint within a +/- 4 Pa wander. The air handler
 * is taken to run around the clock (in unoccupied hours it would run in setback whenever a zone calls; the boxes
 * decide when they take air).
 */
public record AirHandlerConditions(double[] supplyAirC, double[] supplyStaticPa) {
    /** Supply air temperature setpoint at or above 21 C outdoors, C. */
    public static final double SAT_MIN_C = 12.8;
    /** Supply air temperature setpoint at or below 15.5 C outdoors, C. */
    public static final double SAT_MAX_C = 14.5;
    /** Supply duct static pressure setpoint, Pa. */
    public static final double STATIC_SETPOINT_PA = 250.0;

    /** The supply air temperature setpoint at an outdoor temperature (the reset above). */
    public static double supplySetpointC(double outdoorC) {
        double f = Math.max(0.0, Math.min(1.0, (outdoorC - 15.5) / (21.0 - 15.5)));
        return SAT_MAX_C + (SAT_MIN_C - SAT_MAX_C) * f;
    }

    /** The air handler's conditions over the site's minutes; its own random stream, so nothing else changes. */
    public static AirHandlerConditions generate(SiteConditions site, long seed) {
        SeededRandom rng = SeededRandom.forStream(seed, "air-handler");
        int minutes = site.minutes();
        double[] satWander = Weather.autoregressive(rng, minutes / 60 + 2, 6.0);
        double[] spWander = Weather.autoregressive(rng, minutes / 60 + 2, 3.0);
        double[] sat = new double[minutes];
        double[] sp = new double[minutes];
        double[] outdoor = site.weather().outdoorC();
        for (int m = 0; m < minutes; m++) {
            double frac = (m % 60) / 60.0;
            int h = m / 60;
            sat[m] = supplySetpointC(outdoor[m]) + 0.3 * (satWander[h] + (satWander[h + 1] - satWander[h]) * frac)
                    + 0.08 * Math.max(0.0, outdoor[m] - 30.0);
            sp[m] = STATIC_SETPOINT_PA + 4.0 * (spWander[h] + (spWander[h + 1] - spWander[h]) * frac);
        }
        return new AirHandlerConditions(sat, sp);
    }
}
