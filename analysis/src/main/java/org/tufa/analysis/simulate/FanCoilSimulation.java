package org.tufa.analysis.simulate;

import java.util.Optional;

/**
 * One four-pipe fan coil unit and its zone, simulated at one-minute steps and sampled every 15 minutes.
 *
 * <p>Zone: {@link TwoNodeZone} (two lumped capacitances, explicit Euler at 60 s, the step under a tenth of the air
 * node's time constant), with internal gains following the occupancy schedule and solar gains through the glazing
 * of the zone's orientation.
 *
 * <p>Unit: recirculating room air through a cooling coil, then a heating coil ({@link CoilModel}); single-speed fan,
 * always on in occupied hours, cycling on the unoccupied setpoints (16/29 C) otherwise (on outside the band,
 * loops aiming 1.5 K inside it, off 1 K inside it); fan heat
 * 0.3 K (notes section 3: usually under 1 F). Two PI loops on the zone sensor with a 3 K dead band between heating
 * and cooling setpoints (21/24 C occupied; ASHRAE 90.1 requires at least 2.8 K, notes section 1). Loop outputs are
 * the logged commands; valve actuators follow them at 40 % per minute (150 s full stroke). Valves are closed and
 * loops reset while the fan is commanded off.
 *
 * <p>Sensors: zone sensor lag 3 min, discharge sensor lag 1 min with airflow and 10 min without; Gaussian noise
 * 0.1 K on logged temperatures; rare isolated spikes (one sample in 3000, 4-10 K either way).
 */
final class FanCoilSimulation {
    static final double FAN_HEAT_K = 0.3;
    static final double NOISE_K = 0.1;
    static final double SPIKE_PROBABILITY = 1.0 / 3000.0;
    static final double ACTUATOR_RATE_PER_MIN = 0.4;
    static final double VALVE_RANGEABILITY = 25.0;
    static final double UNOCCUPIED_HEATING_C = 16.0;
    static final double UNOCCUPIED_COOLING_C = 29.0;
    static final double OCCUPIED_HEATING_C = 21.0;
    static final double OCCUPIED_COOLING_C = 24.0;
    static final double UNOCCUPIED_OVERSHOOT_K = 1.5;
    /** Per-minute first-order lags of the sensors (time constants 3 min, 1 min with airflow, 10 min without). */
    static final double ZONE_SENSOR_ALPHA = 1 - Math.exp(-1.0 / 3.0);
    static final double DISCHARGE_ALPHA_FLOW = 1 - Math.exp(-1.0);
    static final double DISCHARGE_ALPHA_STILL = 1 - Math.exp(-1.0 / 10.0);
    private static final double DT = 60.0;
    private static final int TABLE_STEPS = 400;

    private FanCoilSimulation() {
    }

    /** Whether minute m falls in the occupied hours of a workday (the schedule fan coil units and VAV boxes share). */
    static boolean occupied(SiteConditions site, int m, int startMinute, int endMinute) {
        int minuteOfDay = site.localMinuteOfDay()[m];
        return site.workday()[m] && minuteOfDay >= startMinute && minuteOfDay < endMinute;
    }

    static double heatingSetpoint(boolean occupied, double shiftK) {
        return occupied ? OCCUPIED_HEATING_C + shiftK : UNOCCUPIED_HEATING_C;
    }

    static double coolingSetpoint(boolean occupied, double shiftK) {
        return occupied ? OCCUPIED_COOLING_C + shiftK : UNOCCUPIED_COOLING_C;
    }

