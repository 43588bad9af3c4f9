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
 */
public record UnitOutcome(String unit, String label, String folder, String status, String reason, List<String> notes,
                          UnitAnalysis.Result result, List<Finding> findings) {

    public static final String ANALYZED = "analyzed";
    public static final String SKIPPED = "skipped";
    public static final String FAILED = "failed";

    public UnitOutcome {
        notes = List.copyOf(notes);
        findings = List.copyOf(findings);
    }

    /** Modes clustered, ';'-separated. */
    public String analyzedModes() {
        if (result == null) {
            return "";
        }
        return String.join(";", result.modeResults().stream().filter(ModeResult::analyzed).map(ModeResult::mode)
                .toList());
    }

    /** Feature rows clustered over all modes. */
    public int samplesUsed() {
        return result == null ? 0 : result.modeResults().stream().filter(ModeResult::analyzed)
                .mapToInt(m -> m.features().size()).sum();
    }

    public int clusters() {
        return result == null ? 0 : result.modeResults().stream().mapToInt(ModeResult::clusterCount).sum();
    }

    public int faultClusters() {
        return result == null ? 0 : result.modeResults().stream().mapToInt(ModeResult::faultClusterCount).sum();
    }

    /** Hours covered by at least one finding (overlapping findings counted once). */
    public double faultHours() {
        if (result == null || findings.isEmpty()) {
            return 0;
        }
        boolean[] covered = new boolean[result.modes().codes().length];
        for (Finding f : findings) {
            for (int i = f.range().start(); i < f.range().end(); i++) {
                covered[i] = true;
            }
        }
        int count = 0;
        for (boolean c : covered) {
            count += c ? 1 : 0;
        }
        return result.hoursPerSample() * count;
    }

    /** Sensible energy moved during findings (overlaps counted once), kWh. */
    public double faultEnergyKwh() {
        if (result == null || findings.isEmpty()) {
            return 0;
        }
        boolean[] covered = new boolean[result.loadKw().length];
        for (Finding f : findings) {
            for (int i = f.range().start(); i < f.range().end(); i++) {
                covered[i] = true;
            }
        }
        double hoursPerSample = result.hoursPerSample();
        double kwh = 0;
        for (int i = 0; i < covered.length; i++) {
            if (covered[i] && !Double.isNaN(result.loadKw()[i])) {
                kwh += Math.abs(result.loadKw()[i]) * hoursPerSample;
            }
        }
        return kwh;
    }
}
