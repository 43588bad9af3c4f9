package org.tufa.analysis.labels;

import com.google.gson.GsonBuilder;
import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.tufa.analysis.cluster.LabelSpreading;
import org.tufa.analysis.fleet.FleetReport;
import org.tufa.analysis.review.Verdict;
import org.tufa.common.OutputFiles;

/**
 * The data card of an export, {@code labels.md} (what the files hold, what each label and source means, counts per
 * label, cause and unit, how the labels were spread, the caution), and its machine-readable twin,
 * {@code labels.json} ({@code tufa diagnose} reads it). Both are the same bytes for the same inputs.
 */
public final class DataCard {

    public static final String CARD = "labels.md";
    public static final String INDEX = "labels.json";

    private DataCard() {
    }

    /** Writes labels.md and labels.json into the export folder. */
    public static void write(Path out, LabelExport.Result result, LabelExport.Settings settings, Path analysis,
                             Path review, String reviewSha256, List<Verdict> verdicts, java.time.ZoneId zone) {
        OutputFiles.writeString(out.resolve(CARD), card(result, settings, analysis, review, reviewSha256));
        OutputFiles.writeString(out.resolve(INDEX), index(result, settings, analysis, review, reviewSha256, verdicts,
                zone));
    }

    static String card(LabelExport.Result r, LabelExport.Settings s, Path analysis, Path review, String sha) {
        StringBuilder b = new StringBuilder();
        b.append("# Labelled samples\n\n");
        b.append("Data card of the samples `tufa labels` labelled from the analysis in `").append(analysis)
                .append("` and the analyst's review `").append(review).append("` (SHA-256 ").append(sha)
                .append(").\n\n");
        b.append("**What the files hold.** One table per unit and clustered operating mode, `units/<folder>/<mode>"
                + ".").append(s.format().extension()).append("` (").append(s.format() == org.tufa.analysis.tables
                .SampleFormat.PARQUET ? "Apache Parquet" : "CSV with a header row").append("): every sample the "
                + "analysis clustered (`timestamp`, the sample's start), its features in engineering units as in "
                + "the analysis' `features` table, its health features divided by their engineering gates "
                + "(`<feature>_scaled`, the space the clustering worked in), its `cluster` (-1 noise), and "
                + "`label`, `cause`, `source`, `confidence` (1 for a person's or the detection's label, the spread "
                + "share for spreading, NaN when unlabelled) and `review_line` (the line of the review file whose "
                + "verdict gave the label, 0 when none). Numbers at full double precision.\n\n");
        b.append("**Labels and their sources.**\n\n| label | source | meaning |\n|---|---|---|\n"
                + "| fault | review | a person confirmed a finding covering the sample; `cause` is the cause they "
                + "named |\n"
                + "| normal | review | a person rejected a finding covering the sample: normal operation |\n"
                + "| normal | detection | the sample is in its mode's normal reference (the largest cluster and the "
                + "regimes that agree with it) and no listed finding covers it: the unsupervised detection's "
                + "label, not a person's |\n"
                + "| fault or normal | spreading | spread from the labels above to an unlabelled sample of a reviewed "
                + "unit (label spreading, Zhou et al., NIPS 2003); `confidence` is the share of the sample's "
                + "spread distribution on its label |\n"
                + "| unlabelled | not_sure | a person looked at a finding covering the sample and did not decide |\n"
                + "| unlabelled | none | nobody decided: noise, candidate clusters, findings without a verdict, "
                + "and samples spreading did not reach |\n\n");
        b.append("**Intended use.** Training and checking classifiers that suggest a cause for a finding "
                + "(`tufa diagnose`). The labels are only as good as the review: a cause is what an analyst wrote, "
                + "and the detection's normal reference can hold faults nobody found. Labels spread by the graph "
                + "are guesses with a confidence, not verdicts.\n\n");
        b.append("## Samples per label and source\n\n| label | source | samples |\n|---|---|---:|\n");
        LabelExport.totals(r.parts()).forEach((k, v) -> {
            String[] ls = k.split("/", 2);
            b.append("| ").append(ls[0]).append(" | ").append(ls[1]).append(" | ").append(v).append(" |\n");
        });
        b.append("\n## Confirmed causes\n\n| cause | samples (review) | samples (spreading) | units |\n"
                + "|---|---:|---:|---:|\n");
        for (String cause : r.classes().subList(1, r.classes().size())) {
            int byReview = 0;
            int bySpreading = 0;
            java.util.Set<String> units = new java.util.TreeSet<>();
            for (LabelExport.Part p : r.parts()) {
                int a = p.causes().getOrDefault(cause + "/" + SampleLabels.REVIEW, 0);
                int c = p.causes().getOrDefault(cause + "/" + SampleLabels.SPREADING, 0);
                byReview += a;
                bySpreading += c;
                if (a > 0) {
                    units.add(p.unit().iri());
                }
            }
            b.append("| ").append(md(cause)).append(" | ").append(byReview).append(" | ").append(bySpreading).append(" | ")
                    .append(units.size()).append(" |\n");
        }
        b.append("\n## Samples per unit (all clustered modes)\n\n| unit | reviewed | samples | fault (review) | "
                + "normal (review) | normal (detection) | fault (spreading) | normal (spreading) | not sure | "
                + "unlabelled |\n|---|---|---:|---:|---:|---:|---:|---:|---:|---:|\n");
        Map<String, Map<String, Integer>> perUnit = new LinkedHashMap<>();
        Map<String, LabelExport.Part> first = new LinkedHashMap<>();
        Map<String, Integer> samples = new TreeMap<>();
        for (LabelExport.Part p : r.parts()) {
            first.putIfAbsent(p.unit().iri(), p);
            samples.merge(p.unit().iri(), p.samples(), Integer::sum);
            Map<String, Integer> c = perUnit.computeIfAbsent(p.unit().iri(), k -> new TreeMap<>());
            p.counts().forEach((k, v) -> c.merge(k, v, Integer::sum));
        }
        for (Map.Entry<String, Map<String, Integer>> e : perUnit.entrySet()) {
            Map<String, Integer> c = e.getValue();
            LabelExport.Part p = first.get(e.getKey());
            b.append("| ").append(md(p.unit().name())).append(" | ").append(p.reviewed() ? "yes" : "no").append(" | ")
                    .append(samples.get(e.getKey()));
            for (String k : List.of("fault/review", "normal/review", "normal/detection", "fault/spreading",
                    "normal/spreading", "unlabelled/not_sure", "unlabelled/none")) {
                b.append(" | ").append(c.getOrDefault(k, 0));
            }
            b.append(" |\n");
        }
        LabelSpreading.Parameters p = s.spreading();
        long spread = r.parts().stream().filter(x -> x.iterations() > 0).count();
        long converged = r.parts().stream().filter(x -> x.iterations() > 0 && x.converged()).count();
        b.append("\n## Spreading\n\n");
        if (!s.spread()) {
            b.append("Not spread (`--no-spread`).\n");
        } else {
            b.append("Label spreading (Zhou, Bousquet, Lal, Weston and Schoelkopf, NIPS 2003) on the scaled health "
                    + "features, one graph per reviewed unit and mode: kernel ").append(p.kernel().name()
                    .toLowerCase(java.util.Locale.ROOT)).append(p.kernel() == LabelSpreading.Kernel.RBF
                    ? ", gamma " + p.gamma() : ", " + p.neighbours() + " neighbours").append(", alpha ")
                    .append(p.alpha()).append(", at most ").append(p.maxIter()).append(" steps, tolerance ")
                    .append(p.tol()).append(". Spread on ").append(spread).append(" unit mode(s), converged on ")
                    .append(converged).append(". Classes: ").append(md(String.join(", ", r.classes())))
                    .append(".\n");
        }
        b.append("\n**Caution.** ").append(FleetReport.CAUTION).append(" Labels and causes here are what an analyst "
                + "recorded and what the tool inferred from it; they are candidates for training, not facts about "
                + "the equipment.\n");
        return b.toString();
    }

