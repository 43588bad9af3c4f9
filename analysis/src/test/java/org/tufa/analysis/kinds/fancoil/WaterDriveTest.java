package org.tufa.analysis.kinds.fancoil;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.time.Instant;
import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.fleet.FanCoilSignals;

/**
 * Coil samples whose supply water cannot drive the coil are not clustered ({@link FanCoilKind#waterCanDrive}).
 * Worked by hand: zone 21 degC; hot water at 45 degC on the first 60 heating samples (drive 24 K) and at 24 degC,
 * a plant off for the season, on the last 40 (drive 3 K). The 90th percentile of the drive is 24 K, half of it
 * 12 K, so the last 40 samples are left out and the first 60 kept.
 */
class WaterDriveTest {

    static final int N = 100;

    private static UnitSignals unit(double[] hotWater, double[] chilledWater) {
        double[] zone = new double[N];
        Arrays.fill(zone, 21);
        double[] other = new double[N];
        return FanCoilSignals.of(Instant.parse("2031-07-01T00:00:00Z"), Duration.ofMinutes(15), 0.19, zone,
                other.clone(), other.clone(), other.clone(), other.clone(), other.clone(), chilledWater, hotWater,
                other.clone());
    }

    @Test
    void samplesOfAPlantOffForTheSeasonAreNotClustered() {
        double[] hot = new double[N];
        Arrays.fill(hot, 0, 60, 45);
        Arrays.fill(hot, 60, N, 24);
        double[] chilled = new double[N];
        Arrays.fill(chilled, 7);
        boolean[] heating = new boolean[N];
        Arrays.fill(heating, true);
        boolean[] kept = FanCoilKind.waterCanDrive(heating, unit(hot, chilled), false);
        for (int i = 0; i < N; i++) {
            if (i < 60) {
                assertTrue(kept[i], "sample " + i);
            } else {
                assertFalse(kept[i], "sample " + i);
            }
        }
    }

    /** Without a supply-water trend nothing is known of the plant, and every sample of the mode stays. */
    @Test
    void withoutAWaterTemperatureEverySampleStays() {
        double[] none = new double[N];
        Arrays.fill(none, Double.NaN);
        boolean[] cooling = new boolean[N];
        Arrays.fill(cooling, 0, 50, true);
        assertArrayEquals(cooling, FanCoilKind.waterCanDrive(cooling, unit(none, none), true));
    }
}
