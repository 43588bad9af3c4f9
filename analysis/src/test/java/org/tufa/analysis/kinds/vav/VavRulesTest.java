package org.tufa.analysis.kinds.vav;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.kinds.RuleChannel;
import org.tufa.analysis.modes.ModeSplit;

/** The four VAV rules, sample by sample, on a healthy box and with each one's fault planted (worked by hand). */
class VavRulesTest {

    private static List<RuleChannel> rules(UnitSignals s) {
        ModeSplit modes = VavKind.INSTANCE.modes(s, AnalysisSettings.defaults());
        return VavRules.of(s, modes, VavModes.levels(s), AnalysisSettings.defaults());
    }

    private static RuleChannel rule(List<RuleChannel> rules, String name) {
        return rules.stream().filter(r -> r.name().equals(name)).findFirst().orElseThrow();
    }

    private static int count(boolean[] b) {
        int n = 0;
        for (boolean x : b) {
            n += x ? 1 : 0;
        }
        return n;
    }

    @Test
    void aHealthyBoxFailsNoRule() {
        for (RuleChannel r : rules(SyntheticVav.healthy(7, 1).signals())) {
            assertTrue(count(r.eligible()) > 0, r.name() + " never eligible");
            assertEquals(0, count(r.flagged()), r.name());
        }
    }

    @Test
    void damperOpenAndFlowShortIsFlaggedOnlyWhereBothHold() {
        SyntheticVav b = SyntheticVav.healthy(2, 2);
        int i = 14 * 4 + SyntheticVav.PER_DAY; // day 1, 14:00, cooling
        for (int k = i - 4; k <= i + 4; k++) {
            b.setpoint[k] = 0.5;
            b.airflow[k] = 0.38;
            b.damper[k] = 100;
        }
        boolean[] flagged = rule(rules(b.signals()), "damper_open_flow_short").flagged();
        // 0.38 is 24 % short of 0.5 with the damper at 100 %: all nine samples, and (after the 2-sample running
        // median) nothing beside them.
        assertEquals(9, count(flagged));
        assertTrue(flagged[i - 4] && flagged[i + 4]);
    }

    @Test
    void reheatWithoutRiseIsFlaggedWhenTheDischargeStaysAtTheSupply() {
        SyntheticVav b = SyntheticVav.healthy(2, 3);
        int from = 7 * 4 + SyntheticVav.PER_DAY;
        for (int k = from; k < from + 8; k++) {
            b.discharge[k] = b.supply[k] + 0.6; // duct gain only: no heat from a valve commanded 30-70 %
        }
        RuleChannel r = rule(rules(b.signals()), "reheat_without_rise");
        boolean[] expected = new boolean[b.n];
        for (int k = from; k < from + 8; k++) {
            expected[k] = b.reheat[k] >= VavRules.REHEAT_WELL_OPEN_PERCENT;
        }
        // Of the 8 samples those commanded at least 50 % open fail; smoothing over 2 samples each side keeps them.
        assertTrue(count(expected) >= 3, "the test needs well-open samples");
        for (int k = from + 2; k < from + 6; k++) {
            assertEquals(expected[k], r.flagged()[k], "sample " + k);
        }
        assertEquals(count(expected), count(r.flagged()), 1.0);
    }

    @Test
    void airflowBelowMinimumWhileOccupiedIsFlagged() {
        SyntheticVav b = SyntheticVav.healthy(2, 4);
        int from = 12 * 4 + SyntheticVav.PER_DAY;
        for (int k = from; k < from + 12; k++) {
            b.airflow[k] = 0.03; // a damper stuck near shut: a third of the 0.09 minimum
        }
        RuleChannel r = rule(rules(b.signals()), "airflow_below_minimum");
        assertEquals(12, count(r.flagged()));
        assertEquals(0.0, r.normalShare());
    }

    @Test
    void zoneNotHeldCountsOnlyPastTheMorningRecovery() {
        SyntheticVav b = SyntheticVav.healthy(2, 5);
        int day = SyntheticVav.PER_DAY;
        for (int k = day + 7 * 4; k < day + 18 * 4; k++) {
            b.zone[k] = 27; // 3 K above the 24 C cooling setpoint all the occupied day
        }
        RuleChannel r = rule(rules(b.signals()), "zone_not_held");
        // Occupied 07:00-18:00 is 44 samples; the first 8 (two hours) are recovery, and the running median of the
        // zone keeps the first flagged sample inside the hot stretch: 36 flagged.
        assertEquals(36, count(r.flagged()));
        assertTrue(Double.isNaN(r.normalShare()), "judged against the box's own days");
    }

    @Test
    void recoveryStartsEachOccupiedStretch() {
        boolean[] occupied = new boolean[24];
        for (int k = 2; k < 20; k++) {
            occupied[k] = true;
        }
        boolean[] expected = new boolean[24];
        for (int k = 2 + VavRules.RECOVERY_SAMPLES; k < 20; k++) {
            expected[k] = true;
        }
        assertArrayEquals(expected, VavRules.recovered(occupied));
    }
}
