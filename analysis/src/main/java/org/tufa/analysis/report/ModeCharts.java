package org.tufa.analysis.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.tufa.analysis.cluster.OpticsResult;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.findings.ClusterSummary;
import org.tufa.analysis.fleet.ModeResult;

/** The reachability plot and the PCA biplot of one clustered mode, drawn into the unit's folder. */
final class ModeCharts {

    /** File names (relative to the unit folder) and the biplot caption (HTML, escaped). */
    record Drawn(String reachabilityFile, String biplotFile, String caption, int reachabilityColumnWidth)
            implements java.io.Serializable {
    }

    private ModeCharts() {
    }

    static Drawn draw(ModeResult m, String unitName, Path dir) {
        String reachFile = m.mode() + "-reachability.png";
        String biplotFile = m.mode() + "-biplot.png";
        List<Charts.Group> groups = groups(m);
        OpticsResult optics = m.optics();
        int[] order = optics.ordering();
        int[] labelsInOrder = new int[order.length];
        for (int i = 0; i < order.length; i++) {
            labelsInOrder[i] = m.labels()[order[i]];
        }
        Thinning.Bars bars = Thinning.reachabilityColumns(optics.reachabilityPlot(), labelsInOrder,
                UnitPages.REACH_COLUMNS);
        Charts.writePng(Charts.reachability(unitName + ", " + m.mode() + ": reachability plot", bars,
                labelsInOrder, groups), UnitPages.REACH_WIDTH, UnitPages.REACH_HEIGHT, dir.resolve(reachFile));
        Biplot b = biplot(m, unitName, groups);
        Charts.writePng(b.chart(), UnitPages.BIPLOT_SIZE, UnitPages.BIPLOT_SIZE, dir.resolve(biplotFile));
        return new Drawn(reachFile, biplotFile, b.caption(), (int) bars.width());
    }

    /** Cluster groups in drawing order: noise first (underneath), then normal, then the others. */
    private static List<Charts.Group> groups(ModeResult m) {
        List<Charts.Group> groups = new ArrayList<>();
        int noise = 0;
        for (int l : m.labels()) {
            noise += l < 0 ? 1 : 0;
        }
        if (noise > 0) {
            groups.add(new Charts.Group(-1, "noise (" + noise + ")"));
        }
        for (ClusterSummary c : m.clusters()) {
            String role = c.label() == 0 ? "normal" : c.candidateFault() ? "candidate fault" : "other regime";
            groups.add(new Charts.Group(c.label(), "C" + c.label() + " " + role + " (" + c.size() + ")"));
        }
        return groups;
    }

    /** E.g. "coil_residual -1 K, discharge_air_temperature +1 K". */
    private static String describe(Map<String, Double> change) {
        return String.join(", ", change.entrySet().stream().map(e -> e.getKey() + " "
                + (e.getValue() >= 0 ? "+" : "") + Html.fixed(e.getValue(), 0) + " K").toList());
    }

    private record Biplot(org.jfree.chart.JFreeChart chart, String caption) {
    }

