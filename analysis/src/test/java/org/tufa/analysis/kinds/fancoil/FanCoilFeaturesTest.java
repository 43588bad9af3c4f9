package org.tufa.analysis.kinds.fancoil;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.time.Instant;
import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.fleet.FanCoilSignals;

/**
 * Fan coil features learnt from part of the samples: the coil curve of the samples that may teach it, applied to
 * the others. The coil follows its energy balance (ASHRAE Handbook Fundamentals): discharge = zone - e(v) (zone -
 * chilled water), with e(v) = 0.6 v, a curve the quadratic coil response holds exactly.
 */
class FanCoilFeaturesTest {

    static final int N = 400;

    private static UnitSignals unit(double[] effectiveness) {
        double[] zone = new double[N];
        double[] discharge = new double[N];
        double[] cooling = new double[N];
        double[] heating = new double[N];
        double[] fan = new double[N];
        double[] setpoint = new double[N];
        double[] water = new double[N];
        double[] outdoor = new double[N];
        double[] hotWater = new double[N];
        for (int i = 0; i < N; i++) {
            zone[i] = 24;
            water[i] = 7;
            cooling[i] = 20 + (i * 37) % 80;
            double e = Double.isNaN(effectiveness[i]) ? 0.6 * cooling[i] / 100 : effectiveness[i];
            discharge[i] = zone[i] - e * (zone[i] - water[i]);
            fan[i] = 1;
            setpoint[i] = 24;
            outdoor[i] = 28;
            hotWater[i] = 45;
        }
        return FanCoilSignals.of(Instant.parse("2031-07-01T00:00:00Z"), Duration.ofMinutes(15), 0.19, zone,
                discharge, cooling, heating, fan, setpoint, water, hotWater, outdoor);
    }

    private static int[] all() {
        int[] s = new int[N];
        Arrays.setAll(s, i -> i);
        return s;
    }

    private static boolean[] running() {
        boolean[] r = new boolean[N];
        Arrays.fill(r, true);
        return r;
    }

    /** Learning from every sample is the plain build, value for value. */
    /**
     * A three-speed fan on a manual switch, six hours at each stage in turn, the valve moving independently:
     * the lower stages cool the air more at the same opening (effectiveness 0.6 v times 1.16, 1.07, 1.0 at low,
     * medium, high; invented, of the size the effectiveness-NTU relations give for half and two-thirds airflow,
     * Kays and London, Compact Heat Exchangers). Read with the speed, every stage's coil residual is centred on 0;
     * read without it (the contrast), low and high sit on either side of one curve by about 0.16 x 0.6 v x 17 K
     * (about 1 K at the mean opening, measured 0.76 K after the running median).
     */
    @Test
    void aStagedFanGetsACoilResidualPerStage() {
        double[] zone = new double[N];
        double[] discharge = new double[N];
        double[] cooling = new double[N];
        double[] speed = new double[N];
        double[] water = new double[N];
        double[] fan = new double[N];
        double[] ones = new double[N];
        for (int i = 0; i < N; i++) {
            zone[i] = 24;
            water[i] = 7;
            cooling[i] = 20 + (i * 37) % 80;
            speed[i] = 1 + (i / 24) % 3;
            double factor = speed[i] == 1 ? 1.16 : speed[i] == 2 ? 1.07 : 1.0;
            discharge[i] = zone[i] - factor * 0.6 * cooling[i] / 100 * (zone[i] - water[i]);
            fan[i] = 1;
            ones[i] = 24;
        }
        double[] none = new double[N];
        Arrays.fill(none, Double.NaN);
        Instant start = Instant.parse("2031-07-01T00:00:00Z");
        UnitSignals staged = FanCoilSignals.of(start, Duration.ofMinutes(15), 0.19, zone, discharge, cooling, none,
                fan, ones, water, none, none, speed);
        UnitSignals blind = FanCoilSignals.of(start, Duration.ofMinutes(15), 0.19, zone, discharge, cooling, none,
                fan, ones, water, none, none);
        double[] withSpeed = FanCoilFeatures.build("cooling", staged, all(), running()).column(0);
        double[] without = FanCoilFeatures.build("cooling", blind, all(), running()).column(0);
        for (int stage = 1; stage <= 3; stage++) {
            assertEquals(0.0, medianOfStage(withSpeed, speed, stage), 0.05, "stage " + stage);
        }
        double split = medianOfStage(without, speed, 1) - medianOfStage(without, speed, 3);
        assertTrue(split > 0.5, "low minus high stage without the speed: " + split);
    }

    private static double medianOfStage(double[] residual, double[] speed, int stage) {
        double[] of = java.util.stream.IntStream.range(0, N).filter(i -> speed[i] == stage)
                .mapToDouble(i -> residual[i]).sorted().toArray();
        return of[of.length / 2];
    }

    @Test
    void learningFromEverySampleIsThePlainBuild() {
        double[] none = new double[N];
        Arrays.fill(none, Double.NaN);
        UnitSignals s = unit(none);
        boolean[] every = new boolean[N];
        Arrays.fill(every, true);
        FeatureMatrix plain = FanCoilFeatures.build("cooling", s, all(), running());
        FeatureMatrix learnt = FanCoilFeatures.build("cooling", s, all(), every, running());
        assertArrayEquals(plain.sampleIndex(), learnt.sampleIndex());
        for (int r = 0; r < plain.size(); r++) {
            assertArrayEquals(plain.rows()[r], learnt.rows()[r]);
        }
    }

    /**
     * Samples 300-399 cool the air with effectiveness 0.95 whatever the valve (a failed fan). Learnt from all the
     * samples, the curve bends towards them; learnt from samples 0-299 only, it is the healthy e = 0.6 v, so the
     * last samples' residual is (0.95 - 0.6 v) x 17 K, worked by hand: at least 0.35 x 17 = 5.95 K, and the healthy
     * samples' residual is 0 (an exact fit).
     */
    @Test
    void samplesOutsideTheLearningSetAreJudgedByTheCurveOfTheOthers() {
        double[] e = new double[N];
        Arrays.fill(e, Double.NaN);
        Arrays.fill(e, 300, N, 0.95);
        UnitSignals s = unit(e);
        boolean[] learn = new boolean[N];
        Arrays.fill(learn, 0, 300, true);
        FeatureMatrix f = FanCoilFeatures.build("cooling", s, all(), learn, running());
        int residual = f.indexOf("coil_residual");
        assertEquals(0, residual);
        // Away from the boundary, where the running median (12 samples each side) sees one kind only.
        for (int r = 0; r < 280; r++) {
            assertEquals(0, f.rows()[r][residual], 1e-6, "healthy row " + r);
        }
        for (int r = 320; r < N; r++) {
            assertTrue(f.rows()[r][residual] >= 5.9, "row " + r + ": " + f.rows()[r][residual]);
        }
        FeatureMatrix outside = f.onlySamples(flags(300, N));
        assertEquals(100, outside.size());
        FeatureMatrix.Merged merged = FanCoilFeatures.build("cooling", s, Arrays.copyOf(all(), 300), running())
                .mergedWith(outside);
        assertEquals(N, merged.matrix().size());
        for (int r = 0; r < N; r++) {
            assertEquals(r, merged.matrix().sampleIndex()[r]);
            assertEquals(r >= 300, merged.fromOther()[r]);
        }
    }

    private static boolean[] flags(int from, int to) {
        boolean[] b = new boolean[N];
        Arrays.fill(b, from, to, true);
        return b;
    }
}
