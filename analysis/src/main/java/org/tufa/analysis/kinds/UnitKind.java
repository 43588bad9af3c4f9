package org.tufa.analysis.kinds;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.findings.CauseTable;
import org.tufa.analysis.findings.DirectionCheck;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.modes.ModeSplit;

/**
 * What the per-unit detection needs to know about a kind of terminal unit (fan coil units, VAV boxes): the rest of
 * the pipeline (load band, PCA, OPTICS, the normal reference, cluster summaries, day channels and the fleet stage)
 * is the same for every kind ({@code org.tufa.analysis.fleet.UnitAnalysis}). A kind is chosen per unit by its
 * requirement profile's {@code tufa:unitKind} ({@link UnitKinds#of}); implementations are stateless.
 * What the kind's rules and features find goes through the same fleet decision as every kind's
 * ({@code org.tufa.analysis.decision.FleetDecision}), among units of the kind.
 *
 * <p>A kind says which roles it reads, how each sample's operating mode follows from the signals, which modes are
 * clustered and on which samples, whether the load band applies, what its health features are (with each one's
 * fault sides, engineering gate and spread floor, {@link HealthFeature}), its rule channels ({@link RuleChannel}),
 * its load and its candidate causes.
 */
public interface UnitKind {

    /** The {@code tufa:unitKind} of the profiles this detection is for ({@code fan_coil}, {@code vav}). */
    String name();

    /** The roles the analysis reads, in the order their series are prepared. */
    List<String> roles();

    /** The unit's point for each role the analysis reads; by default each of {@link #roles()} the coverage found. */
    default Map<String, PointRef> points(UnitCoverage coverage) {
        Map<String, PointRef> points = new LinkedHashMap<>();
        for (String role : roles()) {
            coverage.point(role).ifPresent(p -> points.put(role, p));
        }
        return points;
    }

    /** Why a unit with these signals cannot be analysed at all (no data for a role every mode needs), or null. */
    String unanalysable(UnitSignals s);

    /**
     * Notes for the reader on how the unit's points are read (a valve the model lacks, a default airflow).
     *
     * @param points            the points found for the kind's roles
     * @param airflowFromModel  whether the model gives the unit's nominal airflow
     */
    List<String> notes(Map<String, PointRef> points, boolean airflowFromModel, AnalysisSettings settings);

    /** The labels of the kind's per-sample operating modes, in code order (modes.csv). */
    List<String> modeLabels();

    /** The operating mode of every sample. */
    ModeSplit modes(UnitSignals s, AnalysisSettings settings);

    /** The unit's air-side sensible load per sample, kW (positive cooling), NaN where unknown. */
    double[] load(UnitSignals s);

    /** The modes that are clustered, in the order they are analysed (the profile's mode names). */
    List<String> clusteredModes();

    /** Why the unit cannot be analysed in the mode (a role without data), or null when it can. */
    String missingFor(String mode, UnitSignals s);

    /** Every sample of the mode: their count is the mode's size, and the load band is fitted on them. */
    boolean[] modeSamples(String mode, ModeSplit modes, UnitSignals s);

    /** The samples of the mode that are clustered: by default all of them. */
    default boolean[] clusteredSamples(String mode, ModeSplit modes, UnitSignals s) {
        return modeSamples(mode, modes, s);
    }

    /** Whether the load band applies in the mode (not where the load is fixed by design). */
    boolean bandApplies(String mode);

    /**
     * The feature rows of the mode's samples.
     *
     * @param samples grid indices of the samples to build rows for, ascending
     */
    FeatureMatrix features(String mode, UnitSignals s, int[] samples, ModeSplit modes);

    /**
     * The feature rows of the mode's samples outside the load band, judged by what the unit does inside it: what a
     * feature learns from the unit (a coil curve, say) is learnt from the samples in the band only. Those samples
     * are not clustered (the published method compares like loads with like), but a fault that pushes the load out
     * of the band (a failed fan: the coil cools a trickle of air to near the water temperature) shows in them
     * first. By default none: the kind's out-of-band samples are then judged by the out-of-band rules alone.
     *
     * @param samples grid indices of the mode's samples to build rows for, ascending: those in the band and those
     *                beyond it on the side of more heat moved
     * @param inBand  per entry of {@code samples}: inside the band
     * @return rows of the samples outside the band only (the same columns as {@link #features}), or null
     */
    default FeatureMatrix featuresOutsideBand(String mode, UnitSignals s, int[] samples, boolean[] inBand,
                                              ModeSplit modes) {
        return null;
    }

    /**
     * The fault sides on which a health feature judges the samples outside the load band
     * ({@link #featuresOutsideBand}): only where the side means something the band's edge cannot explain. By
     * default none.
     */
    default int[] sidesOutsideBand(String feature) {
        return new int[0];
    }

    /** The names of the kind's health features (over all its modes). */
    List<String> healthFeatures();

    /** How a health feature of this kind is judged. */
    HealthFeature health(String feature, AnalysisSettings settings);

    /**
     * The expected-direction check of a group of a mode's rows ({@link DirectionCheck}), or null where no check
     * applies.
     */
    DirectionCheck.Outcome direction(String mode, FeatureMatrix f, boolean[] rows);

    /** The kind's rule channels. */
    List<RuleChannel> rules(UnitSignals s, ModeSplit modes, AnalysisSettings settings);

    /**
     * What the kind's channel keys carry in run.json, so that two kinds' channels of the same name stay apart: by
     * default the kind's name and a colon, as in the cause table ({@link CauseTable#forKind}).
     */
    default String channelPrefix() {
        return name() + CauseTable.KIND_SEPARATOR;
    }

    /** The kind's candidate causes: its part of the run's cause table. */
    default CauseTable causes(AnalysisSettings settings) {
        return settings.causes().forKind(name());
    }
}
