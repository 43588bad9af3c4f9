package org.tufa.analysis.fleet;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.tufa.analysis.band.LoadBand;
import org.tufa.analysis.band.OutOfBandRun;
import org.tufa.analysis.cluster.AutoClusters;
import org.tufa.analysis.cluster.ComponentRule;
import org.tufa.analysis.cluster.Extraction;
import org.tufa.analysis.cluster.Optics;
import org.tufa.analysis.cluster.OpticsResult;
import org.tufa.analysis.cluster.Pca;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.ModeFeatures;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.features.ValveActivity;
import org.tufa.analysis.findings.BalanceRules;
import org.tufa.analysis.findings.ClusterShifts;
import org.tufa.analysis.findings.ClusterSummary;
import org.tufa.analysis.findings.DirectionCheck;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.IndexRange;
import org.tufa.analysis.findings.Intervals;
import org.tufa.analysis.findings.ModeHunting;
import org.tufa.analysis.findings.Shift;
import org.tufa.analysis.load.SensibleLoad;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.modes.ModeSplit;
import org.tufa.analysis.modes.ModeThresholds;
import org.tufa.analysis.modes.OperatingMode;
import org.tufa.analysis.modes.OperatingModes;

/**
 * The detection for one unit: operating modes, load, load band, and per mode features, PCA, OPTICS, clusters and
 * findings. Pure: signals in, an immutable result out; no I/O.
 *
 * <p>The clustering follows the published PCA + OPTICS approach (PCA: Jolliffe, Principal Component Analysis,
 * 2002; OPTICS: Ankerst, Breunig, Kriegel and Sander, SIGMOD 1999): largest cluster = normal, other clusters =
 * candidates, noise ignored. Three additions keep it useful when it runs unattended on hundreds of units:
 * <ul>
 *   <li>physically informed features (coil residual, ventilation discharge offset, valve activity;
 *       {@link ModeFeatures}) so that a fault separates from a change of load;</li>
 *   <li>an engineering-significance gate: a cluster is a candidate fault only when it differs from normal in a
 *       health feature by more than the sensor uncertainty, or fails the expected-direction check; a cluster
 *       that differs only in load or weather is another regime of normal operation;</li>
 *   <li>persistence: flagged samples become findings only as intervals of a minimum duration
 *       ({@link Intervals}), so isolated spikes stay noise.</li>
 * </ul>
 * Samples outside the load band are not clustered but never dropped silently: sustained out-of-band periods
 * become findings of their own, and simultaneous heating and cooling is reported directly.
 */
public final class UnitAnalysis {

    /** Everything the detection produced for one unit. */
    public record Result(Instant gridStart, Duration interval, ModeSplit modes, double[] loadKw, byte[] bandState,
                         List<ModeResult> modeResults, List<Finding> findings) {
        /** {@link #bandState} values: not applicable, inside the band, outside the band. */
        public static final byte NOT_APPLICABLE = 0;
        public static final byte IN_BAND = 1;
        public static final byte OUT_OF_BAND = 2;

        public Result {
            modeResults = List.copyOf(modeResults);
            findings = List.copyOf(findings);
        }

        /** Hours per grid sample. */
        public double hoursPerSample() {
            return interval.toMillis() / 3_600_000.0;
        }

        /** Start time of grid sample {@code i}. */
        public Instant time(int i) {
            return gridStart.plus(interval.multipliedBy(i));
        }
    }

    private UnitAnalysis() {
    }

