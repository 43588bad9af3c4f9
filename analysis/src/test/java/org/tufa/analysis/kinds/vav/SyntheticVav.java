package org.tufa.analysis.kinds.vav;

import java.time.Duration;
import java.time.Instant;
import java.util.SplittableRandom;
import org.tufa.analysis.features.UnitSignals;

/**
 * A hand-built VAV box with hot-water reheat at 15-minute samples, sequenced as ASHRAE Guideline 36 describes a
 * box (from memory; simplified): off outside 07:00-18:00; 07:00-09:00 reheat at the minimum airflow; 09:00-11:00
 * deadband at the minimum; then the cooling loop raises the airflow setpoint from the minimum towards the maximum. The flow loop
 * settles within the sample: the airflow follows its setpoint, the damper opens to pass it through an
 * equal-percentage characteristic (rangeability 10). The reheat coil is a counterflow coil with equal capacity
 * rates on both sides, whose effectiveness is NTU / (1 + NTU) (Incropera and DeWitt, Fundamentals of Heat and Mass
 * Transfer, eq. 11.29b, Cr = 1), NTU proportional to the water passed by an equal-percentage valve (rangeability 25).
 * The discharge is the AHU's supply plus a 0.5 K duct gain plus that rise. Faults are planted by the tests on the
 * public arrays.
 */
final class SyntheticVav {

    static final Instant START = Instant.parse("2031-06-02T00:00:00Z");
    static final Duration STEP = Duration.ofMinutes(15);
    static final int PER_DAY = 96;
    static final double MIN = 0.09;
    static final double MAX = 0.30;
    static final double FULL_OPEN = 0.38;
    static final double NTU_DESIGN = 2.0;
    static final double HOT_WATER = 60.0;
    static final double DUCT_GAIN = 0.5;

    final int n;
    final double[] zone;
    final double[] discharge;
    final double[] airflow;
    final double[] setpoint;
    final double[] damper;
    final double[] reheat;
    final double[] cooling;
    final double[] heating;
    final double[] occupancy;
    final double[] supply;
    /** Per sample: the reheat coil's NTU at full water flow (a fault may lower it). */
    final double[] ntu;

    private SyntheticVav(int days) {
        n = days * PER_DAY;
        zone = new double[n];
        discharge = new double[n];
        airflow = new double[n];
        setpoint = new double[n];
        damper = new double[n];
        reheat = new double[n];
        cooling = new double[n];
        heating = new double[n];
        occupancy = new double[n];
        supply = new double[n];
        ntu = new double[n];
        java.util.Arrays.fill(ntu, NTU_DESIGN);
    }

    /** A healthy box over {@code days} days. */
    static SyntheticVav healthy(int days, long seed) {
        SyntheticVav b = new SyntheticVav(days);
        b.sequence(new SplittableRandom(seed));
        return b;
    }

    /** The reheat coil's effectiveness at a command (percent) and full-flow NTU: eq. 11.29b with Cr = 1. */
    static double effectiveness(double commandPercent, double fullNtu) {
        double w = (Math.pow(25, commandPercent / 100) - 1) / 24;
        double ntu = fullNtu * w;
        return ntu / (1 + ntu);
    }

    /** The damper opening (percent) that passes a flow at the design inlet pressure. */
    static double opening(double flow) {
        double share = Math.max(0, Math.min(1, flow / FULL_OPEN));
        return 100 * Math.log(1 + 9 * share) / Math.log(10);
    }

