package org.tufa.analysis.fleet;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import org.tufa.analysis.coverage.CoverageSummary;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.decision.FleetDecision;
import org.tufa.analysis.episodes.ChannelEvidence;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.kinds.UnitKind;
import org.tufa.analysis.kinds.UnitKinds;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.review.ReviewStep;
import org.tufa.analysis.review.Verdict;
import org.tufa.analysis.trends.IngestReport;
import org.tufa.analysis.trends.PlausibleRange;
import org.tufa.analysis.trends.ResampledSeries;
import org.tufa.analysis.trends.SeriesKind;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.analysis.trends.TrendSource;
import org.tufa.analysis.trends.TrendStore;

/**
 * Runs the detection on every unit of a fleet, in three phases:
 * <ol>
 *   <li>reads the trends once, then analyses units in parallel; each unit's per-sample files and charts are
 *       written as it finishes ({@link UnitSink#analysed}), and only its small summary and its evidence are kept;</li>
 *   <li>decides every candidate finding at once for the whole fleet ({@link FleetDecision}): against the fleet's
 *       healthy units, the unit's peers and fleet-wide effects, with a false-discovery rate over all tests;</li>
 *   <li>applies the analyst's verdicts, when there is a review ({@link ReviewStep}), then hands each unit its
 *       decided findings ({@link UnitSink#decided}), with its signals prepared again from the trend store when it
 *       has findings to show.</li>
 * </ol>
 * One unit's failure never stops the fleet: it becomes a {@code failed} row. Results are collected in unit order
 * and the decision is made on them in that order, so the outputs are the same bytes whatever the thread count.
 */
public final class FleetAnalysis {

    /** Told after each unit; called from worker threads. */
    @FunctionalInterface
    public interface Progress {
        void unitDone(int done, int total);
    }

    /**
     * The whole run: one outcome per unit of the coverage, in unit order, the fleet-wide findings, the decision's
     * figures and the ingest report.
     */
    public record Result(List<UnitOutcome> units, List<FleetDecision.FleetFinding> fleetFindings,
                         List<FleetDecision.ChannelNull> nulls, int tests, int fleetBelowConfidence,
                         IngestReport ingest, StageTimes times, ReviewStep.Result review) {
        public Result {
            units = List.copyOf(units);
            fleetFindings = List.copyOf(fleetFindings);
            nulls = List.copyOf(nulls);
            review = review == null ? ReviewStep.Result.NONE : review;
        }

        /** A run without a review. */
        public Result(List<UnitOutcome> units, List<FleetDecision.FleetFinding> fleetFindings,
                      List<FleetDecision.ChannelNull> nulls, int tests, int fleetBelowConfidence, IngestReport ingest,
                      StageTimes times) {
            this(units, fleetFindings, nulls, tests, fleetBelowConfidence, ingest, times, null);
        }
    }

    private FleetAnalysis() {
    }

    /** Runs on trend files (CSV, long or wide, plain or gzip, or folders of them). */
    public static Result run(FleetCoverage coverage, List<Path> trends, TimeOptions timeOptions,
                             AnalysisSettings settings, int threads, List<UnitSink> sinks, Progress progress) {
        return run(coverage, TrendStore.opener(trends), timeOptions, settings, List.of(), threads, sinks, progress);
    }

    /**
     * Runs on any trend source: the opener is given the series of every analysable unit, their plausible ranges
     * (from the points' units) and the time options.
     */
    public static Result run(FleetCoverage coverage, TrendSource.Opener trends, TimeOptions timeOptions,
                             AnalysisSettings settings, int threads, List<UnitSink> sinks, Progress progress) {
        return run(coverage, trends, timeOptions, settings, List.of(), threads, sinks, progress);
    }

