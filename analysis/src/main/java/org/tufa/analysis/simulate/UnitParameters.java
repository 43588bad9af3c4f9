package org.tufa.analysis.simulate;

/**
 * The physical and control parameters of one simulated fan coil unit and its zone, drawn deterministically from
 * (seed, unit IRI) by {@link #draw}. Ranges are design values for small perimeter offices served by one FCU
 * (common practice, no source, unless noted), chosen so that the cooling discharge temperature at full valve with a
 * 24 C zone and 6.7 C water is 12-13 C (field notes section 3: cooling DAT about 55 F) and the peak summer load is
 * well inside the coil's capacity.
 *
 * @param nominalAirflowLps fan airflow when running, L/s (150-250)
 * @param floorAreaM2 zone floor area, m2 (airflow / 5.5-7 L/s per m2)
 * @param envelopeUaWPerK conduction and infiltration conductance to outdoors, W/K (0.6-1.0 W/(m2 K) of floor)
 * @param windowAreaM2 glazing area, m2 (12-18 % of floor area)
 * @param solarHeatGainCoefficient glazing with blinds (0.30-0.40)
 * @param orientation index into {@link Weather#ORIENTATIONS}
 * @param internalGainWPerM2 occupied-hours people, lights and plug loads, W/m2 (10-20)
 * @param airCapacitanceJPerK zone air and furnishings, J/K (4-6 times the air's own capacitance)
 * @param massCapacitanceJPerK building mass coupled to the zone, J/K (80-160 kJ/(m2 K) of floor)
 * @param massConductanceWPerK air-to-mass convective conductance, W/K (7.5-10.5 W/(m2 K) of floor)
 * @param coolingEffectivenessDesign air-side cooling coil effectiveness at design flows (0.635-0.69)
 * @param heatingEffectivenessDesign air-side heating coil effectiveness at design flows (0.55-0.65)
 * @param coolingGainPctPerK cooling loop proportional gain, % per K (25-40)
 * @param coolingIntegralMin cooling loop integral time, minutes (12-20)
 * @param heatingGainPctPerK heating loop proportional gain, % per K (20-35)
 * @param heatingIntegralMin heating loop integral time, minutes (15-25)
 * @param setpointShiftK shift of both occupied setpoints from 21/24 C (-0.5, 0 or +0.5; the dead band stays 3 K)
 * @param occupiedStartMinute local minute of day the occupied period starts (06:30, 07:00 or 07:30)
 * @param occupiedEndMinute local minute of day it ends (18:00 or 18:30)
 */
public record UnitParameters(
        double nominalAirflowLps,
        double floorAreaM2,
        double envelopeUaWPerK,
        double windowAreaM2,
        double solarHeatGainCoefficient,
        int orientation,
        double internalGainWPerM2,
        double airCapacitanceJPerK,
        double massCapacitanceJPerK,
        double massConductanceWPerK,
        double coolingEffectivenessDesign,
        double heatingEffectivenessDesign,
        double coolingGainPctPerK,
        double coolingIntegralMin,
        double heatingGainPctPerK,
        double heatingIntegralMin,
        double setpointShiftK,
        int occupiedStartMinute,
        int occupiedEndMinute) {

    /** Design chilled-water capacity rate as a multiple of the air's (about a 5.8 K water rise at full load). */
    public static final double CHW_TO_AIR_CAPACITY_RATIO = 2.0;
    /** Design hot-water capacity rate as a multiple of the air's. */
    public static final double HW_TO_AIR_CAPACITY_RATIO = 1.0;
    /** Share of the coil's design thermal resistance on the air side; the rest is on the water side. */
    public static final double AIR_SIDE_RESISTANCE_SHARE = 0.65;
    /** Zone temperature at which the design effectiveness is specified (the occupied cooling setpoint). */
    public static final double DESIGN_ZONE_C = 24.0;

    /** Draws the parameters of one unit; the same (seed, unit IRI) always gives the same unit. */
    public static UnitParameters draw(long seed, String unitIri) {
        SeededRandom r = SeededRandom.forStream(seed, "unit-parameters|" + unitIri);
        double airflow = r.uniform(150, 250);
        double area = airflow / r.uniform(5.5, 7.0);
        double airOwn = area * 2.7 * CoilModel.AIR_DENSITY * CoilModel.AIR_CP;
        double[] shifts = {-0.5, 0.0, 0.5};
        int[] starts = {390, 420, 450};
        int[] ends = {1080, 1110};
        return new UnitParameters(
                airflow,
                area,
                area * r.uniform(0.6, 1.0),
                area * r.uniform(0.12, 0.18),
                r.uniform(0.30, 0.40),
                r.nextInt(Weather.ORIENTATIONS.length),
                r.uniform(10, 20),
                airOwn * r.uniform(4, 6),
                area * r.uniform(80e3, 160e3),
                area * r.uniform(7.5, 10.5),
                r.uniform(0.635, 0.69),
                r.uniform(0.55, 0.65),
                r.uniform(25, 40),
                r.uniform(12, 20),
                r.uniform(20, 35),
                r.uniform(15, 25),
                shifts[r.nextInt(3)],
                starts[r.nextInt(3)],
                ends[r.nextInt(2)]);
    }

    /** Air capacity rate at nominal airflow, W/K: rho * V * cp. */
    public double airCapacityRate() {
        return CoilModel.AIR_DENSITY * nominalAirflowLps / 1000.0 * CoilModel.AIR_CP;
    }

    /** Cooling coil overall conductance at design flows, W/K, from the design effectiveness. */
    public double coolingUaDesign() {
        double cr = 1.0 / CHW_TO_AIR_CAPACITY_RATIO;
        return CoilModel.counterflowNtu(coolingEffectivenessDesign, cr) * airCapacityRate();
    }

    /** Heating coil overall conductance at design flows, W/K. */
    public double heatingUaDesign() {
        double cr = 1.0 / HW_TO_AIR_CAPACITY_RATIO;
        return CoilModel.counterflowNtu(heatingEffectivenessDesign, cr) * airCapacityRate();
    }

    /**
     * The cooling coil's sensible capacity, W, at nominal airflow, the valve fully open and healthy water flow, for
     * the given entering air and water temperatures.
     */
    public double fullCoolingCapacityW(double enteringAirC, double chilledWaterC) {
        double ua = CoilModel.conductance(coolingUaDesign() / AIR_SIDE_RESISTANCE_SHARE, 1.0,
                coolingUaDesign() / (1 - AIR_SIDE_RESISTANCE_SHARE), 1.0);
        return CoilModel.heatFromAir(airCapacityRate(), CHW_TO_AIR_CAPACITY_RATIO * airCapacityRate(), ua,
                enteringAirC, chilledWaterC);
    }
}
