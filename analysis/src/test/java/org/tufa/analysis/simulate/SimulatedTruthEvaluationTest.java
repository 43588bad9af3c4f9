package org.tufa.analysis.simulate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.evaluate.Evaluation;
import org.tufa.analysis.evaluate.EvaluationFiles;

/**
 * The simulator's truth.csv feeds the evaluator: an oracle that flags exactly the truth episodes scores every
 * episode detected, 100 % of analysable fault hours flagged and 0 % of healthy hours flagged; an analysis that
 * flags nothing scores the opposite. Modes are derived from the simulated logs (field notes section 4, h = 5 %).
 */
class SimulatedTruthEvaluationTest {

    @Test
    void oracleFindingsMeetEveryGoal(@TempDir Path dir) throws Exception {
        Season season = new Season(LocalDate.of(2031, 7, 1), LocalDate.of(2031, 7, 31), Season.DEMO_ZONE);
        SimulationResult r = Simulator.run(DemoSimulation.plan(SimulationBenchmark.fleet(10, ""),
                SimulationBenchmark.buildingTargets(""), season, 4));
        DemoTrends.writeTruth(dir.resolve("truth.csv"), r);
        String[] stamps = DemoTrends.timestamps(r);
        StringBuilder fleet = new StringBuilder(
                "unit,label,folder,status,reason,modes,samples_used,clusters,fault_clusters,fault_hours,energy_kwh\n");
        for (int i = 0; i < r.units().size(); i++) {
            UnitTrace u = r.units().get(i);
            String folder = "unit-" + i;
            fleet.append(u.unitIri()).append(",FCU ").append(i).append(',').append(folder)
                    .append(",analyzed,,cooling,0,0,0,0,0\n");
            StringBuilder modes = new StringBuilder("timestamp,mode,in_band\n");
            for (int s = 0; s < stamps.length; s++) {
                modes.append(stamps[s]).append(',').append(TraceSummary.mode(u, s)).append(",\n");
            }
            Files.createDirectories(dir.resolve("units").resolve(folder));
            Files.writeString(dir.resolve("units").resolve(folder).resolve("modes.csv"), modes);
        }
        Files.writeString(dir.resolve("fleet.csv"), fleet);
        String header = "unit,mode,kind,cluster,start,end,hours,energy_kwh,shift,candidate_causes\n";
        DateTimeFormatter iso = DateTimeFormatter.ISO_OFFSET_DATE_TIME;
        StringBuilder oracle = new StringBuilder(header);
        for (FaultEpisode e : r.plan().faults()) {
            oracle.append(e.unitIri()).append(",cooling,fault_cluster,1,")
                    .append(iso.format(e.start().atZone(season.zone()))).append(',')
                    .append(iso.format(e.end().atZone(season.zone()))).append(",0,0,0,\n");
        }
        Files.writeString(dir.resolve("findings.csv"), oracle);

        Evaluation.Result perfect = Evaluation.fit(EvaluationFiles.read(dir, dir.resolve("truth.csv")), 2.0);
        assertEquals(r.plan().faults().size(), perfect.allFaults().episodes());
        assertEquals(FaultType.ofKind(FaultType.Kind.FAN_COIL).size(), perfect.byFault().size());
        assertTrue(perfect.goalsMet());
        assertEquals(1.0, perfect.allFaults().flaggedShare(), 1e-12);
        assertEquals(0.0, perfect.healthy().flaggedShare(), 1e-12);
        assertTrue(perfect.healthy().units() >= 3);

        Files.writeString(dir.resolve("findings.csv"), header);
        Evaluation.Result blind = Evaluation.fit(EvaluationFiles.read(dir, dir.resolve("truth.csv")), 2.0);
        assertEquals(0, blind.allFaults().detected());
        assertEquals(List.of(false, false), List.of(blind.allDetected(), blind.flaggedShareMet()));
        assertTrue(blind.falseShareMet());
    }
}
