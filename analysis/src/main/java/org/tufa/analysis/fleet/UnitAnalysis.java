package org.tufa.analysis.fleet;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.tufa.analysis.band.LoadBand;
import org.tufa.analysis.cluster.AutoClusters;
import org.tufa.analysis.cluster.ComponentRule;
import org.tufa.analysis.cluster.Extraction;
import org.tufa.analysis.cluster.Optics;
import org.tufa.analysis.cluster.OpticsResult;
import org.tufa.analysis.cluster.Pca;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.episodes.ChannelEvidence;
import org.tufa.analysis.episodes.DayChannel;
import org.tufa.analysis.episodes.DayIndex;
import org.tufa.analysis.episodes.UsualHours;
import org.tufa.analysis.episodes.Episode;
import org.tufa.analysis.episodes.EpisodeFinder;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.ModeFeatures;
import org.tufa.analysis.features.RollingMedian;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.features.ValveActivity;
import org.tufa.analysis.findings.BalanceRules;
import org.tufa.analysis.findings.ClusterShifts;
import org.tufa.analysis.findings.ClusterSummary;
import org.tufa.analysis.findings.DirectionCheck;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.IndexRange;
import org.tufa.analysis.findings.ModeHunting;
import org.tufa.analysis.findings.NormalReference;
import org.tufa.analysis.findings.Shift;
import org.tufa.analysis.load.SensibleLoad;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.modes.ModeSplit;
import org.tufa.analysis.modes.ModeThresholds;
import org.tufa.analysis.modes.OperatingMode;
import org.tufa.analysis.modes.OperatingModes;
import org.tufa.analysis.significance.ScanStatistic;

/**
 * The detection for one unit: operating modes, load, load band, and per mode features, PCA, OPTICS, clusters and
 * the candidate findings with their evidence. Pure: signals in, an immutable result out; no I/O. Whether a
 * candidate becomes a finding is decided for the whole fleet at once ({@code FleetDecision}), against what the
 * fleet's healthy units do.
 *
 * <p>The clustering follows the published PCA + OPTICS approach (PCA: Jolliffe, Principal Component Analysis,
 * 2002; OPTICS: Ankerst, Breunig, Kriegel and Sander, SIGMOD 1999): per mode, the samples of the unit's normal
 * operation form the bulk, other dense clusters are candidates, noise is ignored. What this class adds, so that it
 * can run unattended on hundreds of units:
 * <ul>
 *   <li>physically informed health features (coil residual, ventilation discharge offset, valve activity, zone
 *       error; {@link ModeFeatures}) so that a fault separates from a change of load;</li>
 *   <li>a normal reference that is the unit's normal operation: the largest cluster together with every cluster
 *       whose health features agree with it within the engineering gate (other regimes of normal operation, such
 *       as high and low load); when it holds less than half of the mode's samples the mode has no dominant regime
 *       and raises no cluster findings;</li>
 *   <li>days as the unit of persistence ({@link DayChannel}, {@link EpisodeFinder}): a candidate cluster counts
 *       only on days it dominates, and only where those days stray from the unit's own normal days by more than
 *       the engineering gate and by several day-to-day spreads; consecutive such days form one episode, one
 *       candidate finding;</li>
 *   <li>rule-based evidence under the same discipline: simultaneous heating and cooling, hunting and the
 *       energy-balance rules are shares of each day's samples, compared with the unit's own normal days.</li>
 * </ul>
 * Samples outside the load band are not clustered (the published method), and their count stays in the mode's
 * summary.
 */
public final class UnitAnalysis {

