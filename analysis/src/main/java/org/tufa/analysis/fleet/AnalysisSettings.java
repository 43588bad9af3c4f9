package org.tufa.analysis.fleet;

import java.time.ZoneId;
import java.time.ZoneOffset;
import org.tufa.analysis.band.BandKind;
import org.tufa.analysis.band.RunOptions;
import org.tufa.analysis.cluster.AutoParameters;
import org.tufa.analysis.findings.CauseTable;
import org.tufa.analysis.modes.ModeThresholds;

/**
 * Every parameter of the analysis; {@code run.json} records them.
 *
 * @param modeThresholds       when a valve counts as open and the fan as running
 * @param band                 load band kind applied in heating and cooling
 * @param bandRuns             how many consecutive out-of-band samples make a sustained period (counted in the
 *                             mode's summary)
 * @param varianceTarget       PCA: cumulative explained variance to keep
 * @param minPts               OPTICS MinPts
 * @param extraction           automatic xi extraction parameters
 * @param minModeSamples       fewest samples of a mode worth clustering
 * @param residualGate         shift of a residual or offset feature (kelvin) that matters in engineering terms
 * @param activityGate         shift of valve activity (percent per sample) that matters; on a unit's days at least
 *                             half its own normal activity as well
 * @param zoneErrorGate        shift of the zone's distance above its setpoint (kelvin) that matters
 * @param defaultAirflow       nominal airflow (m3/s) for units whose model gives none
 * @param causes               the candidate-cause table
 * @param dayZone              the zone whose midnights separate days
 * @param minDayDeviation      fewest day-to-day spreads of the unit's normal days that a fault day lies from them
 * @param maxEpisodeWindowDays longest window of the scan statistic, in days
 * @param minEpisodeDays       fewest fault days a candidate finding rests on
 * @param decision             the fleet stage's parameters
 */
