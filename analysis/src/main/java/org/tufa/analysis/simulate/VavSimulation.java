package org.tufa.analysis.simulate;

import java.util.Optional;

/**
 * One VAV box (cooling-only, or with hot-water reheat) and its zone, simulated at one-minute steps and sampled every
 * 15 minutes, fed by the wing's air handler ({@link AirHandlerConditions}).
 *
 * <p>Zone: {@link TwoNodeZone}, as for the fan coil units, with the box's supply air as the HVAC term:
 * Q = rho cp V (T_discharge - T_zone), the air-side sensible heat of ASHRAE Handbook Fundamentals.
 *
 * <p>Control, as ASHRAE Guideline 36 sequences a VAV box (from memory; simplified): two PI loops on the zone
 * sensor, cooling (24 C occupied) and heating (21 C), 3 K apart. In cooling the cooling loop raises the airflow
 * setpoint from the minimum to the cooling maximum; in deadband the box holds its minimum with the reheat shut; in
 * heating (boxes with reheat) the first half of the heating loop raises the discharge temperature setpoint from the
 * supply air temperature to at most {@value VavParameters#MAX_DISCHARGE_ABOVE_SETPOINT_K} K above the heating
 * setpoint at minimum airflow, and the second half raises the airflow to the heating maximum ("dual maximum"). A
 * discharge loop (integral, 1.5 %/K per minute) drives the reheat valve to the discharge setpoint. Unoccupied, the box
 * is off (no airflow) until its zone leaves the setback band 16-29 C, then conditions it back 1.5 K inside and stops
 * 1 K inside (as the fan coil units do).
 *
 * <p>Airflow: pressure-independent control; the flow loop is taken as settled within the minute (a real loop
 * settles in one or two, well under the 15-minute sample), so the damper command is the opening that gives the
 * setpoint as the airflow sensor reads it, through the damper's inherent characteristic (equal percentage,
 * rangeability 10: flow share (10^x - 1) / 9 at opening x; common practice, no source) scaled by the square root
 * of the inlet static pressure (orifice flow). The actuator strokes in 90 s (common practice). The airflow sensor
 * reads the true flow with 1 % gain noise and 1.5 % of the maximum as additive noise (velocity-pressure sensors are
 * poorest at low flow; chosen, no source).
 *
 * <p>Reheat coil: dry water-to-air coil by effectiveness-NTU ({@link CoilModel}, Incropera and DeWitt), design
 * effectiveness at the heating maximum, both sides' conductance scaling with flow to the power 0.8, the valve
 * equal-percentage with rangeability 25 as on the fan coil units. The discharge temperature is the supply air
 * temperature at the box (the air handler's plus 0.5 K duct gain; common practice, no source) plus Q / (rho cp V).
 *
 * <p>Sensors: zone sensor lag 3 min, discharge sensor lag 1 min with airflow and 10 min without (it then reads the
 * plenum, taken as the zone temperature); Gaussian noise 0.1 K; rare spikes as on the fan coil units.
 */
final class VavSimulation {
    static final double DUCT_GAIN_K = 0.5;
    static final double DAMPER_RANGEABILITY = 10.0;
    static final double DAMPER_RATE_PER_MIN = 60.0 / 90.0;
    static final double DISCHARGE_LOOP_PCT_PER_K_MIN = 1.5;
    static final double AIRFLOW_GAIN_NOISE = 0.01;
    static final double AIRFLOW_NOISE_SHARE_OF_MAX = 0.015;
    private static final double DT = 60.0;

    private VavSimulation() {
    }

    /** The share of the full-open airflow at a damper opening in [0, 1]. */
    static double damperFlowShare(double opening) {
        return CoilModel.equalPercentageFlow(opening, DAMPER_RANGEABILITY);
    }

    /** The opening that gives a share of the full-open airflow (inverse of {@link #damperFlowShare}), in [0, 1]. */
    static double damperOpeningFor(double share) {
        double s = Math.max(0.0, Math.min(1.0, share));
        return Math.log(1 + s * (DAMPER_RANGEABILITY - 1)) / Math.log(DAMPER_RANGEABILITY);
    }

