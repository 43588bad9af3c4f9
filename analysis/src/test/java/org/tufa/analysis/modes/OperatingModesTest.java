package org.tufa.analysis.modes;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;

/**
 * Mode split per the table of notes section 4 (derived from the APAR mode logic, House et al. 2001; Schein et al.
 * 2006): expected modes are read off that table by hand for each sample.
 */
class OperatingModesTest {

    private static final double N = Double.NaN;
    private static final ModeThresholds NO_SETTLING = ModeThresholds.defaults().withSettlingSamples(0);

    private static List<String> labels(ModeSplit split) {
        return IntStream.range(0, split.codes().length).mapToObj(i -> split.at(i).label()).toList();
    }

    @Test
    void eachSampleFollowsTheModeTable() {
        double[] fan = {0, 1, 1, 1, 1, 1, N, 0, 0.5, 0.4};
        double[] clg = {50, 0, 80, 5, 60, 5.01, 30, N, 0, 0};
        double[] htg = {0, 0, 0, 70, 40, 0, 0, 0, 0, 0};
        ModeSplit split = OperatingModes.classify(fan, FanSignal.STATUS, clg, htg, NO_SETTLING);
        // h = 5 %: 5 is not open, 5.01 is; status >= 0.5 is on, 0.4 is off; missing valve with fan off -> off.
        assertEquals(List.of("off", "ventilation", "cooling", "heating", "simultaneous", "cooling", "no_data", "off",
                "ventilation", "off"), labels(split));
        assertEquals(3, split.count(OperatingMode.OFF));
        assertEquals(1, split.count(OperatingMode.SIMULTANEOUS));
        assertEquals(fan.length, split.countsByMode().values().stream().mapToInt(Integer::intValue).sum());
    }

    @Test
    void speedSignalCountsAnySpeedAsOn() {
        ModeSplit split = OperatingModes.classify(new double[] {0, 0.01, 0.3}, FanSignal.SPEED,
                new double[] {0, 0, 0}, new double[] {0, 0, 50}, NO_SETTLING);
        assertEquals(List.of("off", "ventilation", "heating"), labels(split));
    }

    @Test
    void withoutFanSignalOpenValvesImplyFanOnAndClosedValvesAreUnknowable() {
        ModeSplit split = OperatingModes.classify(null, FanSignal.NONE, new double[] {0, 40, 40, 0},
                null, NO_SETTLING);
        assertEquals(List.of("no_data", "cooling", "cooling", "no_data"), labels(split));
        assertTrue(split.fanInferred());
    }

    @Test
    void settlingMarksTheFirstSamplesAfterEachChange() {
        double[] fan = {1, 1, 1, 1, 1, 1, 1, 1, N, 1, 1};
        double[] clg = {50, 50, 0, 0, 0, 50, 50, 50, 50, 50, 50};
        double[] htg = new double[fan.length];
        ModeSplit one = OperatingModes.classify(fan, FanSignal.STATUS, clg, htg, ModeThresholds.defaults());
        // Raw: C C V V V C C C N C C -> first run not settled; the first sample of each later run -> transition,
        // including the run after the data gap; no_data itself stays no_data.
        assertEquals(List.of("cooling", "cooling", "transition", "ventilation", "ventilation", "transition", "cooling",
                "cooling", "no_data", "transition", "cooling"), labels(one));
        ModeSplit two = OperatingModes.classify(fan, FanSignal.STATUS, clg, htg,
                ModeThresholds.defaults().withSettlingSamples(2));
        assertEquals(List.of("cooling", "cooling", "transition", "transition", "ventilation", "transition",
                "transition", "cooling", "no_data", "transition", "transition"), labels(two));
        double[] onlyCooling = one.only(OperatingMode.COOLING, clg);
        assertEquals(50, onlyCooling[0], 0);
        assertTrue(Double.isNaN(onlyCooling[2]));
    }

    @Test
    void stableLabelsForOutputFiles() {
        assertEquals(List.of("off", "ventilation", "cooling", "heating", "simultaneous", "transition", "no_data"),
                Arrays.stream(OperatingMode.values()).map(OperatingMode::label).toList());
    }
}
