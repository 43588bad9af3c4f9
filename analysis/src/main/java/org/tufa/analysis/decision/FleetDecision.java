package org.tufa.analysis.decision;

import java.time.Instant;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.tufa.analysis.band.Quantiles;
import org.tufa.analysis.episodes.ChannelEvidence;
import org.tufa.analysis.episodes.DayChannel;
import org.tufa.analysis.findings.CauseTable;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.IndexRange;
import org.tufa.analysis.significance.BenjaminiHochberg;
import org.tufa.analysis.significance.FisherCombination;
import org.tufa.analysis.significance.GumbelNull;
import smile.math.special.Erf;

/**
 * The fleet stage: decides which candidate findings of every unit are findings, with what confidence, by comparing
 * each unit with the fleet's healthy units, with its peers and with the fleet as a whole. Pure: evidence in, a
 * decision out.
 *
 * <ol>
 *   <li><b>Null from the fleet.</b> Per channel (mode, feature or rule, fault side) the most unusual stretch
 *       (scan maximum) of every unit is pooled and a Gumbel null is fitted to the centre of the pool (median and
 *       interquartile range, never laxer than the theoretical null; {@link GumbelNull#fit}, after Efron's empirical
 *       null, JASA 2004): how far a healthy unit of this fleet strays at its most unusual. A candidate's p-value is the null's tail probability of its own scan
 *       statistic.</li>
 *   <li><b>Fleet-wide effects.</b> A day on which more units are in an episode of the same channel than
 *       independent faults would explain (at least {@code minFleetUnits}, and a Poisson tail probability below
 *       {@code fleetWideP} given the channel's overall rate of episode days) is a fleet-wide day: something common
 *       to the units (the plant, the weather, a schedule). Episodes lying mostly on fleet-wide days are reported
 *       once, as one fleet finding, and not on every unit.</li>
 *   <li><b>Peers.</b> A unit's normal level on channels with an absolute meaning (discharge offset with the
 *       valves shut, zone error, the share of samples a rule flags) is compared with the other units': a unit
 *       faulty from its first day has the fault as its normal days, and only its peers show it. The comparison
 *       uses the peers' median and scaled MAD (at least their typical day-to-day spread); it counts when it
 *       reaches {@code minPeerDeviation} and the engineering gate.</li>
 *   <li><b>Agreement.</b> A cluster candidate and a rule candidate of the same unit that overlap in time support
 *       each other: each takes the Fisher combination of both p-values when that is smaller
 *       ({@link FisherCombination}).</li>
 *   <li><b>False-discovery rate.</b> All tests of the fleet (every unit channel, every peer comparison, every
 *       fleet-wide episode) go through the Benjamini-Hochberg procedure; a finding's confidence is 1 minus its
 *       q-value ({@link BenjaminiHochberg#adjust}), so among the findings at or above a confidence c the expected
 *       share of false ones is at most 1 - c.</li>
 * </ol>
 */
public final class FleetDecision {

    /** Kind of a peer finding. */
    public static final String PEER_KIND = "differs_from_peers";
    /** Kind of a fleet-wide finding. */
    public static final String FLEET_KIND = "fleet_wide_shift";
    /** The unit column of fleet-wide findings. */
    public static final String FLEET_UNIT = "fleet";

    /** One unit's evidence. */
    public record UnitEvidence(String unit, List<ChannelEvidence> channels) {
        public UnitEvidence {
            channels = List.copyOf(channels);
        }
    }

    /** A finding of the whole fleet and the units it spans. */
    public record FleetFinding(Finding finding, List<String> units) {
        public FleetFinding {
            units = List.copyOf(units);
        }
    }

    /** How one channel's null came out, for run.json and the report. */
    public record ChannelNull(String key, GumbelNull nullDistribution, int units, int candidates) {
    }

    /**
     * The decision.
     *
     * @param findings per unit (in input order), every candidate with its confidence, fleet-wide ones removed
     * @param fleet    the fleet-wide findings
     * @param nulls    the null of every channel, by key
     * @param tests    number of tests the false-discovery rate was controlled over
     */
    public record Decision(Map<String, List<Finding>> findings, List<FleetFinding> fleet, List<ChannelNull> nulls,
                           int tests) {
    }

    /** Fewest informative days a unit's normal level needs before it is compared with its peers'. */
    static final int MIN_PEER_DAYS = 7;

    private FleetDecision() {
    }

