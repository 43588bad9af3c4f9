package org.tufa.analysis.labels;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.tufa.analysis.cluster.LabelSpreading;
import org.tufa.analysis.cluster.LabelSpreadingResult;
import org.tufa.analysis.review.Verdict;
import org.tufa.analysis.tables.SampleColumn;
import org.tufa.analysis.tables.SampleFormat;
import org.tufa.analysis.tables.SampleTable;
import org.tufa.common.InputException;
import org.tufa.common.OutputFiles;

/**
 * {@code tufa labels}: per unit and clustered mode, every sample with its features (engineering units, and the
 * health features scaled by their gates as the clustering saw them), its label from {@link SampleLabels} and, on
 * units an analyst reviewed, the labels spread to the unlabelled samples ({@link LabelSpreading} on the scaled health
 * features, one graph per unit and mode: the features are relative to the unit's own normal). Writes
 * {@code units/<folder>/<mode>.parquet} (or {@code .csv}) per unit and mode; {@link DataCard} writes labels.md and
 * labels.json. A sample without a confidence (unlabelled) has NaN; a label no verdict gave has review line 0.
 */
public final class LabelExport {

    /** The per-sample file's columns after the features. */
    public static final List<String> LABEL_COLUMNS = List.of("cluster", "label", "cause", "source", "confidence",
            "review_line");

    /**
     * @param spreading the label-spreading parameters
     * @param spread    whether to spread at all
     * @param format    the per-sample files' format
     */
    public record Settings(LabelSpreading.Parameters spreading, boolean spread, SampleFormat format) {
    }

    /**
     * One unit's mode as written.
     *
     * @param file       the per-sample file, relative to the output folder
     * @param features   its feature columns (engineering units), in order
     * @param counts     samples per "label/source" (fault/review, normal/detection, ...)
     * @param causes     fault samples per cause and source ("cause/review", "cause/spreading")
     * @param iterations label-spreading steps (0 when not spread)
     * @param converged  whether the spreading converged
     * @param lines      the review-file lines whose verdicts labelled at least one sample
     */
    public record Part(AnalysisFolder.Unit unit, String mode, String file, List<String> features, int samples,
                       Map<String, Integer> counts, Map<String, Integer> causes, boolean reviewed, int iterations,
                       boolean converged, java.util.Set<Long> lines) {
    }

    /** The export: the classes (normal first, then the confirmed causes) and every part in unit and mode order. */
    public record Result(List<String> classes, List<Part> parts) {
    }

    private LabelExport() {
    }