    static VavTrace run(String unitIri, VavParameters p, SiteConditions site, AirHandlerConditions ahu,
            Optional<FaultEpisode> fault, long seed) {
        SeededRandom rng = SeededRandom.forStream(seed, "vav-noise|" + unitIri);
        SeededRandom faultRng = SeededRandom.forStream(seed, "vav-fault|" + unitIri);
        int minutes = site.minutes();
        int warmUp = site.warmUpMinutes();
        int samples = (minutes - warmUp) / 15;

        float[] zone = new float[samples];
        float[] dat = new float[samples];
        float[] coolSpLog = new float[samples];
        float[] heatSpLog = new float[samples];
        float[] flowLog = new float[samples];
        float[] flowSpLog = new float[samples];
        float[] damperCmdLog = new float[samples];
        float[] damperPosLog = new float[samples];
        float[] reheatLog = new float[samples];
        float[] occ = new float[samples];
        float[] flowTrue = new float[samples];
        float[] datTrue = new float[samples];
        float[] reheatW = new float[samples];

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
        double driftSign = faultRng.nextDouble() < 0.5 ? -1 : 1;
        double driftFull = driftSign * (0.15 + 0.35 * severity);

        int days = site.localDay()[minutes - 1] + 1;
        double[] dayFactor = new double[days];
        for (int d = 0; d < days; d++) {
            dayFactor[d] = rng.uniform(0.8, 1.1);
        }

        double cHeatMax = p.heatingAirCapacityRate();
        double uaAir = p.reheatUaDesign() / UnitParameters.AIR_SIDE_RESISTANCE_SHARE;
        double uaWater = p.reheatUaDesign() / (1 - UnitParameters.AIR_SIDE_RESISTANCE_SHARE);
        double hwRateDesign = VavParameters.HW_TO_AIR_CAPACITY_RATIO * cHeatMax;
        double leak = 0.03 + 0.17 * severity;
        double peakInternalW = p.internalGainWPerM2() * p.floorAreaM2();
        double solarAperture = p.windowAreaM2() * p.solarHeatGainCoefficient();
        double[] facade = site.weather().facadeIrradiance()[p.orientation()];
        double[] outdoor = site.weather().outdoorC();
        double[] hw = site.hotWaterSupplyC();

        TwoNodeZone zoneModel = new TwoNodeZone(24.0);
        double tAir = zoneModel.air();
        double zoneSensor = tAir;
        double datSensor = tAir;
        double damperPos = 0;
        double valvePos = 0;
        double valveCmd = 0;
        double coolIntegral = 0;
        double heatIntegral = 0;
        boolean on = false;

        for (int m = 0; m < minutes; m++) {
            boolean faulty = m >= faultFrom && m < faultTo;
            int minuteOfDay = site.localMinuteOfDay()[m];
            boolean occupied = FanCoilSimulation.occupied(site, m, p.occupiedStartMinute(), p.occupiedEndMinute());
            double heatSp = FanCoilSimulation.heatingSetpoint(occupied, p.setpointShiftK());
            double coolSp = FanCoilSimulation.coolingSetpoint(occupied, p.setpointShiftK());

            zoneSensor += (tAir - zoneSensor) * FanCoilSimulation.ZONE_SENSOR_ALPHA;

            // On when occupied; unoccupied, on once the zone leaves the setback band (cooling-only boxes answer
            // only the cooling side), aiming 1.5 K inside it, off 1 K inside it.
            double heatTarget = heatSp;
            double coolTarget = coolSp;
            if (occupied) {
                on = true;
            } else {
                boolean tooCold = p.reheat() && zoneSensor < heatSp;
                if (!on && (zoneSensor > coolSp || tooCold)) {
                    on = true;
                } else if (on && zoneSensor < coolSp - 1.0 && (!p.reheat() || zoneSensor > heatSp + 1.0)) {
                    on = false;
                }
                heatTarget = heatSp + FanCoilSimulation.UNOCCUPIED_OVERSHOOT_K;
                coolTarget = coolSp - FanCoilSimulation.UNOCCUPIED_OVERSHOOT_K;
            }

            double coolLoop = 0;
            double heatLoop = 0;
            if (on) {
                double ec = zoneSensor - coolTarget;
                coolIntegral = FanCoilSimulation.clamp(coolIntegral + p.coolingGainPctPerK() * ec * DT
                        / (60 * p.coolingIntegralMin()), 0, 100);
                coolLoop = FanCoilSimulation.clamp(p.coolingGainPctPerK() * ec + coolIntegral, 0, 100);
                if (p.reheat()) {
                    double eh = heatTarget - zoneSensor;
                    heatIntegral = FanCoilSimulation.clamp(heatIntegral + p.heatingGainPctPerK() * eh * DT
                            / (60 * p.heatingIntegralMin()), 0, 100);
                    heatLoop = FanCoilSimulation.clamp(p.heatingGainPctPerK() * eh + heatIntegral, 0, 100);
                }
            } else {
                coolIntegral = 0;
                heatIntegral = 0;
            }

            // Airflow setpoint: minimum in deadband, up to the cooling maximum with the cooling loop, up to the
            // heating maximum with the second half of the heating loop.
            double flowSp = 0;
            if (on) {
                flowSp = p.minAirflowLps();
                if (coolLoop > 0) {
                    flowSp += (p.maxAirflowLps() - p.minAirflowLps()) * coolLoop / 100.0;
                } else if (heatLoop > 50) {
                    flowSp += (p.heatingMaxAirflowLps() - p.minAirflowLps()) * (heatLoop - 50) / 50.0;
                }
                if (faulty && type == FaultType.UNREACHABLE_AIRFLOW_SETPOINT) {
                    flowSp = p.maxAirflowLps() * (1.4 + 0.8 * severity);
                }
            }

            // Flow loop (settled): the opening that makes the sensor read the setpoint.
            double pressureShare = faulty && type == FaultType.INSUFFICIENT_SUPPLY_AIR ? 0.6 - 0.5 * severity : 1.0;
            double fullOpen = p.fullOpenAirflowLps() * Math.sqrt(pressureShare);
            double sensorGain = 1.0;
            if (faulty && type == FaultType.AIRFLOW_SENSOR_DRIFT) {
                sensorGain += driftFull * Math.min(1.0, (m - faultFrom) / (2.0 * 1440.0));
            }
            double damperCmd = flowSp > 0 ? damperOpeningFor(flowSp / sensorGain / fullOpen) : 0.0;
            if (faulty && type == FaultType.STUCK_DAMPER) {
                damperPos = 0.1 + 0.8 * severity;
            } else {
                damperPos = FanCoilSimulation.towards(damperPos, damperCmd, DAMPER_RATE_PER_MIN);
            }
            double flow = fullOpen * damperFlowShare(damperPos);
            double cAir = CoilModel.AIR_DENSITY * flow / 1000.0 * CoilModel.AIR_CP;
            double supplyAtBox = ahu.supplyAirC()[m] + DUCT_GAIN_K;

            // Discharge loop and reheat valve (boxes with reheat).
            if (p.reheat() && heatLoop > 0) {
                double datSp = supplyAtBox + (heatSp + VavParameters.MAX_DISCHARGE_ABOVE_SETPOINT_K - supplyAtBox)
                        * Math.min(1.0, heatLoop / 50.0);
                valveCmd = FanCoilSimulation.clamp(valveCmd + DISCHARGE_LOOP_PCT_PER_K_MIN * (datSp - datSensor),
                        0, 100);
            } else {
                valveCmd = 0;
            }
            if (faulty && type == FaultType.STUCK_REHEAT_VALVE) {
                valvePos = 0.8 * severity;
            } else {
                valvePos = FanCoilSimulation.towards(valvePos, valveCmd / 100.0,
                        FanCoilSimulation.ACTUATOR_RATE_PER_MIN);
            }
            double qReheat = 0;
            double leaving = tAir;
            if (cAir > 0) {
                if (p.reheat()) {
                    double w = valvePos <= 0 ? 0.0
                            : CoilModel.equalPercentageFlow(valvePos, FanCoilSimulation.VALVE_RANGEABILITY);
                    if (faulty && type == FaultType.LEAKING_REHEAT_VALVE) {
                        w += leak * (1 - w);
                    }
                    qReheat = w > 0 ? -CoilModel.heatFromAir(cAir, hwRateDesign * w, CoilModel.conductance(uaAir,
                            flow / p.heatingMaxAirflowLps(), uaWater, w), supplyAtBox, hw[m]) : 0;
                }
                leaving = supplyAtBox + qReheat / cAir;
            }
            boolean airflowSeen = flow > 0.05 * p.maxAirflowLps();
            double datTarget = airflowSeen ? leaving : tAir;
            datSensor += (datTarget - datSensor) * (airflowSeen ? FanCoilSimulation.DISCHARGE_ALPHA_FLOW : FanCoilSimulation.DISCHARGE_ALPHA_STILL);

            // Zone heat balance: the supply air brings rho cp V (T_discharge - T_zone).
            double internalW = TwoNodeZone.internalGainsW(occupied, peakInternalW, minuteOfDay,
                    p.occupiedStartMinute(), p.occupiedEndMinute(), dayFactor[site.localDay()[m]]);
            zoneModel.step(DT, p.envelopeUaWPerK(), p.massConductanceWPerK(), p.airCapacitanceJPerK(),
                    p.massCapacitanceJPerK(), outdoor[m], cAir * (leaving - tAir), internalW, solarAperture * facade[m]);
            tAir = zoneModel.air();

            int k = m - warmUp;
            if (k >= 0 && k % 15 == 0) {
                int s = k / 15;
                zone[s] = (float) (zoneSensor + FanCoilSimulation.NOISE_K * rng.gaussian()
                        + FanCoilSimulation.spike(rng));
                dat[s] = (float) (datSensor + FanCoilSimulation.NOISE_K * rng.gaussian()
                        + FanCoilSimulation.spike(rng));
                coolSpLog[s] = (float) coolSp;
                heatSpLog[s] = (float) heatSp;
                double read = flow * sensorGain * (1 + AIRFLOW_GAIN_NOISE * rng.gaussian())
                        + AIRFLOW_NOISE_SHARE_OF_MAX * p.maxAirflowLps() * rng.gaussian();
                flowLog[s] = (float) Math.max(0.0, read);
                flowSpLog[s] = (float) flowSp;
                damperCmdLog[s] = (float) (100 * damperCmd);
                damperPosLog[s] = (float) FanCoilSimulation.clamp(100 * damperPos + 0.3 * rng.gaussian(), 0, 100);
                reheatLog[s] = (float) valveCmd;
                occ[s] = occupied ? 1f : 0f;
                flowTrue[s] = (float) flow;
                datTrue[s] = (float) datSensor;
                reheatW[s] = (float) qReheat;
            }
        }
        return new VavTrace(unitIri, p, fault, zone, dat, coolSpLog, heatSpLog, flowLog, flowSpLog, damperCmdLog,
                damperPosLog, reheatLog, occ, flowTrue, datTrue, reheatW);
    }
}
