package org.tufa.analysis.features;

import java.util.Arrays;
import java.util.Map;
import java.util.TreeMap;

/**
 * The stages of a multi-speed fan (low, medium, high), found in its speed signal, and the stage of each sample:
 * what {@link CoilResponse} needs to judge each sample against the airflow it had.
 *
 * <p>A staged fan sits on a few values (a stage number, or a fixed percentage per stage); a variable-speed fan
 * moves through many. A value is a stage when it holds at least {@link #MIN_SHARE} of the samples (and
 * {@link #MIN_SAMPLES}); the signal is staged when 2 to {@link #MAX_STAGES} such values hold at least
 * {@link #MIN_COVER} of the samples together (the rest are resampling means across a stage change, given the
 * nearest stage). A variable-speed fan or a single speed gives no stages. Thresholds: common practice, no source.
 *
 * @param levels        the stage values, ascending (empty: no stages)
 * @param stageOfSample per sample, its stage index into {@code levels}; -1 for a sample without a speed value or
 *                      when there are no stages
 */
public record FanStages(double[] levels, int[] stageOfSample) {

    /** Share of the samples a value must hold to be a stage. */
    public static final double MIN_SHARE = 0.05;
    /** Samples a value must hold to be a stage: six hours at 15-minute samples. */
    public static final int MIN_SAMPLES = 24;
    /** Share of the samples the stages must hold together. */
    public static final double MIN_COVER = 0.8;
    /** Most stages a staged fan has; more distinct values are a variable-speed fan. */
    public static final int MAX_STAGES = 5;

    public FanStages {
        levels = levels.clone();
        stageOfSample = stageOfSample.clone();
    }

    @Override
    public double[] levels() {
        return levels.clone();
    }

    @Override
    public int[] stageOfSample() {
        return stageOfSample.clone();
    }

    /** The number of stages (0 when the signal is not staged). */
    public int count() {
        return levels.length;
    }

    /**
     * Finds the stages in the speed values of a set of samples (any unit: the values are only compared).
     *
     * @param speed per sample, the fan speed; NaN without a value; null for a unit without a speed signal
     */
    public static FanStages of(double[] speed) {
        if (speed == null) {
            return new FanStages(new double[0], new int[0]);
        }
        int[] none = new int[speed.length];
        Arrays.fill(none, -1);
        Map<Long, Integer> counts = new TreeMap<>();
        int finite = 0;
        for (double x : speed) {
            if (Double.isFinite(x)) {
                counts.merge(key(x), 1, Integer::sum);
                finite++;
            }
        }
        double minCount = Math.max(MIN_SAMPLES, MIN_SHARE * finite);
        double[] found = new double[counts.size()];
        int stages = 0;
        long covered = 0;
        for (Map.Entry<Long, Integer> e : counts.entrySet()) {
            if (e.getValue() >= minCount) {
                found[stages++] = e.getKey() / 1000.0;
                covered += e.getValue();
            }
        }
        if (stages < 2 || stages > MAX_STAGES || covered < MIN_COVER * finite) {
            return new FanStages(new double[0], none);
        }
        double[] levels = Arrays.copyOf(found, stages);
        int[] stage = none;
        for (int i = 0; i < speed.length; i++) {
            if (Double.isFinite(speed[i])) {
                stage[i] = nearest(levels, speed[i]);
            }
        }
        return new FanStages(levels, stage);
    }

    /** The value rounded to a thousandth, as a whole number: stage values compare exactly. */
    private static long key(double x) {
        return Math.round(x * 1000);
    }

    private static int nearest(double[] levels, double x) {
        int best = 0;
        for (int s = 1; s < levels.length; s++) {
            if (Math.abs(levels[s] - x) < Math.abs(levels[best] - x)) {
                best = s;
            }
        }
        return best;
    }
}
