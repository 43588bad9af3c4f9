package org.tufa.analysis.kinds.vav;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Medians in bins (Tukey 1977, resistant smoothing), worked by hand. */
class BinnedCurveTest {

    @Test
    void medianPerBinResistsAMinorityOfOutliersAndEmptyBinsTakeTheNearest() {
        double[] x = {1, 2, 3, 4, 11, 12, 13, 14, 15, 31};
        double[] y = {10, 11, 12, 90, 20, 21, 22, 23, 99, 40};
        BinnedCurve c = BinnedCurve.fit(x, y, 0, 40, 10, 3);
        // Bin 0 holds 10, 11, 12, 90: median 11.5 (the outlier 90 does not move it far); bin 1 holds
        // 20, 21, 22, 23, 99: median 22; bin 3 has a single pair, too few for a median of its own.
        assertEquals(11.5, c.at(2), 1e-12);
        assertEquals(22, c.at(14), 1e-12);
        assertEquals(22, c.at(25), 1e-12);
        assertTrue(Double.isNaN(c.medians()[3]));
        assertEquals(22, c.at(35), 1e-12);
        assertTrue(Double.isNaN(c.at(Double.NaN)));
    }

    @Test
    void byDaysAFaultHoldingManySamplesInABinWeighsItsDaysOnly() {
        // Bin 0 (x in [0, 10)): three normal days with one pair each at y = 10, 11, 12, and one fault day with
        // five pairs at y = 30. By samples the median of {10, 11, 12, 30, 30, 30, 30, 30} is 30; by days the
        // median of the day medians {10, 11, 12, 30} is 11.5.
        double[] x = {1, 2, 3, 4, 4, 4, 4, 4};
        double[] y = {10, 11, 12, 30, 30, 30, 30, 30};
        int[] day = {0, 1, 2, 3, 3, 3, 3, 3};
        assertEquals(30, BinnedCurve.fit(x, y, 0, 10, 10, 3).at(5), 1e-12);
        assertEquals(11.5, BinnedCurve.fit(x, y, day, 0, 10, 10, 3).at(5), 1e-12);
    }
}
