package org.tufa.analysis.band;

import java.util.ArrayList;
import java.util.List;

/**
 * The load band of one unit in one mode, and what lies outside it.
 *
 * @param kind band kind
 * @param q1 first quartile (type 7)
 * @param q3 third quartile (type 7)
 * @param low lower band limit (inclusive)
 * @param high upper band limit (inclusive)
 * @param inBand per sample: finite and {@code low <= x <= high}
 * @param inBandCount samples in band
 * @param outOfBandCount finite samples outside the band (never dropped silently: counted here, and in runs)
 * @param missingCount NaN samples (no data, or not in this mode)
 * @param runs sustained stretches outside the band, in time order
 */
public record LoadBand(
        BandKind kind,
        double q1,
        double q3,
        double low,
        double high,
        boolean[] inBand,
        int inBandCount,
        int outOfBandCount,
        int missingCount,
        List<OutOfBandRun> runs) {

    public LoadBand {
        runs = List.copyOf(runs);
    }

    /** Interquartile range q3 - q1. */
    public double iqr() {
        return q3 - q1;
    }

    /**
     * Computes the band of the finite values and the sustained out-of-band runs.
     *
     * <p>Quartiles by linear interpolation (Hyndman and Fan 1996, type 7; NumPy's default). {@code iqr} keeps
     * [Q1, Q3]; {@code tukey} keeps [Q1 - 1.5 IQR, Q3 + 1.5 IQR] (Tukey 1977); {@code none} keeps all finite values.
     * Pass NaN for samples that are missing or belong to another mode.
     */
    public static LoadBand fit(double[] values, BandKind kind, RunOptions runOptions) {
        double[] sorted = Quantiles.finiteSorted(values);
        double q1 = Quantiles.linearOfSorted(sorted, 0.25);
        double q3 = Quantiles.linearOfSorted(sorted, 0.75);
        double low;
        double high;
        switch (kind) {
            case IQR -> {
                low = q1;
                high = q3;
            }
            case TUKEY -> {
                low = q1 - 1.5 * (q3 - q1);
                high = q3 + 1.5 * (q3 - q1);
            }
            default -> {
                low = Double.NEGATIVE_INFINITY;
                high = Double.POSITIVE_INFINITY;
            }
        }
        boolean[] inBand = new boolean[values.length];
        int in = 0;
        int out = 0;
        int missing = 0;
        for (int i = 0; i < values.length; i++) {
            double v = values[i];
            if (Double.isNaN(v)) {
                missing++;
            } else if (v >= low && v <= high) {
                inBand[i] = true;
                in++;
            } else {
                out++;
            }
        }
        return new LoadBand(kind, q1, q3, low, high, inBand, in, out, missing,
                runs(values, low, high, runOptions));
    }

    /** Stretches of outside samples joined across gaps of at most maxBridgedSamples, kept if long enough. */
    static List<OutOfBandRun> runs(double[] values, double low, double high, RunOptions options) {
        List<OutOfBandRun> runs = new ArrayList<>();
        int start = -1;
        int lastOutside = -1;
        int outside = 0;
        int above = 0;
        for (int i = 0; i <= values.length; i++) {
            boolean isOutside = i < values.length && !Double.isNaN(values[i]) && (values[i] < low || values[i] > high);
            if (start >= 0 && (i == values.length || (!isOutside && i - lastOutside > options.maxBridgedSamples()))) {
                if (outside >= options.minOutsideSamples()) {
                    runs.add(new OutOfBandRun(start, lastOutside + 1, outside, above));
                }
                start = -1;
            }
            if (isOutside) {
                if (start < 0) {
                    start = i;
                    outside = 0;
                    above = 0;
                }
                lastOutside = i;
                outside++;
                if (values[i] > high) {
                    above++;
                }
            }
        }
        return runs;
    }
}