    static UnitTrace run(String unitIri, UnitParameters p, SiteConditions site, Optional<FaultEpisode> fault,
            long seed) {
        SeededRandom rng = SeededRandom.forStream(seed, "unit-noise|" + unitIri);
        SeededRandom faultRng = SeededRandom.forStream(seed, "unit-fault|" + unitIri);
        int minutes = site.minutes();
        int warmUp = site.warmUpMinutes();
        int samples = (minutes - warmUp) / 15;

        float[] zone = new float[samples];
        float[] dat = new float[samples];
        float[] sp = new float[samples];
        float[] clg = new float[samples];
        float[] htg = new float[samples];
        float[] fan = new float[samples];
        float[] occ = new float[samples];
        float[] datTrue = new float[samples];
        float[] flow = new float[samples];
        float[] clgOpen = new float[samples];
        float[] clgW = new float[samples];

        // Fault window in simulated minutes, and the fault's own parameters.
        int faultFrom = Integer.MAX_VALUE;
        int faultTo = Integer.MIN_VALUE;
        FaultType type = null;
        double severity = 0;
        if (fault.isPresent()) {
            faultFrom = site.minuteOf(fault.get().start());
            faultTo = site.minuteOf(fault.get().end());
            type = fault.get().fault();
            severity = fault.get().severity();
        }
        double biasK = (faultRng.nextDouble() < 0.5 ? -1 : 1) * (1 + 3 * severity);

        // Daily occupancy factor (people away, meetings): per local day, 0.8-1.1.
        int days = site.localDay()[minutes - 1] + 1;
        double[] dayFactor = new double[days];
        for (int d = 0; d < days; d++) {
            dayFactor[d] = rng.uniform(0.8, 1.1);
        }

        double cAirNominal = p.airCapacityRate();
        double uaCoolAir = p.coolingUaDesign() / UnitParameters.AIR_SIDE_RESISTANCE_SHARE;
        double uaCoolWater = p.coolingUaDesign() / (1 - UnitParameters.AIR_SIDE_RESISTANCE_SHARE);
        double uaHeatAir = p.heatingUaDesign() / UnitParameters.AIR_SIDE_RESISTANCE_SHARE;
        double uaHeatWater = p.heatingUaDesign() / (1 - UnitParameters.AIR_SIDE_RESISTANCE_SHARE);
        double chwRateDesign = UnitParameters.CHW_TO_AIR_CAPACITY_RATIO * cAirNominal;
        double hwRateDesign = UnitParameters.HW_TO_AIR_CAPACITY_RATIO * cAirNominal;
        double lowFlowFactor = 1 - 0.75 * severity;
        double leak = 0.03 + 0.17 * severity;
        double[] coolTable = coilTable(uaCoolAir, uaCoolWater, cAirNominal, chwRateDesign,
                x -> coolWaterFraction(x, 1.0));
        double[] coolTableLowFlow = type == FaultType.LOW_CHW_FLOW ? coilTable(uaCoolAir, uaCoolWater, cAirNominal,
                chwRateDesign, x -> coolWaterFraction(x, lowFlowFactor)) : coolTable;
        double[] heatTable = coilTable(uaHeatAir, uaHeatWater, cAirNominal, hwRateDesign,
                x -> heatWaterFraction(x, 0.0));
        double[] heatTableLeaking = type == FaultType.LEAKING_HEATING_VALVE ? coilTable(uaHeatAir, uaHeatWater,
                cAirNominal, hwRateDesign, x -> heatWaterFraction(x, leak)) : heatTable;
        double peakInternalW = p.internalGainWPerM2() * p.floorAreaM2();
        double solarAperture = p.windowAreaM2() * p.solarHeatGainCoefficient();
        double[] facade = site.weather().facadeIrradiance()[p.orientation()];
        double[] outdoor = site.weather().outdoorC();
        double[] chw = site.chilledWaterSupplyC();
        double[] hw = site.hotWaterSupplyC();

        TwoNodeZone zoneModel = new TwoNodeZone(24.0);
        double tAir = zoneModel.air();
        double zoneSensor = tAir;
        double datSensor = tAir;
        double coolPos = 0;
        double heatPos = 0;
        double coolCmd = 0;
        double heatCmd = 0;
        double coolIntegral = 0;
        double heatIntegral = 0;
        boolean fanOn = false;
        boolean heatingLast = false;

        for (int m = 0; m < minutes; m++) {
            boolean faulty = m >= faultFrom && m < faultTo;
            int minuteOfDay = site.localMinuteOfDay()[m];
            boolean occupied = occupied(site, m, p.occupiedStartMinute(), p.occupiedEndMinute());
            double heatSp = heatingSetpoint(occupied, p.setpointShiftK());
            double coolSp = coolingSetpoint(occupied, p.setpointShiftK());

            zoneSensor += (tAir - zoneSensor) * ZONE_SENSOR_ALPHA;

            // Fan: continuous when occupied. Unoccupied, it starts when the zone leaves the setback band; the
            // loops then aim 1.5 K inside the band and the fan stops once the zone is 1 K inside it.
            double heatTarget = heatSp;
            double coolTarget = coolSp;
            if (occupied) {
                fanOn = true;
            } else {
                if (!fanOn && (zoneSensor > coolSp || zoneSensor < heatSp)) {
                    fanOn = true;
                } else if (fanOn && zoneSensor < coolSp - 1.0 && zoneSensor > heatSp + 1.0) {
                    fanOn = false;
                }
                heatTarget = heatSp + UNOCCUPIED_OVERSHOOT_K;
                coolTarget = coolSp - UNOCCUPIED_OVERSHOOT_K;
            }

            // PI loops with integral clamping (anti-windup); hunting multiplies gains and shortens integral times.
            double gainFactor = 1.0;
            double integralFactor = 1.0;
            if (faulty && type == FaultType.OSCILLATING_CONTROL) {
                gainFactor = 20 + 30 * severity;
                integralFactor = 0.15;
            }
            if (fanOn) {
                double kc = p.coolingGainPctPerK() * gainFactor;
                double ec = zoneSensor - coolTarget;
                coolIntegral = clamp(coolIntegral + kc * ec * DT / (60 * p.coolingIntegralMin() * integralFactor),
                        0, 100);
                coolCmd = clamp(kc * ec + coolIntegral, 0, 100);
                double kh = p.heatingGainPctPerK() * gainFactor;
                double eh = heatTarget - zoneSensor;
                heatIntegral = clamp(heatIntegral + kh * eh * DT / (60 * p.heatingIntegralMin() * integralFactor),
                        0, 100);
                heatCmd = clamp(kh * eh + heatIntegral, 0, 100);
            } else {
                coolIntegral = 0;
                heatIntegral = 0;
                coolCmd = 0;
                heatCmd = 0;
            }
            if (heatCmd > 0) {
                heatingLast = true;
            } else if (coolCmd > 0) {
                heatingLast = false;
            }

            // Actuators.
            if (faulty && type == FaultType.STUCK_COOLING_VALVE) {
                coolPos = severity;
            } else {
                coolPos = towards(coolPos, coolCmd / 100.0, ACTUATOR_RATE_PER_MIN);
            }
            heatPos = towards(heatPos, heatCmd / 100.0, ACTUATOR_RATE_PER_MIN);

            // Airflow: the fan's status echoes the command; a failed fan moves (almost) no air.
            double airFraction = fanOn ? 1.0 : 0.0;
            if (faulty && type == FaultType.FAN_FAILURE && fanOn) {
                airFraction = 0.3 * (1 - severity);
            }
            double cAir = cAirNominal * airFraction;

            // Cooling coil, then heating coil.
            double qCool = 0;
            double qHeat = 0;
            double afterCooling = tAir;
            double leaving = tAir;
            if (cAir > 0) {
                boolean lowFlow = faulty && type == FaultType.LOW_CHW_FLOW;
                boolean leaking = faulty && type == FaultType.LEAKING_HEATING_VALVE;
                if (airFraction == 1.0) {
                    // Nominal airflow: epsilon * Cmin from the per-unit tables.
                    qCool = lookup(lowFlow ? coolTableLowFlow : coolTable, coolPos) * (tAir - chw[m]);
                    afterCooling = tAir - qCool / cAir;
                    qHeat = lookup(leaking ? heatTableLeaking : heatTable, heatPos) * (hw[m] - afterCooling);
                } else {
                    double w = coolWaterFraction(coolPos, lowFlow ? lowFlowFactor : 1.0);
                    qCool = w > 0 ? CoilModel.heatFromAir(cAir, chwRateDesign * w,
                            CoilModel.conductance(uaCoolAir, airFraction, uaCoolWater, w), tAir, chw[m]) : 0;
                    afterCooling = tAir - qCool / cAir;
                    double h = heatWaterFraction(heatPos, leaking ? leak : 0.0);
                    qHeat = h > 0 ? -CoilModel.heatFromAir(cAir, hwRateDesign * h,
                            CoilModel.conductance(uaHeatAir, airFraction, uaHeatWater, h), afterCooling, hw[m]) : 0;
                }
                leaving = afterCooling + qHeat / cAir + FAN_HEAT_K * airFraction * airFraction;
            }
            boolean coolWaterFlows = coolPos > 0.01;
            boolean heatWaterFlows = heatPos > 0.01 || (faulty && type == FaultType.LEAKING_HEATING_VALVE);
            double supplyToZoneW = cAir * (leaving - tAir);

            // Discharge sensor: sees the leaving air with airflow; with little or none (below 30 % of nominal, the
            // share seen falling with the square of the airflow) it reads room air pulled a little (5 %) towards
            // the water of any open coil by natural convection. Chosen, no source.
            double stillTarget = tAir + 0.05 * (coolWaterFlows ? chw[m] - tAir : 0)
                    + 0.05 * (heatWaterFlows ? hw[m] - tAir : 0);
            double seen = airFraction >= 0.3 ? 1.0 : (airFraction / 0.3) * (airFraction / 0.3);
            double datTarget = seen * leaving + (1 - seen) * stillTarget;
            datSensor += (datTarget - datSensor) * (airFraction >= 0.3 ? DISCHARGE_ALPHA_FLOW : DISCHARGE_ALPHA_STILL);

            // Zone heat balance.
            double internalW = TwoNodeZone.internalGainsW(occupied, peakInternalW, minuteOfDay,
                    p.occupiedStartMinute(), p.occupiedEndMinute(), dayFactor[site.localDay()[m]]);
            zoneModel.step(DT, p.envelopeUaWPerK(), p.massConductanceWPerK(), p.airCapacitanceJPerK(),
                    p.massCapacitanceJPerK(), outdoor[m], supplyToZoneW, internalW, solarAperture * facade[m]);
            tAir = zoneModel.air();

            // Sample every 15 minutes after the warm-up: the instantaneous values, as a polled trend log holds them.
            int k = m - warmUp;
            if (k >= 0 && k % 15 == 0) {
                int s = k / 15;
                zone[s] = (float) (zoneSensor + NOISE_K * rng.gaussian() + spike(rng));
                double bias = faulty && type == FaultType.DISCHARGE_SENSOR_BIAS ? biasK : 0.0;
                dat[s] = (float) (datSensor + bias + NOISE_K * rng.gaussian() + spike(rng));
                sp[s] = (float) (heatingLast ? heatSp : coolSp);
                clg[s] = (float) coolCmd;
                htg[s] = (float) heatCmd;
                fan[s] = fanOn ? 1f : 0f;
                occ[s] = occupied ? 1f : 0f;
                datTrue[s] = (float) datSensor;
                flow[s] = (float) (airFraction * p.nominalAirflowLps());
                clgOpen[s] = (float) coolPos;
                clgW[s] = (float) qCool;
            }
        }
        return new UnitTrace(unitIri, p, fault, zone, dat, sp, clg, htg, fan, occ, datTrue, flow, clgOpen, clgW);
    }

