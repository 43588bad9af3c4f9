package org.tufa.analysis.cluster;

import java.util.List;

/**
 * Result of {@link Extraction#auto}.
 *
 * @param labels per sample: index into {@code clusters} (0 = largest), -1 for noise
 * @param clusters the chosen top-level clusters by decreasing size; each keeps its id, parent and children in
 *     {@code hierarchy}
 * @param hierarchy every xi cluster found
 * @param parameters the parameters used
 */
public record AutoClusters(int[] labels, List<XiCluster> clusters, XiClusters hierarchy, AutoParameters parameters) {

    public AutoClusters {
        labels = labels.clone();
        clusters = List.copyOf(clusters);
    }

    @Override
    public int[] labels() {
        return labels.clone();
    }

    public int labelOf(int sample) {
        return labels[sample];
    }

    /** Number of clusters (noise not counted). */
    public int clusterCount() {
        return clusters.size();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof AutoClusters a && java.util.Arrays.equals(labels, a.labels) && clusters.equals(a.clusters)
                && hierarchy.equals(a.hierarchy) && parameters.equals(a.parameters);
    }

    @Override
    public int hashCode() {
        return java.util.Arrays.hashCode(labels) * 31 + clusters.hashCode();
    }

    @Override
    public String toString() {
        return "AutoClusters[" + clusters.size() + " clusters, n=" + labels.length + "]";
    }
}
