package org.tufa.analysis.simulate;

/**
 * The physical and control parameters of one simulated VAV box and its zone, drawn deterministically from (seed,
 * box IRI, whether it has reheat) by {@link #draw}. A box with hot-water reheat serves a perimeter office zone
 * (envelope, glazing, sun); a cooling-only box an interior zone (internal gains only). Ranges are design values
 * (common practice, no source, unless noted). The airflows are sized from the zone's own design loads, so a healthy
 * box holds its zone: the cooling maximum carries the design sensible cooling load at a 10 K supply-to-zone
 * difference with a 30 % margin (air-side sensible heat Q = rho cp V dT, ASHRAE Handbook Fundamentals); the minimum
 * is 25-35 % of the maximum and the heating maximum at least half of it (from memory, in the range ASHRAE Guideline
 * 36 and common design practice use: the minimum covers ventilation, the heating maximum limits stratification).
 *
 * @param reheat whether the box has a hot-water reheat coil
 * @param floorAreaM2 zone floor area, m2 (perimeter 25-45, interior 40-80)
 * @param envelopeUaWPerK conduction and infiltration conductance to outdoors, W/K (perimeter 0.6-1.0 W/(m2 K)
 *     of floor; interior 0.05 W/(m2 K), coupling to the perimeter only)
 * @param windowAreaM2 glazing area, m2 (perimeter 15-25 % of floor area; interior none)
 * @param solarHeatGainCoefficient glazing with blinds (0.30-0.40)
 * @param orientation index into {@link Weather#ORIENTATIONS}
 * @param internalGainWPerM2 occupied-hours people, lights and plug loads, W/m2 (12-22)
 * @param airCapacitanceJPerK zone air and furnishings, J/K (4-6 times the air's own capacitance)
 * @param massCapacitanceJPerK building mass coupled to the zone, J/K (80-160 kJ/(m2 K) of floor)
 * @param massConductanceWPerK air-to-mass convective conductance, W/K (7.5-10.5 W/(m2 K) of floor)
 * @param maxAirflowLps cooling maximum airflow, L/s (design)
 * @param minAirflowLps minimum airflow, L/s
 * @param heatingMaxAirflowLps heating maximum airflow, L/s (the minimum for a cooling-only box)
 * @param fullOpenAirflowLps airflow with the damper fully open at design inlet static pressure, L/s (1.2-1.35 times
 *     the maximum: the inlet is sized so the damper is not wide open at the maximum)
 * @param reheatEffectivenessDesign reheat coil effectiveness at the heating maximum and design water flow (0.55-0.70)
 * @param coolingGainPctPerK cooling loop proportional gain, % per K (25-40)
 * @param coolingIntegralMin cooling loop integral time, minutes (12-20)
 * @param heatingGainPctPerK heating loop proportional gain, % per K (20-35)
 * @param heatingIntegralMin heating loop integral time, minutes (15-25)
 * @param setpointShiftK shift of both occupied setpoints from 21/24 C (-0.5, 0 or +0.5)
 * @param occupiedStartMinute local minute of day the occupied period starts (06:30, 07:00 or 07:30)
 * @param occupiedEndMinute local minute of day it ends (18:00 or 18:30)
 */
