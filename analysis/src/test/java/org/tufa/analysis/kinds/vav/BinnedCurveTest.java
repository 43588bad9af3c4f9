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
}
