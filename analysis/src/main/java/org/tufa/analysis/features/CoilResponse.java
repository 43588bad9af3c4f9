package org.tufa.analysis.features;

import java.util.Arrays;

/**
 * How much a coil changes the air temperature at each valve opening, learned from the unit's own data, and the
 * residual of each sample against it: the physically informed feature that separates a coil or sensor fault
 * from normal operation at the same valve position.
 *
 * <p>Energy balance of a water coil (ASHRAE Handbook Fundamentals; see also the APAR rules of Schein, Bushby,
 * Castro and House, Energy and Buildings 38(12), 2006): the air temperature change across the coil is the coil
 * effectiveness times the entering temperature difference between air and water, and the effectiveness grows
 * with the valve opening. When the supply-water temperature is known the response is learned as effectiveness
 * {@code e = dT_air / (T_zone - T_water)} per valve band, else as the air temperature change itself.
 * The per-band statistic is the median, so up to half of a band's samples may be faulty without moving it
 * (a fault episode is a minority of a season).
 *
 * @param bandUpperEdges upper edge of each valve band, in percent
 * @param bandResponse   median response per band (effectiveness, or kelvin when {@code usesWaterTemperature} is false);
 *                       NaN for a band without samples
 * @param usesWaterTemperature whether the response is an effectiveness against the supply-water temperature
 */
public record CoilResponse(double[] bandUpperEdges, double[] bandResponse, boolean usesWaterTemperature) {

    /** Valve bands, in percent: fine at low openings where the response changes fastest. */
    private static final double[] EDGES = {10, 20, 30, 40, 50, 60, 70, 80, 90, 100.0001};
    /** Fewest samples for a band's median to be trusted; sparser bands borrow from the nearest trusted band. */
    private static final int MIN_BAND_SAMPLES = 8;

    /**
     * Learns the response from samples in one mode.
     *
     * @param valvePercent   valve command of the active coil, percent
     * @param airDeltaT      air temperature change across the coil in the direction of the mode, kelvin
     *                       (zone - discharge in cooling, discharge - zone in heating)
     * @param waterDeltaT    entering temperature difference between air and water in the same direction
     *                       (zone - chilled water, hot water - zone), or null when the water temperature is unknown
     */
    public static CoilResponse fit(double[] valvePercent, double[] airDeltaT, double[] waterDeltaT) {
        boolean useWater = waterDeltaT != null;
        int bands = EDGES.length;
        double[][] values = new double[bands][];
        int[] counts = new int[bands];
        for (int b = 0; b < bands; b++) {
            values[b] = new double[16];
        }
        for (int i = 0; i < valvePercent.length; i++) {
            double r = response(airDeltaT[i], useWater ? waterDeltaT[i] : Double.NaN, useWater);
            if (Double.isNaN(r) || Double.isNaN(valvePercent[i])) {
                continue;
            }
            int b = band(valvePercent[i]);
            if (counts[b] == values[b].length) {
                values[b] = Arrays.copyOf(values[b], counts[b] * 2);
            }
            values[b][counts[b]++] = r;
        }
        double[] median = new double[bands];
        for (int b = 0; b < bands; b++) {
            median[b] = counts[b] >= MIN_BAND_SAMPLES ? median(values[b], counts[b]) : Double.NaN;
        }
        fillFromNeighbours(median);
        return new CoilResponse(EDGES.clone(), median, useWater);
    }

    /**
     * Residual of one sample in kelvin: the measured air temperature change minus the change expected at this
     * valve opening. Negative = the coil did less than usual (warm discharge in cooling), positive = more.
     */
    public double residual(double valvePercent, double airDeltaT, double waterDeltaT) {
        if (Double.isNaN(valvePercent) || Double.isNaN(airDeltaT)) {
            return Double.NaN;
        }
        double expected = bandResponse[band(valvePercent)];
        if (Double.isNaN(expected)) {
            return Double.NaN;
        }
        if (usesWaterTemperature) {
            if (Double.isNaN(waterDeltaT)) {
                return Double.NaN;
            }
            return airDeltaT - expected * waterDeltaT;
        }
        return airDeltaT - expected;
    }

    private static double response(double airDeltaT, double waterDeltaT, boolean useWater) {
        if (!useWater) {
            return airDeltaT;
        }
        // An effectiveness needs a real driving difference; below 2 K the ratio is dominated by sensor error.
        if (Double.isNaN(waterDeltaT) || waterDeltaT < 2.0) {
            return Double.NaN;
        }
        return airDeltaT / waterDeltaT;
    }

    private static int band(double valvePercent) {
        for (int b = 0; b < EDGES.length; b++) {
            if (valvePercent < EDGES[b]) {
                return b;
            }
        }
        return EDGES.length - 1;
    }

    private static double median(double[] v, int n) {
        double[] s = Arrays.copyOf(v, n);
        Arrays.sort(s);
        return n % 2 == 1 ? s[n / 2] : 0.5 * (s[n / 2 - 1] + s[n / 2]);
    }

    /** A band without enough samples takes the value of the nearest trusted band (lower band on a tie). */
    private static void fillFromNeighbours(double[] m) {
        double[] src = m.clone();
        for (int b = 0; b < m.length; b++) {
            if (!Double.isNaN(src[b])) {
                continue;
            }
            for (int d = 1; d < m.length; d++) {
                if (b - d >= 0 && !Double.isNaN(src[b - d])) {
                    m[b] = src[b - d];
                    break;
                }
                if (b + d < m.length && !Double.isNaN(src[b + d])) {
                    m[b] = src[b + d];
                    break;
                }
            }
        }
    }
}
