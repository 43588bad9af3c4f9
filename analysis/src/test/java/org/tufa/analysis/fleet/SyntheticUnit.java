package org.tufa.analysis.fleet;

import java.time.Duration;
import java.time.Instant;
import java.util.Arrays;
import java.util.SplittableRandom;
import org.tufa.analysis.features.UnitSignals;

/**
 * Hand-built signals of one invented four-pipe fan coil unit on a 15-minute grid, with deterministic sensor noise
 * from a seeded {@link SplittableRandom}. The fan runs 07:00-19:00 every day; the first two hours are fan-only,
 * then the active coil's valve follows a smooth daily load curve. The coil follows its energy balance (ASHRAE
 * Handbook Fundamentals): discharge = zone - e(v) (zone - water) in cooling, zone + e(v) (water - zone) in heating,
 * with an effectiveness e(v) that rises with the valve opening and flattens towards full opening; fan heat adds
 * 0.3 K (common practice, no source). Arrays are public so a test can plant a fault before building the signals.
 */
final class SyntheticUnit {

    static final Instant START = Instant.parse("2031-06-02T00:00:00Z");
    static final Duration STEP = Duration.ofMinutes(15);
    static final int PER_DAY = 96;
    /** Nominal airflow of the synthetic unit, m3/s. */
    static final double AIRFLOW = 0.19;

    final int n;
    final double[] zone;
    final double[] discharge;
    final double[] cooling;
    final double[] heating;
    final double[] fan;
    final double[] setpoint;
    final double[] chilledWater;
    final double[] hotWater;
    final double[] outdoor;
    /** A multi-speed fan's stage per sample (1-3, 0 off), or null for a single-speed fan. */
    double[] fanSpeed;

    private SyntheticUnit(int n) {
        this.n = n;
        zone = new double[n];
        discharge = new double[n];
        cooling = new double[n];
        heating = new double[n];
        fan = new double[n];
        setpoint = new double[n];
        chilledWater = new double[n];
        hotWater = new double[n];
        outdoor = new double[n];
    }

    /** Effectiveness at a valve opening in percent: 0 shut, 0.7 wide open, concave. */
    static double effectiveness(double valvePercent) {
        double v = Math.max(0, valvePercent) / 100;
        return 0.7 * (1 - Math.exp(-2.5 * v)) / (1 - Math.exp(-2.5));
    }

    static boolean occupied(int i) {
        int q = i % PER_DAY;
        return q >= 28 && q < 76; // 07:00-19:00
    }

    static boolean fanOnly(int i) {
        int q = i % PER_DAY;
        return q >= 28 && q < 36; // 07:00-09:00
    }

    /** Healthy operation over {@code days} days: cooling season when {@code summer}, heating season otherwise. */
    static SyntheticUnit healthy(int days, boolean summer, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        SyntheticUnit u = new SyntheticUnit(days * PER_DAY);
        for (int i = 0; i < u.n; i++) {
            double hour = (i % PER_DAY) / 4.0;
            int day = i / PER_DAY;
            double target = summer ? 24.0 : 21.0;
            u.setpoint[i] = target;
            u.chilledWater[i] = 7.0 + 0.1 * random.nextGaussian();
            u.hotWater[i] = 45.0 + 0.3 * random.nextGaussian();
            u.outdoor[i] = (summer ? 24 : 3) + 5 * Math.sin(2 * Math.PI * (hour - 9) / 24)
                    + 0.2 * random.nextGaussian();
            double demand = 0;
            if (occupied(i) && !fanOnly(i)) {
                demand = 40 + 30 * Math.sin(Math.PI * (hour - 9) / 10) + 10 * Math.sin(2 * Math.PI * day / 7)
                        + 2 * random.nextGaussian();
                demand = Math.min(100, Math.max(12, demand));
            }
            u.fan[i] = occupied(i) ? 1 : 0;
            u.cooling[i] = summer ? demand : 0;
            u.heating[i] = summer ? 0 : demand;
            u.zone[i] = (occupied(i) ? target - (summer ? 0.4 : -0.4) : target + (summer ? 2 : -3))
                    + 0.1 * random.nextGaussian();
            double dischargeTrue;
            if (!occupied(i)) {
                dischargeTrue = u.zone[i];
            } else if (summer && demand > 0) {
                dischargeTrue = u.zone[i] - effectiveness(demand) * (u.zone[i] - u.chilledWater[i]) + 0.3;
            } else if (!summer && demand > 0) {
                dischargeTrue = u.zone[i] + effectiveness(demand) * (u.hotWater[i] - u.zone[i]) + 0.3;
            } else {
                dischargeTrue = u.zone[i] + 0.3;
            }
            u.discharge[i] = dischargeTrue + 0.15 * random.nextGaussian();
        }
        return u;
    }

