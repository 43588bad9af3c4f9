package org.tufa.analysis.fleet;

import java.util.List;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.review.ReviewStep;

/**
 * What happened to one unit in a fleet run; one row of fleet.csv.
 *
 * @param status          analyzed, skipped or failed
 * @param reason          why a unit was skipped or failed (empty when analysed)
 * @param notes           data-quality and analysis notes (units of measure, series without data, modes without a
 *                        dominant regime)
 * @param result          the detailed detection result while the unit's files are written (phase 1 of
 *                        {@link FleetAnalysis}); null afterwards and unless analysed
 * @param summary         the small summary kept for the rest of the run; null unless analysed
 * @param findings        the unit's findings: the candidates while {@code result} is present, then the decided
 *                        findings at or above the run's minimum confidence
 * @param belowConfidence decided findings of the unit below the minimum confidence (counted, not listed)
 * @param totals          the fleet.csv figures
 * @param review          the analyst's verdicts on the listed findings and what the review took out
 *                        ({@link ReviewStep}); {@link ReviewStep.UnitReview#NONE} without a review
 */
public record UnitOutcome(String unit, String label, String folder, String status, String reason, List<String> notes,
                          UnitAnalysis.Result result, UnitSummary summary, List<Finding> findings,
                          int belowConfidence, Totals totals, ReviewStep.UnitReview review)
        implements java.io.Serializable {

    public static final String ANALYZED = "analyzed";
    public static final String SKIPPED = "skipped";
    public static final String FAILED = "failed";

    /** The name people read: the model's label, else the unit's IRI (many models carry no labels). */
    public String displayName() {
        return label == null || label.isBlank() ? unit : label;
    }

    /** The figures of one fleet.csv row. */
    public record Totals(String modes, int samplesUsed, int clusters, int faultClusters, double faultHours,
                         double faultEnergyKwh) implements java.io.Serializable {

        static final Totals NONE = new Totals("", 0, 0, 0, 0, 0);

        /**
         * @param loadKw the unit's load per grid sample, for the energy moved during findings; may be null when
         *               there are no findings
         */
        static Totals of(UnitSummary summary, List<Finding> findings, double[] loadKw) {
            if (summary == null) {
                return NONE;
            }
            String modes = String.join(";", summary.modes().stream().filter(ModeSummary::analyzed)
                    .map(ModeSummary::mode).toList());
            int samples = summary.modes().stream().filter(ModeSummary::analyzed)
                    .mapToInt(ModeSummary::samplesClustered).sum();
            int clusters = summary.modes().stream().mapToInt(m -> m.clusters().size()).sum();
            int faultClusters = summary.modes().stream().mapToInt(ModeSummary::faultClusterCount).sum();
            // Samples covered by at least one finding: overlapping findings count once.
            boolean[] covered = new boolean[summary.samples()];
            for (Finding f : findings) {
                for (int i = f.range().start(); i < f.range().end(); i++) {
                    covered[i] = true;
                }
            }
            double hoursPerSample = summary.hoursPerSample();
            int count = 0;
            double kwh = 0;
            for (int i = 0; i < covered.length; i++) {
                if (covered[i]) {
                    count++;
                    if (loadKw != null && !Double.isNaN(loadKw[i])) {
                        kwh += Math.abs(loadKw[i]) * hoursPerSample;
                    }
                }
            }
            return new Totals(modes, samples, clusters, faultClusters, count * hoursPerSample, kwh);
        }
    }

    public UnitOutcome {
        notes = List.copyOf(notes);
        findings = List.copyOf(findings);
        review = review == null ? ReviewStep.UnitReview.NONE : review;
    }

    /** An outcome without a review. */
    public UnitOutcome(String unit, String label, String folder, String status, String reason, List<String> notes,
                       UnitAnalysis.Result result, UnitSummary summary, List<Finding> findings, int belowConfidence,
                       Totals totals) {
        this(unit, label, folder, status, reason, notes, result, summary, findings, belowConfidence, totals, null);
    }

    /** An outcome straight from the analysis (phase 1): detailed result, candidate findings. */
    public UnitOutcome(String unit, String label, String folder, String status, String reason, List<String> notes,
                       UnitAnalysis.Result result) {
        this(unit, label, folder, status, reason, notes, result, result == null ? null : UnitSummary.of(result),
                result == null ? List.of() : result.findings(), 0,
                Totals.of(result == null ? null : UnitSummary.of(result), List.of(), null));
    }

    /**
     * The same outcome without the detailed result (signals-sized arrays, feature matrices, PCA, OPTICS): what the
     * fleet keeps once the unit's files are written, so memory does not grow with the fleet's samples.
     */
    public UnitOutcome withoutDetail() {
        return new UnitOutcome(unit, label, folder, status, reason, notes, null, summary, findings, belowConfidence,
                totals, review);
    }

    /**
     * The outcome with the fleet stage's decision.
     *
     * @param listed the findings at or above the minimum confidence
     * @param below  how many were below it
     * @param loadKw the unit's load per sample (may be null when {@code listed} is empty)
     */
    public UnitOutcome decided(List<Finding> listed, int below, List<String> moreNotes, double[] loadKw) {
        return decided(listed, below, moreNotes, loadKw, ReviewStep.UnitReview.NONE);
    }

    /** The outcome with the fleet stage's decision and the analyst's review of it. */
    public UnitOutcome decided(List<Finding> listed, int below, List<String> moreNotes, double[] loadKw,
                               ReviewStep.UnitReview unitReview) {
        List<String> all = new java.util.ArrayList<>(notes);
        all.addAll(moreNotes);
        return new UnitOutcome(unit, label, folder, status, reason, all, null, summary, listed, below,
                Totals.of(summary, listed, loadKw), unitReview);
    }

    /** The review mark of one of the listed findings (empty when no verdict concerns it). */
    public ReviewStep.Mark mark(Finding f) {
        return review.mark(org.tufa.analysis.review.FindingIds.of(unit, f));
    }

    /** Modes clustered, ';'-separated. */
    public String analyzedModes() {
        return totals.modes();
    }

    /** Feature rows clustered over all modes. */
    public int samplesUsed() {
        return totals.samplesUsed();
    }

    public int clusters() {
        return totals.clusters();
    }

    public int faultClusters() {
        return totals.faultClusters();
    }

    /** Hours covered by at least one listed finding (overlapping findings counted once). */
    public double faultHours() {
        return totals.faultHours();
    }

    /** Sensible energy moved during listed findings (overlaps counted once), kWh. */
    public double faultEnergyKwh() {
        return totals.faultEnergyKwh();
    }

    /** The highest confidence among the listed findings, 0 without any. */
    public double topConfidence() {
        return findings.stream().mapToDouble(Finding::confidence).filter(Double::isFinite).max().orElse(0);
    }
}
