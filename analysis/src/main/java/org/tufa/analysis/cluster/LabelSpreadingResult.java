package org.tufa.analysis.cluster;

/**
 * What {@link LabelSpreading#fit} found.
 *
 * @param distributions per sample its distribution over the classes (rows sum to 1, or are all 0 where no label
 *                      reached the sample)
 * @param labels        per sample the class of largest share (the first on a tie), -1 where no label reached it
 * @param iterations    steps taken
 * @param converged     whether the change fell below the tolerance before the last allowed step
 */
public record LabelSpreadingResult(double[][] distributions, int[] labels, int iterations, boolean converged) {

    /** The share of the sample's own label, its confidence (0 where no label reached it). */
    public double confidence(int sample) {
        return labels[sample] < 0 ? 0 : distributions[sample][labels[sample]];
    }
}
