package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.Shift;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.modes.OperatingMode;

/**
 * The per-unit detection on hand-built signals ({@link SyntheticUnit}): four weeks at 15 minutes, one planted
 * fault per test. The expected outcomes follow from the coil energy balance and the mode rules (APAR: Schein,
 * Bushby, Castro and House, Energy and Buildings 38(12), 2006); the planted sizes are chosen well past the
 * 1.1 K gate so each expectation is clear-cut (worked examples, computed by hand, noted per test).
 */
class UnitAnalysisTest {

    static final int DAYS = 28;
    static final double AIRFLOW = 0.19;

    private static UnitAnalysis.Result run(org.tufa.analysis.features.UnitSignals s) {
        return UnitAnalysis.run(s, FanSignal.STATUS, AIRFLOW, AnalysisSettings.defaults(), new StageTimes());
    }

    private static List<Finding> of(UnitAnalysis.Result r, String kind) {
        return r.findings().stream().filter(f -> f.kind().equals(kind)).toList();
    }

    private static boolean overlaps(Finding f, int from, int to) {
        return f.range().start() < to && from < f.range().end();
    }

    private static String describe(UnitAnalysis.Result r) {
        return r.findings().stream().map(f -> f.mode() + "/" + f.kind() + "[" + f.range().start() + ","
                + f.range().end() + ") " + f.shifts().stream().map(Shift::describe).toList())
                .collect(Collectors.joining("\n"));
    }

    private static ModeResult mode(UnitAnalysis.Result r, String name) {
        return r.modeResults().stream().filter(m -> m.mode().equals(name)).findFirst().orElseThrow();
    }

    @Test
    void healthyCoolingOperationGivesNoFaultClusterAndNoHunting() {
        UnitAnalysis.Result r = run(SyntheticUnit.healthy(DAYS, true, 1).signals());
        assertTrue(mode(r, "cooling").analyzed(), mode(r, "cooling").reason());
        assertTrue(mode(r, "ventilation").analyzed(), mode(r, "ventilation").reason());
        assertEquals(List.of(), of(r, "fault_cluster"), describe(r));
        assertEquals(List.of(), of(r, "mode_hunting"), describe(r));
    }