    public static Result run(UnitSignals s, FanSignal fanSignal, double nominalAirflow, AnalysisSettings settings,
                             StageTimes times) {
        int n = s.size();
        ModeSplit modes = classify(s, fanSignal, settings.modeThresholds());
        double[] fan = s.fanFraction();
        if (fanSignal == FanSignal.NONE || !UnitSignals.present(s.fanFraction())) {
            // Without a fan signal the fan counts as running whenever the unit is in a coil mode (inferred above).
            fan = new double[n];
            java.util.Arrays.fill(fan, 1.0);
        }
        double[] load = SensibleLoad.kilowatts(nominalAirflow, fan, s.zoneAirTemperature(),
                s.dischargeAirTemperature());
        byte[] bandState = new byte[n];
        List<ModeResult> results = new ArrayList<>();
        List<Finding> findings = new ArrayList<>();

        findings.addAll(ruleFindings(modes.mask(OperatingMode.SIMULTANEOUS), "simultaneous_heating_cooling", s, load,
                settings));
        findings.addAll(ruleFindings(hunting(s, fanSignal, settings), "mode_hunting", s, load, settings));
        findings.addAll(balanceFindings(modes, s, load, settings));
        for (String mode : ModeFeatures.CLUSTERED_MODES) {
            OperatingMode m = OperatingMode.valueOf(mode.toUpperCase(java.util.Locale.ROOT));
            results.add(mode(mode, m, s, modes, load, bandState, findings, settings, times));
        }
        findings.sort(Comparator.comparing((Finding f) -> f.range().start()).thenComparing(Finding::mode)
                .thenComparing(Finding::kind).thenComparingInt(Finding::cluster));
        return new Result(s.gridStart(), s.interval(), modes, load, bandState, results, findings);
    }

    private static ModeResult mode(String name, OperatingMode m, UnitSignals s, ModeSplit modes, double[] load,
                                   byte[] bandState, List<Finding> findings, AnalysisSettings settings,
                                   StageTimes times) {
        int modeSamples = modes.count(m);
        String missing = ModeFeatures.missingFor(name, s);
        if (missing != null) {
            return ModeResult.skipped(name, modeSamples, missing);
        }
        if (modeSamples < settings.minModeSamples()) {
            return ModeResult.skipped(name, modeSamples, "only " + modeSamples + " samples in " + name
                    + " (at least " + settings.minModeSamples() + " needed)");
        }
        boolean[] inMode = modes.mask(m);
        LoadBand band = null;
        boolean[] keep = inMode;
        if (m != OperatingMode.VENTILATION) {
            double[] modeLoad = modes.only(m, load);
            band = LoadBand.fit(modeLoad, settings.band(), settings.bandRuns());
            keep = band.inBand();
            for (int i = 0; i < load.length; i++) {
                if (inMode[i] && !Double.isNaN(modeLoad[i])) {
                    bandState[i] = keep[i] ? Result.IN_BAND : Result.OUT_OF_BAND;
                }
            }
            for (OutOfBandRun run : band.runs()) {
                String side = run.aboveSamples() * 2 >= run.outsideSamples() ? "high" : "low";
                IndexRange r = new IndexRange(run.start(), run.endExclusive());
                findings.add(finding(name, "out_of_band_" + side, -1, r, s, load, List.of(),
                        settings.causes().causes("out_of_band_" + side, List.of(), null)));
            }
        }
        long t0 = System.nanoTime();
        FeatureMatrix features = ModeFeatures.build(name, s, indices(keep, inMode));
        long t1 = System.nanoTime();
        times.add(StageTimes.Stage.FEATURES, t1 - t0);
        if (features.size() < Math.max(settings.minModeSamples() / 2, settings.minPts() + 1)) {
            return ModeResult.skipped(name, modeSamples, "only " + features.size() + " complete samples in "
                    + name + " inside the load band");
        }
        PcaResult pca = Pca.fit(scaledByGate(features, settings),
                ComponentRule.cumulativeVariance(settings.varianceTarget()), Pca.Scaling.CENTRE_ONLY);
        long t2 = System.nanoTime();
        times.add(StageTimes.Stage.PCA, t2 - t1);
        OpticsResult optics = Optics.fit(pca.scores(), settings.minPts());
        long t3 = System.nanoTime();
        times.add(StageTimes.Stage.OPTICS, t3 - t2);
        AutoClusters clusters = Extraction.auto(optics, settings.extraction());
        int[] labels = clusters.labels();
        List<ClusterSummary> summaries = summarise(name, features, labels, clusters.clusterCount(), settings);
        // Samples of all candidate-fault clusters together, so one fault that OPTICS split into neighbouring
        // clusters gives one finding per interval, not one per cluster; each interval is described by the
        // cluster holding most of its samples.
        int[] clusterAt = new int[s.size()];
        java.util.Arrays.fill(clusterAt, -1);
        boolean[] flagged = new boolean[s.size()];
        for (int k = 0; k < labels.length; k++) {
            if (labels[k] > 0 && summaries.get(labels[k]).candidateFault()) {
                flagged[features.sampleIndex()[k]] = true;
                clusterAt[features.sampleIndex()[k]] = labels[k];
            }
        }
        for (IndexRange r : Intervals.runs(flagged, settings.bridgeSamples(), settings.minFindingSamples())) {
            ClusterSummary c = summaries.get(dominant(clusterAt, r, summaries.size()));
            findings.add(finding(name, "fault_cluster", c.label(), r, s, load, c.shifts(), c.causes()));
        }
        times.add(StageTimes.Stage.FINDINGS, System.nanoTime() - t3);
        return new ModeResult(name, true, "", modeSamples, band, features, pca, optics, labels, summaries);
    }

