package org.tufa.analysis.features;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** Finding a multi-speed fan's stages in its speed signal ({@link FanStages}); hand-built signals. */
class FanStagesTest {

    /** A stage number 1-3, with a few 15-minute means across a stage change (1.33, 2.67): nearest stage. */
    @Test
    void stageNumbersAreStagesAndMeansGoToTheNearest() {
        double[] speed = new double[1000];
        for (int i = 0; i < speed.length; i++) {
            speed[i] = i < 500 ? 1 : i < 800 ? 2 : 3;
        }
        speed[10] = 1.333;
        speed[600] = 2.667;
        speed[700] = Double.NaN;
        FanStages s = FanStages.of(speed);
        assertArrayEquals(new double[] {1, 2, 3}, s.levels(), 0.0);
        int[] stage = s.stageOfSample();
        assertEquals(0, stage[0]);
        assertEquals(0, stage[10]);
        assertEquals(2, stage[600]);
        assertEquals(-1, stage[700]);
        assertEquals(1, stage[799]);
        assertEquals(2, stage[900]);
    }

    /** Percent per stage (33, 67, 100) works the same: the values are only compared. */
    @Test
    void percentPerStage() {
        double[] speed = new double[300];
        for (int i = 0; i < speed.length; i++) {
            speed[i] = new double[] {33, 67, 100}[i % 3];
        }
        assertArrayEquals(new double[] {33, 67, 100}, FanStages.of(speed).levels(), 0.0);
    }

    /** A variable-speed fan moving through many values, a single speed, and no signal: no stages. */
    @Test
    void variableSpeedSingleSpeedAndNoSignalHaveNoStages() {
        SplittableRandom random = new SplittableRandom(3);
        double[] variable = new double[2000];
        for (int i = 0; i < variable.length; i++) {
            variable[i] = i % 10 == 0 ? 100 : random.nextDouble(30, 100);
        }
        assertEquals(0, FanStages.of(variable).count());
        double[] single = new double[500];
        java.util.Arrays.fill(single, 1.0);
        assertEquals(0, FanStages.of(single).count());
        assertEquals(0, FanStages.of(null).count());
    }

    /** A rare value (under 5 % of the samples) is not a stage: its samples go to the nearest stage. */
    @Test
    void rareValueIsNotAStage() {
        double[] speed = new double[1000];
        for (int i = 0; i < speed.length; i++) {
            speed[i] = i < 30 ? 3 : i < 600 ? 1 : 2;
        }
        FanStages s = FanStages.of(speed);
        assertArrayEquals(new double[] {1, 2}, s.levels(), 0.0);
        assertEquals(1, s.stageOfSample()[0]);
    }
}
