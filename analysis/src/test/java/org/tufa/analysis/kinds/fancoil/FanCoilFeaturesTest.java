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