    private static String md(String text) {
        return text.replace("|", "\\|").replace("\n", " ");
    }

    static String index(LabelExport.Result r, LabelExport.Settings s, Path analysis, Path review, String sha,
                        List<Verdict> verdicts, java.time.ZoneId zone) {
        JsonObject o = new JsonObject();
        o.addProperty("tool", "tufa labels");
        o.addProperty("analysis", analysis.toString());
        o.addProperty("review", review.toString());
        o.addProperty("review_sha256", sha);
        JsonObject p = new JsonObject();
        p.addProperty("spread", s.spread());
        p.addProperty("kernel", s.spreading().kernel().name().toLowerCase(java.util.Locale.ROOT));
        p.addProperty("gamma", s.spreading().gamma());
        p.addProperty("neighbours", s.spreading().neighbours());
        p.addProperty("alpha", s.spreading().alpha());
        p.addProperty("max_iter", s.spreading().maxIter());
        p.addProperty("tol", s.spreading().tol());
        p.addProperty("format", s.format().extension());
        o.add("parameters", p);
        JsonArray classes = new JsonArray();
        r.classes().forEach(classes::add);
        o.add("classes", classes);
        JsonArray files = new JsonArray();
        for (LabelExport.Part part : r.parts()) {
            JsonObject f = new JsonObject();
            f.addProperty("unit", part.unit().iri());
            f.addProperty("label", part.unit().label());
            f.addProperty("folder", part.unit().folder());
            f.addProperty("mode", part.mode());
            f.addProperty("file", part.file());
            JsonArray features = new JsonArray();
            part.features().forEach(features::add);
            f.add("features", features);
            f.addProperty("samples", part.samples());
            f.addProperty("reviewed", part.reviewed());
            JsonObject counts = new JsonObject();
            part.counts().forEach(counts::addProperty);
            f.add("counts", counts);
            JsonObject causes = new JsonObject();
            part.causes().forEach(causes::addProperty);
            f.add("causes", causes);
            f.addProperty("spreading_iterations", part.iterations());
            f.addProperty("spreading_converged", part.converged());
            files.add(f);
        }
        o.add("files", files);
        JsonArray vs = new JsonArray();
        for (Verdict v : verdicts) {
            JsonObject j = new JsonObject();
            j.addProperty("line", v.line());
            j.addProperty("unit", v.unit());
            j.addProperty("mode", v.mode());
            j.addProperty("kind", v.kind());
            j.addProperty("start", org.tufa.analysis.fleet.Csv.time(v.start(), zone));
            j.addProperty("end", org.tufa.analysis.fleet.Csv.time(v.end(), zone));
            j.addProperty("finding_id", v.findingId());
            j.addProperty("verdict", v.decision().word());
            j.addProperty("cause", v.cause());
            vs.add(j);
        }
        o.add("verdicts", vs);
        JsonObject totals = new JsonObject();
        LabelExport.totals(r.parts()).forEach(totals::addProperty);
        o.add("totals", totals);
        return new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().create().toJson(o) + "\n";
    }
}
