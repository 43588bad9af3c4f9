package org.tufa.analysis.band;

/**
 * What makes a stretch outside the band "sustained".
 *
 * @param minOutsideSamples at least this many outside samples in the stretch (default 4 = 1 h at 15 min)
 * @param maxBridgedSamples gaps of at most this many in-band or missing samples are bridged (default 1)
 */
public record RunOptions(int minOutsideSamples, int maxBridgedSamples) implements java.io.Serializable {

    public RunOptions {
        if (minOutsideSamples < 1 || maxBridgedSamples < 0) {
            throw new IllegalArgumentException("need minOutsideSamples >= 1 and maxBridgedSamples >= 0");
        }
    }

    /** Defaults (common practice, no source): 4 outside samples, gaps of 1 sample bridged. */
    public static RunOptions defaults() {
        return new RunOptions(4, 1);
    }
}
