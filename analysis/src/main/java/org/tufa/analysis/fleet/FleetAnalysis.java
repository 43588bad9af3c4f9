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
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.decision.FleetDecision;
import org.tufa.analysis.episodes.ChannelEvidence;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.kinds.UnitKind;
import org.tufa.analysis.kinds.UnitKinds;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.review.ReviewStep;
import org.tufa.analysis.review.Verdict;
import org.tufa.analysis.trends.IngestReport;
import org.tufa.analysis.trends.ResampledSeries;
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
 *
 * <p>Phase 1 is per unit and pure but for its sinks ({@link #analyse}); an engine may run it elsewhere
 * ({@link UnitAnalyser}: the spark module's executors) and hand back each unit's {@link Kept}, and the decision
 * and phase 3 then run here as always, so every engine writes the same files.
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
        return run(coverage, trends, timeOptions, settings, List.of(), threads, sinks, progress, null);
    }

    /** @param verdicts the analyst's verdicts on an earlier run's findings (empty: no review) */
    public static Result run(FleetCoverage coverage, TrendSource.Opener trends, TimeOptions timeOptions,
                             AnalysisSettings settings, List<Verdict> verdicts, int threads, List<UnitSink> sinks,
                             Progress progress) {
        return run(coverage, trends, timeOptions, settings, verdicts, threads, sinks, progress, null);
    }

    /**
     * Analyses the units of a plan (phase 1) somewhere other than this JVM's worker threads: the Spark job's
     * executors. Each unit's outcome is handed to sinks where it is analysed, as {@link UnitSink#analysed} says.
     */
    @FunctionalInterface
    public interface UnitAnalyser {
        /**
         * @param plan        every unit of the run, in run order
         * @param store       the trends as the run read them (the grid every unit must be resampled on)
         * @param timeOptions how the run read them
         * @param times       where to add the stage times measured
         * @return one {@link Kept} per unit of the plan, in the plan's order
         */
        List<Kept> analyse(FleetPlan plan, TrendSource store, TimeOptions timeOptions, AnalysisSettings settings,
                           StageTimes times, Progress progress);
    }

    /**
     * Runs with phase 1 done by {@code analyser} (null: in this JVM's worker threads, like the other overloads);
     * the fleet decision, the review and phase 3 run here, on the trends {@code trends} opens.
     *
     * @param verdicts the analyst's verdicts on an earlier run's findings (empty: no review)
     */
    public static Result run(FleetCoverage coverage, TrendSource.Opener trends, TimeOptions timeOptions,
                             AnalysisSettings settings, List<Verdict> verdicts, int threads, List<UnitSink> sinks,
                             Progress progress, UnitAnalyser analyser) {
        StageTimes times = new StageTimes();
        FleetPlan plan = FleetPlan.of(coverage, settings);
        Map<String, UnitInputs> inputs = new LinkedHashMap<>();
        for (FleetPlan.Unit u : plan.units()) {
            inputs.put(u.unit(), u.inputs());
        }
        long t0 = System.nanoTime();
        try (TrendSource store = trends.open(plan.wanted(), plan.ranges(), timeOptions)) {
            times.add(StageTimes.Stage.READ, System.nanoTime() - t0);
            ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, threads), r -> {
                Thread t = new Thread(r, "tufa-unit");
                t.setDaemon(true);
                return t;
            });
            try {
                List<Kept> kept = analyser != null ? analyser.analyse(plan, store, timeOptions, settings, times,
                        progress)
                        : analyseHere(pool, plan, store, settings, sinks, times, progress);
                if (kept.size() != plan.units().size()) {
                    throw new IllegalStateException("phase 1 returned " + kept.size() + " units of "
                            + plan.units().size());
                }
                long t1 = System.nanoTime();
                FleetDecision.Decision decision = decide(kept, inputs, settings);
                ReviewStep.Result review = ReviewStep.apply(decision.findings(), verdicts);
                times.add(StageTimes.Stage.DECISION, System.nanoTime() - t1);
                double min = settings.decision().minConfidence();
                List<Future<UnitOutcome>> finals = new ArrayList<>();
                for (Kept k : kept) {
                    UnitOutcome o = k.outcome();
                    if (k.sinkState() != null) {
                        for (int i = 0; i < sinks.size(); i++) {
                            sinks.get(i).restore(o.folder(), k.sinkState().get(i));
                        }
                    }
                    ReviewStep.UnitReview reviewed = review.unit(o.unit(),
                            decision.findings().getOrDefault(o.unit(), List.of()));
                    finals.add(pool.submit(() -> complete(o, reviewed, min, inputs.get(o.unit()), store, sinks,
                            times)));
                }
                List<UnitOutcome> outcomes = new ArrayList<>(kept.size());
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
                throw rethrown(e);
            } finally {
                pool.shutdownNow();
            }
        }
    }

    /** Phase 1 in this JVM: one task per unit on the pool, collected in plan order. */
    private static List<Kept> analyseHere(ExecutorService pool, FleetPlan plan, TrendSource store,
                                          AnalysisSettings settings, List<UnitSink> sinks, StageTimes times,
                                          Progress progress) throws InterruptedException, ExecutionException {
        AtomicInteger done = new AtomicInteger();
        int total = plan.units().size();
        List<Future<Kept>> futures = new ArrayList<>();
        for (FleetPlan.Unit u : plan.units()) {
            futures.add(pool.submit(() -> {
                Kept k = analyse(u, store, settings, sinks, times);
                progress.unitDone(done.incrementAndGet(), total);
                return k;
            }));
        }
        List<Kept> kept = new ArrayList<>(total);
        for (Future<Kept> f : futures) {
            kept.add(f.get());
        }
        return kept;
    }

    /**
     * Phase 1 for one unit: its analysis (or its skipped row), handed to the sinks, and what the fleet keeps of it.
     * Pure but for the sinks and the trend source; any engine calls this for every unit.
     *
     * @param store the trends, on the run's grid (not read for a skipped unit)
     * @throws org.tufa.common.InputException when the trend source cannot be read
     */
    public static Kept analyse(FleetPlan.Unit u, TrendSource store, AnalysisSettings settings, List<UnitSink> sinks,
                               StageTimes times) {
        Analysed a = analyse(u, store, settings, times);
        UnitOutcome o = a.outcome();
        long w = System.nanoTime();
        for (UnitSink sink : sinks) {
            sink.analysed(o, a.signals());
        }
        times.add(StageTimes.Stage.WRITE, System.nanoTime() - w);
        List<ChannelEvidence> evidence = o.result() != null && o.status().equals(UnitOutcome.ANALYZED)
                ? o.result().evidence() : null;
        return new Kept(o.withoutDetail(), evidence, null);
    }

    private static RuntimeException rethrown(ExecutionException e) {
        // Only the file writer can fail here (analysis failures become rows); pass its error on.
        if (e.getCause() instanceof RuntimeException re) {
            return re;
        }
        return new IllegalStateException(e.getCause());
    }

    /**
     * What the fleet keeps of a unit between the phases: its outcome without the detailed result, and its channels'
     * evidence for the fleet decision (null unless analysed). Small and serializable.
     */
    public record Kept(UnitOutcome outcome, List<ChannelEvidence> evidence, List<java.io.Serializable> sinkState)
            implements java.io.Serializable {
        public Kept {
            evidence = evidence == null ? null : List.copyOf(evidence);
            sinkState = sinkState == null ? null : java.util.Collections.unmodifiableList(new ArrayList<>(sinkState));
        }

        /**
         * The same with what each sink kept of the unit ({@link UnitSink#carry}), for an engine whose phase 2
         * runs in another process with other instances of the sinks.
         */
        public Kept carried(List<UnitSink> sinks) {
            List<java.io.Serializable> state = new ArrayList<>();
            for (UnitSink s : sinks) {
                state.add(s.carry(outcome.folder()));
            }
            return new Kept(outcome, evidence, state);
        }
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

    private static Analysed analyse(FleetPlan.Unit plan, TrendSource store, AnalysisSettings settings,
                                    StageTimes times) {
        UnitInputs in = plan.inputs();
        String folder = plan.folder();
        if (!plan.analysed()) {
            return new Analysed(new UnitOutcome(in.unit(), in.label(), folder, UnitOutcome.SKIPPED,
                    plan.skipReason(), List.of(), null), null);
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
                return new Analysed(new UnitOutcome(in.unit(), in.label(), folder, UnitOutcome.SKIPPED,
                        unanalysable, p.notes(), null), null);
            }
            UnitAnalysis.Result r = UnitAnalysis.run(in.kind(), s, settings, times);
            List<String> notes = new ArrayList<>(p.notes());
            notes.addAll(in.kind().notes(in.points(), in.airflowFromModel(), settings));
            if (r.modeResults().stream().noneMatch(ModeResult::analyzed)) {
                String why = String.join("; ", r.modeResults().stream().map(m -> m.mode() + ": " + m.reason())
                        .toList());
                return new Analysed(new UnitOutcome(in.unit(), in.label(), folder, UnitOutcome.SKIPPED,
                        "no mode could be clustered (" + why + ")", notes, r), s);
            }
            return new Analysed(new UnitOutcome(in.unit(), in.label(), folder, UnitOutcome.ANALYZED, "", notes, r), s);
        } catch (RuntimeException e) {
            String msg = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
            return new Analysed(new UnitOutcome(in.unit(), in.label(), folder, UnitOutcome.FAILED,
                    msg.lines().findFirst().orElse(""), List.of(), null), null);
        }
    }
}
