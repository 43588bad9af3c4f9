package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.cluster.LabelSpreading;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.diagnose.LabelledData;
import org.tufa.analysis.diagnose.Samples;
import org.tufa.analysis.evaluate.EvaluationFiles;
import org.tufa.analysis.evaluate.TruthReview;
import org.tufa.analysis.labels.AnalysisFolder;
import org.tufa.analysis.labels.DataCard;
import org.tufa.analysis.labels.LabelExport;
import org.tufa.analysis.review.ReviewFile;
import org.tufa.analysis.review.Verdict;
import org.tufa.analysis.simulate.DemoTargets;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.FaultEpisode;
import org.tufa.analysis.simulate.FaultType;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.tables.SampleFormat;
import org.tufa.analysis.trends.TimeOptions;

/**
 * The review loop on a small simulated fleet (tufa's simulator, a discharge-sensor bias injected on two units):
 * a review derived from the truth with the last finding rejected, the re-run with it, a run on a shorter window whose
 * verdicts follow their findings onto the full window, and the labelled-data export in Parquet (read back by DuckDB,
 * its own Parquet reader) and CSV with the same labels.
 */
class ReviewLoopTest {

    static final ZoneId ZONE = Season.DEMO_ZONE;
    static Path dir;
    static FleetCoverage coverage;
    static Path trendsFile;
    static Path truth;
    static Path first;

    @BeforeAll
    static void firstRun(@TempDir Path tmp) throws Exception {
        dir = tmp;
        Model model = SmallFleet.model(3, false);
        Vocabulary v = Vocabulary.standard();
        coverage = Coverage.assess(model, v, v.profiles().profile("fcu-modes"), Set.of(Coverage.TERMINAL_UNIT));
        Season season = new Season(LocalDate.of(2031, 6, 1), LocalDate.of(2031, 6, 29), ZONE);
        Instant start = LocalDate.of(2031, 6, 10).atStartOfDay(ZONE).toInstant();
        FaultEpisode fault = new FaultEpisode(SmallFleet.unitIris(3).get(0), FaultType.DISCHARGE_SENSOR_BIAS, start,
                start.plus(Duration.ofDays(8)), 0.8);
        FaultEpisode second = new FaultEpisode(SmallFleet.unitIris(3).get(1), FaultType.DISCHARGE_SENSOR_BIAS,
                start.plus(Duration.ofDays(4)), start.plus(Duration.ofDays(12)), 0.8);
        Path trends = dir.resolve("trends");
        DemoTrends.write(trends, Simulator.run(new SimulationPlan(DemoTargets.from(coverage).units(),
                DemoTargets.from(coverage).building(), season, 3L, List.of(fault, second))), DemoTrends.Layout.WIDE);
        truth = trends.resolve(DemoTrends.TRUTH_FILE);
        trendsFile = trends.resolve(DemoTrends.TRENDS_FILE);
        first = run("first", List.of(), null, SampleFormat.PARQUET);
    }

    static Path run(String name, List<Verdict> verdicts, Instant to, SampleFormat format) {
        Path out = dir.resolve(name);
        TimeOptions time = new TimeOptions(ZONE, Duration.ofMinutes(15), Duration.ofHours(1), null, to, false);
        FleetAnalysis.Result r = FleetAnalysis.run(coverage, org.tufa.analysis.trends.TrendStore.opener(
                List.of(trendsFile)), time, AnalysisSettings.defaults().withDayZone(ZONE), verdicts, 2,
                List.of(new UnitFiles(out, ZONE, format)), (d, t) -> { });
        FleetOutputs.write(out, r, ZONE, java.util.Map.<String, Object>of("timezone", ZONE.getId()), List.of());
        return out;
    }

    /** The truth's review with its last finding turned into a rejection. */
    static List<Verdict> review() {
        AnalysisFolder f = AnalysisFolder.open(first);
        List<Verdict> verdicts = new ArrayList<>(TruthReview.fit(f.findings(), EvaluationFiles.read(first, truth)
                .truth(), ZONE));
        assertTrue(verdicts.stream().filter(v -> v.decision() == Verdict.Decision.CONFIRMED).count() >= 2,
                "the injected bias gives findings: " + verdicts);
        int last = verdicts.size() - 1;
        Verdict c = verdicts.get(last);
        verdicts.set(last, new Verdict(0, c.unit(), c.mode(), c.kind(), c.start(), c.end(), c.findingId(),
                Verdict.Decision.REJECTED, "", "test: called normal", "tester", c.date()));
        return verdicts;
    }

