package org.tufa.analysis.features;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import org.junit.jupiter.api.Test;

/**
 * Running medians as in Tukey, Exploratory Data Analysis (1977): a short spike is removed, a lasting level shift
 * is kept. Every expected series below is a worked example, computed by hand.
 */
class RollingMedianTest {

    private static final double NAN = Double.NaN;

    @Test
    void singleSampleSpikeIsRemoved() {
        // Worked example, computed by hand: windows of 3 around the spike hold {1, 9, 1} -> 1; at the ends the
        // window is cut to {1, 1} (2 valid values >= halfWindow + 1) -> 1.
        double[] in = {1, 1, 1, 9, 1, 1, 1};
        assertArrayEquals(new double[] {1, 1, 1, 1, 1, 1, 1}, RollingMedian.of(in, 1), 0.0);
    }

    @Test
    void lastingLevelShiftIsKept() {
        // Worked example, computed by hand: at the step, windows {0, 0, 5} -> 0 and {0, 5, 5} -> 5.
        double[] in = {0, 0, 0, 0, 5, 5, 5, 5};
        assertArrayEquals(in, RollingMedian.of(in, 1), 0.0);
        // Half window 2: at the step, {0, 0, 0, 5, 5} -> 0 and {0, 0, 5, 5, 5} -> 5; the ends see 3 values.
        assertArrayEquals(in, RollingMedian.of(in, 2), 0.0);
    }

    @Test
    void twoSampleSpikeIsRemovedByAWindowOfFive() {
        // Worked example, computed by hand: {2, 2, 8, 8, 2} -> 2 at every sample of the spike.
        double[] in = {2, 2, 2, 8, 8, 2, 2, 2};
        assertArrayEquals(new double[] {2, 2, 2, 2, 2, 2, 2, 2}, RollingMedian.of(in, 2), 0.0);
    }

    @Test
    void missingSamplesAreSkippedAndStayMissing() {
        // Worked example, computed by hand, half window 2 (3 valid values needed):
        //   i=0: {1, 3} (NaN skipped) -> only 2 valid -> NaN
        //   i=1: NaN in -> NaN out
        //   i=2: {1, 3, 5, 7} -> even count -> (3 + 5) / 2 = 4
        //   i=3: {3, 5, 7} -> 5;  i=4: {3, 5, 7} -> 5
        double[] in = {1, NAN, 3, 5, 7};
        assertArrayEquals(new double[] {NAN, NAN, 4, 5, 5}, RollingMedian.of(in, 2), 0.0);
    }

    @Test
    void tooFewValidValuesGiveNaN() {
        // Worked example, computed by hand: a lone value among gaps has 1 valid value < halfWindow + 1 = 2.
        double[] in = {NAN, 2, NAN, NAN, 4, 6};
        assertArrayEquals(new double[] {NAN, NAN, NAN, NAN, 5, 5}, RollingMedian.of(in, 1), 0.0);
        assertArrayEquals(new double[] {NAN, NAN, NAN}, RollingMedian.of(new double[] {NAN, NAN, NAN}, 1), 0.0);
    }

    /** The plain definition: sort the window's valid values at every sample. */
    private static double[] bySorting(double[] values, int halfWindow) {
        int n = values.length;
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            double[] window = java.util.stream.IntStream.rangeClosed(Math.max(0, i - halfWindow),
                    Math.min(n - 1, i + halfWindow)).mapToDouble(j -> values[j]).filter(v -> !Double.isNaN(v))
                    .sorted().toArray();
            int k = window.length;
            out[i] = Double.isNaN(values[i]) || k < halfWindow + 1 ? Double.NaN
                    : k % 2 == 1 ? window[k / 2] : 0.5 * (window[k / 2 - 1] + window[k / 2]);
        }
        return out;
    }

    @Test
    void slidingWindowGivesTheMediansOfTheDefinitionToTheBit() {
        // Random series with gaps, ties (values on a 0.1 grid, as trend logs round them), signed zeros and long
        // runs of NaN, against the plain definition above.
        java.util.SplittableRandom random = new java.util.SplittableRandom(20311);
        for (int trial = 0; trial < 200; trial++) {
            int n = 1 + random.nextInt(300);
            double[] in = new double[n];
            for (int i = 0; i < n; i++) {
                double u = random.nextDouble();
                in[i] = u < 0.15 ? NAN : u < 0.2 ? (random.nextBoolean() ? 0.0 : -0.0)
                        : Math.round(random.nextGaussian() * 30) / 10.0;
            }
            if (trial % 10 == 0) {
                java.util.Arrays.fill(in, n / 3, Math.min(n, n / 3 + 40), NAN);
            }
            int halfWindow = random.nextInt(15);
            assertArrayEquals(bySorting(in, halfWindow), RollingMedian.of(in, halfWindow), 0.0,
                    "trial " + trial + ", half window " + halfWindow);
        }
    }
}
