package org.tufa.analysis.fleet;

import java.util.List;
import org.tufa.analysis.band.LoadBand;
import org.tufa.analysis.cluster.OpticsResult;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.findings.ClusterSummary;

/**
 * One unit in one operating mode: what was clustered and what came out. Fields after {@code reason} are null
 * when the mode was skipped.
 *
 * @param mode        cooling, heating or ventilation
 * @param analyzed    whether the mode was clustered
 * @param reason      why it was not (empty when analysed)
 * @param modeSamples samples of the unit in this mode
 * @param band        the load band (null in ventilation, where the coil load is zero by definition)
 * @param features    feature rows of the in-band samples
 * @param pca         PCA of the features
 * @param optics      OPTICS of the PCA scores
 * @param labels      cluster label per feature row, 0 = normal (largest), -1 = noise
 * @param clusters    one summary per cluster label, in label order
 * @param referenceShare share of the clustered samples in the normal reference (the largest cluster and every
 *                    cluster whose health features agree with it); NaN when skipped
 * @param dominantRegime whether at least half of the mode's days are days of normal operation (candidate-fault
 *                    clusters hold less than half of their samples): without a dominant regime the mode raises no
 *                    cluster findings
 */
public record ModeResult(String mode, boolean analyzed, String reason, int modeSamples, LoadBand band,
                         FeatureMatrix features, PcaResult pca, OpticsResult optics, int[] labels,
                         List<ClusterSummary> clusters, double referenceShare, boolean dominantRegime) {

    public ModeResult {
        clusters = clusters == null ? List.of() : List.copyOf(clusters);
    }

    static ModeResult skipped(String mode, int modeSamples, String reason) {
        return new ModeResult(mode, false, reason, modeSamples, null, null, null, null, null, List.of(), Double.NaN,
                false);
    }

    /** Clusters (noise not counted). */
    public int clusterCount() {
        return clusters.size();
    }

    /** Clusters judged candidate faults. */
    public int faultClusterCount() {
        return (int) clusters.stream().filter(ClusterSummary::candidateFault).count();
    }
}
