package org.tufa.analysis.fleet;

import org.tufa.analysis.band.BandKind;
import org.tufa.analysis.band.RunOptions;
import org.tufa.analysis.cluster.AutoParameters;
import org.tufa.analysis.findings.CauseTable;
import org.tufa.analysis.modes.ModeThresholds;

/**
 * Every parameter of the per-unit analysis; {@code run.json} records them.
 *
 * @param modeThresholds       when a valve counts as open and the fan as running
 * @param band                 load band kind applied in heating and cooling
 * @param bandRuns             how many consecutive out-of-band samples make a sustained period
 * @param varianceTarget       PCA: cumulative explained variance to keep
 * @param minPts               OPTICS MinPts
 * @param extraction           automatic xi extraction parameters
 * @param minModeSamples       fewest samples of a mode worth clustering
 * @param minFindingSamples    fewest flagged samples an interval needs to become a finding (persistence)
 * @param bridgeSamples        unflagged samples bridged inside a finding interval
 * @param residualGate         shift of a residual or offset feature (kelvin) that makes a cluster a candidate fault
 * @param activityGate         shift of valve activity (percent per sample) that makes a cluster a candidate fault
 * @param zoneErrorGate        shift of the zone's distance above its setpoint (kelvin) that makes a cluster a
 *                             candidate fault
 * @param defaultAirflow       nominal airflow (m3/s) for units whose model gives none
 * @param causes               the candidate-cause table
 */
public record AnalysisSettings(
        ModeThresholds modeThresholds,
        BandKind band,
        RunOptions bandRuns,
        double varianceTarget,
        int minPts,
        AutoParameters extraction,
        int minModeSamples,
        int minFindingSamples,
        int bridgeSamples,
        double residualGate,
        double activityGate,
        double zoneErrorGate,
        double defaultAirflow,
        CauseTable causes) {

    /**
     * Automatic extraction for the fleet: xi 0.03 instead of scikit-learn's 0.05 ({@link AutoParameters#DEFAULT}),
     * the minimum cluster size and merge rule unchanged. Chosen by evaluation against ground truth on three
     * simulated labelled sets, the same way for all: demo summer, 150 units: 69.1 to 71.1 % of analysable fault
     * hours flagged, 22 to 24 of 24 episodes; demo year: 55.6 to 64.7 %, 23 to 24 of 25; a 500-unit year of another
     * building (FleetBenchmark): 57.0 to 58.7 %, 72 to 73 of 85; healthy-unit hours flagged unchanged (0.7-1.0 %
     * to 0.8-1.0 %). Smoothed health features make fault clusters shallower valleys than raw data, and a gentler
     * steepness finds them; 0.08 lost episodes (summer: 18 of 24).
     */
    public static final AutoParameters FLEET_EXTRACTION = new AutoParameters(0.03, 0.01, 0.8);

    /**
     * Defaults for unattended fleet runs at 15-minute samples. MinPts 20 and 90 % variance follow the published
     * PCA + OPTICS practice (Ankerst et al. 1999 found MinPts 10-20 works well, from memory; Jolliffe 2002 s. 6.1
     * for 70-90 % variance). Findings need 8 samples (2 hours) with gaps of up to 12 samples (3 hours) bridged; the
     * 1.1 K gate is about the combined uncertainty of two air temperature sensors (ASHRAE Guideline 36 uses
     * 2 F per sensor, from memory); the 2 K zone-error gate is Guideline 36's zone temperature alarm
     * threshold (2 K above the cooling setpoint, from memory via the Modelica Buildings Library's implementation).
     * Out-of-band periods must last 16 samples (4 hours): with 8, hot afternoons made most of the false flags
     * (demo summer: 1.0 % of healthy hours flagged with 8, 0.6 % with 16, fault hours 71.1 % and 70.4 %, every
     * episode still found; demo year and the 500-unit year unchanged within 0.2 points). Default airflow
     * 0.19 m3/s (400 cfm, one nominal ton: 350-400 cfm per ton is common practice, no source).
     */
    public static AnalysisSettings defaults() {
        return new AnalysisSettings(ModeThresholds.defaults(), BandKind.TUKEY, new RunOptions(16, 2), 0.90, 20,
                FLEET_EXTRACTION, 96, 8, 12, 1.1, 2.0, 2.0, 400 * 0.3048 * 0.3048 * 0.3048 / 60.0,
                CauseTable.standard());
    }
}