    private static Biplot biplot(ModeResult m, String unitName, List<Charts.Group> groups) {
        PcaResult pca = m.pca();
        FeatureMatrix f = m.features();
        double[][] scores = pca.scores();
        int[] labels = m.labels();
        int k = pca.componentCount();
        double[] ratio = pca.explainedVarianceRatio();
        int[] shown = Thinning.subset(labels, UnitPages.BIPLOT_POINTS);
        double extent = BiplotGeometry.frame(scores, labels);
        double edge = extent * Charts.BIPLOT_MARGIN;
        int outside = 0;
        for (double[] s : scores) {
            outside += Math.abs(s[0]) > edge || (k > 1 && Math.abs(s[1]) > edge) ? 1 : 0;
        }
        List<Charts.Points> layers = new ArrayList<>();
        for (Charts.Group g : groups) {
            int count = 0;
            for (int i : shown) {
                count += labels[i] == g.label() ? 1 : 0;
            }
            double[] x = new double[count];
            double[] y = new double[count];
            int j = 0;
            for (int i : shown) {
                if (labels[i] == g.label()) {
                    x[j] = scores[i][0];
                    y[j++] = k > 1 ? scores[i][1] : 0;
                }
            }
            layers.add(new Charts.Points(g, x, y));
        }
        List<ArrowAnnotation> arrows = new ArrayList<>();
        double[][] loadings = pca.loadings();
        double scale = BiplotGeometry.loadingScale(extent, loadings);
        int[] kept = pca.keptColumns();
        List<String> inputs = BiplotGeometry.pcaInputNames(pca, f);
        for (int j = 0; j < kept.length; j++) {
            double lx = loadings[j][0] * scale;
            double ly = k > 1 ? loadings[j][1] * scale : 0;
            arrows.add(new ArrowAnnotation(0, 0, lx, ly, Palette.BLACK, false, 0.9f, inputs.get(kept[j])));
        }
        StringBuilder cap = new StringBuilder();
        cap.append("PCA biplot (Gabriel, Biometrika 1971): scores of the clustered samples on the first two "
                + "principal components of the standardised clustered features (")
                .append(Html.esc(String.join(", ", inputs))).append("; PC1 ").append(Html.fixed(100 * ratio[0], 0))
                .append(" %");
        if (k > 1) {
            cap.append(", PC2 ").append(Html.fixed(100 * ratio[1], 0)).append(" %");
        } else {
            cap.append("; only one component was kept, so the vertical axis is empty");
        }
        cap.append(" of the variance), coloured by cluster");
        if (shown.length < labels.length) {
            cap.append(", ").append(shown.length).append(" of ").append(labels.length)
                    .append(" samples shown (an even, deterministic selection per cluster; small clusters kept)");
        }
        if (outside > 0) {
            cap.append("; ").append(outside).append(" far sample(s) lie outside the frame (set by the 99th "
                    + "percentile of the clustered samples) and are not drawn");
        }
        cap.append(". Thin black arrows: loading of each feature (its direction in the PC1/PC2 plane), all "
                + "multiplied by ").append(Html.fixed(scale, 2)).append(" to fit the cloud.");
        Map<String, Double> less = BiplotGeometry.visible(pca, f, BiplotGeometry.coilDoesLess(m.mode()));
        double[] expected = less.isEmpty() ? new double[0] : BiplotGeometry.scoreChange(pca, f, less);
        double[] normal = BiplotGeometry.medianScores(scores, labels, 0);
        List<String> notes = new ArrayList<>();
        double longest = 0;
        for (ClusterSummary c : m.clusters()) {
            if (!c.candidateFault()) {
                continue;
            }
            double[] centre = BiplotGeometry.medianScores(scores, labels, c.label());
            double[] actual = new double[k];
            for (int j = 0; j < k; j++) {
                actual[j] = centre[j] - normal[j];
            }
            double ny = k > 1 ? normal[1] : 0;
            double ay = k > 1 ? actual[1] : 0;
            arrows.add(new ArrowAnnotation(normal[0], ny, normal[0] + actual[0], ny + ay,
                    Palette.cluster(c.label()), false, 2.6f, "C" + c.label() + " actual"));
            longest = Math.max(longest, Math.hypot(actual[0], ay));
            if (expected.length == 0) {
                continue;
            }
            double cos = BiplotGeometry.cosine(actual, expected);
            notes.add("C" + c.label() + ": cosine between actual and expected shift over all " + k
                    + " kept components " + (Double.isNaN(cos) ? "undefined" : Html.fixed(cos, 2)));
        }
        // One expected arrow serves every fault cluster (the direction is the same), at the longest actual length.
        double ex = expected.length > 0 ? expected[0] : 0;
        double ey = expected.length > 1 ? expected[1] : 0;
        double elen = Math.hypot(ex, ey);
        if (elen > 1e-9 && longest > 0) {
            double ny = k > 1 ? normal[1] : 0;
            arrows.add(new ArrowAnnotation(normal[0], ny, normal[0] + ex / elen * longest, ny + ey / elen * longest,
                    Palette.BLACK, true, 1.8f, "expected if the coil does less"));
        }
        if (m.clusters().stream().anyMatch(ClusterSummary::candidateFault)) {
            cap.append(" Thick coloured arrow: a candidate fault cluster's departure from normal (median scores of"
                    + " normal C0 to median scores of the cluster).");
            if (!less.isEmpty()) {
                cap.append(" Dashed black arrow: the direction the scores would move if the coil delivered 1 K "
                        + "less and nothing else changed (").append(Html.esc(describe(less)))
                        .append(" among the clustered features), drawn from the normal median at the length of the longest actual arrow (one arrow: the direction is the same for every cluster). Arrows that agree support causes in "
                                + "which the coil does less (water flow, fouling, supply water); arrows that "
                                + "disagree point elsewhere (a sensor, a valve, a change of operating point). The "
                                + "plane shows only two components; the cosine over all kept components is the "
                                + "fairer measure: ").append(Html.esc(String.join("; ", notes))).append('.');
            } else if (m.mode().equals("ventilation")) {
                cap.append(" No expected direction is drawn in ventilation: no coil is meant to be at work.");
            } else {
                cap.append(" No expected direction is drawn: none of the features a weaker coil moves (coil "
                        + "residual, discharge air temperature) is among the clustered ones.");
            }
        } else {
            cap.append(" No candidate fault cluster in this mode.");
        }
        String xl = "PC1 (" + Html.fixed(100 * ratio[0], 0) + " % of variance, standardised units)";
        String yl = k > 1 ? "PC2 (" + Html.fixed(100 * ratio[1], 0) + " % of variance, standardised units)"
                : "PC2 (not kept)";
        return new Biplot(Charts.biplot(unitName + ", " + m.mode() + ": PCA biplot", xl, yl, layers, arrows,
                extent), cap.toString());
    }
}
