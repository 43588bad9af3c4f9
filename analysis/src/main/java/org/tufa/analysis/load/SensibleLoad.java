package org.tufa.analysis.load;

import java.time.Duration;

/**
 * Air-side sensible load of a terminal unit: Q = rho * cp * V * (T_zone - T_discharge), positive when the unit
 * delivers cooling, negative when it delivers heating (notes section 4, per-sample load).
 *
 * <p>rho = 1.2 kg/m3 (standard air) and cp = 1.006 kJ/(kg K) (dry air), so rho*cp = 1.2072 kJ/(m3 K), i.e.
 * Q[kW] = 1.2072 * V[m3/s] * dT[K] (ASHRAE Handbook - Fundamentals, psychrometrics and load-calculation
 * chapters). Its inch-pound twin is Q[Btu/h] = 1.08 * V[cfm] * dT[F], and 1.08 Btu/(h cfm F) equals
 * 1.2072 W/(L/s K) (notes section 3). Airflow without a flow sensor: nominal airflow times the fan fraction
 * (speed fraction for ECM fans, on-fraction for constant-speed fans), common practice (notes section 3).
 */
public final class SensibleLoad {

    /** Standard air density, kg/m3. */
    public static final double AIR_DENSITY = 1.2;
    /** Specific heat of dry air, kJ/(kg K). */
    public static final double AIR_SPECIFIC_HEAT = 1.006;
    /** rho * cp, kJ/(m3 K) = kW per (m3/s K). */
    public static final double RHO_CP = AIR_DENSITY * AIR_SPECIFIC_HEAT;

    /** 1 cfm in m3/s: (0.3048 m)^3 / 60 s (international foot, exact). */
    public static final double CUBIC_METRES_PER_SECOND_PER_CFM = 0.3048 * 0.3048 * 0.3048 / 60.0;
    /** 1 Btu/h in W: the International Table Btu is 1055.05585262 J, divided by 3600 s. */
    public static final double WATTS_PER_BTU_PER_HOUR = 1055.05585262 / 3600.0;

    private SensibleLoad() {
    }

    /** Sensible load in kW of airflow {@code airflow} (m3/s) between zone and discharge temperatures (C or K). */
    public static double kilowatts(double airflow, double zoneTemperature, double dischargeTemperature) {
        return RHO_CP * airflow * (zoneTemperature - dischargeTemperature);
    }

    /**
     * Per-sample sensible load in kW.
     *
     * @param nominalAirflow nominal (full-speed) airflow, m3/s
     * @param fanFraction fan speed or on-fraction 0..1 per sample (NaN = unknown)
     * @param zoneTemperature zone temperature per sample, C
     * @param dischargeTemperature discharge air temperature per sample, C
     * @return kW per sample, NaN where any input is NaN
     */
    public static double[] kilowatts(double nominalAirflow, double[] fanFraction, double[] zoneTemperature,
            double[] dischargeTemperature) {
        int n = fanFraction.length;
        if (zoneTemperature.length != n || dischargeTemperature.length != n) {
            throw new IllegalArgumentException("fan, zone and discharge series differ in length");
        }
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            out[i] = kilowatts(nominalAirflow * fanFraction[i], zoneTemperature[i], dischargeTemperature[i]);
        }
        return out;
    }

    /** Energy over a series of per-interval loads, split by sign; NaN samples are skipped and counted. */
    public static Energy energy(double[] kilowatts, Duration interval) {
        double hours = interval.toMillis() / 3_600_000.0;
        double cooling = 0;
        double heating = 0;
        int valid = 0;
        for (double kw : kilowatts) {
            if (Double.isNaN(kw)) {
                continue;
            }
            valid++;
            if (kw > 0) {
                cooling += kw * hours;
            } else {
                heating -= kw * hours;
            }
        }
        return new Energy(cooling, heating, valid, kilowatts.length - valid);
    }

    /**
     * Energy delivered over a series.
     *
     * @param coolingKwh cooling delivered (positive loads), kWh
     * @param heatingKwh heating delivered (negative loads, reported as a positive number), kWh
     * @param validSamples samples with a load
     * @param missingSamples samples without (NaN)
     */
    public record Energy(double coolingKwh, double heatingKwh, int validSamples, int missingSamples) {
    }

    /** cfm to m3/s. */
    public static double cfmToCubicMetresPerSecond(double cfm) {
        return cfm * CUBIC_METRES_PER_SECOND_PER_CFM;
    }

    /** W to Btu/h. */
    public static double wattsToBtuPerHour(double watts) {
        return watts / WATTS_PER_BTU_PER_HOUR;
    }
}