    /** Water flow fraction through the cooling coil at an opening, times a fault factor. */
    private static double coolWaterFraction(double opening, double factor) {
        return opening <= 0 ? 0.0 : CoilModel.equalPercentageFlow(opening, VALVE_RANGEABILITY) * factor;
    }

    /** Water flow fraction through the heating coil at an opening, plus a leak (share of design flow). */
    private static double heatWaterFraction(double opening, double leak) {
        double f = opening <= 0 ? 0.0 : CoilModel.equalPercentageFlow(opening, VALVE_RANGEABILITY);
        return f + leak * (1 - f);
    }

    /**
     * epsilon * Cmin (W/K) at nominal airflow for valve openings 0, 1/N, ..., 1, so that the heat flow is this
     * times the entering air-water temperature difference. Interpolating keeps every value at or below the air's
     * capacity rate, so the leaving air still never passes the water temperature.
     */
    private static double[] coilTable(double uaAir, double uaWater, double cAir, double waterRateDesign,
            java.util.function.DoubleUnaryOperator waterFractionAt) {
        double[] t = new double[TABLE_STEPS + 1];
        for (int i = 0; i <= TABLE_STEPS; i++) {
            double w = waterFractionAt.applyAsDouble(i / (double) TABLE_STEPS);
            t[i] = w <= 0 ? 0.0 : CoilModel.heatFromAir(cAir, waterRateDesign * w,
                    CoilModel.conductance(uaAir, 1.0, uaWater, w), 1.0, 0.0);
        }
        return t;
    }