    /** Sets the cooling valve of sample {@code i} and the noise-free discharge temperature that goes with it. */
    void coolWith(int i, double valvePercent) {
        cooling[i] = valvePercent;
        double shift = valvePercent > 0 ? effectiveness(valvePercent) * (zone[i] - chilledWater[i]) : 0;
        discharge[i] = zone[i] - shift + 0.3;
    }

    /**
     * Makes the fan a three-speed one on a manual switch, as many fan coil units have: low in the mornings, medium
     * from 14:00, high from 11:00 through a hot spell on days 8-11. The stage does not follow the valve, and the lower
     * stages pass less air, so the coil changes its temperature more: effectiveness at low and medium is 1.16 and
     * 1.07 times the high stage's (invented, of the size the effectiveness-NTU relations give for half and
     * two-thirds airflow; Kays and London, Compact Heat Exchangers).
     */
    void stageTheFan() {
        fanSpeed = new double[n];
        for (int i = 0; i < n; i++) {
            if (fan[i] == 0) {
                continue;
            }
            int day = i / PER_DAY;
            double hour = (i % PER_DAY) / 4.0;
            int stage = day >= 8 && day < 12 ? (hour >= 11 ? 3 : 1) : hour >= 14 ? 2 : 1;
            fanSpeed[i] = stage;
            if (cooling[i] > 0) {
                double d = cooling[i];
                double factor = stage == 1 ? 1.16 : stage == 2 ? 1.07 : 1.0;
                double noise = discharge[i] - (zone[i] - effectiveness(d) * (zone[i] - chilledWater[i]) + 0.3);
                discharge[i] = zone[i] - factor * effectiveness(d) * (zone[i] - chilledWater[i]) + 0.3 + noise;
            }
        }
    }

    /** Grid indices of day {@code day} from {@code fromHour} (inclusive) to {@code toHour} (exclusive). */
    static int[] span(int day, double fromHour, double toHour) {
        int a = day * PER_DAY + (int) Math.round(fromHour * 4);
        int b = day * PER_DAY + (int) Math.round(toHour * 4);
        return new int[] {a, b};
    }

    static Instant time(int i) {
        return START.plus(STEP.multipliedBy(i));
    }

    UnitSignals signals() {
        return FanCoilSignals.of(START, STEP, AIRFLOW, zone.clone(), discharge.clone(), cooling.clone(),
                heating.clone(), fan.clone(), setpoint.clone(), chilledWater.clone(), hotWater.clone(),
                outdoor.clone(), fanSpeed == null ? null : fanSpeed.clone());
    }

    /** The same unit with no trend for the cooling valve command (all NaN). */
    UnitSignals withoutCoolingValve() {
        double[] none = new double[n];
        Arrays.fill(none, Double.NaN);
        return FanCoilSignals.of(START, STEP, AIRFLOW, zone.clone(), discharge.clone(), none, heating.clone(),
                fan.clone(), setpoint.clone(), chilledWater.clone(), hotWater.clone(), outdoor.clone());
    }
}
