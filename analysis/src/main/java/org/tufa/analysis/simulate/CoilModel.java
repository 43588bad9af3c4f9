package org.tufa.analysis.simulate;

/**
 * Dry (sensible-only) water-to-air coil by the effectiveness-NTU method for counterflow heat exchangers
 * (Kays and London, Compact Heat Exchangers; Incropera and DeWitt, Fundamentals of Heat and Mass Transfer,
 * eq. 11.29a): epsilon = (1 - exp(-NTU (1 - Cr))) / (1 - Cr exp(-NTU (1 - Cr))), and NTU / (1 + NTU) when Cr = 1.
 * Heat flow Q = epsilon * Cmin * (T_air_in - T_water_in). Because epsilon <= 1 and Cmin <= C_air, the leaving air
 * can never pass the entering water temperature: a cooling coil cannot cool air below its water temperature.
 *
 * <p>Overall conductance UA = 1 / (1 / UA_air + 1 / UA_water), each side scaling with its flow to the power 0.8
 * (turbulent convection, Dittus-Boelter exponent; Incropera and DeWitt eq. 8.60). Latent (dehumidifying) load is
 * not modelled: the discharge temperature follows from the sensible balance only.
 */
public final class CoilModel {
    /** Air density, kg/m3 (ASHRAE Handbook Fundamentals, standard air). */
    public static final double AIR_DENSITY = 1.2;
    /** Specific heat of dry air, J/(kg K) (ASHRAE Handbook Fundamentals). */
    public static final double AIR_CP = 1006.0;
    /** Specific heat of water, J/(kg K). */
    public static final double WATER_CP = 4186.0;

    private CoilModel() {
    }

    /** Counterflow effectiveness for {@code ntu >= 0} and capacity ratio {@code cr} in [0, 1]. */
    public static double counterflowEffectiveness(double ntu, double cr) {
        if (ntu <= 0) {
            return 0.0;
        }
        if (cr > 0.999) {
            return ntu / (1 + ntu);
        }
        double e = Math.exp(-ntu * (1 - cr));
        return (1 - e) / (1 - cr * e);
    }

    /** The NTU that gives effectiveness {@code eps} at capacity ratio {@code cr} (inverse of the above). */
    public static double counterflowNtu(double eps, double cr) {
        if (cr > 0.999) {
            return eps / (1 - eps);
        }
        return Math.log((1 - eps * cr) / (1 - eps)) / (1 - cr);
    }

    /**
     * Heat flow from air to water, W (positive when the air is cooled).
     *
     * @param airCapacityRate air mass flow times cp, W/K
     * @param waterCapacityRate water mass flow times cp, W/K
     * @param ua overall conductance, W/K
     * @param airInC entering air temperature
     * @param waterInC entering water temperature
     */
    public static double heatFromAir(double airCapacityRate, double waterCapacityRate, double ua,
            double airInC, double waterInC) {
        if (airCapacityRate <= 0 || waterCapacityRate <= 0 || ua <= 0) {
            return 0.0;
        }
        double cmin = Math.min(airCapacityRate, waterCapacityRate);
        double cmax = Math.max(airCapacityRate, waterCapacityRate);
        double eps = counterflowEffectiveness(ua / cmin, cmin / cmax);
        return eps * cmin * (airInC - waterInC);
    }

    /** Overall conductance from each side's design conductance and its flow fraction (exponent 0.8 each side). */
    public static double conductance(double uaAirDesign, double airFraction, double uaWaterDesign,
            double waterFraction) {
        if (airFraction <= 0 || waterFraction <= 0) {
            return 0.0;
        }
        double uaAir = uaAirDesign * Math.pow(airFraction, 0.8);
        double uaWater = uaWaterDesign * Math.pow(waterFraction, 0.8);
        return 1.0 / (1.0 / uaAir + 1.0 / uaWater);
    }

    /**
     * Equal-percentage valve characteristic shifted to pass zero flow when closed: flow fraction
     * (R^x - 1) / (R - 1) for opening x in [0, 1] and rangeability R (common practice for coil valves; the shape
     * offsets the coil's saturating capacity so the loop sees a roughly linear plant).
     */
    public static double equalPercentageFlow(double opening, double rangeability) {
        double x = Math.max(0.0, Math.min(1.0, opening));
        return (Math.pow(rangeability, x) - 1.0) / (rangeability - 1.0);
    }
}