    /**
     * @param units     every analysed unit's evidence
     * @param settings  the stage's parameters
     * @param causes    the cause table (peer and fleet findings take their causes from it)
     * @param dayZone   the zone whose midnights separate days
     * @param maxWindow longest scan window, in days
     */
    public static Decision fit(List<UnitEvidence> units, org.tufa.analysis.fleet.AnalysisSettings.DecisionSettings
            settings, CauseTable causes, ZoneId dayZone, int maxWindow) {
        Map<String, List<Slot>> byKey = new TreeMap<>();
        for (int u = 0; u < units.size(); u++) {
            for (ChannelEvidence c : units.get(u).channels()) {
                byKey.computeIfAbsent(c.key(), k -> new ArrayList<>()).add(new Slot(u, c));
            }
        }
        List<Test> tests = new ArrayList<>();
        List<ChannelNull> nulls = new ArrayList<>();
        List<FleetFinding> fleetFindings = new ArrayList<>();
        List<Test> fleetTests = new ArrayList<>();
        for (Map.Entry<String, List<Slot>> e : byKey.entrySet()) {
            List<Slot> slots = e.getValue();
            double[] maxima = slots.stream().mapToDouble(s -> s.channel().scanMax()).toArray();
            int[] days = slots.stream().mapToInt(s -> s.channel().informativeDays()).sorted().toArray();
            int typicalDays = days.length == 0 ? 1 : Math.max(1, days[days.length / 2]);
            GumbelNull nul = GumbelNull.fit(maxima, typicalDays * Math.min(maxWindow, typicalDays));
            int candidateCount = 0;
            List<Test> channelTests = new ArrayList<>();
            for (Slot s : slots) {
                if (s.channel().candidates().isEmpty()) {
                    // The channel was tested and found nothing: it counts as a test all the same.
                    channelTests.add(new Test(s.unit(), s.channel(), null, nul.survival(s.channel().scanMax())));
                }
                for (ChannelEvidence.Candidate c : s.channel().candidates()) {
                    candidateCount++;
                    channelTests.add(new Test(s.unit(), s.channel(), c, nul.survival(c.episode().statistic())));
                }
            }
            nulls.add(new ChannelNull(e.getKey(), nul, slots.size(), candidateCount));
            fleetWide(e.getKey(), slots, channelTests, settings, causes, dayZone, units, fleetFindings, fleetTests);
            tests.addAll(channelTests);
            tests.addAll(peerTests(slots, settings, causes));
        }
        agreement(tests);
        List<Test> all = new ArrayList<>(tests);
        all.addAll(fleetTests);
        all.removeIf(t -> t.folded);
        double[] p = all.stream().mapToDouble(t -> t.p).toArray();
        double[] q = p.length == 0 ? new double[0] : BenjaminiHochberg.adjust(p);
        Map<String, List<Finding>> byUnit = new LinkedHashMap<>();
        units.forEach(u -> byUnit.put(u.unit(), new ArrayList<>()));
        List<FleetFinding> decidedFleet = new ArrayList<>();
        for (int i = 0; i < all.size(); i++) {
            Test t = all.get(i);
            if (t.finding == null) {
                continue;
            }
            double confidence = 1 - q[i];
            String text = t.finding.evidence() + String.format(Locale.ROOT, "; p %.2g%s", t.p,
                    t.agreement.isEmpty() ? "" : "; agrees with " + t.agreement);
            Finding decided = t.finding.decided(text, t.p, confidence);
            if (t.fleetIndex >= 0) {
                decidedFleet.add(new FleetFinding(decided, fleetFindings.get(t.fleetIndex).units()));
            } else {
                byUnit.get(units.get(t.unit).unit()).add(decided);
            }
        }
        byUnit.replaceAll((k, v) -> v.stream().sorted(org.tufa.analysis.fleet.UnitAnalysis.FINDING_ORDER).toList());
        decidedFleet.sort((a, b) -> org.tufa.analysis.fleet.UnitAnalysis.FINDING_ORDER.compare(a.finding(),
                b.finding()));
        return new Decision(byUnit, decidedFleet, nulls, all.size());
    }