    @Test
    void rejectedFindingsStayAwayOnTheRerunAndEveryVerdictIsAccounted() {
        List<Verdict> verdicts = review();
        Path file = dir.resolve("review.csv");
        ReviewFile.write(file, verdicts, ZONE);
        List<Verdict> read = ReviewFile.read(file, AnalysisFolder.open(first).knownUnits());
        Path rerun = run("rerun", read, null, SampleFormat.PARQUET);
        TruthReview.Honoured h = TruthReview.honoured(read, AnalysisFolder.open(rerun).findings());
        assertTrue(h.rejected() >= 1);
        assertEquals(0, h.flaggedAgain(), "no listed finding of the re-run flags a rejected period again");
        long confirmedListed = AnalysisFolder.open(rerun).findings().stream()
                .filter(x -> x.review().equals("confirmed")).count();
        assertEquals(verdicts.stream().filter(v -> v.decision() == Verdict.Decision.CONFIRMED)
                .map(Verdict::findingId).distinct().count(), confirmedListed, "confirmed findings stay, marked");
    }

    @Test
    void verdictsOnAShorterWindowFollowTheirFindingsOntoTheFullWindow() {
        Instant to = LocalDate.of(2031, 6, 24).atStartOfDay(ZONE).toInstant();
        Path shorter = run("shorter", List.of(), to, SampleFormat.PARQUET);
        AnalysisFolder f = AnalysisFolder.open(shorter);
        List<Verdict> verdicts = TruthReview.fit(f.findings(), EvaluationFiles.read(shorter, truth).truth(), ZONE);
        assertFalse(verdicts.isEmpty());
        FleetAnalysis.Result r = FleetAnalysis.run(coverage, org.tufa.analysis.trends.TrendStore.opener(
                List.of(trendsFile)), TimeOptions.defaults(ZONE), AnalysisSettings.defaults().withDayZone(ZONE),
                verdicts, 2, List.of(), (d, t) -> { });
        assertEquals(verdicts.size(), r.review().applied().size(), "unmatched: " + r.review().unmatched());
        long sameId = verdicts.stream().filter(v -> r.units().stream().anyMatch(u -> u.findings().stream()
                .anyMatch(x -> u.mark(x).findingId().equals(v.findingId())))).count();
        assertTrue(sameId > 0, "at least one finding keeps its id on the extended data");
    }

    @Test
    void labelsInParquetAndCsvHoldTheSameLabelsAndDuckDbReadsTheParquet() throws Exception {
        List<Verdict> verdicts = review();
        AnalysisFolder folder = AnalysisFolder.open(first);
        LabelSpreading.Parameters p = new LabelSpreading.Parameters(LabelSpreading.Kernel.KNN, 20, 7, 0.2, 30, 1e-3);
        Path pq = dir.resolve("labels-parquet");
        Path csv = dir.resolve("labels-csv");
        for (SampleFormat format : SampleFormat.values()) {
            Path out = format == SampleFormat.PARQUET ? pq : csv;
            LabelExport.Settings s = new LabelExport.Settings(p, true, format);
            LabelExport.Result r = LabelExport.run(folder, verdicts, s, out, 2);
            DataCard.write(out, r, s, first, dir.resolve("review.csv"), "0", verdicts, ZONE);
        }
        LabelledData a = LabelledData.open(pq);
        LabelledData b = LabelledData.open(csv);
        assertEquals(a.tables().size(), b.tables().size());
        int faults = 0;
        int rejectedNormal = 0;
        try (Connection duck = DriverManager.getConnection("jdbc:duckdb:")) {
            for (int k = 0; k < a.tables().size(); k++) {
                Samples.Part x = a.read(a.tables().get(k));
                Samples.Part y = b.read(b.tables().get(k));
                assertEquals(List.of(x.label()), List.of(y.label()));
                assertEquals(List.of(x.cause()), List.of(y.cause()));
                assertEquals(List.of(x.source()), List.of(y.source()));
                for (int i = 0; i < x.size(); i++) {
                    assertEquals(x.times()[i], y.times()[i]);
                    assertEquals(Double.doubleToLongBits(x.confidence()[i]), Double.doubleToLongBits(
                            y.confidence()[i]));
                    faults += x.label()[i].equals("fault") && x.source()[i].equals("review") ? 1 : 0;
                    rejectedNormal += x.label()[i].equals("normal") && x.source()[i].equals("review") ? 1 : 0;
                }
                Path file = pq.resolve(a.tables().get(k).file());
                try (var st = duck.createStatement(); ResultSet rs = st.executeQuery("SELECT count(*), "
                        + "count(*) FILTER (WHERE label = 'fault') FROM read_parquet('" + file + "')")) {
                    rs.next();
                    assertEquals(x.size(), rs.getInt(1), file.toString());
                    assertEquals(java.util.Arrays.stream(x.label()).filter("fault"::equals).count(), rs.getInt(2));
                }
            }
        }
        assertTrue(faults > 0, "confirmed findings label samples fault");
        assertTrue(rejectedNormal > 0, "the rejected finding labels samples normal");
        String card = Files.readString(pq.resolve(DataCard.CARD));
        assertTrue(card.contains("| fault | review |"), card);
        assertTrue(card.contains("discharge_sensor_bias"), card);
    }
}