    /** Everything the detection produced for one unit. */
    public record Result(Instant gridStart, Duration interval, ModeSplit modes, double[] loadKw, byte[] bandState,
                         List<ModeResult> modeResults, List<Finding> findings, List<ChannelEvidence> evidence) {
        /** {@link #bandState} values: not applicable, inside the band, outside the band. */
        public static final byte NOT_APPLICABLE = 0;
        public static final byte IN_BAND = 1;
        public static final byte OUT_OF_BAND = 2;

        public Result {
            modeResults = List.copyOf(modeResults);
            findings = List.copyOf(findings);
            evidence = List.copyOf(evidence);
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
        double[] load = load(s, fanSignal, nominalAirflow);
        int[] day = DayIndex.of(s.gridStart(), s.interval(), n, settings.dayZone());
        Context cx = new Context(s, load, day, settings);
        byte[] bandState = new byte[n];
        List<ModeResult> results = new ArrayList<>();
        List<ChannelEvidence> evidence = new ArrayList<>();

        boolean[] running = running(modes);
        // Both valves open together and the energy-balance rules are faults by physics whatever the unit's own days
        // say; how often a unit changes mode depends on its control, so hunting is judged against its own days.
        evidence.add(cx.rule("any", "simultaneous_heating_cooling", running,
                modes.mask(OperatingMode.SIMULTANEOUS), RULE_MIN_SHARE, 0));
        evidence.add(cx.rule("any", "mode_hunting", running, hunting(s, fanSignal, settings), RULE_MIN_SHARE,
                Double.NaN));
        evidence.addAll(balanceEvidence(modes, cx));
        evidence.add(outsideUsualHours(modes, running, day, cx));
        for (String mode : ModeFeatures.CLUSTERED_MODES) {
            OperatingMode m = OperatingMode.valueOf(mode.toUpperCase(Locale.ROOT));
            results.add(mode(mode, m, modes, bandState, evidence, cx, times));
        }
        evidence.removeIf(e -> e == null);
        List<Finding> findings = new ArrayList<>();
        for (ChannelEvidence e : evidence) {
            e.candidates().forEach(c -> findings.add(c.finding()));
        }
        findings.sort(FINDING_ORDER);
        return new Result(s.gridStart(), s.interval(), modes, load, bandState, results, findings, evidence);
    }

    /** The unit's air-side sensible load per sample, kW ({@link SensibleLoad}). */
    public static double[] load(UnitSignals s, FanSignal fanSignal, double nominalAirflow) {
        double[] fan = s.fanFraction();
        if (fanSignal == FanSignal.NONE || !UnitSignals.present(s.fanFraction())) {
            // Without a fan signal the fan counts as running whenever the unit is in a coil mode (inferred).
            fan = new double[s.size()];
            Arrays.fill(fan, 1.0);
        }
        return SensibleLoad.kilowatts(nominalAirflow, fan, s.zoneAirTemperature(), s.dischargeAirTemperature());
    }

    /** Findings in time order, then mode, kind and cluster: a total order, so outputs are deterministic. */
    public static final Comparator<Finding> FINDING_ORDER = Comparator.comparing((Finding f) -> f.range().start())
            .thenComparing(Finding::mode).thenComparing(Finding::kind).thenComparingInt(Finding::cluster)
            .thenComparingInt(f -> f.range().end());

    /** Share of a day's eligible samples a rule must flag on a fault day (common practice, no source). */
    static final double RULE_MIN_SHARE = 0.25;
    /** A rule's share must exceed the unit's normal share by this much on a fault day (common practice, no source). */
    static final double RULE_GATE = 0.2;
    /** Smallest day-to-day spread of a rule's share: one sample in twenty (common practice, no source). */
    static final double SHARE_FLOOR = 0.05;
    /** Share of a mode's informative days that must be days of normal operation for the mode to have a dominant regime. */
    static final double MIN_REFERENCE_SHARE = 0.5;

    /** The inputs every channel of one unit needs. */
    private record Context(UnitSignals s, double[] load, int[] day, AnalysisSettings settings) {

        int minDaySamples() {
            long perHour = Math.max(1, Math.round(3_600_000.0 / Math.max(1, s.interval().toMillis())));
            return (int) Math.max(4, perHour);
        }

        EpisodeFinder.Parameters parameters(double gate, double minShare) {
            return new EpisodeFinder.Parameters(settings.minDayDeviation(), gate, minShare, 1, 4,
                    settings.maxEpisodeWindowDays(), settings.minEpisodeDays());
        }

        /**
         * A rule channel: the share of the day's eligible samples that the rule flags, against the unit's own normal
         * days, or against a share known from physics ({@code normalShare}, NaN for the unit's own).
         */
        ChannelEvidence rule(String mode, String kind, boolean[] eligible, boolean[] flagged, double minShare,
                             double normalShare) {
            int[] rows = indices(eligible);
            if (rows.length == 0) {
                return null;
            }
            int[] dayOfRow = new int[rows.length];
            boolean[] flags = new boolean[rows.length];
            for (int k = 0; k < rows.length; k++) {
                dayOfRow[k] = day[rows[k]];
                flags[k] = flagged[rows[k]];
            }
            DayChannel c = Double.isNaN(normalShare)
                    ? DayChannel.ofShares(kind, dayOfRow, flags, minDaySamples(), SHARE_FLOOR)
                    : DayChannel.ofSharesAgainst(normalShare, kind, dayOfRow, flags, minDaySamples(), SHARE_FLOOR);
            if (c.size() == 0) {
                return null;
            }
            List<ChannelEvidence.Candidate> candidates = new ArrayList<>();
            for (Episode e : EpisodeFinder.find(c, parameters(RULE_GATE, minShare))) {
                IndexRange r = rangeOf(rows, flags, dayOfRow, e.firstDay(), e.lastDay());
                if (r == null) {
                    continue;
                }
                String text = String.format(Locale.ROOT, "%s on %.0f %% of the samples on %d day(s), against %.0f %%"
                        + " on the unit's normal days", kind, 100 * e.meanValue(), e.faultDays(),
                        100 * e.meanNormal());
                candidates.add(new ChannelEvidence.Candidate(e, finding(mode, kind, -1, r, List.of(),
                        settings.causes().causes(kind, List.of(), null)).withEvidence(text)));
            }
            return evidence(mode, c, "share", RULE_GATE, rows, candidates);
        }

        ChannelEvidence evidence(String mode, DayChannel c, String unit, double gate, int[] rows,
                                 List<ChannelEvidence.Candidate> candidates) {
            return evidence(mode, c, c.center(), c.spread(), unit, gate, rows, candidates);
        }

        /** A channel with its normal level in engineering units given apart (share channels of a feature). */
        ChannelEvidence evidence(String mode, DayChannel c, double level, double levelSpread, String unit,
                                 double gate, int[] rows, List<ChannelEvidence.Candidate> candidates) {
            double scan = ScanStatistic.max(c.z(), settings.maxEpisodeWindowDays());
            IndexRange span = rows.length == 0 ? null : new IndexRange(rows[0], rows[rows.length - 1] + 1);
            Finding spanFinding = span == null ? null : finding(mode, c.channel(), -1, span, List.of(), List.of());
            return new ChannelEvidence(mode, c.channel(), c.direction(), unit, c.center(), c.spread(), level,
                    levelSpread, gate, c.size(), scan, spanFinding, candidates);
        }

        Finding finding(String mode, String kind, int cluster, IndexRange r, List<Shift> shifts, List<String> causes) {
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
            return new Finding(mode, kind, cluster, r, start, end, hours, valid == 0 ? Double.NaN : kwh, shifts,
                    causes);
        }
    }

    /**
     * The grid range from the first to the last flagged row on the days {@code firstDay..lastDay}, or null when no
     * row there is flagged.
     */
    private static IndexRange rangeOf(int[] rows, boolean[] flagged, int[] dayOfRow, int firstDay, int lastDay) {
        int first = -1;
        int last = -1;
        for (int k = 0; k < rows.length; k++) {
            if (dayOfRow[k] >= firstDay && dayOfRow[k] <= lastDay && flagged[k]) {
                if (first < 0) {
                    first = rows[k];
                }
                last = rows[k];
            }
        }
        return first < 0 ? null : new IndexRange(first, last + 1);
    }

    private static ModeResult mode(String name, OperatingMode m, ModeSplit modes, byte[] bandState,
                                   List<ChannelEvidence> evidence, Context cx, StageTimes times) {
        UnitSignals s = cx.s();
        AnalysisSettings settings = cx.settings();
        int modeSamples = modes.count(m);
        String missing = ModeFeatures.missingFor(name, s);
        if (missing != null) {
            return ModeResult.skipped(name, modeSamples, missing);
        }
        if (modeSamples < settings.minModeSamples()) {
            return ModeResult.skipped(name, modeSamples, "only " + modeSamples + " samples in " + name
                    + " (at least " + settings.minModeSamples() + " needed)");
        }
        boolean[] inMode = m == OperatingMode.VENTILATION ? steadyVentilation(modes, s) : modes.mask(m);
        LoadBand band = null;
        boolean[] keep = inMode;
        if (m != OperatingMode.VENTILATION) {
            double[] modeLoad = modes.only(m, cx.load());
            band = LoadBand.fit(modeLoad, settings.band(), settings.bandRuns());
            keep = band.inBand();
            boolean[] eligible = new boolean[modeLoad.length];
            boolean[] above = new boolean[modeLoad.length];
            boolean[] below = new boolean[modeLoad.length];
            for (int i = 0; i < modeLoad.length; i++) {
                if (inMode[i] && !Double.isNaN(modeLoad[i])) {
                    bandState[i] = keep[i] ? Result.IN_BAND : Result.OUT_OF_BAND;
                    eligible[i] = true;
                    above[i] = modeLoad[i] > band.high();
                    below[i] = modeLoad[i] < band.low();
                }
            }
            // Samples outside the band are not clustered (the published method), but days spent mostly outside it
            // are evidence of their own: a failed fan pushes every sample of the day above the band.
            if (settings.band() != org.tufa.analysis.band.BandKind.NONE) {
                evidence.add(cx.rule(name, "out_of_band_high", eligible, above, 0.5, Double.NaN));
                evidence.add(cx.rule(name, "out_of_band_low", eligible, below, 0.5, Double.NaN));
            }
        }
        long t0 = System.nanoTime();
        FeatureMatrix features = ModeFeatures.build(name, s, indices(keep, inMode), modes.mask(m));
        long t1 = System.nanoTime();
        times.add(StageTimes.Stage.FEATURES, t1 - t0);
        if (features.size() < Math.max(settings.minModeSamples() / 2, settings.minPts() + 1)) {
            return ModeResult.skipped(name, modeSamples, "only " + features.size() + " complete samples in "
                    + name + " inside the load band");
        }
        if (everyColumnConstant(features)) {
            // Nothing varies (a frozen sensor or a held value, say): PCA and OPTICS have nothing to separate.
            return ModeResult.skipped(name, modeSamples, "every health feature of " + name + " holds one value ("
                    + String.join(", ", features.healthNames()) + "): a frozen sensor or a held trend value?");
        }
        PcaResult pca = Pca.fit(scaledByGate(features, settings),
                ComponentRule.cumulativeVariance(settings.varianceTarget()), Pca.Scaling.CENTRE_ONLY);
        long t2 = System.nanoTime();
        times.add(StageTimes.Stage.PCA, t2 - t1);
        OpticsResult optics = Optics.fit(pca.scores(), settings.minPts());
        long t3 = System.nanoTime();
        times.add(StageTimes.Stage.OPTICS, t3 - t2);
        AutoClusters clusters = Extraction.auto(optics, settings.extraction());
        double[] weight = dayWeights(features.sampleIndex(), cx.day());
        double[] gates = new double[features.width()];
        for (int j = 0; j < gates.length; j++) {
            gates[j] = gate(features.names().get(j), settings);
        }
        NormalReference normal = NormalReference.fit(features, clusters.labels(), clusters.clusterCount(), weight,
                gates);
        int[] labels = normal.labels();
        boolean[] reference = normal.reference();
        List<ClusterSummary> summaries = summarise(name, features, labels, clusters.clusterCount(),
                normal.referenceCount(), reference, settings);
        double referenceShare = referenceSamples(reference) / (double) labels.length;
        boolean dominant = normalDayShare(reference, labels, features.sampleIndex(), cx) >= MIN_REFERENCE_SHARE;
        evidence.addAll(clusterEvidence(name, features, labels, summaries, reference, dominant, cx));
        times.add(StageTimes.Stage.FINDINGS, System.nanoTime() - t3);
        return new ModeResult(name, true, "", modeSamples, band, features, pca, optics, labels, summaries,
                referenceShare, dominant);
    }

    private static int referenceSamples(boolean[] reference) {
        int n = 0;
        for (boolean r : reference) {
            n += r ? 1 : 0;
        }
        return n;
    }

    /**
     * Share of the mode's informative days that candidate-fault clusters do not dominate (they hold less than half of
     * the day's clustered samples): the days of normal operation. Noise samples count for neither side.
     */
    private static double normalDayShare(boolean[] reference, int[] labels, int[] sampleIndex, Context cx) {
        int days = 0;
        int normal = 0;
        int i = 0;
        int[] day = cx.day();
        while (i < sampleIndex.length) {
            int j = i;
            int clustered = 0;
            int candidate = 0;
            while (j < sampleIndex.length && day[sampleIndex[j]] == day[sampleIndex[i]]) {
                if (labels[j] >= 0) {
                    clustered++;
                    candidate += reference[j] ? 0 : 1;
                }
                j++;
            }
            if (j - i >= cx.minDaySamples()) {
                days++;
                normal += 2 * candidate < clustered || clustered == 0 ? 1 : 0;
            }
            i = j;
        }
        return days == 0 ? 0 : normal / (double) days;
    }

    /**
     * Each row's weight when clusters are sized by days: 1 / (rows of the mode on the row's day), so every day of
     * operation counts once. A fault that keeps a unit running around the clock (a failed fan that never satisfies
     * the zone) gives its days twice the samples of a normal day; counted in samples it could outweigh normal
     * operation, counted in days it cannot unless it lasts most of the record.
     */
    static double[] dayWeights(int[] sampleIndex, int[] day) {
        double[] w = new double[sampleIndex.length];
        int i = 0;
        while (i < sampleIndex.length) {
            int j = i;
            while (j < sampleIndex.length && day[sampleIndex[j]] == day[sampleIndex[i]]) {
                j++;
            }
            for (int k = i; k < j; k++) {
                w[k] = 1.0 / (j - i);
            }
            i = j;
        }
        return w;
    }

    /**
     * The health features of one mode as day channels, and their episodes. Per feature and fault side the day's
     * value is the share of its samples in candidate-fault clusters leaning to that side; a fault day holds an
     * unusual share of them for this unit (against its own normal days, {@link DayChannel}), at least a quarter of
     * the day, and those samples lie past the engineering gate from normal that day. A share rather than the
     * day's median, because many faults show for part of each day only: a leaking heating valve when the cooling
     * valve is nearly shut, a fouled coil at high load.
     */
    private static List<ChannelEvidence> clusterEvidence(String mode, FeatureMatrix f, int[] labels,
                                                         List<ClusterSummary> summaries, boolean[] reference,
                                                         boolean dominant, Context cx) {
        AnalysisSettings settings = cx.settings();
        int n = f.size();
        int[] rows = f.sampleIndex();
        int[] dayOfRow = new int[n];
        for (int k = 0; k < n; k++) {
            dayOfRow[k] = cx.day()[rows[k]];
        }
        List<ChannelEvidence> out = new ArrayList<>();
        for (int j = 0; j < f.width(); j++) {
            if (!f.health()[j]) {
                continue;
            }
            String feature = f.names().get(j);
            double gate = gate(feature, settings);
            double[] column = f.column(j);
            double normalLevel = ClusterShifts.median(f.rows(), reference, j);
            // The feature's own day medians: the unit's normal level and spread, for the comparison with peers.
            DayChannel levels = DayChannel.ofMedians(feature, 1, dayOfRow, column, null, cx.minDaySamples(),
                    floor(feature));
            if (levels.size() == 0) {
                continue;
            }
            for (int dir : faultDirections(feature)) {
                double dayGate = feature.equals("valve_activity") ? Math.max(gate, 0.5 * normalLevel) : gate;
                // Rows in a candidate-fault cluster that leans to this side by at least half the gate: a fault the
                // clustering split into neighbouring clusters still counts whole, and its samples must then pass
                // the whole gate on the day.
                boolean[] side = new boolean[n];
                for (int k = 0; k < n; k++) {
                    int l = labels[k];
                    side[k] = l > 0 && summaries.get(l).candidateFault()
                            && dir * summaries.get(l).shifts().get(j).value() >= 0.5 * gate;
                }
                DayChannel c = DayChannel.ofShares(feature, dayOfRow, side, cx.minDaySamples(), SHARE_FLOOR);
                double[] magnitude = dayMagnitude(c, dayOfRow, side, column, normalLevel, dir);
                List<ChannelEvidence.Candidate> candidates = new ArrayList<>();
                if (dominant) {
                    for (Episode e : EpisodeFinder.find(c, cx.parameters(RULE_GATE, CLUSTER_MIN_SHARE), magnitude,
                            dayGate)) {
                        ChannelEvidence.Candidate cand = clusterCandidate(mode, f, labels, summaries, reference,
                                side, rows, dayOfRow, e, feature, dir, c, cx);
                        if (cand != null) {
                            candidates.add(cand);
                        }
                    }
                }
                DayChannel level = dir > 0 ? levels : levels.flipped();
                out.add(new ChannelEvidence(mode, feature, dir, f.units().get(j), c.center(), c.spread(),
                        normalLevel, level.spread(), dayGate, c.size(),
                        ScanStatistic.max(c.z(), settings.maxEpisodeWindowDays()),
                        cx.finding(mode, feature, -1, new IndexRange(rows[0], rows[n - 1] + 1), List.of(),
                                List.of()), candidates));
            }
        }
        return out;
    }

    /** Share of a day's clustered samples that candidate-fault clusters must hold on a fault day. */
    static final double CLUSTER_MIN_SHARE = 0.25;

    /**
     * Per informative day of a share channel: how far the day's side rows lie from the normal level, fault side
     * positive (the median of the feature over them, minus normal); NaN on days without side rows.
     */
    private static double[] dayMagnitude(DayChannel c, int[] dayOfRow, boolean[] side, double[] column,
                                         double normalLevel, int dir) {
        double[] out = new double[c.size()];
        Arrays.fill(out, Double.NaN);
        double[] buffer = new double[dayOfRow.length];
        int k = 0;
        int i = 0;
        while (i < dayOfRow.length && k < c.size()) {
            int j = i;
            int m = 0;
            while (j < dayOfRow.length && dayOfRow[j] == dayOfRow[i]) {
                if (side[j] && !Double.isNaN(column[j])) {
                    buffer[m++] = column[j];
                }
                j++;
            }
            while (k < c.size() && c.days()[k] < dayOfRow[i]) {
                k++;
            }
            if (k < c.size() && c.days()[k] == dayOfRow[i] && m > 0) {
                Arrays.sort(buffer, 0, m);
                double median = m % 2 == 1 ? buffer[m / 2] : 0.5 * (buffer[m / 2 - 1] + buffer[m / 2]);
                out[k] = dir * (median - normalLevel);
            }
            i = j;
        }
        return out;
    }

    private static ChannelEvidence.Candidate clusterCandidate(String mode, FeatureMatrix f, int[] labels,
                                                             List<ClusterSummary> summaries, boolean[] reference,
                                                             boolean[] side, int[] rows, int[] dayOfRow, Episode e,
                                                             String feature, int dir, DayChannel c, Context cx) {
        IndexRange r = rangeOf(rows, side, dayOfRow, e.firstDay(), e.lastDay());
        if (r == null) {
            return null;
        }
        // The episode's own shift from normal, on medians of its candidate rows against the reference rows.
        boolean[] inEpisode = new boolean[labels.length];
        int[] count = new int[summaries.size()];
        for (int k = 0; k < labels.length; k++) {
            inEpisode[k] = side[k] && dayOfRow[k] >= e.firstDay() && dayOfRow[k] <= e.lastDay();
            if (inEpisode[k]) {
                count[labels[k]]++;
            }
        }
        int cluster = 1;
        for (int l = 1; l < count.length; l++) {
            if (count[l] > count[cluster]) {
                cluster = l;
            }
        }
        List<Shift> shifts = ClusterShifts.of(f, inEpisode, reference);
        DirectionCheck.Outcome direction = summaries.get(cluster).direction();
        boolean directionFault = direction == DirectionCheck.Outcome.FAILS
                && summaries.get(0).direction() == DirectionCheck.Outcome.AS_EXPECTED;
        List<String> causes = cx.settings().causes().causes(mode, shifts, directionFault ? direction : null);
        String unit = f.units().get(f.indexOf(feature));
        String text = String.format(Locale.ROOT, "%s %+.1f %s from normal on %.0f %% of the samples, %d day(s) (%.0f %%"
                        + " on the unit's normal days; %.1f day-to-day spreads)", feature, dir * e.meanShift(),
                unit.equals("degC") ? "K" : unit, 100 * e.meanValue(), e.faultDays(), 100 * e.meanNormal(),
                e.meanZ());
        return new ChannelEvidence.Candidate(e, cx.finding(mode, "fault_cluster", cluster, r, shifts, causes)
                .withEvidence(text));
    }

    /** How long a coil takes to reach the zone's temperature after its valve shuts (common practice, no source). */
    static final Duration COIL_RECOVERY = Duration.ofMinutes(30);

    /**
     * Fan-only samples with both valves commanded shut ({@link #shut}) and at least {@link #COIL_RECOVERY} after the
     * last sample of a coil mode (cooling, heating,
     * simultaneous, or the transition that follows them): before that the water left in the coil and a slow
     * actuator still cool or warm the air, which is normal and no leaking valve (the field practice of dropping
     * the first 15-30 minutes after a mode change; APAR evaluates its rules only in steady state, Schein et al.
     * 2006).
     */
    static boolean[] steadyVentilation(ModeSplit modes, UnitSignals s) {
        Duration interval = s.interval();
        int n = modes.codes().length;
        int recovery = (int) Math.max(1, Math.ceil(COIL_RECOVERY.toMillis() / (double) interval.toMillis()));
        boolean[] out = new boolean[n];
        int sinceCoil = Integer.MAX_VALUE / 2;
        for (int i = 0; i < n; i++) {
            OperatingMode m = modes.at(i);
            boolean coil = m == OperatingMode.COOLING || m == OperatingMode.HEATING
                    || m == OperatingMode.SIMULTANEOUS;
            if (coil) {
                sinceCoil = 0;
            } else if (m == OperatingMode.VENTILATION || m == OperatingMode.TRANSITION) {
                sinceCoil++;
            } else {
                sinceCoil = Integer.MAX_VALUE / 2; // fan off: the coil has time to settle
            }
            out[i] = m == OperatingMode.VENTILATION && sinceCoil > recovery
                    && shut(s.coolingValveCommand()[i]) && shut(s.heatingValveCommand()[i]);
        }
        // Steady state: the discharge temperature holds still from one sample to the next. A polled trend log sees
        // the command only at the log instant; a two-position valve that cycles between instants shows as a
        // discharge jumping by kelvins with the logged command at zero.
        double[] d = s.dischargeAirTemperature();
        boolean[] steady = out.clone();
        for (int i = 0; i < n; i++) {
            if (out[i]) {
                boolean before = i > 0 && Math.abs(d[i] - d[i - 1]) <= STEADY_STEP_K;
                boolean after = i + 1 < n && Math.abs(d[i + 1] - d[i]) <= STEADY_STEP_K;
                steady[i] = before && after;
            }
        }
        return steady;
    }

    /**
     * A valve commanded fully shut: at most half a percent, i.e. zero as a BAS logs commands (to 1 % or 0.01).
     * A command below the open threshold of the modes (5 %) still passes water on most valves (a 2 % command on
     * an equal-percentage valve cools the air by kelvins), so fan-only analysis takes only samples whose valves are
     * commanded shut (common practice, no source). A missing command is a missing valve.
     */
    static boolean shut(double command) {
        return Double.isNaN(command) || command <= SHUT_PERCENT;
    }

    /**
     * Largest change of the discharge temperature between consecutive samples in steady fan-only operation: the
     * 1.1 K sensor tolerance (common practice, no source; APAR's steady-state filter, Schein et al. 2006).
     */
    static final double STEADY_STEP_K = 1.1;

    /** Largest command that counts as fully shut, percent. */
    static final double SHUT_PERCENT = 0.5;

    /** The sides of a health feature that mean a fault: a calmer valve or a cooler zone is no fault. */
    static int[] faultDirections(String feature) {
        return switch (feature) {
            case "valve_activity", "zone_error" -> new int[] {1};
            default -> new int[] {1, -1};
        };
    }

    /**
     * Smallest day-to-day spread of a health feature: about the resolution a BAS logs it with (0.1 K for
     * temperatures, logged at 0.1 degC or 0.1 degF; half a percent per sample for valve activity), so that a very
     * steady unit does not turn a rounding step into a large deviation (common practice, no source).
     */
    static double floor(String feature) {
        return feature.equals("valve_activity") ? 0.5 : 0.15;
    }

    /**
     * Shifts, direction check and gate of every cluster against the normal reference ({@link NormalReference}):
     * clusters of the reference are normal (label 0, the seed, and other regimes of normal operation); another
     * cluster is a candidate fault when it strays from the reference beyond the gate on a health feature, on its
     * fault side, or fails the expected-direction check where the reference passes it.
     */
    private static List<ClusterSummary> summarise(String mode, FeatureMatrix f, int[] labels, int count,
                                                  int referenceCount, boolean[] reference,
                                                  AnalysisSettings settings) {
        List<ClusterSummary> out = new ArrayList<>(count);
        boolean coil = !mode.equals("ventilation");
        int valve = coil ? f.indexOf(mode.equals("cooling") ? "cooling_valve_command" : "heating_valve_command") : -1;
        int discharge = f.indexOf("discharge_air_temperature");
        DirectionCheck.Outcome normalDirection = coil
                ? direction(f, reference, valve, discharge, mode.equals("cooling")) : null;
        for (int c = 0; c < count; c++) {
            boolean[] in = new boolean[labels.length];
            int size = 0;
            for (int k = 0; k < labels.length; k++) {
                in[k] = labels[k] == c;
                size += in[k] ? 1 : 0;
            }
            List<Shift> shifts = c == 0 ? List.of() : ClusterShifts.of(f, in, reference);
            DirectionCheck.Outcome dir = coil ? direction(f, in, valve, discharge, mode.equals("cooling")) : null;
            if (c < referenceCount) {
                out.add(new ClusterSummary(c, size, false, shifts, dir, List.of()));
                continue;
            }
            boolean significant = false;
            for (int j = 0; j < f.width(); j++) {
                if (!f.health()[j]) {
                    continue;
                }
                double gate = gate(f.names().get(j), settings);
                for (int side : faultDirections(f.names().get(j))) {
                    significant |= side * shifts.get(j).value() >= gate;
                }
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
    public static double gate(String feature, AnalysisSettings settings) {
        return switch (feature) {
            case "valve_activity" -> settings.activityGate();
            case "zone_error" -> settings.zoneErrorGate();
            default -> settings.residualGate();
        };
    }

    private static DirectionCheck.Outcome direction(FeatureMatrix f, boolean[] rows, int valve, int discharge,
                                                    boolean cooling) {
        int size = 0;
        for (boolean r : rows) {
            size += r ? 1 : 0;
        }
        double[] v = new double[size];
        double[] d = new double[size];
        int k = 0;
        for (int i = 0; i < rows.length; i++) {
            if (rows[i]) {
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
     * fan-only and cooling at low load) from counting, and only a modulating valve's swing counts
     * ({@link ValveActivity#twoPosition}): a two-position valve cycling on its thermostat is not hunting (common
     * practice, no source).
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
        // Only a modulating valve can hunt: a two-position valve cycles on its thermostat by design.
        boolean coolingModulates = !ValveActivity.twoPosition(s.coolingValveCommand());
        boolean heatingModulates = !ValveActivity.twoPosition(s.heatingValveCommand());
        for (int i = 0; i < flags.length; i++) {
            double swing = Math.max(coolingModulates && !Double.isNaN(cooling[i]) ? cooling[i] : 0,
                    heatingModulates && !Double.isNaN(heating[i]) ? heating[i] : 0);
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
    private static List<ChannelEvidence> balanceEvidence(ModeSplit modes, Context cx) {
        UnitSignals s = cx.s();
        if (!UnitSignals.present(s.dischargeAirTemperature()) || !UnitSignals.present(s.zoneAirTemperature())) {
            return List.of();
        }
        List<ChannelEvidence> out = new ArrayList<>();
        double eps = cx.settings().residualGate();
        record Rule(OperatingMode mode, String kind, double tolerance) {
        }
        for (Rule rule : List.of(new Rule(OperatingMode.HEATING, "heating_without_heat", eps),
                new Rule(OperatingMode.COOLING, "cooling_without_cooling", eps),
                new Rule(OperatingMode.VENTILATION, "ventilation_offset", 2 * eps))) {
            boolean[] in = rule.mode() == OperatingMode.VENTILATION ? steadyVentilation(modes, s)
                    : modes.mask(rule.mode());
            int[] idx = indices(in);
            double[] difference = new double[idx.length];
            for (int k = 0; k < idx.length; k++) {
                difference[k] = s.dischargeAirTemperature()[idx[k]] - s.zoneAirTemperature()[idx[k]];
            }
            double[] smooth = RollingMedian.of(difference, 2);
            boolean[] eligible = new boolean[in.length];
            boolean[] failed = new boolean[in.length];
            for (int k = 0; k < idx.length; k++) {
                double d = smooth[k];
                if (Double.isNaN(d)) {
                    continue;
                }
                eligible[idx[k]] = true;
                failed[idx[k]] = switch (rule.mode()) {
                    case HEATING -> BalanceRules.heatingWithoutHeat(0, d, rule.tolerance());
                    case COOLING -> BalanceRules.coolingWithoutCooling(0, d, rule.tolerance());
                    default -> BalanceRules.ventilationOffset(0, d, rule.tolerance());
                };
            }
            out.add(cx.rule(rule.mode().label(), rule.kind(), eligible, failed, 0.5, 0));
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

    /**
     * Running in the hours the unit usually does not run ({@link UsualHours}): the share of the day's usually-off
     * samples with the fan running, against the unit's own days (night cycling is some units' normal; judged
     * against them, short runs that follow the weather on every unit at once become fleet-wide findings).
     */
    private static ChannelEvidence outsideUsualHours(ModeSplit modes, boolean[] running, int[] day, Context cx) {
        UnitSignals s = cx.s();
        int[] hour = DayIndex.hourOf(s.gridStart(), s.interval(), s.size(), cx.settings().dayZone());
        boolean[] hasData = new boolean[running.length];
        for (int i = 0; i < hasData.length; i++) {
            hasData[i] = modes.at(i) != OperatingMode.NO_DATA;
        }
        UsualHours usual = UsualHours.fit(day, hour, hasData, running);
        return cx.rule("any", "running_outside_usual_hours", usual.eligible(day, hour, hasData), running,
                RULE_MIN_SHARE, Double.NaN);
    }

    /** Valve swing (mean absolute change per sample, percent) that makes mode changes hunting. */
    static final double HUNTING_ACTIVITY = 10.0;

    private static boolean running(OperatingMode m) {
        return m == OperatingMode.COOLING || m == OperatingMode.HEATING || m == OperatingMode.VENTILATION
                || m == OperatingMode.SIMULTANEOUS;
    }

    /** Samples with the fan running: a running mode, or the transition sample after a change of mode. */
    private static boolean[] running(ModeSplit modes) {
        boolean[] out = new boolean[modes.codes().length];
        for (int i = 0; i < out.length; i++) {
            out[i] = running(modes.at(i)) || modes.at(i) == OperatingMode.TRANSITION;
        }
        return out;
    }

    /** Whether every health feature (the columns PCA sees) holds one value over the mode's samples. */
    private static boolean everyColumnConstant(FeatureMatrix f) {
        double[][] rows = f.healthRows();
        for (int j = 0; j < rows[0].length; j++) {
            double first = rows[0][j];
            for (double[] row : rows) {
                if (row[j] != first) {
                    return false;
                }
            }
        }
        return true;
    }

    private static int[] indices(boolean[] mask) {
        int count = 0;
        for (boolean b : mask) {
            count += b ? 1 : 0;
        }
        int[] idx = new int[count];
        int k = 0;
        for (int i = 0; i < mask.length; i++) {
            if (mask[i]) {
                idx[k++] = i;
            }
        }
        return idx;
    }

    private static int[] indices(boolean[] keep, boolean[] inMode) {
        boolean[] both = new boolean[keep.length];
        for (int i = 0; i < keep.length; i++) {
            both[i] = keep[i] && inMode[i];
        }
        return indices(both);
    }
}