    /**
     * Decisions taken apart (one per kind of unit) as one: units' findings side by side, fleet findings in
     * {@code FINDING_ORDER}, nulls in the given order, with each part's channel keys prefixed by its
     * {@code prefixes} entry, and the tests summed.
     */
    public static Decision merge(List<Decision> parts, List<String> prefixes) {
        if (parts.size() != prefixes.size()) {
            throw new IllegalArgumentException(parts.size() + " decisions, " + prefixes.size() + " prefixes");
        }
        Map<String, List<Finding>> findings = new LinkedHashMap<>();
        List<FleetFinding> fleet = new ArrayList<>();
        List<ChannelNull> nulls = new ArrayList<>();
        int tests = 0;
        for (int i = 0; i < parts.size(); i++) {
            Decision d = parts.get(i);
            findings.putAll(d.findings());
            fleet.addAll(d.fleet());
            String prefix = prefixes.get(i);
            d.nulls().forEach(n -> nulls.add(prefix.isEmpty() ? n
                    : new ChannelNull(prefix + n.key(), n.nullDistribution(), n.units(), n.candidates())));
            tests += d.tests();
        }
        fleet.sort((a, b) -> org.tufa.analysis.fleet.UnitAnalysis.FINDING_ORDER.compare(a.finding(), b.finding()));
        return new Decision(findings, fleet, nulls, tests);
    }

    /** One channel of one unit in the pool of its key. */
    private record Slot(int unit, ChannelEvidence channel) {
    }

    /** One hypothesis of the fleet; {@code finding} is what a rejection reports (null: nothing to report). */
    private static final class Test {
        final int unit;
        final ChannelEvidence channel;
        final Finding finding;
        final boolean cluster;
        double p;
        String agreement = "";
        boolean folded;
        int fleetIndex = -1;

        Test(int unit, ChannelEvidence channel, ChannelEvidence.Candidate candidate, double p) {
            this.unit = unit;
            this.channel = channel;
            this.finding = candidate == null ? null : candidate.finding();
            this.cluster = candidate != null && candidate.finding().kind().equals("fault_cluster");
            this.p = p;
        }

        Test(Finding finding, double p, int fleetIndex) {
            this.unit = -1;
            this.channel = null;
            this.finding = finding;
            this.cluster = false;
            this.p = p;
            this.fleetIndex = fleetIndex;
        }
    }

    /**
     * Folds the episodes lying mostly on fleet-wide days into fleet findings (one per run of fleet-wide days).
     */
    private static void fleetWide(String key, List<Slot> slots, List<Test> channelTests,
                                  org.tufa.analysis.fleet.AnalysisSettings.DecisionSettings settings,
                                  CauseTable causes, ZoneId zone, List<UnitEvidence> units,
                                  List<FleetFinding> fleetFindings, List<Test> fleetTests) {
        TreeMap<Integer, int[]> perDay = new TreeMap<>(); // day -> {informative units, units in an episode}
        for (Slot s : slots) {
            Finding span = s.channel().span();
            if (span == null) {
                continue;
            }
            int first = day(span.start(), zone);
            int last = day(span.end().minusMillis(1), zone);
            for (int d = first; d <= last; d++) {
                perDay.computeIfAbsent(d, k -> new int[2])[0]++;
            }
        }
        for (Test t : channelTests) {
            if (t.finding == null) {
                continue;
            }
            ChannelEvidence.Candidate c = candidateOf(t);
            for (int d = c.episode().firstDay(); d <= c.episode().lastDay(); d++) {
                int[] v = perDay.get(d);
                if (v != null) {
                    v[1]++;
                }
            }
        }
        // Expected units in an episode on a day if episodes were independent of one another: each informative unit
        // is in one with the channel's overall rate of episode days.
        long informativeUnitDays = 0;
        long episodeUnitDays = 0;
        for (int[] v : perDay.values()) {
            informativeUnitDays += v[0];
            episodeUnitDays += v[1];
        }
        double rate = informativeUnitDays == 0 ? 0 : episodeUnitDays / (double) informativeUnitDays;
        List<int[]> runs = new ArrayList<>();
        int runStart = Integer.MIN_VALUE;
        int previous = Integer.MIN_VALUE;
        for (Map.Entry<Integer, int[]> e : perDay.entrySet()) {
            int[] v = e.getValue();
            boolean wide = v[1] >= settings.minFleetUnits()
                    && poissonUpperTail(rate * v[0], v[1]) < settings.fleetWideP();
            if (wide) {
                if (runStart == Integer.MIN_VALUE || e.getKey() > previous + 1) {
                    if (runStart != Integer.MIN_VALUE) {
                        runs.add(new int[] {runStart, previous});
                    }
                    runStart = e.getKey();
                }
                previous = e.getKey();
            }
        }
        if (runStart != Integer.MIN_VALUE) {
            runs.add(new int[] {runStart, previous});
        }
        for (int[] run : joinReaching(runs, channelTests)) {
            List<Test> members = members(run, channelTests);
            if (members.size() < settings.minFleetUnits()) {
                continue;
            }
            int start = Integer.MAX_VALUE;
            int end = 0;
            double energy = 0;
            List<String> names = new ArrayList<>();
            for (Test t : members) {
                t.folded = true;
                start = Math.min(start, t.finding.range().start());
                end = Math.max(end, t.finding.range().end());
                energy += Double.isNaN(t.finding.energyKwh()) ? 0 : t.finding.energyKwh();
                names.add(units.get(t.unit).unit());
            }
            names = names.stream().distinct().sorted().toList();
            Finding first = members.get(0).finding;
            Instant s = members.stream().map(t -> t.finding.start()).min(Instant::compareTo).orElseThrow();
            Instant en = members.stream().map(t -> t.finding.end()).max(Instant::compareTo).orElseThrow();
            String text = String.format(Locale.ROOT, "%d of %d units in the same %s episode on the same days (%s)",
                    names.size(), slots.size(), key, first.evidence());
            Finding f = new Finding(first.mode(), FLEET_KIND, -1, new IndexRange(start, end), s, en,
                    (en.toEpochMilli() - s.toEpochMilli()) / 3_600_000.0, energy, first.shifts(),
                    causes.causes(FLEET_KIND, List.of(), null)).withEvidence(text);
            fleetFindings.add(new FleetFinding(f, names));
            // Evidence that something common is at work: no more units strayed together than independent faults
            // would give, on the run's most crowded day, corrected for every day tested. (The members' own
            // p-values say nothing here: a shared effect moves the fleet's null with it.)
            double tail = 1;
            for (int d = run[0]; d <= run[1]; d++) {
                int[] v = perDay.get(d);
                if (v != null) {
                    tail = Math.min(tail, poissonUpperTail(rate * v[0], v[1]));
                }
            }
            fleetTests.add(new Test(f, Math.min(1, tail * perDay.size()), fleetFindings.size() - 1));
        }
    }

