package org.tufa.analysis.kinds.vav;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.band.Quantiles;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.Shift;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.fleet.ModeResult;
import org.tufa.analysis.fleet.StageTimes;
import org.tufa.analysis.fleet.UnitAnalysis;

/**
 * The per-unit detection on VAV boxes ({@link SyntheticVav}: 28 days, one fault planted on days 14-20), through the
 * same pipeline as fan coil units ({@link UnitAnalysis}). Expected shifts are worked out from the physics the box
 * is built on, noted per test.
 */
class VavDetectionTest {

    static final int DAYS = 28;

    private static UnitAnalysis.Result run(UnitSignals s) {
        return UnitAnalysis.run(VavKind.INSTANCE, s, AnalysisSettings.defaults(), new StageTimes());
    }

    private static String describe(UnitAnalysis.Result r) {
        return r.findings().stream().map(f -> f.mode() + "/" + f.kind() + "[" + f.range().start() + ","
                + f.range().end() + ") " + f.shifts().stream().map(Shift::describe).toList() + " " + f.causes())
                .collect(Collectors.joining("\n"));
    }

    private static ModeResult mode(UnitAnalysis.Result r, String name) {
        return r.modeResults().stream().filter(m -> m.mode().equals(name)).findFirst().orElseThrow();
    }

    /** Findings that overlap the fault's days (14-20), and those outside them. */
    private static List<Finding> during(UnitAnalysis.Result r, boolean inside) {
        int from = 14 * SyntheticVav.PER_DAY;
        int to = 21 * SyntheticVav.PER_DAY;
        return r.findings().stream()
                .filter(f -> (f.range().start() < to && from < f.range().end()) == inside).toList();
    }

    private static double shift(Finding f, String feature) {
        return f.shifts().stream().filter(s -> s.feature().equals(feature)).findFirst().orElseThrow().value();
    }

    @Test
    void healthyBoxGivesNoCandidateFindingInAnyMode() {
        UnitAnalysis.Result r = run(SyntheticVav.healthy(DAYS, 1).signals());
        for (String m : VavFeatures.CLUSTERED_MODES) {
            assertTrue(mode(r, m).analyzed(), m + ": " + mode(r, m).reason());
        }
        assertEquals(List.of(), r.findings(), describe(r));
    }

    /**
     * A fouled reheat coil: its NTU halves on days 14-20. By eq. 11.29b (Cr = 1) the rise at each command falls
     * from eps(NTU) to eps(NTU / 2) times the water-to-air difference; the median of that drop over the fault's
     * reheat samples is the shift the reheat residual must show, within a quarter.
     */
    @Test
    void fouledReheatCoilShowsAsTheRiseEffectivenessNtuPredicts() {
        SyntheticVav b = SyntheticVav.healthy(DAYS, 2);
        int[] span = SyntheticVav.days(14, 21);
        SplittableRandom r = new SplittableRandom(9);
        double[] drop = new double[span[1] - span[0]];
        java.util.Arrays.fill(drop, Double.NaN);
        for (int i = span[0]; i < span[1]; i++) {
            b.ntu[i] = SyntheticVav.NTU_DESIGN / 2;
            b.dischargeAt(i, r);
            if (b.reheat[i] > VavModes.REHEAT_OPEN_PERCENT) {
                double dt = SyntheticVav.HOT_WATER - b.supply[i] - SyntheticVav.DUCT_GAIN;
                drop[i - span[0]] = dt * (SyntheticVav.effectiveness(b.reheat[i], SyntheticVav.NTU_DESIGN / 2)
                        - SyntheticVav.effectiveness(b.reheat[i], SyntheticVav.NTU_DESIGN));
            }
        }
        double expected = Quantiles.median(drop);
        assertTrue(expected < -2, "the planted fault is large enough to test: " + expected);
        UnitAnalysis.Result res = run(b.signals());
        List<Finding> found = during(res, true).stream()
                .filter(f -> f.mode().equals(VavModes.REHEAT) && f.kind().equals("fault_cluster")).toList();
        assertFalse(found.isEmpty(), describe(res));
        double shift = shift(found.get(0), "reheat_residual");
        assertEquals(expected, shift, 0.25 * Math.abs(expected), describe(res));
        assertTrue(found.get(0).causes().stream().anyMatch(c -> c.contains("low hot-water flow")),
                found.get(0).causes().toString());
        assertEquals(List.of(), during(res, false), describe(res));
    }

    /**
     * A reheat valve passing water while shut: as if commanded 15 %, eps = 0.049 (eq. 11.29b), about 2.3 K over a
     * 46.5 K water-to-air difference: the discharge sits that far above the AHU's supply in cooling and deadband.
     */
    @Test
    void leakingReheatValveRaisesTheSupplyOffsetWithTheReheatShut() {
        SyntheticVav b = SyntheticVav.healthy(DAYS, 3);
        int[] span = SyntheticVav.days(14, 21);
        SplittableRandom r = new SplittableRandom(5);
        for (int i = span[0]; i < span[1]; i++) {
            if (b.reheat[i] <= 0.5 && b.airflow[i] > 0.02) {
                b.discharge[i] += SyntheticVav.effectiveness(15, SyntheticVav.NTU_DESIGN)
                        * (SyntheticVav.HOT_WATER - b.supply[i] - SyntheticVav.DUCT_GAIN) + 0.1 * r.nextGaussian();
            }
        }
        UnitAnalysis.Result res = run(b.signals());
        List<Finding> found = during(res, true).stream()
                .filter(f -> (f.mode().equals(VavModes.COOLING) || f.mode().equals(VavModes.DEADBAND))
                        && f.kind().equals("fault_cluster")).toList();
        assertFalse(found.isEmpty(), describe(res));
        assertEquals(2.3, shift(found.get(0), "supply_offset"), 0.5, describe(res));
        assertTrue(found.get(0).causes().get(0).contains("leaking or stuck-open reheat valve"),
                found.get(0).causes().toString());
        assertEquals(List.of(), during(res, false), describe(res));
    }

