package org.tufa.analysis.band;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Medians by selection (Hoare 1961) against medians by sorting, bit for bit: type-7 (NumPy's default, Hyndman and
 * Fan 1996) through {@link Quantiles#linear}, and the mean of the middle pair. Random samples with heavy ties (a
 * valve at 0 % most of the time), signed zeros, infinities and NaN.
 */
class MedianSelectionTest {

    private static double[] sample(SplittableRandom r, int n) {
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            double u = r.nextDouble();
            v[i] = u < 0.3 ? 0.0 : u < 0.35 ? -0.0 : u < 0.37 ? Double.NaN : u < 0.38 ? Double.POSITIVE_INFINITY
                    : Math.round(r.nextGaussian() * 50) / 10.0;
        }
        return v;
    }

    @Test
    void typeSevenMedianEqualsTheSortedOneBitForBit() {
        SplittableRandom r = new SplittableRandom(1961);
        for (int trial = 0; trial < 2000; trial++) {
            double[] v = sample(r, r.nextInt(60));
            double bySort = Quantiles.linear(v, 0.5)[0];
            double bySelection = Quantiles.median(v);
            assertEquals(Double.doubleToRawLongBits(bySort), Double.doubleToRawLongBits(bySelection),
                    "trial " + trial + ": " + Arrays.toString(v));
        }
    }

    @Test
    void middlePairMeanEqualsTheSortedOneBitForBit() {
        SplittableRandom r = new SplittableRandom(65);
        for (int trial = 0; trial < 2000; trial++) {
            int n = r.nextInt(60);
            double[] v = sample(r, n + r.nextInt(5));
            double[] sorted = Arrays.copyOf(v, n);
            Arrays.sort(sorted);
            double bySort = n == 0 ? Double.NaN
                    : n % 2 == 1 ? sorted[n / 2] : 0.5 * (sorted[n / 2 - 1] + sorted[n / 2]);
            double bySelection = Quantiles.medianInPlace(v.clone(), n);
            assertEquals(Double.doubleToRawLongBits(bySort), Double.doubleToRawLongBits(bySelection),
                    "trial " + trial + ": " + Arrays.toString(Arrays.copyOf(v, n)));
        }
    }

    @Test
    void aLongRunOfEqualValuesStaysCheap() {
        // Three-way partition: 200,000 zeros and one 1 select in one pass (a two-way partition would take
        // quadratic time here). Checked by value; the time is not asserted.
        double[] v = new double[200_001];
        v[100_000] = 1;
        assertEquals(0.0, Quantiles.medianInPlace(v, v.length), 0.0);
    }
}