    private static double lookup(double[] table, double opening) {
        double x = Math.max(0.0, Math.min(1.0, opening)) * TABLE_STEPS;
        int i = Math.min((int) x, TABLE_STEPS - 1);
        return table[i] + (table[i + 1] - table[i]) * (x - i);
    }

    /**
     * Share of peak internal gains in occupied hours from {@code startMinute} to {@code endMinute} (local minutes of
     * day): ramp-up in the first 90 min, lunch dip, wind-down.
     */
    static double occupiedProfile(int minuteOfDay, int startMinute, int endMinute) {
        double sinceStart = minuteOfDay - startMinute;
        double untilEnd = endMinute - minuteOfDay;
        double f = sinceStart < 90 ? 0.6 + 0.4 * sinceStart / 90.0 : 1.0;
        if (minuteOfDay >= 720 && minuteOfDay < 780) {
            f = Math.min(f, 0.85);
        }
        if (untilEnd < 60) {
            f = Math.min(f, 0.7);
        }
        return f;
    }

    static double spike(SeededRandom rng) {
        if (rng.nextDouble() >= SPIKE_PROBABILITY) {
            return 0.0;
        }
        double size = rng.uniform(4, 10);
        return rng.nextDouble() < 0.5 ? -size : size;
    }

    static double towards(double from, double to, double maxStep) {
        return from + clamp(to - from, -maxStep, maxStep);
    }

    static double clamp(double v, double lo, double hi) {
        return Math.max(lo, Math.min(hi, v));
    }
}