    public static Result run(AnalysisFolder folder, List<Verdict> verdicts, Settings settings, Path out, int threads) {
        TreeSet<String> causes = new TreeSet<>();
        for (Verdict v : verdicts) {
            if (v.decision() == Verdict.Decision.CONFIRMED) {
                causes.add(v.cause().isEmpty() ? SampleLabels.NO_CAUSE : v.cause());
            }
        }
        List<String> classes = new ArrayList<>();
        classes.add(SampleLabels.NORMAL);
        classes.addAll(causes);
        Map<String, List<Verdict>> byUnit = new TreeMap<>();
        verdicts.forEach(v -> byUnit.computeIfAbsent(v.unit(), k -> new ArrayList<>()).add(v));
        Map<String, List<AnalysisFolder.Listed>> findings = folder.findingsByUnit();
        ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, threads), r -> {
            Thread t = new Thread(r, "tufa-labels");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<List<Part>>> futures = new ArrayList<>();
            for (AnalysisFolder.Unit u : folder.units()) {
                if (!u.analyzed()) {
                    continue;
                }
                List<Verdict> mine = byUnit.getOrDefault(u.iri(), List.of());
                List<AnalysisFolder.Listed> listed = findings.getOrDefault(u.iri(), List.of());
                futures.add(pool.submit(() -> unit(folder, u, mine, listed, classes, settings, out)));
            }
            List<Part> parts = new ArrayList<>();
            for (Future<List<Part>> f : futures) {
                parts.addAll(f.get());
            }
            return new Result(classes, parts);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException re) {
                throw re;
            }
            throw new IllegalStateException(e.getCause());
        } finally {
            pool.shutdownNow();
        }
    }

    private static List<Part> unit(AnalysisFolder folder, AnalysisFolder.Unit u, List<Verdict> verdicts,
                                   List<AnalysisFolder.Listed> findings, List<String> classes, Settings settings,
                                   Path out) {
        List<Part> parts = new ArrayList<>();
        boolean reviewed = !verdicts.isEmpty();
        for (AnalysisFolder.Mode m : folder.modes(u)) {
            if (!m.analyzed()) {
                continue;
            }
            AnalysisFolder.Samples s = folder.samples(u, m);
            SampleLabels.Labels labels = SampleLabels.assign(m.mode(), s.times(), s.cluster(),
                    new HashSet<>(m.normalClusters()), verdicts, findings);
            double[][] scaled = scaled(folder, m, s);
            double[] confidence = new double[s.size()];
            for (int i = 0; i < s.size(); i++) {
                confidence[i] = labels.label()[i].equals(SampleLabels.UNLABELLED) ? Double.NaN : 1;
            }
            int iterations = 0;
            boolean converged = false;
            if (reviewed && settings.spread() && s.size() > 0 && !m.healthFeatures().isEmpty()) {
                LabelSpreadingResult r = spread(u, m, labels, scaled, classes, settings.spreading());
                if (r != null) {
                    iterations = r.iterations();
                    converged = r.converged();
                    for (int i = 0; i < s.size(); i++) {
                        if (labels.label()[i].equals(SampleLabels.UNLABELLED) && r.labels()[i] >= 0) {
                            int c = r.labels()[i];
                            labels.label()[i] = c == 0 ? SampleLabels.NORMAL : SampleLabels.FAULT;
                            labels.cause()[i] = c == 0 ? "" : classes.get(c);
                            labels.source()[i] = SampleLabels.SPREADING;
                            confidence[i] = r.confidence(i);
                        }
                    }
                }
            }
            String file = "units/" + u.folder() + "/" + m.mode() + "." + settings.format().extension();
            write(out.resolve("units").resolve(u.folder()), m.mode(), settings.format(), m, s, scaled, labels,
                    confidence);
            Map<String, Integer> counts = new TreeMap<>();
            Map<String, Integer> causes = new TreeMap<>();
            java.util.Set<Long> lines = new java.util.TreeSet<>();
            for (int i = 0; i < s.size(); i++) {
                if (labels.verdictLine()[i] > 0) {
                    lines.add(labels.verdictLine()[i]);
                }
                counts.merge(labels.label()[i] + "/" + labels.source()[i], 1, Integer::sum);
                if (labels.label()[i].equals(SampleLabels.FAULT)) {
                    causes.merge(labels.cause()[i] + "/" + labels.source()[i], 1, Integer::sum);
                }
            }
            parts.add(new Part(u, m.mode(), file, m.features(), s.size(), counts, causes, reviewed, iterations,
                    converged, lines));
        }
        return parts;
    }

    /** The health features divided by their gates: the space the clustering worked in. */
    static double[][] scaled(AnalysisFolder folder, AnalysisFolder.Mode m, AnalysisFolder.Samples s) {
        int h = m.healthFeatures().size();
        int[] column = new int[h];
        double[] gate = new double[h];
        for (int k = 0; k < h; k++) {
            column[k] = m.features().indexOf(m.healthFeatures().get(k));
            gate[k] = folder.gate(m.healthFeatures().get(k));
        }
        double[][] out = new double[s.size()][h];
        for (int i = 0; i < s.size(); i++) {
            for (int k = 0; k < h; k++) {
                out[i][k] = s.values()[i][column[k]] / gate[k];
            }
        }
        return out;
    }

    private static LabelSpreadingResult spread(AnalysisFolder.Unit u, AnalysisFolder.Mode m,
                                               SampleLabels.Labels labels, double[][] scaled, List<String> classes,
                                               LabelSpreading.Parameters p) {
        int n = scaled.length;
        int[] y = new int[n];
        boolean any = false;
        boolean open = false;
        for (int i = 0; i < n; i++) {
            String l = labels.label()[i];
            y[i] = l.equals(SampleLabels.NORMAL) ? 0 : l.equals(SampleLabels.FAULT) ? classes.indexOf(labels.cause()[i])
                    : -1;
            any |= y[i] >= 0;
            open |= y[i] < 0;
        }
        if (!any || !open) {
            return null;
        }
        if (p.kernel() == LabelSpreading.Kernel.RBF && n > LabelSpreading.MAX_DENSE) {
            throw new InputException("--kernel rbf: unit " + u.name() + ", mode " + m.mode() + " has " + n
                    + " samples; the RBF graph is dense and takes at most " + LabelSpreading.MAX_DENSE
                    + ": use --kernel knn");
        }
        return LabelSpreading.fit(scaled, y, classes.size(), p);
    }

    private static void write(Path dir, String name, SampleFormat format, AnalysisFolder.Mode m,
                              AnalysisFolder.Samples s, double[][] scaled, SampleLabels.Labels labels,
                              double[] confidence) {
        OutputFiles.ensureFolder(dir);
        List<SampleColumn> columns = new ArrayList<>();
        columns.add(SampleColumn.time("timestamp"));
        m.features().forEach(f -> columns.add(SampleColumn.real(f)));
        m.healthFeatures().forEach(h -> columns.add(SampleColumn.real(h + "_scaled")));
        columns.add(SampleColumn.integer("cluster"));
        columns.add(SampleColumn.text("label"));
        columns.add(SampleColumn.text("cause"));
        columns.add(SampleColumn.text("source"));
        columns.add(SampleColumn.real("confidence"));
        columns.add(SampleColumn.integer("review_line"));
        SampleTable.write(dir, name, format, columns, t -> {
            for (int i = 0; i < s.size(); i++) {
                t.time(s.times()[i].getEpochSecond(), s.timeText()[i]);
                for (double v : s.values()[i]) {
                    t.real(v);
                }
                for (double v : scaled[i]) {
                    t.real(v);
                }
                t.integer(s.cluster()[i]);
                t.text(labels.label()[i]);
                t.text(labels.cause()[i]);
                t.text(labels.source()[i]);
                t.real(confidence[i]);
                t.integer((int) labels.verdictLine()[i]);
                t.endRow();
            }
        });
    }

    /** Totals over all parts: "label/source" -> samples. */
    public static Map<String, Integer> totals(List<Part> parts) {
        Map<String, Integer> t = new TreeMap<>();
        parts.forEach(p -> p.counts().forEach((k, v) -> t.merge(k, v, Integer::sum)));
        return t;
    }

    /** Fault samples per cause over all parts, "cause/source" -> samples. */
    public static Map<String, Integer> causeTotals(List<Part> parts) {
        Map<String, Integer> t = new LinkedHashMap<>();
        parts.forEach(p -> p.causes().forEach((k, v) -> t.merge(k, v, Integer::sum)));
        return new TreeMap<>(t);
    }
}
