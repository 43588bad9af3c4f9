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
import org.tufa.analysis.episodes.Episode;
import org.tufa.analysis.episodes.EpisodeFinder;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.findings.ClusterShifts;
import org.tufa.analysis.findings.ClusterSummary;
import org.tufa.analysis.findings.DirectionCheck;
import org.tufa.analysis.findings.CauseTable;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.IndexRange;
import org.tufa.analysis.findings.NormalReference;
import org.tufa.analysis.findings.Shift;
import org.tufa.analysis.modes.ModeSplit;
import org.tufa.analysis.kinds.HealthFeature;
import org.tufa.analysis.kinds.Masks;
import org.tufa.analysis.kinds.RuleChannel;
import org.tufa.analysis.kinds.UnitKind;
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
 *   <li>physically informed health features, each kind of unit its own ({@link UnitKind#features}: a fan coil
 *       unit's coil residual, ventilation discharge offset, valve activity and zone error; a VAV box's airflow
 *       tracking, damper and discharge features) so that a fault separates from a change of load;</li>
 *   <li>a normal reference that is the unit's normal operation: the largest cluster together with every cluster
 *       whose health features agree with it within the engineering gate (other regimes of normal operation, such
 *       as high and low load); when it holds less than half of the mode's samples the mode has no dominant regime
 *       and raises no cluster findings;</li>
 *   <li>days as the unit of persistence ({@link DayChannel}, {@link EpisodeFinder}): a candidate cluster counts
 *       only on days it dominates, and only where those days stray from the unit's own normal days by more than
 *       the engineering gate and by several day-to-day spreads; consecutive such days form one episode, one
 *       candidate finding;</li>
 *   <li>rule-based evidence under the same discipline ({@link UnitKind#rules}): each rule is a share of each
 *       day's samples, compared with the unit's own normal days or with a share known from physics.</li>
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

    /**
     * The detection for one unit of the given kind.
     *
     * @param kind the kind of unit (from its profile): modes, features, rules, causes
     * @param s    the unit's signals
     */
    public static Result run(UnitKind kind, UnitSignals s, AnalysisSettings settings, StageTimes times) {
        int n = s.size();
        ModeSplit modes = kind.modes(s, settings);
        double[] load = kind.load(s);
        int[] day = DayIndex.of(s.gridStart(), s.interval(), n, settings.dayZone());
        Context cx = new Context(kind, s, load, day, settings, kind.causes(settings));
        byte[] bandState = new byte[n];
        List<ModeResult> results = new ArrayList<>();
        List<ChannelEvidence> evidence = new ArrayList<>();

        for (RuleChannel rule : kind.rules(s, modes, settings)) {
            evidence.add(cx.rule(rule.mode(), rule.name(), rule.eligible(), rule.flagged(), rule.minShare(),
                    rule.normalShare(), rule.comparableAcrossUnits()));
        }
        for (String mode : kind.clusteredModes()) {
            results.add(mode(mode, modes, bandState, evidence, cx, times));
        }
        evidence.removeIf(e -> e == null);
        List<Finding> findings = new ArrayList<>();
        for (ChannelEvidence e : evidence) {
            e.candidates().forEach(c -> findings.add(c.finding()));
        }
        findings.sort(FINDING_ORDER);
        return new Result(s.gridStart(), s.interval(), modes, load, bandState, results, findings, evidence);
    }

    /** Findings in time order, then mode, kind and cluster: a total order, so outputs are deterministic. */
    public static final Comparator<Finding> FINDING_ORDER = Comparator.comparing((Finding f) -> f.range().start())
            .thenComparing(Finding::mode).thenComparing(Finding::kind).thenComparingInt(Finding::cluster)
            .thenComparingInt(f -> f.range().end());

    /** A rule's share must exceed the unit's normal share by this much on a fault day (common practice, no source). */
    static final double RULE_GATE = 0.2;
    /** Smallest day-to-day spread of a rule's share: one sample in twenty (common practice, no source). */
    static final double SHARE_FLOOR = 0.05;
    /** Share of a mode's informative days that must be days of normal operation for the mode to have a dominant regime. */
    static final double MIN_REFERENCE_SHARE = 0.5;

    /** The inputs every channel of one unit needs. */
    private record Context(UnitKind kind, UnitSignals s, double[] load, int[] day, AnalysisSettings settings,
                           CauseTable causes) {

        int minDaySamples() {
            long perHour = Math.max(1, Math.round(3_600_000.0 / Math.max(1, s.interval().toMillis())));
            return (int) Math.max(4, perHour);
        }

        EpisodeFinder.Parameters parameters(double gate, double minShare) {
            return new EpisodeFinder.Parameters(settings.minDayDeviation(), gate, minShare,
                    EpisodeFinder.BRIDGED_DAYS, 4, settings.maxEpisodeWindowDays(), settings.minEpisodeDays());
        }

        /**
         * A rule channel: the share of the day's eligible samples that the rule flags, against the unit's own normal
         * days, or against a share known from physics ({@code normalShare}, NaN for the unit's own). A share
         * that does not mean the same on every unit has no level to compare with peers (NaN).
         */
        ChannelEvidence rule(String mode, String kind, boolean[] eligible, boolean[] flagged, double minShare,
                             double normalShare, boolean comparable) {
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
                        causes.causes(kind, List.of(), null)).withEvidence(text)));
            }
            return evidence(mode, c, comparable ? c.center() : Double.NaN, c.spread(), "share", RULE_GATE, rows,
                    candidates);
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

    private static ModeResult mode(String name, ModeSplit modes, byte[] bandState, List<ChannelEvidence> evidence,
                                   Context cx, StageTimes times) {
        UnitSignals s = cx.s();
        UnitKind kind = cx.kind();
        AnalysisSettings settings = cx.settings();
        boolean[] modeMask = kind.modeSamples(name, modes, s);
        int modeSamples = indices(modeMask).length;
        String missing = kind.missingFor(name, s);
        if (missing != null) {
            return ModeResult.skipped(name, modeSamples, missing);
        }
        if (modeSamples < settings.minModeSamples()) {
            return ModeResult.skipped(name, modeSamples, "only " + modeSamples + " samples in " + name
                    + " (at least " + settings.minModeSamples() + " needed)");
        }
        boolean[] inMode = kind.clusteredSamples(name, modes, s);
        LoadBand band = null;
        boolean[] keep = inMode;
        boolean[] withLoad = null;
        if (kind.bandApplies(name)) {
            double[] modeLoad = ModeSplit.only(modeMask, cx.load());
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
            // The samples featuresOutsideBand judges by their features: in the band (what the models learn from) and
            // beyond it on the side of more heat moved (above a cooling band, below a heating one). Samples on the
            // side of less heat moved are mostly transients (a coil still cold after the valve opened, water not
            // yet arrived) where a steady-state coil curve does not hold; a coil that moves no heat at all is the
            // energy-balance rules' to judge.
            withLoad = new boolean[modeLoad.length];
            int beyond = 0;
            for (int i = 0; i < modeLoad.length; i++) {
                boolean moreHeat = band.q1() + band.q3() >= 0 ? modeLoad[i] > band.high() : modeLoad[i] < band.low();
                withLoad[i] = eligible[i] && (keep[i] || moreHeat);
                beyond += eligible[i] && !keep[i] && moreHeat ? 1 : 0;
            }
            if (beyond == 0) {
                withLoad = null; // nothing beyond the band to judge
            }
            // Samples outside the band are not clustered (the published method), but days spent mostly outside it
            // are evidence of their own: a failed fan pushes every sample of the day above the band.
            if (settings.band() != org.tufa.analysis.band.BandKind.NONE) {
                // The band is the unit's own, so its shares are not compared with peers.
                evidence.add(cx.rule(name, "out_of_band_high", eligible, above, 0.5, Double.NaN, false));
                evidence.add(cx.rule(name, "out_of_band_low", eligible, below, 0.5, Double.NaN, false));
            }
        }
        long t0 = System.nanoTime();
        FeatureMatrix features = kind.features(name, s, indices(keep, inMode), modes);
        FeatureMatrix outside = null;
        if (withLoad != null) {
            int[] all = indices(withLoad);
            boolean[] inBand = new boolean[all.length];
            for (int k = 0; k < all.length; k++) {
                inBand[k] = keep[all[k]];
            }
            outside = kind.featuresOutsideBand(name, s, all, inBand, modes);
        }
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
        PcaResult pca = Pca.fit(scaledByGate(features, kind, settings),
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
            gates[j] = features.health()[j] ? kind.health(features.names().get(j), settings).gate() : Double.NaN;
        }
        NormalReference normal = NormalReference.fit(features, clusters.labels(), clusters.clusterCount(), weight,
                gates);
        int[] labels = normal.labels();
        boolean[] reference = normal.reference();
        List<ClusterSummary> summaries = summarise(name, features, labels, clusters.clusterCount(),
                normal.referenceCount(), reference, cx);
        double referenceShare = referenceSamples(reference) / (double) labels.length;
        boolean dominant = normalDayShare(reference, labels, features.sampleIndex(), cx) >= MIN_REFERENCE_SHARE;
        evidence.addAll(clusterEvidence(name, features, outside, labels, summaries, reference, dominant, cx));
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
     *
     * <p>The mode's samples outside the load band ({@code outside}, null when the kind has none) are not clustered,
     * but count on their day's side, on the fault sides the kind names ({@code UnitKind.sidesOutsideBand}), when
     * they lie past the gate from normal themselves: a failed fan pushes whole days above the band, and those days
     * would otherwise hold no clustered sample at all.
     */
    private static List<ChannelEvidence> clusterEvidence(String mode, FeatureMatrix clustered, FeatureMatrix outside,
                                                         int[] clusteredLabels, List<ClusterSummary> summaries,
                                                         boolean[] clusteredReference, boolean dominant,
                                                         Context cx) {
        AnalysisSettings settings = cx.settings();
        ChannelRows inBand = ChannelRows.of(clustered, null, clusteredLabels, clusteredReference, cx);
        ChannelRows withOutside = outside == null || outside.size() == 0 ? inBand
                : ChannelRows.of(clustered, outside, clusteredLabels, clusteredReference, cx);
        List<ChannelEvidence> out = new ArrayList<>();
        for (int j = 0; j < clustered.width(); j++) {
            if (!clustered.health()[j]) {
                continue;
            }
            String feature = clustered.names().get(j);
            HealthFeature spec = cx.kind().health(feature, settings);
            double gate = spec.gate();
            double normalLevel = ClusterShifts.median(clustered.rows(), clusteredReference, j);
            // The feature's own day medians inside the band: the unit's normal level and spread, for the comparison
            // with peers.
            DayChannel levels = DayChannel.ofMedians(feature, 1, inBand.dayOfRow(), clustered.column(j), null,
                    cx.minDaySamples(), spec.spreadFloor());
            if (levels.size() == 0) {
                continue;
            }
            int[] outsideSides = cx.kind().sidesOutsideBand(feature);
            for (int dir : spec.faultSides()) {
                double dayGate = spec.dayGate(normalLevel);
                ChannelRows r = Arrays.stream(outsideSides).anyMatch(x -> x == dir) ? withOutside : inBand;
                int n = r.f().size();
                double[] column = r.f().column(j);
                // Rows in a candidate-fault cluster that leans to this side by at least half the gate: a fault the
                // clustering split into neighbouring clusters still counts whole, and its samples must then pass
                // the whole gate on the day. A row outside the band has no cluster to lean with: it must pass the
                // whole gate itself.
                boolean[] side = new boolean[n];
                for (int k = 0; k < n; k++) {
                    int l = r.labels()[k];
                    side[k] = r.beyond()[k] ? dir * (column[k] - normalLevel) >= dayGate
                            : l > 0 && summaries.get(l).candidateFault()
                            && dir * summaries.get(l).shifts().get(j).value() >= 0.5 * gate;
                }
                DayChannel c = DayChannel.ofShares(feature, r.dayOfRow(), side, cx.minDaySamples(), SHARE_FLOOR);
                double[] magnitude = dayMagnitude(c, r.dayOfRow(), side, column, normalLevel, dir);
                List<ChannelEvidence.Candidate> candidates = new ArrayList<>();
                if (dominant) {
                    for (Episode e : EpisodeFinder.find(c, cx.parameters(RULE_GATE, CLUSTER_MIN_SHARE), magnitude,
                            dayGate)) {
                        ChannelEvidence.Candidate cand = clusterCandidate(mode, r, summaries, side, e, feature, dir,
                                cx);
                        if (cand != null) {
                            candidates.add(cand);
                        }
                    }
                }
                DayChannel level = dir > 0 ? levels : levels.flipped();
                int[] rows = r.f().sampleIndex();
                out.add(new ChannelEvidence(mode, feature, dir, clustered.units().get(j), c.center(), c.spread(),
                        spec.comparableAcrossUnits() ? normalLevel : Double.NaN, level.spread(), dayGate, c.size(),
                        ScanStatistic.max(c.z(), settings.maxEpisodeWindowDays()),
                        cx.finding(mode, feature, -1, new IndexRange(rows[0], rows[n - 1] + 1), List.of(),
                                List.of()), candidates));
            }
        }
        return out;
    }

    /**
     * The rows one channel of a mode looks at: the clustered rows, and (for a side that judges them) the rows
     * outside the load band, in time order; outside rows carry label -1 and are never reference rows.
     *
     * @param beyond   per row: outside the band
     * @param dayOfRow per row: its day
     */
    private record ChannelRows(FeatureMatrix f, int[] labels, boolean[] reference, boolean[] beyond,
                               int[] dayOfRow) {

        static ChannelRows of(FeatureMatrix clustered, FeatureMatrix outside, int[] labels, boolean[] reference,
                              Context cx) {
            if (outside == null) {
                return new ChannelRows(clustered, labels, reference, new boolean[clustered.size()],
                        daysOf(clustered.sampleIndex(), cx));
            }
            FeatureMatrix.Merged merged = clustered.mergedWith(outside);
            FeatureMatrix f = merged.matrix();
            boolean[] beyond = merged.fromOther();
            int[] allLabels = new int[f.size()];
            boolean[] allReference = new boolean[f.size()];
            int a = 0;
            for (int r = 0; r < f.size(); r++) {
                allLabels[r] = beyond[r] ? -1 : labels[a];
                allReference[r] = !beyond[r] && reference[a];
                a += beyond[r] ? 0 : 1;
            }
            return new ChannelRows(f, allLabels, allReference, beyond, daysOf(f.sampleIndex(), cx));
        }
    }

    private static int[] daysOf(int[] rows, Context cx) {
        int[] out = new int[rows.length];
        for (int k = 0; k < rows.length; k++) {
            out[k] = cx.day()[rows[k]];
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

    private static ChannelEvidence.Candidate clusterCandidate(String mode, ChannelRows channelRows,
                                                             List<ClusterSummary> summaries, boolean[] side,
                                                             Episode e, String feature, int dir, Context cx) {
        FeatureMatrix f = channelRows.f();
        int[] labels = channelRows.labels();
        boolean[] beyond = channelRows.beyond();
        boolean[] reference = channelRows.reference();
        int[] rows = f.sampleIndex();
        int[] dayOfRow = channelRows.dayOfRow();
        IndexRange r = rangeOf(rows, side, dayOfRow, e.firstDay(), e.lastDay());
        if (r == null) {
            return null;
        }
        // The episode's own shift from normal, on medians of its candidate rows against the reference rows.
        boolean[] inEpisode = new boolean[labels.length];
        int[] count = new int[summaries.size()];
        int rowsInEpisode = 0;
        int outsideBand = 0;
        for (int k = 0; k < labels.length; k++) {
            inEpisode[k] = side[k] && dayOfRow[k] >= e.firstDay() && dayOfRow[k] <= e.lastDay();
            if (inEpisode[k]) {
                rowsInEpisode++;
                if (beyond[k]) {
                    outsideBand++;
                } else {
                    count[labels[k]]++;
                }
            }
        }
        // The cluster holding most of the episode's clustered rows; -1 when all of them lie outside the load band.
        int cluster = -1;
        for (int l = 1; l < count.length; l++) {
            if (count[l] > 0 && (cluster < 0 || count[l] > count[cluster])) {
                cluster = l;
            }
        }
        List<Shift> shifts = ClusterShifts.of(f, inEpisode, reference);
        DirectionCheck.Outcome direction = cluster > 0 ? summaries.get(cluster).direction()
                : cx.kind().direction(mode, f, inEpisode);
        boolean directionFault = direction == DirectionCheck.Outcome.FAILS
                && summaries.get(0).direction() == DirectionCheck.Outcome.AS_EXPECTED;
        List<String> causes = cx.causes().causes(mode, shifts, directionFault ? direction : null);
        String unit = f.units().get(f.indexOf(feature));
        String text = String.format(Locale.ROOT, "%s %+.1f %s from normal on %.0f %% of the samples, %d day(s) (%.0f %%"
                        + " on the unit's normal days; %.1f day-to-day spreads)%s", feature, dir * e.meanShift(),
                unit.equals("degC") ? "K" : unit, 100 * e.meanValue(), e.faultDays(), 100 * e.meanNormal(),
                e.meanZ(), outsideBand == 0 ? "" : String.format(Locale.ROOT,
                        "; %d of its %d samples outside the load band", outsideBand, rowsInEpisode));
        return new ChannelEvidence.Candidate(e, cx.finding(mode, "fault_cluster", cluster, r, shifts, causes)
                .withEvidence(text));
    }

    /**
     * Shifts, direction check and gate of every cluster against the normal reference ({@link NormalReference}):
     * clusters of the reference are normal (label 0, the seed, and other regimes of normal operation); another
     * cluster is a candidate fault when it strays from the reference beyond the gate on a health feature, on its
     * fault side, or fails the expected-direction check where the reference passes it.
     */
    private static List<ClusterSummary> summarise(String mode, FeatureMatrix f, int[] labels, int count,
                                                  int referenceCount, boolean[] reference, Context cx) {
        UnitKind kind = cx.kind();
        AnalysisSettings settings = cx.settings();
        List<ClusterSummary> out = new ArrayList<>(count);
        DirectionCheck.Outcome normalDirection = kind.direction(mode, f, reference);
        for (int c = 0; c < count; c++) {
            boolean[] in = new boolean[labels.length];
            int size = 0;
            for (int k = 0; k < labels.length; k++) {
                in[k] = labels[k] == c;
                size += in[k] ? 1 : 0;
            }
            List<Shift> shifts = c == 0 ? List.of() : ClusterShifts.of(f, in, reference);
            DirectionCheck.Outcome dir = kind.direction(mode, f, in);
            if (c < referenceCount) {
                out.add(new ClusterSummary(c, size, false, shifts, dir, List.of()));
                continue;
            }
            boolean significant = false;
            for (int j = 0; j < f.width(); j++) {
                if (!f.health()[j]) {
                    continue;
                }
                HealthFeature spec = kind.health(f.names().get(j), settings);
                for (int side : spec.faultSides()) {
                    significant |= side * shifts.get(j).value() >= spec.gate();
                }
            }
            // A failed direction check counts only where normal operation passes it: otherwise the check itself
            // cannot tell (e.g. a unit whose valve barely moves).
            boolean directionFault = dir == DirectionCheck.Outcome.FAILS
                    && normalDirection == DirectionCheck.Outcome.AS_EXPECTED;
            boolean candidate = significant || directionFault;
            List<String> causes = candidate
                    ? cx.causes().causes(mode, shifts, directionFault ? dir : null) : List.of();
            out.add(new ClusterSummary(c, size, candidate, shifts, dir, causes));
        }
        return out;
    }

    /**
     * The health columns in units of their gate: for a fan coil unit a residual of 1.1 K, a valve activity of
     * 2 %/sample and a zone error of 2 K all become 1. This is the standardisation before PCA, by engineering
     * tolerance rather than by each column's own spread: a z-score would blow a column that only holds sensor noise
     * up to the same size as one that holds a fault, and the density contrast OPTICS needs would be lost in the
     * noise.
     */
    static double[][] scaledByGate(FeatureMatrix f, UnitKind kind, AnalysisSettings settings) {
        List<String> names = f.healthNames();
        double[][] rows = f.healthRows();
        double[] gate = new double[names.size()];
        for (int j = 0; j < gate.length; j++) {
            gate[j] = kind.health(names.get(j), settings).gate();
        }
        for (double[] row : rows) {
            for (int j = 0; j < row.length; j++) {
                row[j] /= gate[j];
            }
        }
        return rows;
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
        return Masks.indices(mask);
    }

    private static int[] indices(boolean[] keep, boolean[] inMode) {
        return Masks.indices(Masks.and(keep, inMode));
    }
}