    /** The cluster with most samples in the range (lowest label on a tie). */
    private static int dominant(int[] clusterAt, IndexRange r, int clusters) {
        int[] count = new int[clusters];
        for (int i = r.start(); i < r.end(); i++) {
            if (clusterAt[i] > 0) {
                count[clusterAt[i]]++;
            }
        }
        int best = 1;
        for (int c = 1; c < clusters; c++) {
            if (count[c] > count[best]) {
                best = c;
            }
        }
        return best;
    }

    /** Shifts, direction check, gate and causes of every cluster against cluster 0 (the largest = normal). */
    private static List<ClusterSummary> summarise(String mode, FeatureMatrix f, int[] labels, int count,
                                                  AnalysisSettings settings) {
        List<ClusterSummary> out = new ArrayList<>(count);
        boolean coil = !mode.equals("ventilation");
        int valve = coil ? f.indexOf(mode.equals("cooling") ? "cooling_valve_command" : "heating_valve_command") : -1;
        int discharge = f.indexOf("discharge_air_temperature");
        DirectionCheck.Outcome normalDirection = coil
                ? direction(f, labels, 0, valve, discharge, mode.equals("cooling")) : null;
        for (int c = 0; c < count; c++) {
            int size = 0;
            for (int l : labels) {
                size += l == c ? 1 : 0;
            }
            if (c == 0) {
                out.add(new ClusterSummary(0, size, false, List.of(), normalDirection, List.of()));
                continue;
            }
            List<Shift> shifts = ClusterShifts.of(f, labels, 0, c);
            DirectionCheck.Outcome dir = coil ? direction(f, labels, c, valve, discharge, mode.equals("cooling"))
                    : null;
            boolean significant = false;
            for (int j = 0; j < f.width(); j++) {
                if (!f.health()[j]) {
                    continue;
                }
                significant |= Math.abs(shifts.get(j).value()) >= gate(f.names().get(j), settings);
            }
            // A failed direction check counts only where normal operation passes it: otherwise the check itself
            // cannot tell (e.g. a unit whose valve barely moves).
            boolean directionFault = dir == DirectionCheck.Outcome.FAILS
                    && normalDirection == DirectionCheck.Outcome.AS_EXPECTED;
            boolean candidate = significant || directionFault;
            List<String> causes = candidate
                    ? settings.causes().causes(mode, shifts, directionFault ? dir : null) : List.of();
            out.add(new ClusterSummary(c, size, candidate, shifts, dir, causes));
        }
        return out;
    }

    /**
     * The health columns in units of their gate: a residual of 1.1 K, a valve activity of 2 %/sample and a zone
     * error of 2 K all become 1. This is the standardisation before PCA, by engineering tolerance rather than by
     * each column's own spread: a z-score would blow a column that only holds sensor noise up to the same size as
     * one that holds a fault, and the density contrast OPTICS needs would be lost in the noise.
     */
    static double[][] scaledByGate(FeatureMatrix f, AnalysisSettings settings) {
        List<String> names = f.healthNames();
        double[][] rows = f.healthRows();
        double[] gate = new double[names.size()];
        for (int j = 0; j < gate.length; j++) {
            gate[j] = gate(names.get(j), settings);
        }
        for (double[] row : rows) {
            for (int j = 0; j < row.length; j++) {
                row[j] /= gate[j];
            }
        }
        return rows;
    }

    /** The shift of a health feature that makes a cluster a candidate fault, in the feature's unit. */
    static double gate(String feature, AnalysisSettings settings) {
        return switch (feature) {
            case "valve_activity" -> settings.activityGate();
            case "zone_error" -> settings.zoneErrorGate();
            default -> settings.residualGate();
        };
    }

