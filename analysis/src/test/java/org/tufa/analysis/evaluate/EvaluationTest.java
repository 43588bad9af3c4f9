package org.tufa.analysis.evaluate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalTime;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.cli.Tufa;

/**
 * Metric definitions after Frank S, Lin G, Jin X, et al., "Metrics and methods to assess building fault detection
 * and diagnosis tools", NREL/TP-5500-72801 (2019): episode detection and false-alarm rates. The expected numbers
 * are a worked example, computed by hand (arithmetic only, shown in the comments).
 */
class EvaluationTest {
    static final String FLEET_HEADER =
            "unit,label,folder,status,reason,modes,samples_used,clusters,fault_clusters,fault_hours,energy_kwh";
    static final String FINDINGS_HEADER =
            "unit,mode,kind,cluster,start,end,hours,energy_kwh,shift,candidate_causes";
    static final String DAY = "2031-07-01T";
    static final String OFFSET = "-04:00";

    /**
     * The worked example. Samples every 15 min from 08:00 to 16:00 (33 samples, 0.25 h each).
     * <ul>
     * <li>u1: off 08:00-08:45, cooling from 09:00, except transition at 12:00 and no_data at 12:15. Truth
     * low_chw_flow [10:00, 14:00): 16 samples, 14 analysable = 3.5 h. Findings: fault_cluster [11:00, 13:00)
     * covers 11:00..12:45 = 8 samples, 6 analysable; simultaneous_heating_cooling 12:30-12:30 (one sample, already
     * counted); out_of_band [13:30, 14:30) adds 13:30 and 13:45 inside the episode. Flagged: 8 samples = 2.0 h,
     * detected at 2 h. Share 2.0 / 3.5 = 0.5714.</li>
     * <li>u2: cooling all day. Truth fan_failure [08:00, 10:00): 8 samples = 2.0 h analysable. Finding
     * [09:00, 09:30): 2 samples = 0.5 h, not detected at 2 h (detected at 0.5 h). A finding [15:00, 16:00) lies
     * outside the episode and counts nowhere (u2 is not a healthy unit).</li>
     * <li>u3 (healthy): off 08:00-08:45 (4), ventilation 09:00-09:45 (4), cooling 10:00-15:45 (24), off 16:00.
     * Analysable 28 samples = 7.0 h. Findings [15:00, 16:00) flag 4 cooling samples = 1.0 h (16:00 excluded, end is
     * exclusive, and off anyway); [08:00, 08:30) covers only off samples. False-flag share 1 / 7 = 0.1429.</li>
     * <li>u4: skipped by the analysis; truth stuck_cooling_valve: not analysed, not detected, 0 h.</li>
     * </ul>
     * All faults: 3 episodes, 1 detected, 5.5 h analysable, 2.5 h flagged, share 2.5 / 5.5 = 0.4545.
     */
    static Path workedExample(Path dir) throws IOException {
        Files.writeString(dir.resolve("fleet.csv"), FLEET_HEADER + "\n"
                + "urn:u1,FCU 1,u1,analyzed,,cooling,30,2,1,2.0,1.5\n"
                + "urn:u2,FCU 2,u2,analyzed,,cooling,30,2,1,0.5,0.2\n"
                + "urn:u3,FCU 3,u3,analyzed,,cooling,30,1,0,0,0\n"
                + "urn:u4,FCU 4,u4,skipped,no discharge sensor,,0,0,0,0,0\n");
        Files.writeString(dir.resolve("findings.csv"), FINDINGS_HEADER + "\n"
                + finding("urn:u1", "fault_cluster", "11:00", "13:00")
                + finding("urn:u1", "simultaneous_heating_cooling", "12:30", "12:30")
                + finding("urn:u1", "out_of_band", "13:30", "14:30")
                + finding("urn:u2", "fault_cluster", "09:00", "09:30")
                + finding("urn:u2", "fault_cluster", "15:00", "16:00")
                + finding("urn:u3", "fault_cluster", "15:00", "16:00")
                + finding("urn:u3", "out_of_band", "08:00", "08:30"));
        modes(dir, "u1", t -> t.isBefore(LocalTime.of(9, 0)) ? "off"
                : t.equals(LocalTime.of(12, 0)) ? "transition"
                : t.equals(LocalTime.of(12, 15)) ? "no_data" : "cooling");
        modes(dir, "u2", t -> "cooling");
        modes(dir, "u3", t -> t.isBefore(LocalTime.of(9, 0)) ? "off"
                : t.isBefore(LocalTime.of(10, 0)) ? "ventilation"
                : t.isBefore(LocalTime.of(16, 0)) ? "cooling" : "off");
        Path truth = dir.resolve("truth.csv");
        Files.writeString(truth, "unit,fault,start,end,severity\n"
                + "urn:u1,low_chw_flow," + DAY + "10:00:00" + OFFSET + "," + DAY + "14:00:00" + OFFSET + ",0.8\n"
                + "urn:u2,fan_failure," + DAY + "08:00:00" + OFFSET + "," + DAY + "10:00:00" + OFFSET + ",1\n"
                + "urn:u4,stuck_cooling_valve," + DAY + "08:00:00" + OFFSET + "," + DAY + "12:00:00" + OFFSET
                + ",0.3\n");
        return truth;
    }

