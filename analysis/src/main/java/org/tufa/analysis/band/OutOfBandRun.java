package org.tufa.analysis.band;

/**
 * A sustained stretch outside the band: sample indices {@code [start, endExclusive)}, beginning and ending on an
 * outside sample; short gaps (in-band or missing samples) inside it are bridged.
 *
 * @param outsideSamples samples outside the band within the stretch
 * @param aboveSamples of which above the band (the rest are below)
 */
public record OutOfBandRun(int start, int endExclusive, int outsideSamples, int aboveSamples) {

    public int length() {
        return endExclusive - start;
    }

    /** "above", "below" or "both": which side of the band the stretch lies on. */
    public String side() {
        if (aboveSamples == outsideSamples) {
            return "above";
        }
        return aboveSamples == 0 ? "below" : "both";
    }
}
