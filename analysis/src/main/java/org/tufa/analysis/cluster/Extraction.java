package org.tufa.analysis.cluster;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * Cluster extraction from an OPTICS reachability plot (pure functions).
 *
 * <ul>
 *   <li>{@link #threshold}: the DBSCAN-like cut of Ankerst, Breunig, Kriegel, Sander, "OPTICS: Ordering Points To
 *       Identify the Clustering Structure", SIGMOD 1999, section 4.1 (same labels as scikit-learn 1.2.1's
 *       cluster_optics_dbscan);
 *   <li>{@link #xi}: the xi-steep clusters of the same paper, section 4.3, in the form of scikit-learn 1.2.1's
 *       cluster_optics_xi (its corrections of Definition 9 and 11(4c), and r(end of U + 1) in criterion 3b), with
 *       the predecessor correction of Schubert &amp; Gertz, "Improving the cluster structure extracted from OPTICS
 *       plots", LWDA 2018, Algorithm 2 (as fixed in scikit-learn 1.3, pull request #26459), keeping the whole
 *       hierarchy ({@link XiClusters});
 *   <li>{@link #auto}: the unattended default for the fleet pipeline.
 * </ul>
 *
 * <p><b>Automatic default and why.</b> {@link #auto} runs the xi extraction and labels by top-level clusters
 * ({@link XiClusters#topLevel}), numbered by decreasing size, so label 0 is the largest cluster (the pipeline's
 * "normal") and the others are candidate faults; -1 is noise. Reasons:
 * <ul>
 *   <li>xi is relative (a 5 % steepness), so it needs no distance scale per unit and mode, unlike a threshold cut;
 *       a fixed threshold would have to be tuned to each unit's density;
 *   <li>the minimum cluster size is a fraction of n (default 1 %, at least MinPts), so a candidate fault must
 *       persist for a share of the record rather than a fixed count that means minutes in one unit and weeks in
 *       another; small xi valleys inside the normal cluster stay its children, not separate faults;
 *   <li>top-level rather than scikit-learn's leaf labels, because leaf labelling turns the large normal cluster
 *       into noise as soon as it holds a small denser pocket; and the merge-coverage rule (default 0.8) skips the
 *       clusters that only merge others (see {@link XiClusters#topLevel}), which otherwise put every point into one
 *       cluster;
 *   <li>the trailing point rule {@link XiParameters.TrailingPoint#EXCLUDE_STEEP_RISE} keeps a final outlier as
 *       noise.
 * </ul>
 * These are engineering choices (common practice, no source for the particular values); they are explicit in
 * {@link AutoParameters} so they can be evaluated on labelled data and changed in one place.
 */
public final class Extraction {

    private Extraction() {}

    /**
     * Threshold cut at reachability {@code eps}: scanning the ordering, a point with r(p) > eps starts a new
     * cluster when core(p) <= eps and is noise (-1) otherwise; a point with r(p) <= eps joins the current cluster.
     * Labels by sample, numbered from 0 in ordering order.
     */
    public static int[] threshold(OpticsResult optics, double eps) {
        if (Double.isNaN(eps)) {
            throw new IllegalArgumentException("threshold must be a number");
        }
        int n = optics.size();
        int[] labels = new int[n];
        int current = -1;
        for (int i = 0; i < n; i++) {
            int p = optics.sampleAt(i);
            if (optics.reachabilityOf(p) > eps) {
                if (optics.coreDistanceOf(p) <= eps) {
                    current++;
                    labels[p] = current;
                } else {
                    labels[p] = -1;
                }
            } else {
                labels[p] = current;
            }
        }
        return labels;
    }

    /** Xi-steep extraction with the full hierarchy. */
    public static XiClusters xi(OpticsResult optics, XiParameters parameters) {
        int n = optics.size();
        int minPts = optics.minPts();
        int[] ordering = optics.ordering();
        int[] position = optics.positions();
        double[] r = Arrays.copyOf(optics.reachabilityPlot(), n + 1);
        r[n] = Double.POSITIVE_INFINITY; // closes a cluster that runs to the end of the plot
        int[] predPlot = new int[n];
        for (int i = 0; i < n; i++) {
            predPlot[i] = optics.predecessorOf(ordering[i]);
        }
        double keep = 1 - parameters.xi();
        // Steepness from the ratio r(i) / r(i+1); NaN ratios (inf/inf, 0/0) are neither steep nor monotone.
        boolean[] steepUp = new boolean[n];
        boolean[] steepDown = new boolean[n];
        boolean[] up = new boolean[n];
        boolean[] down = new boolean[n];
        for (int i = 0; i < n; i++) {
            double ratio = r[i] / r[i + 1];
            steepUp[i] = ratio <= keep;
            steepDown[i] = ratio >= 1 / keep;
            down[i] = ratio > 1;
            up[i] = ratio < 1;
        }
        if (parameters.trailingPoint() == XiParameters.TrailingPoint.EXCLUDE_STEEP_RISE && n >= 2
                && steepUp[n - 2]) {
            steepUp[n - 1] = false;
        }

        List<SteepDownArea> areas = new ArrayList<>();
        List<int[]> found = new ArrayList<>();
        int index = 0;
        double mib = 0.0; // maximum in between (section 4.3.2)
        for (int steep = 0; steep < n; steep++) {
            if (!(steepUp[steep] || steepDown[steep]) || steep < index) {
                continue;
            }
            for (int i = index; i <= steep; i++) {
                mib = Math.max(mib, r[i]);
            }
            filterAreas(areas, mib, keep, r);
            if (steepDown[steep]) {
                int end = extendRegion(steepDown, up, steep, minPts);
                areas.add(new SteepDownArea(steep, end));
                index = end + 1;
                mib = r[index];
            } else {
                int upStart = steep;
                int upEnd = extendRegion(steepUp, down, steep, minPts);
                index = upEnd + 1;
                mib = r[index];
                List<int[]> closed = new ArrayList<>();
                for (SteepDownArea area : areas) {
                    int[] c = candidate(area, upStart, upEnd, r, keep, parameters, predPlot, position);
                    if (c != null) {
                        closed.add(c);
                    }
                }
                // nested (later-starting) clusters first
                for (int i = closed.size() - 1; i >= 0; i--) {
                    found.add(closed.get(i));
                }
            }
        }
        return new XiClusters(hierarchy(found), ordering, parameters);
    }

    /** Definition 11 of Ankerst et al. for the steep-down area D and steep-up area [upStart, upEnd]. */
    private static int[] candidate(
            SteepDownArea area, int upStart, int upEnd, double[] r, double keep, XiParameters parameters,
            int[] predPlot, int[] position) {
        int start = area.start;
        int end = upEnd;
        if (r[end + 1] * keep < area.mib) {
            return null; // condition sc2*: the interior must lie below both walls
        }
        double dMax = r[area.start];
        if (dMax * keep >= r[end + 1]) {
            // left wall higher: move the start right to the level of the right wall (criterion 4b)
            while (r[start + 1] > r[end + 1] && start < area.end) {
                start++;
            }
        } else if (r[end + 1] * keep >= dMax) {
            // right wall higher: move the end left to the level of the left wall (criterion 4c, corrected sign)
            while (r[end - 1] > dMax && end > upStart) {
                end--;
            }
        }
        if (parameters.predecessorCorrection()) {
            // Schubert & Gertz 2018, Algorithm 2: drop end points whose predecessor lies outside the cluster.
            while (start < end) {
                if (r[start] > r[end]) {
                    break;
                }
                int pe = predPlot[end];
                if (pe >= 0 && position[pe] >= start && position[pe] < end) {
                    break;
                }
                end--;
            }
            if (start >= end) {
                return null;
            }
        }
        if (end - start + 1 < parameters.minClusterSize() || start > area.end || end < upStart) {
            return null; // criteria 3a, 1 and 2
        }
        return new int[] {start, end};
    }

    /** Drops the areas whose start is not xi-higher than the new maximum in between, and raises their mib. */
    private static void filterAreas(List<SteepDownArea> areas, double mib, double keep, double[] r) {
        if (mib == Double.POSITIVE_INFINITY) {
            areas.clear();
            return;
        }
        areas.removeIf(a -> !(mib <= r[a.start] * keep));
        for (SteepDownArea a : areas) {
            a.mib = Math.max(a.mib, mib);
        }
    }

    /**
     * Extends a steep area from {@code start} while points are steep, or are not steep but not against the
     * direction, at most {@code minPts} such points in a row. Returns the last steep point.
     */
    private static int extendRegion(boolean[] steep, boolean[] against, int start, int minPts) {
        int n = steep.length;
        int nonSteep = 0;
        int end = start;
        for (int i = start; i < n; i++) {
            if (steep[i]) {
                nonSteep = 0;
                end = i;
            } else if (!against[i]) {
                nonSteep++;
                if (nonSteep > minPts) {
                    break;
                }
            } else {
                return end;
            }
        }
        return end;
    }

    /** Removes duplicate intervals (keeping the first) and links each cluster to its smallest container. */
    private static List<XiCluster> hierarchy(List<int[]> found) {
        List<int[]> unique = new ArrayList<>();
        for (int[] c : found) {
            if (unique.stream().noneMatch(u -> u[0] == c[0] && u[1] == c[1])) {
                unique.add(c);
            }
        }
        int m = unique.size();
        int[] parent = new int[m];
        for (int i = 0; i < m; i++) {
            int[] c = unique.get(i);
            parent[i] = -1;
            for (int j = 0; j < m; j++) {
                int[] p = unique.get(j);
                if (j != i && p[0] <= c[0] && c[1] <= p[1]
                        && (parent[i] < 0 || size(p) < size(unique.get(parent[i])))) {
                    parent[i] = j;
                }
            }
        }
        List<XiCluster> clusters = new ArrayList<>(m);
        for (int i = 0; i < m; i++) {
            List<Integer> children = new ArrayList<>();
            for (int j = 0; j < m; j++) {
                if (parent[j] == i) {
                    children.add(j);
                }
            }
            children.sort(Comparator.comparingInt(j -> unique.get(j)[0]));
            clusters.add(new XiCluster(i, unique.get(i)[0], unique.get(i)[1], parent[i], children));
        }
        return clusters;
    }

    private static int size(int[] interval) {
        return interval[1] - interval[0] + 1;
    }

    /** Automatic extraction with {@link AutoParameters#DEFAULT}. */
    public static AutoClusters auto(OpticsResult optics) {
        return auto(optics, AutoParameters.DEFAULT);
    }

    /** Automatic extraction, see the class comment. */
    public static AutoClusters auto(OpticsResult optics, AutoParameters parameters) {
        int n = optics.size();
        int minSize = Math.max(Math.max(2, optics.minPts()),
                (int) Math.ceil(parameters.minClusterFraction() * n));
        XiClusters all = xi(optics, XiParameters.of(parameters.xi(), minSize));
        List<XiCluster> top = all.topLevel(parameters.mergeCoverage());
        return new AutoClusters(all.labelsOf(top), top, all, parameters);
    }

    /** One steep-down area and its running maximum in between. */
    private static final class SteepDownArea {
        final int start;
        final int end;
        double mib;

        SteepDownArea(int start, int end) {
            this.start = start;
            this.end = end;
        }
    }
}