    private static String finding(String unit, String kind, String start, String end) {
        return unit + ",cooling," + kind + ",1," + DAY + start + ":00" + OFFSET + "," + DAY + end + ":00" + OFFSET
                + ",1.0,0.5,0.2,\"valve leak; sensor bias\"\n";
    }

    private static void modes(Path dir, String folder, java.util.function.Function<LocalTime, String> mode)
            throws IOException {
        Path unitDir = Files.createDirectories(dir.resolve("units").resolve(folder));
        StringBuilder sb = new StringBuilder("timestamp,mode,in_band\n");
        for (LocalTime t = LocalTime.of(8, 0); !t.isAfter(LocalTime.of(16, 0)); t = t.plusMinutes(15)) {
            sb.append(DAY).append(t).append(":00").append(OFFSET).append(',').append(mode.apply(t)).append(",true\n");
        }
        Files.writeString(unitDir.resolve("modes.csv"), sb);
    }

    @Test
    void workedExampleScores(@TempDir Path dir) throws IOException {
        Path truth = workedExample(dir);
        Evaluation.Result r = Evaluation.fit(EvaluationFiles.read(dir, truth), 2.0);
        assertEquals(3, r.allFaults().episodes());
        assertEquals(1, r.allFaults().detected());
        assertEquals(5.5, r.allFaults().analysableHours(), 1e-12);
        assertEquals(2.5, r.allFaults().flaggedHours(), 1e-12);
        assertEquals(1, r.healthy().units());
        assertEquals(7.0, r.healthy().analysableHours(), 1e-12);
        assertEquals(1.0 / 7.0, r.healthy().flaggedShare(), 1e-12);
        assertFalse(r.goalsMet());

        EvaluationReport.writeSummary(dir.resolve("evaluation.csv"), r);
        String goal = "all episodes detected; flagged share >= 0.70";
        // u4 is not in the analysed fleet: its episode is counted apart (not_analysed), not as a miss.
        assertEquals(1, r.allFaults().notAnalysed());
        assertEquals("scope,units,episodes,not_analysed,outside_window,detected,analysable_hours,flagged_hours,"
                + "flagged_share,goal,goal_met\n"
                + "fan_failure,1,1,0,0,0,2.00,0.50,0.2500," + goal + ",false\n"
                + "low_chw_flow,1,1,0,0,1,3.50,2.00,0.5714," + goal + ",false\n"
                + "stuck_cooling_valve,1,1,1,0,0,0.00,0.00,," + goal + ",false\n"
                + "all_faults,3,3,1,0,1,5.50,2.50,0.4545," + goal + ",false\n"
                + "healthy_units,1,0,0,0,0,7.00,1.00,0.1429,flagged share <= 0.01,false\n"
                // u3 has no truth row and two findings: one healthy unit of one has a finding (worked by hand).
                + "healthy_units_with_findings,1,0,0,0,0,,,1.0000,share of healthy units <= 0.05,false\n",
                Files.readString(dir.resolve("evaluation.csv")));

        // With --min-hours 0.5 the fan failure's 0.5 flagged hours are enough.
        Evaluation.Result lenient = Evaluation.fit(EvaluationFiles.read(dir, truth), 0.5);
        assertEquals(2, lenient.allFaults().detected());
    }