public record VavParameters(
        boolean reheat,
        double floorAreaM2,
        double envelopeUaWPerK,
        double windowAreaM2,
        double solarHeatGainCoefficient,
        int orientation,
        double internalGainWPerM2,
        double airCapacitanceJPerK,
        double massCapacitanceJPerK,
        double massConductanceWPerK,
        double maxAirflowLps,
        double minAirflowLps,
        double heatingMaxAirflowLps,
        double fullOpenAirflowLps,
        double reheatEffectivenessDesign,
        double coolingGainPctPerK,
        double coolingIntegralMin,
        double heatingGainPctPerK,
        double heatingIntegralMin,
        double setpointShiftK,
        int occupiedStartMinute,
        int occupiedEndMinute) {

    /** Supply-to-zone temperature difference the cooling maximum is sized for, K (14 C at the box, 24 C zone). */
    public static final double DESIGN_COOLING_DELTA_K = 10.0;
    /** Sizing margin on the design cooling airflow. */
    public static final double DESIGN_MARGIN = 1.3;
    /** Peak solar irradiance on the glazing used for sizing, W/m2 (a sunlit facade; common practice, no source). */
    public static final double DESIGN_SOLAR_W_PER_M2 = 550.0;
    /** Design outdoor temperatures for sizing, C (a Toronto-like climate; from memory). */
    public static final double DESIGN_SUMMER_OUTDOOR_C = 31.0;
    public static final double DESIGN_WINTER_OUTDOOR_C = -18.0;
    /** Largest discharge temperature above the heating setpoint in reheat, K (from memory, ASHRAE Guideline 36). */
    public static final double MAX_DISCHARGE_ABOVE_SETPOINT_K = 11.0;
    /** Design hot-water capacity rate as a multiple of the air's at the heating maximum. */
    public static final double HW_TO_AIR_CAPACITY_RATIO = 1.0;

    /** Draws the parameters of one box; the same (seed, IRI, reheat) always gives the same box. */
    public static VavParameters draw(long seed, String unitIri, boolean reheat) {
        SeededRandom r = SeededRandom.forStream(seed, "vav-parameters|" + unitIri);
        double area = reheat ? r.uniform(25, 45) : r.uniform(40, 80);
        double ua = area * (reheat ? r.uniform(0.6, 1.0) : 0.05);
        double window = reheat ? area * r.uniform(0.15, 0.25) : 0.0;
        double shgc = r.uniform(0.30, 0.40);
        int orientation = r.nextInt(Weather.ORIENTATIONS.length);
        double gains = r.uniform(12, 22);
        double airOwn = area * 2.7 * CoilModel.AIR_DENSITY * CoilModel.AIR_CP;
        double airCap = airOwn * r.uniform(4, 6);
        double massCap = area * r.uniform(80e3, 160e3);
        double massCond = area * r.uniform(7.5, 10.5);
        double designLoadW = gains * area + window * shgc * DESIGN_SOLAR_W_PER_M2
                + ua * (DESIGN_SUMMER_OUTDOOR_C - 24.0);
        double max = 1000.0 * DESIGN_MARGIN * designLoadW
                / (CoilModel.AIR_DENSITY * CoilModel.AIR_CP * DESIGN_COOLING_DELTA_K);
        double min = max * r.uniform(0.25, 0.35);
        double heatingMax = min;
        if (reheat) {
            // Enough to carry the design heat loss at the largest discharge temperature, and at least half the max.
            double lossW = ua * (21.0 - DESIGN_WINTER_OUTDOOR_C);
            double needed = 1000.0 * 1.1 * lossW
                    / (CoilModel.AIR_DENSITY * CoilModel.AIR_CP * MAX_DISCHARGE_ABOVE_SETPOINT_K);
            heatingMax = Math.min(max, Math.max(0.5 * max, needed));
        }
        double fullOpen = max * r.uniform(1.2, 1.35);
        double effectiveness = r.uniform(0.55, 0.70);
        double[] shifts = {-0.5, 0.0, 0.5};
        int[] starts = {390, 420, 450};
        int[] ends = {1080, 1110};
        return new VavParameters(reheat, area, ua, window, shgc, orientation, gains, airCap, massCap, massCond, max,
                min, heatingMax, fullOpen, effectiveness, r.uniform(25, 40), r.uniform(12, 20), r.uniform(20, 35),
                r.uniform(15, 25), shifts[r.nextInt(3)], starts[r.nextInt(3)], ends[r.nextInt(2)]);
    }

    /** Air capacity rate at the heating maximum, W/K: rho * V * cp. */
    public double heatingAirCapacityRate() {
        return CoilModel.AIR_DENSITY * heatingMaxAirflowLps / 1000.0 * CoilModel.AIR_CP;
    }

    /** Reheat coil overall conductance at design flows, W/K, from the design effectiveness (counterflow, Cr = 1). */
    public double reheatUaDesign() {
        return CoilModel.counterflowNtu(reheatEffectivenessDesign, 1.0 / HW_TO_AIR_CAPACITY_RATIO)
                * heatingAirCapacityRate();
    }
}
