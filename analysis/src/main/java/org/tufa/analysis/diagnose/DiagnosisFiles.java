package org.tufa.analysis.diagnose;

import java.nio.file.Path;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.tufa.analysis.fleet.Csv;
import org.tufa.analysis.labels.AnalysisFolder;
import org.tufa.analysis.labels.SampleLabels;
import org.tufa.common.OutputFiles;

/**
 * The files of {@code tufa diagnose}: the leave-one-unit-out check ({@code held_out.csv}), the diagnosed findings
 * of a run ({@code diagnosis.csv}) and the summary ({@code diagnosis.txt}, what the console says).
 */
public final class DiagnosisFiles {

    public static final String HELD_OUT = "held_out.csv";
    public static final String DIAGNOSIS = "diagnosis.csv";
    public static final String SUMMARY = "diagnosis.txt";

    public static final String HELD_OUT_HEADER = "unit,mode,kind,start,end,finding_id,confirmed_cause,"
            + "diagnosed_cause,diagnosed_probability,normal_share,samples,correct,note";
    public static final String DIAGNOSIS_HEADER = "unit,mode,kind,start,end,finding_id,confidence,candidate_causes,"
            + "diagnosed_cause,diagnosed_probability,normal_share,samples,unit_in_training,note";

    /** A listed finding of a run with its diagnosis. */
    public record Row(AnalysisFolder.Listed finding, Diagnosis.Diagnosed diagnosed, boolean unitInTraining) {
    }

    private DiagnosisFiles() {
    }

    /** The samples of one analysed unit for diagnosis: the detection's normal reference labelled normal. */
    public static List<Samples.Part> parts(AnalysisFolder folder, AnalysisFolder.Unit u,
                                           List<AnalysisFolder.Listed> listed) {
        List<Samples.Part> out = new ArrayList<>();
        for (AnalysisFolder.Mode m : folder.modes(u)) {
            if (!m.analyzed()) {
                continue;
            }
            AnalysisFolder.Samples s = folder.samples(u, m);
            SampleLabels.Labels l = SampleLabels.assign(m.mode(), s.times(), s.cluster(),
                    new HashSet<>(m.normalClusters()), List.of(), listed);
            double[] confidence = new double[s.size()];
            out.add(new Samples.Part(u.iri(), m.mode(), m.features(), s.times(), s.values(), l.label(), l.cause(),
                    l.source(), confidence));
        }
        return out;
    }

    public static void writeHeldOut(Path file, List<Diagnosis.HeldOut> rows, ZoneId zone) {
        OutputFiles.writeText(file, w -> {
            w.write(HELD_OUT_HEADER + "\n");
            for (Diagnosis.HeldOut h : rows) {
                LabelledData.Reviewed v = h.verdict();
                Diagnosis.Diagnosed d = h.diagnosed();
                w.write(String.join(",", Csv.field(v.unit()), v.mode(), v.kind(), Csv.time(v.start(), zone),
                        Csv.time(v.end(), zone), v.findingId(), Csv.field(v.cause()), Csv.field(d.cause()),
                        Csv.number(d.probability()), Csv.number(d.normalShare()), Integer.toString(d.samples()),
                        Boolean.toString(h.correct()), Csv.field(d.why())) + "\n");
            }
        });
    }

    public static void writeDiagnosis(Path file, List<Row> rows, ZoneId zone) {
        OutputFiles.writeText(file, w -> {
            w.write(DIAGNOSIS_HEADER + "\n");
            for (Row r : rows) {
                AnalysisFolder.Listed f = r.finding();
                Diagnosis.Diagnosed d = r.diagnosed();
                w.write(String.join(",", Csv.field(f.unit()), f.mode(), f.kind(), Csv.time(f.start(), zone),
                        Csv.time(f.end(), zone), f.id(), Csv.number(f.confidence()),
                        Csv.field(String.join(" | ", f.causes())), Csv.field(d.cause()), Csv.number(d.probability()),
                        Csv.number(d.normalShare()), Integer.toString(d.samples()),
                        Boolean.toString(r.unitInTraining()), Csv.field(d.why())) + "\n");
            }
        });
    }

    /** The leave-one-unit-out summary: overall, then per confirmed cause. */
    public static List<String> heldOutLines(List<Diagnosis.HeldOut> rows) {
        List<String> lines = new ArrayList<>();
        long correct = rows.stream().filter(Diagnosis.HeldOut::correct).count();
        Set<String> units = new java.util.TreeSet<>();
        rows.forEach(r -> units.add(r.verdict().unit()));
        lines.add(String.format(Locale.ROOT, "Leave-one-unit-out: %d of %d confirmed finding(s) of %d reviewed "
                        + "unit(s) diagnosed with the confirmed cause (%s), each by a classifier that never saw its "
                        + "unit", correct, rows.size(), units.size(),
                rows.isEmpty() ? "n/a" : String.format(Locale.ROOT, "%.1f %%", 100.0 * correct / rows.size())));
        Map<String, int[]> byCause = new java.util.TreeMap<>();
        for (Diagnosis.HeldOut r : rows) {
            int[] c = byCause.computeIfAbsent(r.verdict().cause(), k -> new int[2]);
            c[1]++;
            c[0] += r.correct() ? 1 : 0;
        }
        byCause.forEach((cause, c) -> lines.add(String.format(Locale.ROOT, "  %-30s %d/%d", cause.isEmpty()
                ? SampleLabels.NO_CAUSE : cause, c[0], c[1])));
        return lines;
    }
}
