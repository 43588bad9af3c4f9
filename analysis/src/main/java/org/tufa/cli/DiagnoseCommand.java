package org.tufa.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;
import org.tufa.analysis.diagnose.CauseForest;
import org.tufa.analysis.diagnose.Diagnosis;
import org.tufa.analysis.diagnose.DiagnosisFiles;
import org.tufa.analysis.diagnose.LabelledData;
import org.tufa.analysis.diagnose.Samples;
import org.tufa.analysis.fleet.FleetReport;
import org.tufa.analysis.labels.AnalysisFolder;
import org.tufa.common.InputException;
import org.tufa.common.OutputFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tufa diagnose}: a cause classifier from the labelled data, checked leaving one unit out, applied to a run. */
@Command(name = "diagnose", mixinStandardHelpOptions = true,
        description = {"Train a cause classifier (random forest, per operating mode) on the labelled samples of the "
                + "reviewed units, check it leaving one unit out, and diagnose the findings of a run: a diagnosed "
                + "cause and its probability beside the candidate causes, a candidate to verify.",
            "Writes DIR3/held_out.csv, DIR3/diagnosis.txt and, with --analysis, DIR3/diagnosis.csv."})
public final class DiagnoseCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Option(names = "--labels", required = true, paramLabel = "DIR2", description = "Folder tufa labels wrote.")
    Path labels;

    @Option(names = "--analysis", paramLabel = "DIR",
            description = "Folder tufa analyze wrote: diagnose its listed findings.")
    Path analysis;

    @Option(names = "--out", required = true, paramLabel = "DIR3", description = "Output folder.")
    Path out;

    @Option(names = "--trees", paramLabel = "N", defaultValue = "100",
            description = "Trees per forest (default: ${DEFAULT-VALUE}).")
    int trees;

    @Option(names = "--per-class", paramLabel = "N", defaultValue = "300",
            description = "Most training samples per unit, mode and class, evenly spaced (default: ${DEFAULT-VALUE}).")
    int perClass;

    @Option(names = "--min-spread-confidence", paramLabel = "C", defaultValue = "0.8",
            description = "Spread labels below this confidence are not trained on (default: ${DEFAULT-VALUE}).")
    double minSpreadConfidence;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "2031",
            description = "Seed of the forests' first tree (default: ${DEFAULT-VALUE}).")
    long seed;

    @Override
    public Integer call() {
        PrintWriter stdout = spec.commandLine().getOut();
        if (trees < 1 || perClass < 1 || !(minSpreadConfidence >= 0 && minSpreadConfidence <= 1)) {
            throw new InputException("--trees and --per-class must be >= 1 and --min-spread-confidence in [0, 1]; "
                    + "got " + trees + ", " + perClass + ", " + minSpreadConfidence);
        }
        OutputFiles.checkFolder("--out", out);
        for (Path in : analysis == null ? List.of(labels) : List.of(labels, analysis)) {
            if (OutputFiles.canonical(out).equals(OutputFiles.canonical(in))) {
                throw InputException.in(out, "--out is an input folder; write the diagnosis to a folder of its own");
            }
        }
        Diagnosis.Settings settings = new Diagnosis.Settings(new CauseForest.Options(trees, 5, seed), perClass,
                minSpreadConfidence);
        LabelledData data = LabelledData.open(labels);
        List<Samples.Part> parts = new ArrayList<>();
        for (LabelledData.Table t : data.tables()) {
            if (t.reviewed()) {
                parts.add(data.read(t));
            }
        }
        if (parts.isEmpty()) {
            throw InputException.in(labels, "no reviewed unit in the labelled data: review some findings first "
                    + "(tufa labels --review)");
        }
        java.time.ZoneId zone = analysis == null ? java.time.ZoneOffset.UTC : null;
        AnalysisFolder folder = analysis == null ? null : AnalysisFolder.open(analysis);
        if (folder != null) {
            zone = folder.zone();
        }
        List<Diagnosis.HeldOut> heldOut = Diagnosis.leaveOneUnitOut(parts, data.verdicts(), settings);
        DiagnosisFiles.writeHeldOut(out.resolve(DiagnosisFiles.HELD_OUT), heldOut, zone);
        List<String> lines = new ArrayList<>(DiagnosisFiles.heldOutLines(heldOut));
        Diagnosis.Model model = Diagnosis.train(parts, data.verdicts(), settings);
        lines.add("Classifier: " + model.forests().size() + " forest(s) (modes " + String.join(", ",
                model.forests().keySet()) + "), classes " + String.join(", ", model.classes()) + ", trained on "
                + parts.stream().map(Samples.Part::unit).distinct().count() + " reviewed unit(s)");
        if (folder != null) {
            Set<String> trained = new java.util.TreeSet<>();
            parts.forEach(p -> trained.add(p.unit()));
            Map<String, List<AnalysisFolder.Listed>> byUnit = folder.findingsByUnit();
            List<DiagnosisFiles.Row> rows = new ArrayList<>();
            for (AnalysisFolder.Unit u : folder.units()) {
                List<AnalysisFolder.Listed> listed = byUnit.getOrDefault(u.iri(), List.of());
                if (listed.isEmpty() || !u.analyzed()) {
                    continue;
                }
                List<Samples.Part> unitParts = DiagnosisFiles.parts(folder, u, listed);
                for (AnalysisFolder.Listed f : listed) {
                    rows.add(new DiagnosisFiles.Row(f, Diagnosis.diagnose(model, unitParts, f.mode(), f.kind(),
                            f.start(), f.end()), trained.contains(u.iri())));
                }
            }
            DiagnosisFiles.writeDiagnosis(out.resolve(DiagnosisFiles.DIAGNOSIS), rows, zone);
            long named = rows.stream().filter(r -> !r.diagnosed().cause().isEmpty()).count();
            lines.add(String.format(Locale.ROOT, "Diagnosed %d of %d listed finding(s) of %s with a cause (%d on "
                    + "units the classifier was trained on: for those the leave-one-unit-out figure above is the "
                    + "honest one)", named, rows.size(), analysis, rows.stream().filter(
                    DiagnosisFiles.Row::unitInTraining).count()));
        }
        lines.add("A diagnosed cause is a candidate to verify, learnt from earlier verdicts; it is not a finding "
                + "of fact. " + FleetReport.CAUTION);
        OutputFiles.writeString(out.resolve(DiagnosisFiles.SUMMARY), String.join("\n", lines) + "\n");
        lines.forEach(stdout::println);
        stdout.println("Wrote " + out.resolve(DiagnosisFiles.HELD_OUT) + (folder == null ? "" : ", "
                + out.resolve(DiagnosisFiles.DIAGNOSIS)) + " and " + out.resolve(DiagnosisFiles.SUMMARY));
        stdout.flush();
        return ExitCodes.OK;
    }
}
