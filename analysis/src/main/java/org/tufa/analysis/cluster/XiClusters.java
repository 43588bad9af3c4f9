package org.tufa.analysis.cluster;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * All xi-steep clusters of one OPTICS result, with their hierarchy, and the ways to turn them into labels.
 *
 * @param clusters every cluster, in scikit-learn's order (by the steep-up area that closed it; nested clusters
 *     closed by the same area come before the clusters containing them), duplicate intervals removed
 * @param ordering the OPTICS ordering they refer to (ordering position to sample index)
 * @param parameters the extraction parameters
 */
public record XiClusters(List<XiCluster> clusters, int[] ordering, XiParameters parameters) {

    public XiClusters {
        clusters = List.copyOf(clusters);
        ordering = ordering.clone();
    }

    @Override
    public int[] ordering() {
        return ordering.clone();
    }

    /** The clusters without a parent, by ascending start. */
    public List<XiCluster> roots() {
        return clusters.stream().filter(c -> c.parent() < 0).sorted(Comparator.comparingInt(XiCluster::start))
                .toList();
    }

    /**
     * scikit-learn's flat labelling (cluster_optics_xi labels): clusters are visited in list order and a cluster
     * labels its interval only when no point of it is labelled yet, so leaves win and a cluster holding
     * sub-clusters leaves its other points as noise (-1). Labels count up from 0 in that visiting order; indexed by
     * sample.
     */
    public int[] leafLabels() {
        int n = ordering.length;
        int[] byPosition = new int[n];
        Arrays.fill(byPosition, -1);
        int label = 0;
        for (XiCluster c : clusters) {
            boolean free = true;
            for (int i = c.start(); i <= c.end() && free; i++) {
                free = byPosition[i] == -1;
            }
            if (free) {
                Arrays.fill(byPosition, c.start(), c.end() + 1, label++);
            }
        }
        return toSampleLabels(byPosition);
    }

    /**
     * The outermost clusters, descending into a cluster's children when they make up most of it.
     *
     * <p>Literally outermost clusters are rarely useful: the first point of the plot has infinite reachability, so
     * xi pairs it with every later rise that is higher than all before it, and the hierarchy is topped by clusters
     * starting at position 0 that merge all real clusters (a whole-plot cluster is usual). Such a merging cluster is
     * recognised by its children covering at least {@code mergeCoverage} of its points; it is replaced by its
     * children (recursively), and its points outside them become noise. A cluster whose children cover less (for
     * example the large normal-operation cluster holding a few small denser pockets) is kept whole. With
     * {@code mergeCoverage > 1} nothing is replaced and the literal outermost clusters are returned.
     *
     * @return the chosen clusters, by decreasing size, ties by ascending start
     */
    public List<XiCluster> topLevel(double mergeCoverage) {
        if (Double.isNaN(mergeCoverage) || mergeCoverage <= 0) {
            throw new IllegalArgumentException("merge coverage must be positive, got " + mergeCoverage);
        }
        List<XiCluster> chosen = new ArrayList<>();
        for (XiCluster root : roots()) {
            expand(root, mergeCoverage, chosen);
        }
        chosen.sort(Comparator.comparingInt(XiCluster::size).reversed().thenComparingInt(XiCluster::start));
        return List.copyOf(chosen);
    }

    private void expand(XiCluster c, double mergeCoverage, List<XiCluster> chosen) {
        if (!c.children().isEmpty() && coveredByChildren(c) >= mergeCoverage * c.size()) {
            for (int child : c.children()) {
                expand(clusters.get(child), mergeCoverage, chosen);
            }
        } else {
            chosen.add(c);
        }
    }

    private int coveredByChildren(XiCluster c) {
        boolean[] covered = new boolean[c.size()];
        int count = 0;
        for (int child : c.children()) {
            XiCluster k = clusters.get(child);
            for (int i = k.start(); i <= k.end(); i++) {
                if (!covered[i - c.start()]) {
                    covered[i - c.start()] = true;
                    count++;
                }
            }
        }
        return count;
    }

    /**
     * Labels by the given clusters: a sample gets the index (in {@code chosen}) of the first cluster containing its
     * ordering position, -1 when none does. Indexed by sample.
     */
    public int[] labelsOf(List<XiCluster> chosen) {
        int n = ordering.length;
        int[] byPosition = new int[n];
        Arrays.fill(byPosition, -1);
        for (int label = chosen.size() - 1; label >= 0; label--) {
            XiCluster c = chosen.get(label);
            Arrays.fill(byPosition, c.start(), c.end() + 1, label);
        }
        return toSampleLabels(byPosition);
    }

    private int[] toSampleLabels(int[] byPosition) {
        int[] labels = new int[byPosition.length];
        for (int i = 0; i < byPosition.length; i++) {
            labels[ordering[i]] = byPosition[i];
        }
        return labels;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof XiClusters x
                && clusters.equals(x.clusters)
                && Arrays.equals(ordering, x.ordering)
                && parameters.equals(x.parameters);
    }

    @Override
    public int hashCode() {
        return 31 * clusters.hashCode() + Arrays.hashCode(ordering);
    }

    @Override
    public String toString() {
        return "XiClusters[" + clusters.size() + " clusters, n=" + ordering.length + ", " + parameters + "]";
    }
}
