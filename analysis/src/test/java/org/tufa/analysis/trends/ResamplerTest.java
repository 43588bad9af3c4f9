package org.tufa.analysis.trends;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Grid resampling. Expected values are worked by hand from the definitions in {@link Resampler}: cell mean for
 * analog series, sample-and-hold for change-of-value logs (BACnet Trend Log, ASHRAE 135-2020 cl. 12.25; notes
 * section 9), hold limited to maxGap.
 */
class ResamplerTest {

    private static final long MIN = 60;
    private static final long INTERVAL = 15 * MIN;
    private static final long MAX_GAP = 60 * MIN;

    @Test
    void analogCellIsTheMeanOfItsSamples() {
        // Samples at 0, 5 and 10 min: one cell, mean (20 + 22 + 27) / 3 = 23 (arithmetic).
        double[] out = Resampler.analog(new long[] {0, 5 * MIN, 10 * MIN}, new double[] {20, 22, 27}, 0, INTERVAL, 1,
                MAX_GAP);
        assertArrayEquals(new double[] {23}, out, 1e-12);
    }

    @Test
    void emptyCellHoldsTheLastValueUpToMaxGapThenNaN() {
        // One sample at 0 min (value 5): held while the cell starts before 0 + 60 min, i.e. cells 0..3; cell 4 starts
        // at 60 min, where the hold has expired -> NaN. Next sample at 120 min starts cell 8.
        double[] out = Resampler.analog(new long[] {0, 120 * MIN}, new double[] {5, 7}, 0, INTERVAL, 10, MAX_GAP);
        double n = Double.NaN;
        assertArrayEquals(new double[] {5, 5, 5, 5, n, n, n, n, 7, 7}, out, 0);
    }

    @Test
    void samplesBeforeTheGridOnlySupplyTheHeldValue() {
        // Sample at -10 min is held into cell 0 (starts at 0 < -10 + 60); the sample at 20 min makes cell 1 = 9.
        double[] out = Resampler.analog(new long[] {-10 * MIN, 20 * MIN}, new double[] {3, 9}, 0, INTERVAL, 2, MAX_GAP);
        assertArrayEquals(new double[] {3, 9}, out, 0);
    }

    @Test
    void binaryCellIsTheTimeWeightedOnFraction() {
        // On at 0, off at 5 min, on at 25 min: cell 0 = 5/15 on; cell 1 [15, 30) = 5/15 on (25..30);
        // cell 2 [30, 45) on throughout (held) = 1. Hand-computed.
        double[] out = Resampler.binary(new long[] {0, 5 * MIN, 25 * MIN}, new double[] {1, 0, 1}, 0, INTERVAL, 3,
                MAX_GAP);
        assertArrayEquals(new double[] {1.0 / 3, 1.0 / 3, 1}, out, 1e-12);
    }

    @Test
    void binaryHoldStopsAtMaxGapAndCountsOnlyCoveredTime() {
        // On at 0, nothing else: held [0, 60 min); cells 0..3 fully on, cell 4 uncovered -> NaN.
        // A sample at 70 min (off) covers [70, 130) of which cell 4 [60, 75) gets 5 min, all off -> 0.
        double[] out = Resampler.binary(new long[] {0, 70 * MIN}, new double[] {1, 0}, 0, INTERVAL, 6, MAX_GAP);
        assertArrayEquals(new double[] {1, 1, 1, 1, 0, 0}, out, 0);
        double[] gap = Resampler.binary(new long[] {0}, new double[] {1}, 0, INTERVAL, 6, MAX_GAP);
        double n = Double.NaN;
        assertArrayEquals(new double[] {1, 1, 1, 1, n, n}, gap, 0);
    }

    @Test
    void unsortedSamplesAreSortedStably() {
        SpillStore.Samples sorted = Resampler.sortedByTime(
                new SpillStore.Samples(new long[] {30, 10, 20, 10}, new double[] {3, 1, 2, 4}));
        assertArrayEquals(new long[] {10, 10, 20, 30}, sorted.epochSeconds());
        assertArrayEquals(new double[] {1, 4, 2, 3}, sorted.values(), 0);
        assertEquals(2, Resampler.samplesInGrid(new long[] {-1, 0, 899, 900}, 0, INTERVAL, 1));
    }
}
