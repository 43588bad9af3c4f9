package org.tufa.analysis.features;

import java.time.Duration;
import java.time.Instant;

/**
 * One terminal unit's signals on a regular time grid, in canonical units: temperatures in degrees C, valve
 * commands in percent (0..100), fan as a running fraction (0..1). An array of NaN stands for a role the unit
 * does not have; a NaN inside an array is a sample without data.
 *
 * @param gridStart start of sample 0
 * @param interval  grid step
 */
public record UnitSignals(
        Instant gridStart,
        Duration interval,
        double[] zoneAirTemperature,
        double[] dischargeAirTemperature,
        double[] coolingValveCommand,
        double[] heatingValveCommand,
        double[] fanFraction,
        double[] zoneSetpoint,
        double[] chilledWaterSupplyTemperature,
        double[] hotWaterSupplyTemperature,
        double[] outdoorAirTemperature) {

    public UnitSignals {
        int n = zoneAirTemperature.length;
        for (double[] a : new double[][] {dischargeAirTemperature, coolingValveCommand, heatingValveCommand,
                fanFraction, zoneSetpoint, chilledWaterSupplyTemperature, hotWaterSupplyTemperature,
                outdoorAirTemperature}) {
            if (a.length != n) {
                throw new IllegalArgumentException("all signals must have the same length: " + n + " vs " + a.length);
            }
        }
    }

    /** Number of samples on the grid. */
    public int size() {
        return zoneAirTemperature.length;
    }

    /** Start time of sample {@code i}. */
    public Instant time(int i) {
        return gridStart.plus(interval.multipliedBy(i));
    }

    /** True when the array holds at least one sample (a role the unit has). */
    public static boolean present(double[] signal) {
        for (double v : signal) {
            if (!Double.isNaN(v)) {
                return true;
            }
        }
        return false;
    }

    /** An all-NaN signal of length n, for a role the unit does not have. */
    public static double[] absent(int n) {
        double[] a = new double[n];
        java.util.Arrays.fill(a, Double.NaN);
        return a;
    }
}