    private void sequence(SplittableRandom r) {
        double dayLoad = 1;
        for (int i = 0; i < n; i++) {
            int q = i % PER_DAY;
            if (q == 0) {
                dayLoad = 0.6 + 0.4 * r.nextDouble();
            }
            double hour = q / 4.0;
            boolean occupied = hour >= 7 && hour < 18;
            occupancy[i] = occupied ? 1 : 0;
            cooling[i] = occupied ? 24 : 29;
            heating[i] = occupied ? 21 : 16;
            supply[i] = 13 + 0.5 * Math.sin(2 * Math.PI * hour / 24) + 0.1 * r.nextGaussian();
            if (!occupied) {
                setpoint[i] = 0;
                reheat[i] = 0;
            } else if (hour < 9) {
                setpoint[i] = MIN;
                reheat[i] = 30 + 40 * (9 - hour) / 2 * dayLoad + 3 * r.nextGaussian();
            } else if (hour < 11) {
                setpoint[i] = MIN;
                reheat[i] = 0;
            } else {
                double c = dayLoad * Math.sin(Math.PI * (hour - 10.5) / 8);
                setpoint[i] = MIN + (MAX - MIN) * Math.max(0, c);
                reheat[i] = 0;
            }
            zone[i] = (occupied ? 22.8 : 25) + 0.15 * r.nextGaussian();
        }
        recompute(new SplittableRandom(r.nextLong()));
    }

    /** Airflow, damper and discharge from the setpoints and commands (called again after planting a fault). */
    void recompute(SplittableRandom r) {
        for (int i = 0; i < n; i++) {
            airflow[i] = Math.max(0, setpoint[i] * (1 + 0.01 * r.nextGaussian()) + 0.003 * r.nextGaussian());
            damper[i] = setpoint[i] > 0 ? opening(setpoint[i]) : 0;
            dischargeAt(i, r);
        }
    }

    void dischargeAt(int i, SplittableRandom r) {
        if (airflow[i] < 0.02) {
            discharge[i] = zone[i] + 0.1 * r.nextGaussian();
            return;
        }
        double rise = effectiveness(Math.max(0, reheat[i]), ntu[i]) * (HOT_WATER - supply[i] - DUCT_GAIN);
        discharge[i] = supply[i] + DUCT_GAIN + rise + 0.1 * r.nextGaussian();
    }

    static int[] days(int from, int to) {
        return new int[] {from * PER_DAY, to * PER_DAY};
    }

    UnitSignals signals() {
        return UnitSignals.builder(START, STEP, n).nominalAirflow(MAX)
                .with(UnitSignals.ZONE_AIR_TEMPERATURE, zone.clone())
                .with(UnitSignals.DISCHARGE_AIR_TEMPERATURE, discharge.clone())
                .with(UnitSignals.AIRFLOW, airflow.clone())
                .with(UnitSignals.AIRFLOW_SETPOINT, setpoint.clone())
                .with(UnitSignals.DAMPER_COMMAND, damper.clone())
                .with(UnitSignals.REHEAT_VALVE_COMMAND, reheat.clone())
                .with(UnitSignals.ZONE_COOLING_TEMPERATURE_SETPOINT, cooling.clone())
                .with(UnitSignals.ZONE_HEATING_TEMPERATURE_SETPOINT, heating.clone())
                .with(UnitSignals.OCCUPANCY, occupancy.clone())
                .with(UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE, supply.clone())
                .build();
    }

    /** The box's signals without some roles (a model that lacks those points). */
    UnitSignals signalsWithout(String... roles) {
        UnitSignals all = signals();
        UnitSignals.Builder b = UnitSignals.builder(START, STEP, n).nominalAirflow(MAX);
        java.util.Set<String> drop = java.util.Set.of(roles);
        for (String role : all.roles()) {
            if (!drop.contains(role)) {
                b.with(role, all.series(role));
            }
        }
        return b.build();
    }

    /** The same box as its airflow side alone: no discharge sensor, no reheat, no AHU point. */
    UnitSignals airflowSideOnly() {
        return UnitSignals.builder(START, STEP, n).nominalAirflow(MAX)
                .with(UnitSignals.ZONE_AIR_TEMPERATURE, zone.clone())
                .with(UnitSignals.AIRFLOW, airflow.clone())
                .with(UnitSignals.AIRFLOW_SETPOINT, setpoint.clone())
                .with(UnitSignals.DAMPER_COMMAND, damper.clone())
                .with(UnitSignals.ZONE_TEMPERATURE_SETPOINT, cooling.clone())
                .build();
    }
}