    /** The episodes lying mostly (half their days or more) inside a run of fleet-wide days. */
    private static List<Test> members(int[] run, List<Test> channelTests) {
        List<Test> members = new ArrayList<>();
        for (Test t : channelTests) {
            if (t.finding == null) {
                continue;
            }
            ChannelEvidence.Candidate c = candidateOf(t);
            int inside = 0;
            int total = c.episode().lastDay() - c.episode().firstDay() + 1;
            for (int d = c.episode().firstDay(); d <= c.episode().lastDay(); d++) {
                inside += d >= run[0] && d <= run[1] ? 1 : 0;
            }
            if (2 * inside >= total) {
                members.add(t);
            }
        }
        return members;
    }

    /**
     * Runs of fleet-wide days whose member episodes overlap in time (a cold spell broken by a mild day, say) are one
     * shared event: joined, they make one fleet finding instead of overlapping ones.
     */
    private static List<int[]> joinReaching(List<int[]> runs, List<Test> channelTests) {
        List<int[]> out = new ArrayList<>();
        int[] current = null;
        for (int[] run : runs) {
            if (current != null && episodeDays(current, channelTests)[1] >= episodeDays(run, channelTests)[0] - 1) {
                current = new int[] {current[0], run[1]};
                continue;
            }
            if (current != null) {
                out.add(current);
            }
            current = run;
        }
        if (current != null) {
            out.add(current);
        }
        return out;
    }

    /** First and last day of the member episodes of a run (the run itself when it has none). */
    private static int[] episodeDays(int[] run, List<Test> channelTests) {
        int first = run[0];
        int last = run[1];
        for (Test t : members(run, channelTests)) {
            first = Math.min(first, candidateOf(t).episode().firstDay());
            last = Math.max(last, candidateOf(t).episode().lastDay());
        }
        return new int[] {first, last};
    }

    /** P(X >= k) for X Poisson with mean lambda (the complement of the Poisson sum). */
    static double poissonUpperTail(double lambda, int k) {
        if (k <= 0) {
            return 1;
        }
        double term = Math.exp(-lambda);
        double below = term;
        for (int i = 1; i < k; i++) {
            term *= lambda / i;
            below += term;
        }
        return Math.max(0, 1 - below);
    }

    private static ChannelEvidence.Candidate candidateOf(Test t) {
        for (ChannelEvidence.Candidate c : t.channel.candidates()) {
            if (c.finding() == t.finding) {
                return c;
            }
        }
        throw new IllegalStateException("candidate not in its channel");
    }

    private static int day(Instant t, ZoneId zone) {
        return (int) t.atZone(zone).toLocalDate().toEpochDay();
    }

