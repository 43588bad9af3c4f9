package org.tufa.analysis.fleet;

import java.util.List;
import org.tufa.analysis.band.BandKind;
import org.tufa.analysis.findings.ClusterSummary;

/**
 * What stays of one unit's mode once its samples are written: the figures summary.json and the report page show.
 * Small, so the fleet can keep one per unit and mode while the fleet stage decides.
 *
 * @param mode             cooling, heating or ventilation
 * @param analyzed         whether the mode was clustered
 * @param reason           why not (empty when analysed)
 * @param modeSamples      samples of the unit in this mode
 * @param band             the load band's figures (null in ventilation or when skipped)
 * @param samplesClustered feature rows clustered
 * @param features         feature names, in column order
 * @param featureUnits     their units
 * @param pca              the PCA's figures (null when skipped)
 * @param minPts           OPTICS MinPts
 * @param clusters         one summary per cluster label
 * @param noise            samples OPTICS left as noise
 * @param referenceShare   share of the clustered samples in the normal reference (NaN when skipped)
 * @param dominantRegime   whether the reference holds at least half of them
 * @param healthFeatures   the health features among {@code features} (those scaled by their gate and clustered)
 */
public record ModeSummary(String mode, boolean analyzed, String reason, int modeSamples, Band band,
                          int samplesClustered, List<String> features, List<String> featureUnits, Pca pca, int minPts,
                          List<ClusterSummary> clusters, int noise, double referenceShare, boolean dominantRegime,
                          List<String> healthFeatures) implements java.io.Serializable {

    /** Load band figures. */
    public record Band(BandKind kind, double q1, double q3, double low, double high, int inBand, int outOfBand,
                       int sustainedRuns) implements java.io.Serializable {
    }

    /** PCA figures. */
    public record Pca(int components, double[] explainedVarianceRatio, double explainedVariance,
                      List<String> keptFeatures, double[][] loadings) implements java.io.Serializable {
    }

    public ModeSummary {
        features = features == null ? List.of() : List.copyOf(features);
        featureUnits = featureUnits == null ? List.of() : List.copyOf(featureUnits);
        clusters = clusters == null ? List.of() : List.copyOf(clusters);
        healthFeatures = healthFeatures == null ? List.of() : List.copyOf(healthFeatures);
    }

    /** The summary of a mode's detailed result. */
    public static ModeSummary of(ModeResult m) {
        Band band = m.band() == null ? null : new Band(m.band().kind(), m.band().q1(), m.band().q3(), m.band().low(),
                m.band().high(), m.band().inBandCount(), m.band().outOfBandCount(), m.band().runs().size());
        if (!m.analyzed()) {
            return new ModeSummary(m.mode(), false, m.reason(), m.modeSamples(), band, 0, null, null, null, 0, null,
                    0, Double.NaN, false, null);
        }
        List<String> health = m.features().healthNames();
        int[] kept = m.pca().keptColumns();
        List<String> keptNames = java.util.Arrays.stream(kept).mapToObj(health::get).toList();
        Pca pca = new Pca(m.pca().componentCount(), m.pca().explainedVarianceRatio(), m.pca().explainedVariance(),
                keptNames, m.pca().loadings());
        int noise = 0;
        for (int l : m.labels()) {
            noise += l < 0 ? 1 : 0;
        }
        return new ModeSummary(m.mode(), true, "", m.modeSamples(), band, m.features().size(), m.features().names(),
                m.features().units(), pca, m.optics().minPts(), m.clusters(), noise, m.referenceShare(),
                m.dominantRegime(), health);
    }

    /** Clusters judged candidate faults. */
    public int faultClusterCount() {
        return (int) clusters.stream().filter(ClusterSummary::candidateFault).count();
    }
}