    @Test
    void minConfidenceScoresOnlyConfidentFindings(@TempDir Path dir) throws IOException {
        Path truth = workedExample(dir);
        // The same findings with a confidence column: u3's two (the false flags) below 0.9, the others above.
        List<String> lines = Files.readAllLines(dir.resolve("findings.csv"));
        StringBuilder withConfidence = new StringBuilder(lines.get(0) + ",confidence\n");
        for (String line : lines.subList(1, lines.size())) {
            withConfidence.append(line).append(line.startsWith("urn:u3,") ? ",0.5" : ",0.95").append('\n');
        }
        Files.writeString(dir.resolve("findings.csv"), withConfidence);

        Evaluation.Result all = Evaluation.fit(EvaluationFiles.read(dir, truth, 0), 2.0);
        assertEquals(1, all.healthyUnitsWithFindings());
        assertEquals(1.0 / 7.0, all.healthy().flaggedShare(), 1e-12);

        Evaluation.Result confident = Evaluation.fit(EvaluationFiles.read(dir, truth, 0.9), 2.0);
        assertEquals(0, confident.healthyUnitsWithFindings());
        assertEquals(0.0, confident.healthy().flaggedShare(), 1e-12);
        // The faulty units' findings are all above 0.9: their scores are those of the worked example.
        assertEquals(2.5, confident.allFaults().flaggedHours(), 1e-12);
    }

    @Test
    void commandPrintsTableWritesFilesAndChecksGoals(@TempDir Path dir) throws IOException {
        Path truth = workedExample(dir);
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        String[] args = {"evaluate", "--findings", dir.toString(), "--truth", truth.toString()};
        assertEquals(0, Tufa.execute(args, new PrintWriter(out), new PrintWriter(err)), err.toString());
        String table = out.toString();
        assertTrue(table.contains("all_faults") && table.contains("1/2 +1"), table);
        assertTrue(table.contains("goal: every injected episode detected (>= 2 h flagged): 1/2 (NOT met); 1 more on "
                + "units not analysed (coverage excluded them, or no detection for their kind yet)"), table);
        assertTrue(table.contains("goal: <= 1 % of healthy-unit hours flagged: 14.3% (NOT met)"), table);
        assertTrue(table.contains("goal: <= 5 % of healthy units with any finding: 1 of 1 (100.0%) (NOT met)"), table);
        assertTrue(Files.exists(dir.resolve("evaluation.csv")));
        List<String> episodes = Files.readAllLines(dir.resolve("evaluation_episodes.csv"));
        assertEquals("urn:u1,low_chw_flow,2031-07-01T14:00Z,2031-07-01T18:00Z,0.800,true,true,3.50,2.00,true",
                episodes.get(1));
        assertEquals("urn:u4,stuck_cooling_valve,2031-07-01T12:00Z,2031-07-01T16:00Z,0.300,false,true,0.00,0.00,false",
                episodes.get(3));

        String[] strict = {"evaluate", "--findings", dir.toString(), "--truth", truth.toString(), "--require-goals"};
        assertEquals(3, Tufa.execute(strict, new PrintWriter(new StringWriter()), new PrintWriter(err)));
    }