    /**
     * The same leak on a box whose model does not link it to its AHU: the discharge against the box's own usual
     * level in the mode stands out by about the same 2.3 K (the synthetic AHU's supply moves by only +-0.5 K).
     */
    @Test
    void leakingReheatValveOnABoxWithoutItsAhuPointRaisesTheDischargeLevel() {
        SyntheticVav b = SyntheticVav.healthy(DAYS, 3);
        int[] span = SyntheticVav.days(14, 21);
        for (int i = span[0]; i < span[1]; i++) {
            if (b.reheat[i] <= 0.5 && b.airflow[i] > 0.02) {
                b.discharge[i] += SyntheticVav.effectiveness(15, SyntheticVav.NTU_DESIGN)
                        * (SyntheticVav.HOT_WATER - b.supply[i] - SyntheticVav.DUCT_GAIN);
            }
        }
        UnitAnalysis.Result res = run(b.signalsWithout(UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE));
        List<Finding> found = during(res, true).stream()
                .filter(f -> (f.mode().equals(VavModes.COOLING) || f.mode().equals(VavModes.DEADBAND))
                        && f.kind().equals("fault_cluster")).toList();
        assertFalse(found.isEmpty(), describe(res));
        assertEquals(2.3, shift(found.get(0), VavFeatures.DISCHARGE_LEVEL), 0.6, describe(res));
        assertEquals(List.of(), during(res, false), describe(res));
    }

    /**
     * An airflow sensor reading 30 % high: the flow loop brings the reading to its setpoint, so the tracking error
     * stays near zero, but the true flow is the setpoint / 1.3 and the damper opens only that far: at the minimum
     * (share 0.237 of full open) the equal-percentage opening falls from 51 % to 43 %, about -8 %.
     */
    @Test
    void driftingAirflowSensorMovesTheDamperOffItsOwnCurve() {
        SyntheticVav b = SyntheticVav.healthy(DAYS, 4);
        int[] span = SyntheticVav.days(14, 21);
        for (int i = span[0]; i < span[1]; i++) {
            if (b.setpoint[i] > 0) {
                b.damper[i] = SyntheticVav.opening(b.setpoint[i] / 1.3);
            }
        }
        UnitAnalysis.Result res = run(b.signals());
        List<Finding> found = during(res, true).stream()
                .filter(f -> f.mode().equals(VavFeatures.AIRFLOW) && f.kind().equals("fault_cluster")).toList();
        assertFalse(found.isEmpty(), describe(res));
        double shift = shift(found.get(0), "damper_residual");
        assertTrue(shift < -5 && shift > -12, "damper residual " + shift + "\n" + describe(res));
        assertTrue(found.get(0).causes().stream().anyMatch(c -> c.contains("airflow sensor reading low")),
                found.get(0).causes().toString());
        assertEquals(List.of(), during(res, false), describe(res));
    }

    /**
     * A flow setpoint the box cannot reach (held at 1.8 times its maximum while occupied): the damper goes fully
     * open and passes its full-open 0.38 m3/s, short of 0.54: the damper-open, flow-short rule.
     */
    @Test
    void unreachableSetpointFailsTheDamperOpenFlowShortRule() {
        SyntheticVav b = SyntheticVav.healthy(DAYS, 5);
        int[] span = SyntheticVav.days(14, 21);
        SplittableRandom r = new SplittableRandom(6);
        for (int i = span[0]; i < span[1]; i++) {
            if (b.occupancy[i] > 0) {
                b.setpoint[i] = 1.8 * SyntheticVav.MAX;
                b.damper[i] = 100;
                b.airflow[i] = SyntheticVav.FULL_OPEN * (1 + 0.01 * r.nextGaussian());
                b.dischargeAt(i, r);
            }
        }
        UnitAnalysis.Result res = run(b.signals());
        List<Finding> rule = during(res, true).stream().filter(f -> f.kind().equals("damper_open_flow_short"))
                .toList();
        assertEquals(1, rule.size(), describe(res));
        assertTrue(rule.get(0).causes().get(0).contains("flow setpoint the box cannot meet"),
                rule.get(0).causes().toString());
        assertEquals(List.of(), during(res, false), describe(res));
    }

    /**
     * A box with no discharge sensor (airflow, its setpoint, the damper command and the zone only, as many
     * published buildings' boxes): the airflow and zone modes are analysed, the discharge modes say what they lack.
     */
    @Test
    void boxWithoutDischargeSensorIsAnalysedOnItsAirflowSide() {
        UnitAnalysis.Result r = run(SyntheticVav.healthy(DAYS, 6).airflowSideOnly());
        assertTrue(mode(r, VavFeatures.AIRFLOW).analyzed(), mode(r, VavFeatures.AIRFLOW).reason());
        assertTrue(mode(r, VavFeatures.ZONE).analyzed(), mode(r, VavFeatures.ZONE).reason());
        assertEquals("missing discharge_air_temperature",
                mode(r, VavModes.COOLING).reason());
        assertEquals(List.of(), r.findings(), describe(r));
    }
}
