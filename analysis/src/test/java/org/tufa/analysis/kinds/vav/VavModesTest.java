package org.tufa.analysis.kinds.vav;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.load.SensibleLoad;
import org.tufa.analysis.modes.ModeSplit;

/**
 * VAV modes as ASHRAE Guideline 36 sequences a box (from memory): no airflow asked for is off; the minimum with the
 * reheat shut is deadband; the cooling loop raising the flow setpoint above the minimum is cooling; the reheat open
 * (at the minimum or the heating maximum) is reheat. Worked by hand on a few samples.
 */
class VavModesTest {

    static final Instant START = Instant.parse("2031-06-02T00:00:00Z");
    static final Duration STEP = Duration.ofMinutes(15);

    /** 20 samples: 4 off, 6 deadband at 0.1, 6 cooling 0.2-0.3, 3 reheat at 0.1, one without an airflow reading. */
    static final double[] SETPOINT = {0, 0, 0, 0, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.2, 0.25, 0.3, 0.3, 0.25, 0.2,
        0.1, 0.1, 0.1, 0.1};
    static final double[] AIRFLOW = {0, 0.004, 0, 0.002, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.2, 0.25, 0.3, 0.3, 0.25, 0.2,
        0.1, 0.1, 0.1, Double.NaN};
    static final double[] REHEAT = {0, 0, 0, 0, 0, 0, 0, 0, 0, 3, 0, 0, 0, 0, 0, 0, 40, 60, 80, 0};

    private static UnitSignals box(boolean withSetpoint) {
        UnitSignals.Builder b = UnitSignals.builder(START, STEP, AIRFLOW.length)
                .with(UnitSignals.AIRFLOW, AIRFLOW.clone())
                .with(UnitSignals.REHEAT_VALVE_COMMAND, REHEAT.clone());
        return (withSetpoint ? b.with(UnitSignals.AIRFLOW_SETPOINT, SETPOINT.clone()) : b).build();
    }

    private static List<String> labels(ModeSplit m) {
        return IntStream.range(0, m.codes().length).mapToObj(m::labelAt).toList();
    }

    @Test
    void levelsAreTheBoxsOwnMaximumAndMinimum() {
        VavModes.Levels l = VavModes.levels(box(true));
        // 95th percentile (type 7) of the 17 delivering readings 0.002 .. 0.3: h = 16 * 0.95 = 15.2 -> 0.3.
        assertEquals(0.3, l.reference(), 1e-12);
        // 5th percentile of the 16 setpoints above 5 % of 0.3 (all 0.1 .. 0.3): the 0.1 the box holds at minimum.
        assertEquals(0.1, l.minimum(), 1e-12);
    }

    @Test
    void samplesFollowTheSequence() {
        ModeSplit m = VavModes.classify(box(true), VavModes.levels(box(true)));
        List<String> expected = List.of("off", "off", "off", "off", "deadband", "deadband", "deadband", "deadband",
                "deadband", "deadband", "cooling", "cooling", "cooling", "cooling", "cooling", "cooling", "reheat",
                "reheat", "reheat", "no_data");
        assertEquals(expected, labels(m));
        assertArrayEquals(new int[] {4, 6, 6, 3, 1}, m.counts());
        assertEquals(VavModes.LABELS, m.labels());
    }

    @Test
    void aBoxWithoutAFlowSetpointIsReadByItsMeasuredAirflow() {
        ModeSplit m = VavModes.classify(box(false), VavModes.levels(box(false)));
        // Without the setpoint the readings 0.004 and 0.002 are under 5 % of 0.3 (0.015): off all the same.
        assertEquals(labels(VavModes.classify(box(true), VavModes.levels(box(true)))), labels(m));
    }

    /**
     * The load from the airflow measured: 0.5 m3/s from a 24 C zone at 14 C is 1.2072 * 0.5 * 10 = 6.036 kW
     * (ASHRAE Handbook Fundamentals, Q = rho cp V dT with standard air); its inch-pound twin, 1.08 * 1059.4 cfm *
     * 18 F = 20,595 Btu/h, is the same 6.036 kW.
     */
    @Test
    void loadIsRhoCpVdTOnTheMeasuredAirflow() {
        UnitSignals s = UnitSignals.builder(START, STEP, 2)
                .with(UnitSignals.AIRFLOW, new double[] {0.5, 0.25})
                .with(UnitSignals.ZONE_AIR_TEMPERATURE, new double[] {24, 20})
                .with(UnitSignals.DISCHARGE_AIR_TEMPERATURE, new double[] {14, 30}).build();
        double[] q = VavKind.INSTANCE.load(s);
        assertEquals(6.036, q[0], 0.001);
        assertEquals(20_595 * SensibleLoad.WATTS_PER_BTU_PER_HOUR / 1000, q[0], 0.002);
        // Reheat: 0.25 m3/s heated 10 K above the zone is -3.018 kW (heating is negative).
        assertEquals(-3.018, q[1], 0.001);
    }
}