    /**
     * A discharge sensor reading 3 K high for one week (days 14-20): in cooling the measured air change is 3 K
     * smaller than the coil delivers at that opening, so the coil residual of that week is about -3 K (worked
     * example, computed by hand).
     */
    @Test
    void dischargeSensorBiasForAWeekIsFoundWithANegativeCoilResidual() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, true, 2);
        int from = 14 * SyntheticUnit.PER_DAY;
        int to = 21 * SyntheticUnit.PER_DAY;
        for (int i = from; i < to; i++) {
            u.discharge[i] += 3.0;
        }
        UnitAnalysis.Result r = run(u.signals());
        List<Finding> clusters = of(r, "fault_cluster").stream()
                .filter(f -> f.mode().equals("cooling") && overlaps(f, from, to)).toList();
        assertFalse(clusters.isEmpty(), describe(r));
        for (Finding f : clusters) {
            Shift residual = f.shifts().stream().filter(s -> s.feature().equals("coil_residual")).findFirst()
                    .orElseThrow();
            assertTrue(residual.value() <= -1.1, "coil_residual shift " + residual.value());
            assertEquals(-3.0, residual.value(), 1.0);
            assertTrue(f.causes().stream().anyMatch(c -> c.contains("discharge air sensor reading high")),
                    f.causes().toString());
        }
        // One episode for the week (its seven days are consecutive fault days), from the first to the last day's
        // cooling hours, and no finding outside the week; the fan-only mornings show the same bias.
        assertEquals(1, clusters.size(), describe(r));
        Finding week = clusters.get(0);
        assertTrue(week.range().start() < from + SyntheticUnit.PER_DAY / 2, describe(r));
        assertTrue(week.range().end() > to - SyntheticUnit.PER_DAY / 2, describe(r));
        for (Finding f : r.findings()) {
            assertTrue(overlaps(f, from - 12, to + 12), "finding outside the biased week: " + describe(r));
        }
        assertTrue(r.findings().stream().anyMatch(f -> f.mode().equals("ventilation")
                && f.shifts().stream().anyMatch(sh -> sh.feature().equals("discharge_offset") && sh.value() > 2)),
                describe(r));
    }

    /**
     * A cooling valve swinging 0/100 % every sample from 09:00 to 19:00 on day 8: the raw mode changes between
     * cooling and fan-only at every sample (window of 9 samples: 8 changes >= 3) and the valve moves 100 % per
     * sample (>= 10), so it hunts (worked example, computed by hand).
     */
    @Test
    void valveSwingingFullyEverySampleIsHunting() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, true, 3);
        int[] first = SyntheticUnit.span(8, 9, 19);
        int[] last = SyntheticUnit.span(10, 9, 19);
        for (int d = 8; d <= 10; d++) {
            int[] day = SyntheticUnit.span(d, 9, 19);
            for (int i = day[0]; i < day[1]; i++) {
                u.coolWith(i, (i % 2 == 0) ? 0 : 100);
            }
        }
        UnitAnalysis.Result r = run(u.signals());
        List<Finding> hunting = of(r, "mode_hunting");
        // Three days of hunting, one episode: from the first day's swinging stretch to the last day's (half a
        // window each side at most).
        assertEquals(1, hunting.size(), describe(r));
        assertTrue(hunting.get(0).range().start() >= first[0] - 4 && hunting.get(0).range().start() < first[1],
                describe(r));
        assertTrue(hunting.get(0).range().end() <= last[1] + 4 && hunting.get(0).range().end() > last[0],
                describe(r));
        assertTrue(hunting.get(0).causes().stream().anyMatch(c -> c.contains("unstable control loop")));
    }

    /** One day of the same swinging is no episode: a finding rests on at least two days. */
    @Test
    void oneDayOfSwingingIsNoFinding() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, true, 3);
        int[] day = SyntheticUnit.span(8, 9, 19);
        for (int i = day[0]; i < day[1]; i++) {
            u.coolWith(i, (i % 2 == 0) ? 0 : 100);
        }
        assertEquals(List.of(), of(run(u.signals()), "mode_hunting"));
    }

    /**
     * The same stretch with the valve flipping 3 % / 7 % around the 5 % open threshold: the mode still changes
     * every sample, but the valve moves only 4 % per sample, below the 10 % swing that makes changes hunting
     * (worked example, computed by hand).
     */
    @Test
    void valveFlippingAroundTheOpenThresholdIsNotHunting() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, true, 3);
        int[] day = SyntheticUnit.span(8, 9, 19);
        for (int i = day[0]; i < day[1]; i++) {
            u.coolWith(i, (i % 2 == 0) ? 3 : 7);
        }
        UnitAnalysis.Result r = run(u.signals());
        // The mode does change at every sample: each one-sample run is a settling (transition) sample. The
        // 09:00 sample (even index, 3 %) continues the fan-only morning, so 39 of the 40 (worked example).
        assertEquals(0, day[0] % 2);
        int unsettled = 0;
        for (int i = day[0]; i < day[1]; i++) {
            unsettled += r.modes().codes()[i] == OperatingMode.TRANSITION.code() ? 1 : 0;
        }
        assertEquals(day[1] - day[0] - 1, unsettled);
        assertEquals(List.of(), of(r, "mode_hunting"), describe(r));
    }

    /**
     * A unit without a cooling valve trend: with both valves shut the cooling valve could be open unseen, so
     * fan-only samples cannot be ventilation; they become no_data and the ventilation mode has no samples.
     */
    @Test
    void missingCoolingValveLeavesNoVentilationSamples() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, false, 4);
        UnitAnalysis.Result full = run(u.signals());
        assertTrue(full.modes().count(OperatingMode.VENTILATION) > 0, "contrast: with both valves there is fan-only");

        UnitAnalysis.Result r = run(u.withoutCoolingValve());
        assertEquals(0, r.modes().count(OperatingMode.VENTILATION));
        for (int i = 0; i < u.n; i++) {
            boolean firstOfRun = i % SyntheticUnit.PER_DAY == 28; // 07:00, settles after the fan starts
            if (SyntheticUnit.fanOnly(i) && !firstOfRun) {
                assertEquals(OperatingMode.NO_DATA.code(), r.modes().codes()[i], "sample " + i);
            }
            assertTrue(r.modes().codes()[i] != OperatingMode.VENTILATION.code());
        }
        ModeResult ventilation = mode(r, "ventilation");
        assertFalse(ventilation.analyzed());
        assertEquals(0, ventilation.modeSamples());
        ModeResult cooling = mode(r, "cooling");
        assertFalse(cooling.analyzed());
        assertTrue(cooling.reason().contains("cooling_valve_command"), cooling.reason());
        assertTrue(mode(r, "heating").analyzed(), mode(r, "heating").reason());
        assertEquals(full.modes().count(OperatingMode.HEATING), r.modes().count(OperatingMode.HEATING));
    }

    /**
     * Heating valve open at 30 % beside the cooling valve from 11:00 to 17:00 on days 5-7: 24 of the day's 48
     * running samples, half of each day, past the 25 % a rule's fault day needs.
     */
    @Test
    void simultaneousHeatingAndCoolingIsAFinding() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, true, 5);
        for (int d = 5; d <= 7; d++) {
            int[] stretch = SyntheticUnit.span(d, 11, 17);
            for (int i = stretch[0]; i < stretch[1]; i++) {
                u.heating[i] = 30;
            }
        }
        int[] first = SyntheticUnit.span(5, 11, 17);
        int[] last = SyntheticUnit.span(7, 11, 17);
        UnitAnalysis.Result r = run(u.signals());
        List<Finding> both = of(r, "simultaneous_heating_cooling");
        assertEquals(1, both.size(), describe(r));
        Finding f = both.get(0);
        // The first sample settles (transition), so the finding starts one sample in (worked example).
        assertEquals(first[0] + 1, f.range().start());
        assertEquals(last[1], f.range().end());
        assertEquals(SyntheticUnit.time(last[1]), f.end());
        assertTrue(f.causes().stream().anyMatch(c -> c.contains("heating and cooling valves open together")));
    }

    /**
     * Heating mode with the discharge 3 K colder than the zone during the heating hours (09:00-19:00) of days
     * 10-12: 3 K past the 1.1 K tolerance (worked example, computed by hand).
     */
    @Test
    void heatingWithDischargeColderThanZoneIsHeatingWithoutHeat() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, false, 6);
        int[] day = {SyntheticUnit.span(10, 9, 19)[0], SyntheticUnit.span(12, 9, 19)[1]};
        for (int d = 10; d <= 12; d++) {
            int[] hours = SyntheticUnit.span(d, 9, 19);
            for (int i = hours[0]; i < hours[1]; i++) {
                u.discharge[i] = u.zone[i] - 3.0;
            }
        }
        UnitAnalysis.Result healthy = run(SyntheticUnit.healthy(DAYS, false, 6).signals());
        assertEquals(List.of(), of(healthy, "heating_without_heat"), "contrast: " + describe(healthy));

        UnitAnalysis.Result r = run(u.signals());
        List<Finding> cold = of(r, "heating_without_heat");
        assertEquals(1, cold.size(), describe(r));
        assertEquals("heating", cold.get(0).mode());
        assertTrue(overlaps(cold.get(0), day[0], day[1]));
        assertTrue(cold.get(0).range().length() >= 30, describe(r));
        assertNotNull(cold.get(0).causes());
        assertTrue(cold.get(0).causes().stream().anyMatch(c -> c.contains("discharge colder than the zone")));
    }

    /**
     * The fan left running 04:00-07:00 and 19:00-23:00 (fan only, valves shut) on days 10-12: 7 of the 12 hours
     * the unit is usually off (00:00-07:00, 19:00-24:00), 58 % of the day's usually-off samples against 0 % on its
     * other days (worked example, computed by hand).
     */
    @Test
    void fanLeftRunningAfterHoursIsRunningOutsideUsualHours() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, true, 7);
        for (int d = 10; d <= 12; d++) {
            for (int[] hours : new int[][] {SyntheticUnit.span(d, 4, 7), SyntheticUnit.span(d, 19, 23)}) {
                for (int i = hours[0]; i < hours[1]; i++) {
                    u.fan[i] = 1;
                    u.cooling[i] = 0;
                    u.heating[i] = 0;
                    u.discharge[i] = u.zone[i] + 0.3;
                }
            }
        }
        UnitAnalysis.Result r = run(u.signals());
        List<Finding> late = of(r, "running_outside_usual_hours");
        assertEquals(1, late.size(), describe(r));
        assertTrue(late.get(0).range().start() >= SyntheticUnit.span(10, 4, 5)[0], describe(r));
        // The sample after the fan stops settles (a transition, counted as running): the finding ends one past it.
        assertTrue(late.get(0).range().end() <= SyntheticUnit.span(12, 23, 24)[0] + 1, describe(r));
        assertTrue(late.get(0).causes().stream().anyMatch(c -> c.contains("override left on")));
    }

    /**
     * A unit that runs 02:00-03:00 every night (night cycling, its normal): the usually-off hours hold the same
     * share of running every day, so no day is unusual.
     */
    @Test
    void nightlyCyclingIsTheUnitsOwnNormal() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, true, 8);
        for (int d = 0; d < DAYS; d++) {
            int[] night = SyntheticUnit.span(d, 2, 3);
            for (int i = night[0]; i < night[1]; i++) {
                u.fan[i] = 1;
                u.discharge[i] = u.zone[i] + 0.3 + 0.1 * Math.sin(i);
            }
        }
        UnitAnalysis.Result r = run(u.signals());
        assertEquals(List.of(), of(r, "running_outside_usual_hours"), describe(r));
        UnitAnalysis.Result plain = run(SyntheticUnit.healthy(DAYS, true, 7).signals());
        assertEquals(List.of(), of(plain, "running_outside_usual_hours"), "contrast: " + describe(plain));
    }

    /**
     * Night running with the discharge held exactly 0.3 K above the zone (a held value, no sensor noise): the
     * mode whose features hold one value is skipped with the reason, not failed.
     */
    @Test
    void aModeWhoseFeaturesHoldOneValueIsSkippedWithTheReason() {
        SyntheticUnit u = SyntheticUnit.healthy(DAYS, true, 8);
        for (int d = 0; d < DAYS; d++) {
            int[] night = SyntheticUnit.span(d, 2, 3);
            for (int i = night[0]; i < night[1]; i++) {
                u.fan[i] = 1;
                u.discharge[i] = u.zone[i] + 0.3;
            }
        }
        UnitAnalysis.Result r = run(u.signals());
        ModeResult ventilation = mode(r, "ventilation");
        assertFalse(ventilation.analyzed());
        assertTrue(ventilation.reason().contains("holds one value"), ventilation.reason());
    }
}