    /** @param verdicts the analyst's verdicts on an earlier run's findings (empty: no review) */
    public static Result run(FleetCoverage coverage, TrendSource.Opener trends, TimeOptions timeOptions,
                             AnalysisSettings settings, List<Verdict> verdicts, int threads, List<UnitSink> sinks,
                             Progress progress) {
        StageTimes times = new StageTimes();
        List<UnitCoverage> units = new ArrayList<>(coverage.units());
        units.sort(java.util.Comparator.comparing(UnitCoverage::unit));
        Map<String, UnitInputs> inputs = new LinkedHashMap<>();
        Map<String, SeriesKind> wanted = new java.util.TreeMap<>();
        Map<String, PlausibleRange> ranges = new java.util.TreeMap<>();
        for (UnitCoverage u : units) {
            UnitInputs in = UnitInputs.of(u, UnitKinds.of(u.unitKind()).orElse(null), settings.defaultAirflow());
            inputs.put(u.unit(), in);
            if (u.analyzable() && detects(u)) {
                wanted.putAll(in.seriesKinds());
                in.points().values().forEach(p -> PlausibleRange.forUnit(p.unitOfMeasureIri())
                        .ifPresent(r -> ranges.putIfAbsent(p.timeseriesId(), r)));
            }
        }
        long t0 = System.nanoTime();
        try (TrendSource store = trends.open(wanted, ranges, timeOptions)) {
            times.add(StageTimes.Stage.READ, System.nanoTime() - t0);
            FolderNames names = new FolderNames();
            List<String> folders = new ArrayList<>();
            for (UnitCoverage u : units) {
                folders.add(names.next(u.unit()));
            }
            ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, threads), r -> {
                Thread t = new Thread(r, "tufa-unit");
                t.setDaemon(true);
                return t;
            });
            AtomicInteger done = new AtomicInteger();
            try {
                List<Future<Kept>> futures = new ArrayList<>();
                for (int k = 0; k < units.size(); k++) {
                    UnitCoverage u = units.get(k);
                    String folder = folders.get(k);
                    futures.add(pool.submit(() -> {
                        Analysed a = analyse(coverage, u, inputs.get(u.unit()), folder, store, settings, times);
                        UnitOutcome o = a.outcome();
                        long w = System.nanoTime();
                        for (UnitSink sink : sinks) {
                            sink.analysed(o, a.signals());
                        }
                        times.add(StageTimes.Stage.WRITE, System.nanoTime() - w);
                        progress.unitDone(done.incrementAndGet(), units.size());
                        List<ChannelEvidence> evidence = o.result() != null && o.status().equals(UnitOutcome.ANALYZED)
                                ? o.result().evidence() : null;
                        return new Kept(o.withoutDetail(), evidence);
                    }));
                }
                List<Kept> kept = new ArrayList<>(units.size());
                for (Future<Kept> f : futures) {
                    kept.add(f.get());
                }
                long t1 = System.nanoTime();
                FleetDecision.Decision decision = decide(kept, inputs, settings);
                ReviewStep.Result review = ReviewStep.apply(decision.findings(), verdicts);
                times.add(StageTimes.Stage.DECISION, System.nanoTime() - t1);
                double min = settings.decision().minConfidence();
                List<Future<UnitOutcome>> finals = new ArrayList<>();
                for (Kept k : kept) {
                    UnitOutcome o = k.outcome();
                    ReviewStep.UnitReview reviewed = review.unit(o.unit(),
                            decision.findings().getOrDefault(o.unit(), List.of()));
                    finals.add(pool.submit(() -> complete(o, reviewed, min, inputs.get(o.unit()), store, sinks,
                            times)));
                }
                List<UnitOutcome> outcomes = new ArrayList<>(units.size());
                for (Future<UnitOutcome> f : finals) {
                    outcomes.add(f.get());
                }
                List<FleetDecision.FleetFinding> fleet = decision.fleet().stream()
                        .filter(f -> f.finding().confidence() >= min).toList();
                return new Result(outcomes, fleet, decision.nulls(), decision.tests(),
                        decision.fleet().size() - fleet.size(), store.report(), times, review);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("interrupted", e);
            } catch (ExecutionException e) {
                // Only the file writer can fail here (analysis failures become rows); pass its error on.
                if (e.getCause() instanceof RuntimeException re) {
                    throw re;
                }
                throw new IllegalStateException(e.getCause());
            } finally {
                pool.shutdownNow();
            }
        }
    }

    /** What the fleet keeps of a unit between the phases. */
    private record Kept(UnitOutcome outcome, List<ChannelEvidence> evidence) {
    }

    /**
     * Phase 3 for one unit: its decided findings after the review (a confirmed finding is listed whatever its
     * confidence), its signals again when it has some, the sinks.
     */
    private static UnitOutcome complete(UnitOutcome o, ReviewStep.UnitReview reviewed, double minConfidence,
                                        UnitInputs in, TrendSource store, List<UnitSink> sinks, StageTimes times) {
        List<Finding> decided = reviewed.findings();
        List<Finding> listed = decided.stream().filter(f -> f.confidence() >= minConfidence
                || reviewed.confirmed(org.tufa.analysis.review.FindingIds.of(o.unit(), f))).toList();
        int below = decided.size() - listed.size();
        List<String> notes = new ArrayList<>();
        if (o.summary() != null) {
            for (ModeSummary m : o.summary().modes()) {
                if (m.analyzed() && !m.dominantRegime()) {
                    notes.add(String.format(java.util.Locale.ROOT, "%s: no dominant regime (the normal reference "
                            + "holds %.0f %% of the clustered samples, less than half), so no cluster findings in "
                            + "this mode", m.mode(), 100 * m.referenceShare()));
                }
            }
        }
        notes.addAll(reviewed.notes());
        UnitSignals signals = null;
        double[] load = null;
        if (!listed.isEmpty()) {
            long t0 = System.nanoTime();
            signals = prepare(in, store).signals();
            load = in.kind().load(signals);
            times.add(StageTimes.Stage.RESAMPLE, System.nanoTime() - t0);
        }
        UnitOutcome done = o.decided(listed, below, notes, load, reviewed);
        long w = System.nanoTime();
        for (UnitSink sink : sinks) {
            sink.decided(done, signals, load);
        }
        times.add(StageTimes.Stage.WRITE, System.nanoTime() - w);
        return done;
    }

    private static SignalPreparation.Prepared prepare(UnitInputs in, TrendSource store) {
        return prepare(in, store.read(in.seriesKinds().keySet()), store);
    }

    private static SignalPreparation.Prepared prepare(UnitInputs in, Map<String, ResampledSeries> series,
                                                      TrendSource store) {
        return SignalPreparation.prepare(in, id -> Optional.ofNullable(series.get(id)), store.gridStart(),
                store.interval(), store.gridLength());
    }

    /** Whether this version has a detection for the unit's kind ({@link UnitKinds}). */
    private static boolean detects(UnitCoverage u) {
        return UnitKinds.of(u.unitKind()).isPresent();
    }

    /**
     * The fleet decision, for each kind of unit apart: a kind's channels and its units' normal levels mean
     * something only among units of that kind (a VAV box's zone error in cooling is not a fan coil unit's), and
     * its peer and fleet findings take their causes from its part of the cause table. The false-discovery rate is
     * therefore controlled per kind.
     */
    private static FleetDecision.Decision decide(List<Kept> kept, Map<String, UnitInputs> inputs,
                                                 AnalysisSettings settings) {
        Map<String, List<FleetDecision.UnitEvidence>> byKind = new java.util.TreeMap<>();
        for (Kept k : kept) {
            if (k.evidence() != null) {
                byKind.computeIfAbsent(inputs.get(k.outcome().unit()).kind().name(), x -> new ArrayList<>())
                        .add(new FleetDecision.UnitEvidence(k.outcome().unit(), k.evidence()));
            }
        }
        List<FleetDecision.Decision> decisions = new ArrayList<>();
        List<String> prefixes = new ArrayList<>();
        for (UnitKind kind : UnitKinds.ALL) {
            List<FleetDecision.UnitEvidence> evidence = byKind.get(kind.name());
            if (evidence != null) {
                decisions.add(FleetDecision.fit(evidence, settings.decision(), kind.causes(settings),
                        settings.dayZone(), settings.maxEpisodeWindowDays()));
                prefixes.add(kind.channelPrefix());
            }
        }
        return FleetDecision.merge(decisions, prefixes);
    }

    /** An outcome with the signals it was computed from (null when the unit was not analysed). */
    private record Analysed(UnitOutcome outcome, UnitSignals signals) {
    }

    private static Analysed analyse(FleetCoverage coverage, UnitCoverage u, UnitInputs in, String folder,
                                    TrendSource store, AnalysisSettings settings, StageTimes times) {
        if (!u.analyzable()) {
            return new Analysed(new UnitOutcome(u.unit(), u.label(), folder, UnitOutcome.SKIPPED,
                    CoverageSummary.reason(coverage, u), List.of(), null), null);
        }
        if (!detects(u)) {
            return new Analysed(new UnitOutcome(u.unit(), u.label(), folder, UnitOutcome.SKIPPED,
                    "no detection for units of kind " + u.unitKind() + " in this version (coverage: analysable with"
                            + " profile " + u.profileName() + ")", List.of(), null), null);
        }
        // Outside the try: a source that cannot be read (a database gone away, a value that is not a number) stops
        // the run with its one-line error instead of failing unit after unit.
        long t0 = System.nanoTime();
        Map<String, ResampledSeries> series = store.read(in.seriesKinds().keySet());
        try {
            SignalPreparation.Prepared p = prepare(in, series, store);
            times.add(StageTimes.Stage.RESAMPLE, System.nanoTime() - t0);
            UnitSignals s = p.signals();
            String unanalysable = in.kind().unanalysable(s);
            if (unanalysable != null) {
                return new Analysed(new UnitOutcome(u.unit(), u.label(), folder, UnitOutcome.SKIPPED,
                        unanalysable, p.notes(), null), null);
            }
            UnitAnalysis.Result r = UnitAnalysis.run(in.kind(), s, settings, times);
            List<String> notes = new ArrayList<>(p.notes());
            notes.addAll(in.kind().notes(in.points(), in.airflowFromModel(), settings));
            if (r.modeResults().stream().noneMatch(ModeResult::analyzed)) {
                String why = String.join("; ", r.modeResults().stream().map(m -> m.mode() + ": " + m.reason())
                        .toList());
                return new Analysed(new UnitOutcome(u.unit(), u.label(), folder, UnitOutcome.SKIPPED,
                        "no mode could be clustered (" + why + ")", notes, r), s);
            }
            return new Analysed(new UnitOutcome(u.unit(), u.label(), folder, UnitOutcome.ANALYZED, "", notes, r), s);
        } catch (RuntimeException e) {
            String msg = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
            return new Analysed(new UnitOutcome(u.unit(), u.label(), folder, UnitOutcome.FAILED,
                    msg.lines().findFirst().orElse(""), List.of(), null), null);
        }
    }
}
