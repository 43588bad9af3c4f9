package org.tufa.analysis.findings;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class DirectionCheckTest {

    @Test
    void pearsonMatchesTextbookExample() {
        // x = 1..5, y = 2,4,5,4,5: r = 6 / sqrt(10 * 6) = 0.7746 (worked by hand: sxy 6, sxx 10, syy 6).
        assertEquals(0.7745966692, DirectionCheck.pearson(new double[] {1, 2, 3, 4, 5},
                new double[] {2, 4, 5, 4, 5}), 1e-9);
    }

    @Test
    void coolingDischargeFallingWithValveIsExpected() {
        double[] valve = {0, 20, 40, 60, 80, 100};
        double[] discharge = {22, 19, 17, 15, 14, 13};
        assertEquals(DirectionCheck.Outcome.AS_EXPECTED, DirectionCheck.check(valve, discharge, true));
    }

    @Test
    void dischargeIgnoringTheValveFails() {
        double[] valve = {0, 20, 40, 60, 80, 100, 10, 90};
        double[] discharge = {18, 18.1, 17.9, 18, 18.1, 17.9, 18, 18};
        assertEquals(DirectionCheck.Outcome.FAILS, DirectionCheck.check(valve, discharge, true));
    }

    @Test
    void valveThatBarelyMovesIsInconclusive() {
        double[] valve = {50, 51, 52, 50, 49, 51};
        double[] discharge = {15, 14, 13, 15, 16, 14};
        assertEquals(DirectionCheck.Outcome.INCONCLUSIVE, DirectionCheck.check(valve, discharge, true));
    }
}