    /**
     * Every unit against its peers on a channel with an absolute meaning: one whose normal level means the same on
     * every unit. A channel that has none (a residual against the unit's own coil, a share that follows its own
     * control style or its own load band) carries NaN as its level and is left out.
     */
    private static List<Test> peerTests(List<Slot> slots, org.tufa.analysis.fleet.AnalysisSettings.DecisionSettings
            settings, CauseTable causes) {
        List<Slot> usable = slots.stream().filter(s -> Double.isFinite(s.channel().level())
                && s.channel().span() != null && s.channel().informativeDays() >= MIN_PEER_DAYS).toList();
        if (usable.size() < settings.minPeers() + 1) {
            return List.of();
        }
        double[] centers = usable.stream().mapToDouble(s -> s.channel().level()).toArray();
        double[] spreads = usable.stream().mapToDouble(s -> s.channel().levelSpread()).toArray();
        double median = Quantiles.median(centers);
        double[] dev = Arrays.stream(centers).map(c -> Math.abs(c - median)).toArray();
        double scale = Math.max(DayChannel.MAD_SCALE * Quantiles.median(dev), Quantiles.median(spreads));
        List<Test> out = new ArrayList<>();
        for (Slot s : usable) {
            ChannelEvidence c = s.channel();
            double shift = c.direction() * (c.level() - median);
            double z = shift / scale;
            double p = 0.5 * Erf.erfc(z / Math.sqrt(2));
            Finding f = null;
            if (z >= settings.minPeerDeviation() && shift >= c.gate()) {
                String unit = c.unit().equals("share") ? "" : " " + c.unit();
                String text = c.unit().equals("share")
                        ? String.format(Locale.ROOT, "%s on %.0f %% of the unit's samples on its normal days, "
                        + "against %.0f %% on its %d peers' (%.1f robust spreads)", c.channel(), 100 * c.level(),
                        100 * median, usable.size() - 1, z)
                        : String.format(Locale.ROOT, "%s %+.1f%s on the unit's normal days, against %+.1f%s on its "
                        + "%d peers' (%.1f robust spreads)", c.channel(), c.level(), unit, median, unit,
                        usable.size() - 1, z);
                List<org.tufa.analysis.findings.Shift> shifts = List.of(new org.tufa.analysis.findings.Shift(
                        c.channel(), c.unit().equals("share") ? "" : c.unit(), c.level() - median));
                List<String> peerCauses = c.unit().equals("share")
                        ? causes.causes(c.channel(), List.of(), null) : causes.causes(c.mode(), shifts, null);
                Finding span = c.span();
                f = new Finding(c.mode(), PEER_KIND, -1, span.range(), span.start(), span.end(), span.hours(),
                        span.energyKwh(), shifts, peerCauses).withEvidence(text);
            }
            Test t = new Test(s.unit(), c, null, p);
            out.add(f == null ? t : withFinding(t, f));
        }
        return out;
    }

    private static Test withFinding(Test t, Finding f) {
        ChannelEvidence.Candidate c = new ChannelEvidence.Candidate(null, f);
        return new Test(t.unit, t.channel, c, t.p);
    }

    /** Cluster and rule candidates of one unit that overlap in time support each other (Fisher's method). */
    private static void agreement(List<Test> tests) {
        Map<Integer, List<Test>> byUnit = new TreeMap<>();
        for (Test t : tests) {
            if (t.finding != null && !t.folded && !t.finding.kind().equals(PEER_KIND)) {
                byUnit.computeIfAbsent(t.unit, k -> new ArrayList<>()).add(t);
            }
        }
        for (List<Test> list : byUnit.values()) {
            double[] combined = new double[list.size()];
            String[] with = new String[list.size()];
            for (int i = 0; i < list.size(); i++) {
                Test a = list.get(i);
                combined[i] = a.p;
                with[i] = "";
                for (Test b : list) {
                    if (a.cluster == b.cluster || !overlap(a.finding.range(), b.finding.range())) {
                        continue;
                    }
                    double c = FisherCombination.combine(a.p, b.p);
                    if (c < combined[i]) {
                        combined[i] = c;
                        with[i] = b.finding.kind().equals("fault_cluster") ? b.finding.mode() + " cluster evidence"
                                : b.finding.kind();
                    }
                }
            }
            for (int i = 0; i < list.size(); i++) {
                list.get(i).p = combined[i];
                list.get(i).agreement = with[i];
            }
        }
    }

    private static boolean overlap(IndexRange a, IndexRange b) {
        return a.start() < b.end() && b.start() < a.end();
    }
}
