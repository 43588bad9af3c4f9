package org.tufa.analysis.cluster;

import java.util.Arrays;

/**
 * The result of {@link Optics#fit}: the cluster ordering and, indexed by sample (row of the input), the
 * reachability distance, core distance and predecessor.
 *
 * <p>Immutable: arrays are copied in and out. Loops over many samples should use the per-sample accessors
 * ({@link #reachabilityOf}, {@link #coreDistanceOf}, {@link #sampleAt}) or take one copy first.
 *
 * @param ordering sample indices in processing order (a permutation of 0..n-1)
 * @param reachability per sample; {@link Double#POSITIVE_INFINITY} where undefined (the first point of each
 *     density-connected component)
 * @param coreDistance per sample; {@link Double#POSITIVE_INFINITY} where undefined (fewer than minPts samples
 *     within maxEps)
 * @param predecessor per sample, the processed sample that set its reachability; -1 where none
 * @param minPts the MinPts parameter used (the point itself counts)
 * @param maxEps the neighbourhood radius used; {@link Double#POSITIVE_INFINITY} when unbounded
 */
public record OpticsResult(
        int[] ordering, double[] reachability, double[] coreDistance, int[] predecessor, int minPts, double maxEps) {

    public OpticsResult {
        int n = ordering.length;
        if (reachability.length != n || coreDistance.length != n || predecessor.length != n) {
            throw new IllegalArgumentException("OPTICS result arrays differ in length");
        }
        ordering = ordering.clone();
        reachability = reachability.clone();
        coreDistance = coreDistance.clone();
        predecessor = predecessor.clone();
    }

    /** Number of samples. */
    public int size() {
        return ordering.length;
    }

    /** The sample processed at position {@code position} of the ordering. */
    public int sampleAt(int position) {
        return ordering[position];
    }

    public double reachabilityOf(int sample) {
        return reachability[sample];
    }

    public double coreDistanceOf(int sample) {
        return coreDistance[sample];
    }

    public int predecessorOf(int sample) {
        return predecessor[sample];
    }

    /** The reachability plot: reachability in ordering position order. */
    public double[] reachabilityPlot() {
        double[] plot = new double[ordering.length];
        for (int i = 0; i < plot.length; i++) {
            plot[i] = reachability[ordering[i]];
        }
        return plot;
    }

    /** position[sample] = the sample's position in the ordering. */
    public int[] positions() {
        int[] position = new int[ordering.length];
        for (int i = 0; i < ordering.length; i++) {
            position[ordering[i]] = i;
        }
        return position;
    }

    @Override
    public int[] ordering() {
        return ordering.clone();
    }

    @Override
    public double[] reachability() {
        return reachability.clone();
    }

    @Override
    public double[] coreDistance() {
        return coreDistance.clone();
    }

    @Override
    public int[] predecessor() {
        return predecessor.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof OpticsResult r
                && minPts == r.minPts
                && Double.compare(maxEps, r.maxEps) == 0
                && Arrays.equals(ordering, r.ordering)
                && Arrays.equals(reachability, r.reachability)
                && Arrays.equals(coreDistance, r.coreDistance)
                && Arrays.equals(predecessor, r.predecessor);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(ordering) + Arrays.hashCode(reachability);
    }

    @Override
    public String toString() {
        return "OpticsResult[n=" + ordering.length + ", minPts=" + minPts + ", maxEps=" + maxEps + "]";
    }
}
