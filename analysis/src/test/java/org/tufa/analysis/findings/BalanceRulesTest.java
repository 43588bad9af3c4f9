package org.tufa.analysis.findings;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The mode energy-balance rules at their boundaries. The rules are strict inequalities with a tolerance, in the
 * manner of the APAR rules (Schein, Bushby, Castro and House, Energy and Buildings 38(12), 2006): a difference
 * exactly at the tolerance is within sensor uncertainty and is not a failure. Values are binary-exact (x.5, x.25)
 * so the boundary is met exactly; worked examples, computed by hand.
 */
class BalanceRulesTest {

    private static final double ZONE = 22.0;
    private static final double TOLERANCE = 1.5;

    @Test
    void heatingWithoutHeat() {
        assertFalse(BalanceRules.heatingWithoutHeat(ZONE, 30.0, TOLERANCE), "warm discharge heats");
        assertFalse(BalanceRules.heatingWithoutHeat(ZONE, 22.0, TOLERANCE), "equal is within tolerance");
        assertFalse(BalanceRules.heatingWithoutHeat(ZONE, 20.5, TOLERANCE), "exactly zone - tolerance");
        assertTrue(BalanceRules.heatingWithoutHeat(ZONE, 20.25, TOLERANCE), "0.25 K past the tolerance");
        assertTrue(BalanceRules.heatingWithoutHeat(ZONE, 14.0, TOLERANCE));
    }

    @Test
    void coolingWithoutCooling() {
        assertFalse(BalanceRules.coolingWithoutCooling(ZONE, 13.0, TOLERANCE), "cool discharge cools");
        assertFalse(BalanceRules.coolingWithoutCooling(ZONE, 23.5, TOLERANCE), "exactly zone + tolerance");
        assertTrue(BalanceRules.coolingWithoutCooling(ZONE, 23.75, TOLERANCE), "0.25 K past the tolerance");
        // A discharge colder than the zone never fails the cooling rule, however cold.
        assertFalse(BalanceRules.coolingWithoutCooling(ZONE, 5.0, TOLERANCE));
    }

    @Test
    void ventilationOffsetEitherWay() {
        assertFalse(BalanceRules.ventilationOffset(ZONE, 22.0, TOLERANCE));
        assertFalse(BalanceRules.ventilationOffset(ZONE, 23.5, TOLERANCE), "exactly + tolerance");
        assertFalse(BalanceRules.ventilationOffset(ZONE, 20.5, TOLERANCE), "exactly - tolerance");
        assertTrue(BalanceRules.ventilationOffset(ZONE, 23.75, TOLERANCE), "warm offset");
        assertTrue(BalanceRules.ventilationOffset(ZONE, 20.25, TOLERANCE), "cold offset");
    }
}