public record AnalysisSettings(
        ModeThresholds modeThresholds,
        BandKind band,
        RunOptions bandRuns,
        double varianceTarget,
        int minPts,
        AutoParameters extraction,
        int minModeSamples,
        double residualGate,
        double activityGate,
        double zoneErrorGate,
        double defaultAirflow,
        CauseTable causes,
        ZoneId dayZone,
        double minDayDeviation,
        int maxEpisodeWindowDays,
        int minEpisodeDays,
        DecisionSettings decision) implements java.io.Serializable {

    /**
     * The fleet stage's parameters ({@code FleetDecision}).
     *
     * @param minConfidence     findings below this confidence are counted but not listed
     * @param minPeerDeviation  fewest robust standard deviations of the peers a unit's normal level must lie from
     *                          theirs to differ from its peers
     * @param minPeers          fewest peers (units with the same channel) a peer comparison needs
     * @param fleetWideP        a day is fleet-wide when so many units are in an episode of the same channel that
     *                          independent faults would give that many with less than this probability
     * @param minFleetUnits     fewest units a fleet-wide day needs
     */
    public record DecisionSettings(double minConfidence, double minPeerDeviation, int minPeers, double fleetWideP,
                                   int minFleetUnits) implements java.io.Serializable {
        public DecisionSettings {
            if (!(minConfidence >= 0 && minConfidence <= 1)) {
                throw new IllegalArgumentException("minimum confidence must be in [0, 1], got " + minConfidence);
            }
        }
    }

    /**
     * Automatic extraction for the fleet: xi 0.03 instead of scikit-learn's 0.05 ({@link AutoParameters#DEFAULT}),
     * the minimum cluster size and merge rule unchanged. Smoothed health features make fault clusters shallower
     * valleys than raw data, and a gentler steepness finds them (chosen on the demo summer and year and a 500-unit
     * year of the demo simulator; 0.08 lost episodes on the demo summer).
     */
    public static final AutoParameters FLEET_EXTRACTION = new AutoParameters(0.03, 0.01, 0.8);

    /**
     * Defaults for unattended fleet runs. MinPts 20 and 90 % variance follow the published PCA + OPTICS practice
     * (Ankerst et al. 1999 found MinPts 10-20 works well, from memory; Jolliffe 2002 s. 6.1 for 70-90 % variance).
     * The 1.1 K gate is about the combined uncertainty of two air temperature sensors (ASHRAE Guideline 36 uses
     * 2 F per sensor, from memory); the 2 K zone-error gate is Guideline 36's zone temperature alarm threshold
     * (2 K above the cooling setpoint, from memory via the Modelica Buildings Library's implementation). Default
     * airflow 0.19 m3/s (400 cfm, one nominal ton: 350-400 cfm per ton is common practice, no source). Fault days
     * lie at least 3 day-to-day spreads from the unit's normal days (three-sigma control limits: Shewhart,
     * Economic Control of Quality of Manufactured Product, 1931); the scan looks at windows of up to two weeks.
     */
    public static AnalysisSettings defaults() {
        return new AnalysisSettings(ModeThresholds.defaults(), BandKind.TUKEY, new RunOptions(16, 2), 0.90, 20,
                FLEET_EXTRACTION, 96, 1.1, 2.0, 2.0, 400 * 0.3048 * 0.3048 * 0.3048 / 60.0,
                CauseTable.standard(), ZoneOffset.UTC, 3.0, 14, 2, new DecisionSettings(0.9, 4.0, 8, 0.001, 3));
    }

    public AnalysisSettings withModeThresholds(ModeThresholds m) {
        return new AnalysisSettings(m, band, bandRuns, varianceTarget, minPts, extraction, minModeSamples,
                residualGate, activityGate, zoneErrorGate, defaultAirflow, causes, dayZone, minDayDeviation,
                maxEpisodeWindowDays, minEpisodeDays, decision);
    }

    public AnalysisSettings withClustering(BandKind bandKind, double variance, int minimumPoints,
                                           AutoParameters autoParameters) {
        return new AnalysisSettings(modeThresholds, bandKind, bandRuns, variance, minimumPoints, autoParameters,
                minModeSamples, residualGate, activityGate, zoneErrorGate, defaultAirflow, causes, dayZone,
                minDayDeviation, maxEpisodeWindowDays, minEpisodeDays, decision);
    }

    public AnalysisSettings withCauses(CauseTable table) {
        return new AnalysisSettings(modeThresholds, band, bandRuns, varianceTarget, minPts, extraction,
                minModeSamples, residualGate, activityGate, zoneErrorGate, defaultAirflow, table, dayZone,
                minDayDeviation, maxEpisodeWindowDays, minEpisodeDays, decision);
    }

    public AnalysisSettings withDayZone(ZoneId zone) {
        return new AnalysisSettings(modeThresholds, band, bandRuns, varianceTarget, minPts, extraction,
                minModeSamples, residualGate, activityGate, zoneErrorGate, defaultAirflow, causes, zone,
                minDayDeviation, maxEpisodeWindowDays, minEpisodeDays, decision);
    }

    /** The settings with other engineering gates (as a run.json records them). */
    public AnalysisSettings withGates(double residual, double activity, double zoneError) {
        return new AnalysisSettings(modeThresholds, band, bandRuns, varianceTarget, minPts, extraction,
                minModeSamples, residual, activity, zoneError, defaultAirflow, causes, dayZone, minDayDeviation,
                maxEpisodeWindowDays, minEpisodeDays, decision);
    }

    public AnalysisSettings withDecision(DecisionSettings d) {
        return new AnalysisSettings(modeThresholds, band, bandRuns, varianceTarget, minPts, extraction,
                minModeSamples, residualGate, activityGate, zoneErrorGate, defaultAirflow, causes, dayZone,
                minDayDeviation, maxEpisodeWindowDays, minEpisodeDays, d);
    }
}
