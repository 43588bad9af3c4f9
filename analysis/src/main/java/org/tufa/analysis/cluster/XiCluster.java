package org.tufa.analysis.cluster;

import java.util.List;

/**
 * One xi-steep cluster: an interval of the OPTICS ordering, with its place in the cluster hierarchy.
 *
 * @param id index of this cluster in {@link XiClusters#clusters()}
 * @param start first ordering position (inclusive)
 * @param end last ordering position (inclusive)
 * @param parent id of the smallest other cluster whose interval contains this one, -1 for a root
 * @param children ids of the clusters whose parent this is, by ascending start
 */
public record XiCluster(int id, int start, int end, int parent, List<Integer> children) {

    public XiCluster {
        if (start < 0 || end < start) {
            throw new IllegalArgumentException("xi cluster interval [" + start + ", " + end + "] is empty");
        }
        children = List.copyOf(children);
    }

    /** Number of samples in the interval. */
    public int size() {
        return end - start + 1;
    }

    /** True when this interval lies inside {@code other}'s. */
    public boolean isInside(XiCluster other) {
        return other.start <= start && end <= other.end;
    }
}
