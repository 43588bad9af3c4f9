package org.tufa.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.Callable;
import org.tufa.analysis.cluster.LabelSpreading;
import org.tufa.analysis.labels.AnalysisFolder;
import org.tufa.analysis.labels.DataCard;
import org.tufa.analysis.labels.LabelExport;
import org.tufa.analysis.review.ReviewFile;
import org.tufa.analysis.review.Verdict;
import org.tufa.analysis.tables.SampleFormat;
import org.tufa.common.InputException;
import org.tufa.common.OutputFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tufa labels}: the analysed samples with the analyst's verdicts as labels, spread to the unlabelled ones. */
@Command(name = "labels", mixinStandardHelpOptions = true,
        description = {"Export labelled data: per unit and clustered mode, every sample with its features (engineering "
                + "units and scaled), a label (fault with the confirmed cause, normal, unlabelled) and where the "
                + "label came from (the review, the detection's normal reference, or label spreading on reviewed "
                + "units, with its confidence).",
            "Writes DIR2/units/<folder>/<mode>.parquet (or .csv), the data card DIR2/labels.md and DIR2/labels.json."})
public final class LabelsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Option(names = "--analysis", required = true, paramLabel = "DIR", description = "Folder tufa analyze wrote.")
    Path analysis;

    @Option(names = "--review", required = true, paramLabel = "FILE", description = "The analyst's review.csv.")
    Path review;

    @Option(names = "--out", required = true, paramLabel = "DIR2", description = "Output folder (not the analysis').")
    Path out;

    @Option(names = "--kernel", paramLabel = "KIND", defaultValue = "knn",
            description = "Label-spreading graph: knn (k nearest neighbours, sparse) or rbf (dense, at most "
                    + LabelSpreading.MAX_DENSE + " samples per unit and mode) (default: ${DEFAULT-VALUE}).")
    String kernel;

    @Option(names = "--neighbours", paramLabel = "K", defaultValue = "7",
            description = "k of the knn graph, the sample itself counted (default: ${DEFAULT-VALUE}).")
    int neighbours;

    @Option(names = "--gamma", paramLabel = "G", defaultValue = "20",
            description = "Width of the rbf graph, affinity exp(-G d^2) in scaled units (default: ${DEFAULT-VALUE}).")
    double gamma;

    @Option(names = "--alpha", paramLabel = "A", defaultValue = "0.2",
            description = "Share a sample takes from its neighbours at each step, in (0, 1) (default: "
                    + "${DEFAULT-VALUE}).")
    double alpha;

    @Option(names = "--max-iter", paramLabel = "N", defaultValue = "30",
            description = "Most spreading steps (default: ${DEFAULT-VALUE}).")
    int maxIter;

    @Option(names = "--tol", paramLabel = "T", defaultValue = "0.001",
            description = "Stop when a step changes the distributions by less than this in sum (default: "
                    + "${DEFAULT-VALUE}).")
    double tol;

    @Option(names = "--no-spread", description = "Only the labels of the review and the detection; no spreading.")
    boolean noSpread;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "parquet",
            description = "Per-sample files: parquet (compressed, typed) or csv, same columns (default: "
                    + "${DEFAULT-VALUE}).")
    String format;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    int threads = Runtime.getRuntime().availableProcessors();

    @Override
    public Integer call() {
        PrintWriter stdout = spec.commandLine().getOut();
        LabelSpreading.Kernel k = switch (kernel.toLowerCase(Locale.ROOT)) {
            case "knn" -> LabelSpreading.Kernel.KNN;
            case "rbf" -> LabelSpreading.Kernel.RBF;
            default -> throw new InputException("--kernel " + kernel + ": give knn or rbf");
        };
        LabelSpreading.Parameters p;
        try {
            p = new LabelSpreading.Parameters(k, gamma, neighbours, alpha, maxIter, tol);
        } catch (IllegalArgumentException e) {
            throw new InputException("--gamma, --neighbours, --alpha, --max-iter or --tol: " + e.getMessage());
        }
        SampleFormat sampleFormat;
        try {
            sampleFormat = SampleFormat.fromName(format);
        } catch (IllegalArgumentException e) {
            throw new InputException("--format: '" + format + "' is not a format; use parquet or csv");
        }
        if (threads < 1 || threads > AnalyzeCommand.MAX_THREADS) {
            throw new InputException("--threads " + threads + ": give 1 to " + AnalyzeCommand.MAX_THREADS);
        }
        OutputFiles.checkFolder("--out", out);
        if (OutputFiles.canonical(out).startsWith(OutputFiles.canonical(analysis))) {
            throw InputException.in(out, "--out lies in the --analysis folder; write the labelled data to a folder "
                    + "of its own");
        }
        Map<String, Path> outputs = new LinkedHashMap<>();
        outputs.put("--out (" + DataCard.CARD + ")", out.resolve(DataCard.CARD));
        outputs.put("--out (" + DataCard.INDEX + ")", out.resolve(DataCard.INDEX));
        OutputFiles.checkDistinct(Map.of("--review", review), outputs);
        if (OutputFiles.canonical(review).startsWith(OutputFiles.canonical(out.resolve("units")))) {
            throw InputException.in(review, "--review lies in " + out.resolve("units") + ", which this run rewrites");
        }
        AnalysisFolder folder = AnalysisFolder.open(analysis);
        List<Verdict> verdicts = ReviewFile.read(review, folder.knownUnits());
        LabelExport.Settings settings = new LabelExport.Settings(p, !noSpread, sampleFormat);
        LabelExport.Result result = LabelExport.run(folder, verdicts, settings, out, threads);
        DataCard.write(out, result, settings, analysis, review, sha256(review), verdicts, folder.zone());
        summary(result, verdicts).forEach(stdout::println);
        stdout.println("Wrote " + out.resolve(DataCard.CARD) + ", " + out.resolve(DataCard.INDEX) + " and "
                + result.parts().size() + " file(s) under " + out.resolve("units"));
        stdout.flush();
        return ExitCodes.OK;
    }

    static List<String> summary(LabelExport.Result result, List<Verdict> verdicts) {
        List<String> lines = new ArrayList<>();
        Map<String, Integer> t = LabelExport.totals(result.parts());
        int samples = t.values().stream().mapToInt(Integer::intValue).sum();
        long units = result.parts().stream().map(x -> x.unit().iri()).distinct().count();
        long reviewed = result.parts().stream().filter(LabelExport.Part::reviewed).map(x -> x.unit().iri()).distinct()
                .count();
        lines.add(String.format(Locale.ROOT, "Labels: %d samples of %d unit(s) (%d reviewed) in %d unit mode(s): "
                        + "%s", samples, units, reviewed, result.parts().size(), String.join(", ", t.entrySet()
                .stream().map(e -> e.getValue() + " " + e.getKey().replace('/', ' ')).toList())));
        lines.add("Classes: " + String.join(", ", result.classes()));
        Set<Long> used = new TreeSet<>();
        result.parts().forEach(x -> used.addAll(x.lines()));
        List<String> idle = verdicts.stream().filter(v -> !used.contains(v.line())).map(v -> Long.toString(v.line()))
                .toList();
        lines.add(String.format(Locale.ROOT, "Verdicts: %d read, %d label samples%s", verdicts.size(),
                verdicts.size() - idle.size(), idle.isEmpty() ? "" : "; " + idle.size() + " label none (lines "
                        + String.join(", ", idle.subList(0, Math.min(10, idle.size()))) + (idle.size() > 10 ? ", ..."
                        : "") + "): no clustered sample of their mode lies in their period, or a confirmation "
                        + "of the same samples takes precedence"));
        return lines;
    }

    static String sha256(Path file) {
        try {
            java.security.MessageDigest d = java.security.MessageDigest.getInstance("SHA-256");
            return java.util.HexFormat.of().formatHex(d.digest(java.nio.file.Files.readAllBytes(file)));
        } catch (java.io.IOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