    private static DirectionCheck.Outcome direction(FeatureMatrix f, int[] labels, int cluster, int valve,
                                                    int discharge, boolean cooling) {
        int size = 0;
        for (int l : labels) {
            size += l == cluster ? 1 : 0;
        }
        double[] v = new double[size];
        double[] d = new double[size];
        int k = 0;
        for (int i = 0; i < labels.length; i++) {
            if (labels[i] == cluster) {
                v[k] = f.rows()[i][valve];
                d[k++] = f.rows()[i][discharge];
            }
        }
        return DirectionCheck.check(v, d, cooling);
    }

    /**
     * Samples in a stretch with at least 3 changes between running modes (cooling, heating, ventilation,
     * simultaneous) within a 2-hour window (8 samples at 15 minutes) while a valve swings by at least
     * {@link #HUNTING_ACTIVITY} percent per sample on average: the unit hunts. Changes are counted on the modes
     * before settling, and a fan starting or stopping (to or from off) is not a change, so unoccupied fan cycling
     * never counts; the swing condition keeps a valve that settles near the open threshold (flipping between
     * fan-only and cooling at low load) from counting (common practice, no source).
     */
    private static boolean[] hunting(UnitSignals s, FanSignal fanSignal, AnalysisSettings settings) {
        ModeSplit raw = classify(s, fanSignal, settings.modeThresholds().withSettlingSamples(0));
        byte[] codes = raw.codes();
        boolean[] changed = new boolean[codes.length];
        for (int i = 1; i < codes.length; i++) {
            OperatingMode m = OperatingMode.ofCode(codes[i]);
            OperatingMode previous = OperatingMode.ofCode(codes[i - 1]);
            changed[i] = m != previous && running(m) && running(previous);
        }
        boolean[] flags = ModeHunting.flags(changed, 4, 3);
        double[] cooling = ValveActivity.of(s.coolingValveCommand(), ModeFeatures.ACTIVITY_HALF_WINDOW);
        double[] heating = ValveActivity.of(s.heatingValveCommand(), ModeFeatures.ACTIVITY_HALF_WINDOW);
        for (int i = 0; i < flags.length; i++) {
            double swing = Math.max(Double.isNaN(cooling[i]) ? 0 : cooling[i], Double.isNaN(heating[i]) ? 0 : heating[i]);
            flags[i] &= swing >= HUNTING_ACTIVITY;
        }
        return flags;
    }

    /**
     * The mode energy-balance rules ({@link BalanceRules}) on the discharge and zone temperatures, each sample
     * smoothed by the same running median as the features so a spike cannot fail a rule. Tolerance: twice the
     * residual gate (two sensors, each within about 1.1 K) in ventilation, once in heating and cooling, where the
     * coil drives the difference well past it.
     */
    private static List<Finding> balanceFindings(ModeSplit modes, UnitSignals s, double[] load,
                                                 AnalysisSettings settings) {
        if (!UnitSignals.present(s.dischargeAirTemperature()) || !UnitSignals.present(s.zoneAirTemperature())) {
            return List.of();
        }
        List<Finding> out = new ArrayList<>();
        double eps = settings.residualGate();
        record Rule(OperatingMode mode, String kind, double tolerance) {
        }
        for (Rule rule : List.of(new Rule(OperatingMode.HEATING, "heating_without_heat", eps),
                new Rule(OperatingMode.COOLING, "cooling_without_cooling", eps),
                new Rule(OperatingMode.VENTILATION, "ventilation_offset", 2 * eps))) {
            boolean[] in = modes.mask(rule.mode());
            int n = 0;
            for (boolean b : in) {
                n += b ? 1 : 0;
            }
            int[] idx = new int[n];
            double[] difference = new double[n];
            int k = 0;
            for (int i = 0; i < in.length; i++) {
                if (in[i]) {
                    idx[k] = i;
                    difference[k++] = s.dischargeAirTemperature()[i] - s.zoneAirTemperature()[i];
                }
            }
            double[] smooth = org.tufa.analysis.features.RollingMedian.of(difference, 2);
            boolean[] failed = new boolean[in.length];
            for (int j = 0; j < n; j++) {
                double d = smooth[j];
                if (Double.isNaN(d)) {
                    continue;
                }
                failed[idx[j]] = switch (rule.mode()) {
                    case HEATING -> BalanceRules.heatingWithoutHeat(0, d, rule.tolerance());
                    case COOLING -> BalanceRules.coolingWithoutCooling(0, d, rule.tolerance());
                    default -> BalanceRules.ventilationOffset(0, d, rule.tolerance());
                };
            }
            String mode = rule.mode().label();
            for (IndexRange r : Intervals.runs(failed, settings.bridgeSamples(), settings.minFindingSamples())) {
                out.add(finding(mode, rule.kind(), -1, r, s, load, List.of(),
                        settings.causes().causes(rule.kind(), List.of(), null)));
            }
        }
        return out;
    }

