package org.tufa.analysis.evaluate;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Scores findings against ground truth, in the spirit of the episode-based detection and false-alarm metrics of
 * Frank S, Lin G, Jin X, et al., "Metrics and methods to assess building fault detection and diagnosis tools",
 * NREL/TP-5500-72801 (2019):
 * <ul>
 * <li>analysable sample: a sample of the unit's modes.csv whose mode is cooling, heating, ventilation or
 * simultaneous; each sample stands for the unit's trend interval ({@link UnitSamples#sampleHours()});</li>
 * <li>flagged sample: an analysable sample covered by the union of all the unit's findings intervals (any kind);</li>
 * <li>episode: a truth row; its analysable and flagged hours count samples with {@code start <= t < end};
 * it is detected when its flagged hours reach {@code minHours};</li>
 * <li>per fault type and over all episodes: episodes, detected, and the pooled share of analysable episode hours
 * flagged;</li>
 * <li>false flags: the share of analysable hours flagged on healthy units (analysed units without any episode).
 * </li>
 * </ul>
 * Episodes on units the analysis skipped or failed (coverage found no discharge sensor, say, or there is no
 * detection for the unit's kind yet) are counted apart as not analysed: no analysis can see them, and the fleet
 * file says why. The detection goal counts the analysed episodes; the table shows the others beside them. When the
 * unit kinds are known, the episodes are also totalled per kind ({@code all_<kind>_faults}), since each kind of
 * unit has its own detection and its own targets.
 */
public final class Evaluation {
    /** Goal: share of analysable fault hours flagged. */
    public static final double GOAL_FLAGGED_SHARE = 0.70;
    /** Goal: share of healthy units with any finding stays at or below this (issue 10). */
    public static final double GOAL_HEALTHY_UNITS_SHARE = 0.05;
    /** Goal: share of healthy-unit analysable hours flagged stays at or below this (issue 10). */
    public static final double GOAL_FALSE_SHARE = 0.01;
    /** Default minimum flagged hours for an episode to count as detected. */
    public static final double DEFAULT_MIN_HOURS = 2.0;

    private Evaluation() {
    }

    /** Score of one truth episode. */
    public record EpisodeScore(TruthEpisode episode, boolean analysed, boolean inWindow, double analysableHours,
            double flaggedHours, boolean detected) {
        public EpisodeScore(TruthEpisode episode, boolean analysed, double analysableHours, double flaggedHours,
                boolean detected) {
            this(episode, analysed, true, analysableHours, flaggedHours, detected);
        }

        /** Whether the episode counts toward the detection goal: on an analysed unit, inside the analysed window. */
        public boolean scored() {
            return analysed && inWindow;
        }
    }

    /** Totals of a group of episodes (one fault type, or all), or of the healthy units (episodes = 0). */
    public record GroupScore(String scope, int units, int episodes, int detected, int notAnalysed, int outsideWindow,
            double analysableHours, double flaggedHours) {
        public GroupScore(String scope, int units, int episodes, int detected, int notAnalysed,
                double analysableHours, double flaggedHours) {
            this(scope, units, episodes, detected, notAnalysed, 0, analysableHours, flaggedHours);
        }

        /** Episodes the detection goal counts: on analysed units and inside the analysed window. */
        public int scoredEpisodes() {
            return episodes - notAnalysed - outsideWindow;
        }

        /** Flagged hours over analysable hours; NaN when there are no analysable hours. */
        public double flaggedShare() {
            return analysableHours > 0 ? flaggedHours / analysableHours : Double.NaN;
        }
    }

    /**
     * The result: per-episode scores (truth order), per-fault groups (sorted by name), all faults, healthy units,
     * and the faults per unit kind (sorted by kind; empty when the kinds are unknown or only one kind has episodes).
     */
    public record Result(double minHours, List<EpisodeScore> episodes, List<GroupScore> byFault, GroupScore allFaults,
            GroupScore healthy, List<GroupScore> byKind, int healthyUnitsWithFindings) {
        public Result {
            byFault = List.copyOf(byFault);
            byKind = List.copyOf(byKind);
        }

        /** Share of the healthy units with at least one flagged analysable sample; NaN without healthy units. */
        public double healthyUnitsShare() {
            return healthy.units() == 0 ? Double.NaN : healthyUnitsWithFindings / (double) healthy.units();
        }

        public boolean healthyUnitsMet() {
            double share = healthyUnitsShare();
            return Double.isNaN(share) || share <= GOAL_HEALTHY_UNITS_SHARE;
        }

        public boolean allDetected() {
            return allFaults.detected() == allFaults.scoredEpisodes();
        }

        public boolean flaggedShareMet() {
            return allFaults.flaggedShare() >= GOAL_FLAGGED_SHARE;
        }

        public boolean falseShareMet() {
            double share = healthy.flaggedShare();
            return Double.isNaN(share) || share <= GOAL_FALSE_SHARE;
        }

        public boolean goalsMet() {
            return allDetected() && flaggedShareMet() && falseShareMet() && healthyUnitsMet();
        }
    }

    /** Computes the scores. */
    public static Result fit(EvaluationInput input, double minHours) {
        if (!(minHours >= 0)) {
            throw new IllegalArgumentException("minimum hours must be >= 0");
        }
        Map<String, FleetUnit> fleet = new TreeMap<>();
        input.fleet().forEach(u -> fleet.put(u.unit(), u));

        List<EpisodeScore> scores = new ArrayList<>();
        for (TruthEpisode e : input.truth()) {
            FleetUnit unit = fleet.get(e.unit());
            UnitSamples samples = input.samplesByUnit().get(e.unit());
            if (unit == null || !unit.analyzed() || samples == null) {
                scores.add(new EpisodeScore(e, false, 0, 0, false));
                continue;
            }
            List<FlaggedInterval> flags = input.findingsByUnit().getOrDefault(e.unit(), List.of());
            double step = samples.sampleHours();
            if (!overlaps(e, samples, step)) {
                // Nothing of it lies in the analysed window: not missed, not seen. Counted apart.
                scores.add(new EpisodeScore(e, true, false, 0, 0, false));
                continue;
            }
            int analysable = 0;
            int flagged = 0;
            for (int i = 0; i < samples.timestamps().size(); i++) {
                Instant t = samples.timestamps().get(i);
                if (e.contains(t) && samples.analysable(i)) {
                    analysable++;
                    if (flagged(flags, t)) {
                        flagged++;
                    }
                }
            }
            double flaggedHours = flagged * step;
            scores.add(new EpisodeScore(e, true, analysable * step, flaggedHours, flaggedHours >= minHours - 1e-9));
        }

        Map<String, List<EpisodeScore>> byFault = new TreeMap<>();
        for (EpisodeScore s : scores) {
            byFault.computeIfAbsent(s.episode().fault(), k -> new ArrayList<>()).add(s);
        }
        List<GroupScore> groups = new ArrayList<>();
        byFault.forEach((fault, list) -> groups.add(group(fault, list)));
        GroupScore all = group("all_faults", scores);

        Set<String> faultyUnits = new TreeSet<>();
        input.truth().forEach(e -> faultyUnits.add(e.unit()));
        int healthyUnits = 0;
        int healthyWithFindings = 0;
        double analysableHours = 0;
        double flaggedHours = 0;
        for (FleetUnit u : input.fleet()) {
            UnitSamples samples = input.samplesByUnit().get(u.unit());
            if (!u.analyzed() || samples == null || faultyUnits.contains(u.unit())) {
                continue;
            }
            healthyUnits++;
            List<FlaggedInterval> flags = input.findingsByUnit().getOrDefault(u.unit(), List.of());
            double step = samples.sampleHours();
            boolean any = false;
            for (int i = 0; i < samples.timestamps().size(); i++) {
                if (samples.analysable(i)) {
                    analysableHours += step;
                    if (flagged(flags, samples.timestamps().get(i))) {
                        flaggedHours += step;
                        any = true;
                    }
                }
            }
            healthyWithFindings += any ? 1 : 0;
        }
        GroupScore healthy = new GroupScore("healthy_units", healthyUnits, 0, 0, 0, analysableHours, flaggedHours);
        Map<String, List<EpisodeScore>> byKind = new TreeMap<>();
        for (EpisodeScore s : scores) {
            String kind = input.unitKinds().get(s.episode().unit());
            if (kind != null && !kind.isEmpty()) {
                byKind.computeIfAbsent(kind, k -> new ArrayList<>()).add(s);
            }
        }
        List<GroupScore> kinds = new ArrayList<>();
        if (byKind.size() > 1) {
            byKind.forEach((kind, list) -> kinds.add(group("all_" + kind + "_faults", list)));
        }
        return new Result(minHours, List.copyOf(scores), List.copyOf(groups), all, healthy, kinds,
                healthyWithFindings);
    }

    private static GroupScore group(String scope, List<EpisodeScore> list) {
        Set<String> units = new TreeSet<>();
        int detected = 0;
        int notAnalysed = 0;
        int outside = 0;
        double analysable = 0;
        double flagged = 0;
        for (EpisodeScore s : list) {
            units.add(s.episode().unit());
            detected += s.detected() ? 1 : 0;
            notAnalysed += s.analysed() ? 0 : 1;
            outside += s.analysed() && !s.inWindow() ? 1 : 0;
            analysable += s.analysableHours();
            flagged += s.flaggedHours();
        }
        return new GroupScore(scope, units.size(), list.size(), detected, notAnalysed, outside, analysable, flagged);
    }

    /** Whether the episode overlaps the unit's samples, each standing for {@code stepHours} from its time. */
    private static boolean overlaps(TruthEpisode e, UnitSamples samples, double stepHours) {
        if (samples.timestamps().isEmpty()) {
            return false;
        }
        Instant first = samples.timestamps().stream().min(Instant::compareTo).orElseThrow();
        Instant last = samples.timestamps().stream().max(Instant::compareTo).orElseThrow()
                .plusSeconds(Math.round(stepHours * 3600));
        return e.start().isBefore(last) && e.end().isAfter(first);
    }

    private static boolean flagged(List<FlaggedInterval> flags, Instant t) {
        for (FlaggedInterval f : flags) {
            if (f.covers(t)) {
                return true;
            }
        }
        return false;
    }
}
