package org.tufa.analysis.fleet;

import java.util.List;
import org.tufa.analysis.findings.Finding;

/**
 * What happened to one unit in a fleet run; one row of fleet.csv.
 *
 * @param status   analyzed, skipped or failed
 * @param reason   why a unit was skipped or failed (empty when analysed)
 * @param notes    data-quality notes (units of measure, series without data)
 * @param result   the detection result, null unless analysed
 * @param findings the unit's findings (empty unless analysed)
 * @param totals   the fleet.csv figures, computed once from the result, so the result can be let go
 */
public record UnitOutcome(String unit, String label, String folder, String status, String reason, List<String> notes,
                          UnitAnalysis.Result result, List<Finding> findings, Totals totals) {

    public static final String ANALYZED = "analyzed";
    public static final String SKIPPED = "skipped";
    public static final String FAILED = "failed";

    /** The figures of one fleet.csv row. */
    public record Totals(String modes, int samplesUsed, int clusters, int faultClusters, double faultHours,
                         double faultEnergyKwh) {

        static Totals of(UnitAnalysis.Result result, List<Finding> findings) {
            if (result == null) {
                return new Totals("", 0, 0, 0, 0, 0);
            }
            String modes = String.join(";", result.modeResults().stream().filter(ModeResult::analyzed)
                    .map(ModeResult::mode).toList());
            int samples = result.modeResults().stream().filter(ModeResult::analyzed)
                    .mapToInt(m -> m.features().size()).sum();
            int clusters = result.modeResults().stream().mapToInt(ModeResult::clusterCount).sum();
            int faultClusters = result.modeResults().stream().mapToInt(ModeResult::faultClusterCount).sum();
            // Samples covered by at least one finding: overlapping findings count once.
            boolean[] covered = new boolean[result.modes().codes().length];
            for (Finding f : findings) {
                for (int i = f.range().start(); i < f.range().end(); i++) {
                    covered[i] = true;
                }
            }
            double hoursPerSample = result.hoursPerSample();
            int count = 0;
            double kwh = 0;
            for (int i = 0; i < covered.length; i++) {
                if (covered[i]) {
                    count++;
                    if (!Double.isNaN(result.loadKw()[i])) {
                        kwh += Math.abs(result.loadKw()[i]) * hoursPerSample;
                    }
                }
            }
            return new Totals(modes, samples, clusters, faultClusters, count * hoursPerSample, kwh);
        }
    }

    public UnitOutcome {
        notes = List.copyOf(notes);
        findings = List.copyOf(findings);
    }

    public UnitOutcome(String unit, String label, String folder, String status, String reason, List<String> notes,
                       UnitAnalysis.Result result, List<Finding> findings) {
        this(unit, label, folder, status, reason, notes, result, findings, Totals.of(result, findings));
    }

    /**
     * The same outcome without the detailed result (signals-sized arrays, feature matrices, PCA, OPTICS): what the
     * fleet keeps once the unit's files and pages are written, so memory does not grow with the fleet.
     */
    public UnitOutcome withoutDetail() {
        return new UnitOutcome(unit, label, folder, status, reason, notes, null, findings, totals);
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

    /** Hours covered by at least one finding (overlapping findings counted once). */
    public double faultHours() {
        return totals.faultHours();
    }

    /** Sensible energy moved during findings (overlaps counted once), kWh. */
    public double faultEnergyKwh() {
        return totals.faultEnergyKwh();
    }
}