    /**
     * Modes per sample. A valve the unit has no command for counts as shut, so the other coil's modes are still
     * found (the fleet runner notes it); but "both valves shut" cannot be known then, so what would be ventilation
     * becomes no_data: a real cooling valve, open and unseen, must not pass for fan-only operation.
     */
    private static ModeSplit classify(UnitSignals s, FanSignal fanSignal, ModeThresholds thresholds) {
        boolean fan = fanSignal != FanSignal.NONE && UnitSignals.present(s.fanFraction());
        boolean cooling = UnitSignals.present(s.coolingValveCommand());
        boolean heating = UnitSignals.present(s.heatingValveCommand());
        ModeSplit split = OperatingModes.classify(fan ? s.fanFraction() : null, fan ? fanSignal : FanSignal.NONE,
                cooling ? s.coolingValveCommand() : null, heating ? s.heatingValveCommand() : null, thresholds);
        if (cooling && heating) {
            return split;
        }
        byte[] codes = split.codes().clone();
        int[] counts = split.counts().clone();
        for (int i = 0; i < codes.length; i++) {
            if (codes[i] == OperatingMode.VENTILATION.code()) {
                codes[i] = OperatingMode.NO_DATA.code();
                counts[OperatingMode.VENTILATION.code()]--;
                counts[OperatingMode.NO_DATA.code()]++;
            }
        }
        return new ModeSplit(codes, counts, split.fanInferred());
    }

    /** Valve swing (mean absolute change per sample, percent) that makes mode changes hunting. */
    static final double HUNTING_ACTIVITY = 10.0;

    private static boolean running(OperatingMode m) {
        return m == OperatingMode.COOLING || m == OperatingMode.HEATING || m == OperatingMode.VENTILATION
                || m == OperatingMode.SIMULTANEOUS;
    }

    private static List<Finding> ruleFindings(boolean[] flagged, String kind, UnitSignals s, double[] load,
                                              AnalysisSettings settings) {
        List<Finding> out = new ArrayList<>();
        for (IndexRange r : Intervals.runs(flagged, settings.bridgeSamples(), settings.minFindingSamples())) {
            out.add(finding("any", kind, -1, r, s, load, List.of(), settings.causes().causes(kind, List.of(), null)));
        }
        return out;
    }

    private static Finding finding(String mode, String kind, int cluster, IndexRange r, UnitSignals s,
                                   double[] load, List<Shift> shifts, List<String> causes) {
        Duration step = s.interval();
        Instant start = s.time(r.start());
        Instant end = s.time(r.end());
        double hours = Duration.between(start, end).toMillis() / 3_600_000.0;
        double kwh = 0;
        int valid = 0;
        for (int i = r.start(); i < r.end(); i++) {
            if (!Double.isNaN(load[i])) {
                kwh += Math.abs(load[i]) * step.toMillis() / 3_600_000.0;
                valid++;
            }
        }
        return new Finding(mode, kind, cluster, r, start, end, hours, valid == 0 ? Double.NaN : kwh, shifts, causes);
    }

    private static int[] indices(boolean[] keep, boolean[] inMode) {
        int count = 0;
        for (int i = 0; i < keep.length; i++) {
            count += keep[i] && inMode[i] ? 1 : 0;
        }
        int[] idx = new int[count];
        int k = 0;
        for (int i = 0; i < keep.length; i++) {
            if (keep[i] && inMode[i]) {
                idx[k++] = i;
            }
        }
        return idx;
    }
}