    @Test
    void badInputIsOneLineNamingTheFile(@TempDir Path dir) throws IOException {
        Path truth = workedExample(dir);
        // Unit in truth but not in the fleet.
        Files.writeString(truth, Files.readString(truth) + "urn:u9,fan_failure," + DAY + "08:00:00" + OFFSET + ","
                + DAY + "09:00:00" + OFFSET + ",1\n");
        assertInputError(dir, truth, "truth.csv:5: unit urn:u9 is not in");

        workedExample(dir);
        Files.writeString(dir.resolve("findings.csv"), "unit,mode,kind,start,end\n");
        assertInputError(dir, truth, "findings.csv:1: header lacks column(s) cluster, hours");

        workedExample(dir);
        Files.writeString(dir.resolve("units").resolve("u2").resolve("modes.csv"),
                "timestamp,mode,in_band\n2031-07-01 08:00,cooling,true\n");
        assertInputError(dir, truth, "modes.csv:2: column timestamp: '2031-07-01 08:00' is not an ISO-8601");

        workedExample(dir);
        Files.delete(dir.resolve("fleet.csv"));
        assertInputError(dir, truth, "fleet.csv: file not found");
    }

    private static void assertInputError(Path dir, Path truth, String expected) {
        StringWriter err = new StringWriter();
        int code = Tufa.execute(new String[] {"evaluate", "--findings", dir.toString(), "--truth", truth.toString()},
                new PrintWriter(new StringWriter()), new PrintWriter(err));
        assertEquals(1, code, err.toString());
        String message = err.toString().trim();
        assertTrue(message.contains(expected), message);
        assertEquals(1, message.lines().count(), message);
    }

    @Test
    void repeatedRowsCountOnceEpisodesOutsideTheWindowApartAndLocalNamesMatch(@TempDir Path dir) throws IOException {
        workedExample(dir);
        Path truth = dir.resolve("truth2.csv");
        // Row 2 names u1 by its local name; row 3 repeats it by IRI; row 4 is on u2 a day after its samples end
        // (the window is 2031-07-01 08:00-16:15); row 5 names u2 by its label.
        Files.writeString(truth, "unit,fault,start,end,severity\n"
                + "u1,low_chw_flow," + DAY + "10:00:00" + OFFSET + "," + DAY + "14:00:00" + OFFSET + ",0.8\n"
                + "urn:u1,low_chw_flow," + DAY + "10:00:00" + OFFSET + "," + DAY + "14:00:00" + OFFSET + ",0.8\n"
                + "urn:u2,fan_failure,2031-07-02T08:00:00" + OFFSET + ",2031-07-02T10:00:00" + OFFSET + ",1\n"
                + "FCU 2,fan_failure," + DAY + "08:00:00" + OFFSET + "," + DAY + "10:00:00" + OFFSET + ",1\n");
        EvaluationInput input = EvaluationFiles.read(dir, truth);
        assertEquals(1, input.repeatedEpisodes());
        assertEquals(List.of("urn:u1", "urn:u2", "urn:u2"), input.truth().stream().map(TruthEpisode::unit).toList());
        Evaluation.Result r = Evaluation.fit(input, 2.0);
        assertEquals(3, r.allFaults().episodes());
        assertEquals(1, r.allFaults().outsideWindow());
        assertEquals(2, r.allFaults().scoredEpisodes());
        // As in the worked example: low_chw_flow detected (2.0 h), fan_failure not (0.5 h); nothing counted twice.
        assertEquals(1, r.allFaults().detected());
        assertEquals(5.5, r.allFaults().analysableHours(), 1e-12);
        assertFalse(r.episodes().get(1).inWindow());
        // A name two units share is refused, not guessed.
        Files.writeString(dir.resolve("fleet.csv"), FLEET_HEADER + "\n"
                + "urn:a#u1,FCU 1,u1,analyzed,,cooling,30,2,1,2.0,1.5\n"
                + "urn:b#u1,FCU 1b,u2,analyzed,,cooling,30,2,1,0.5,0.2\n");
        Files.writeString(dir.resolve("findings.csv"), FINDINGS_HEADER + "\n");
        Files.writeString(truth, "unit,fault,start,end,severity\n"
                + "u1,low_chw_flow," + DAY + "10:00:00" + OFFSET + "," + DAY + "14:00:00" + OFFSET + ",0.8\n");
        org.tufa.common.InputException e = org.junit.jupiter.api.Assertions.assertThrows(
                org.tufa.common.InputException.class, () -> EvaluationFiles.read(dir, truth));
        assertTrue(e.getMessage().contains("matches 2 units"), e.getMessage());
    }
}
