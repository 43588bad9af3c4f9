package org.tufa.analysis.fleet;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonNull;
import com.google.gson.JsonObject;
import com.google.gson.JsonPrimitive;
import java.util.List;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.findings.ClusterSummary;
import org.tufa.analysis.findings.Shift;

/** The JSON files of a run, built as trees in a fixed key order so that they are byte-identical run to run. */
final class Json {

    private static final Gson GSON = new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().create();

    private Json() {
    }

    static String write(JsonElement e) {
        return GSON.toJson(e) + "\n";
    }

    /** A number, or null for NaN and infinities (JSON has neither). */
    static JsonElement number(double v) {
        return Double.isFinite(v) ? new JsonPrimitive(v) : JsonNull.INSTANCE;
    }

    static JsonArray strings(List<String> values) {
        JsonArray a = new JsonArray();
        values.forEach(a::add);
        return a;
    }

    static String unitSummary(UnitOutcome o) {
        JsonObject u = new JsonObject();
        u.addProperty("unit", o.unit());
        u.addProperty("label", o.label());
        u.addProperty("status", o.status());
        u.addProperty("reason", o.reason());
        u.add("notes", strings(o.notes()));
        JsonArray modes = new JsonArray();
        if (o.summary() != null) {
            for (ModeSummary m : o.summary().modes()) {
                modes.add(mode(m));
            }
        }
        u.add("modes", modes);
        JsonArray findings = new JsonArray();
        for (org.tufa.analysis.findings.Finding f : o.findings()) {
            JsonObject fj = new JsonObject();
            fj.addProperty("mode", f.mode());
            fj.addProperty("kind", f.kind());
            fj.addProperty("start", f.start().toString());
            fj.addProperty("end", f.end().toString());
            fj.add("confidence", number(f.confidence()));
            fj.add("p_value", number(f.pValue()));
            fj.addProperty("evidence", f.evidence());
            org.tufa.analysis.review.ReviewStep.Mark mark = o.mark(f);
            fj.addProperty("id", mark.findingId());
            fj.addProperty("review", mark.status());
            if (mark.own() != null) {
                fj.addProperty("review_cause", mark.own().cause());
                fj.addProperty("review_note", mark.own().note());
            }
            if (!mark.overlapping().isEmpty()) {
                JsonArray near = new JsonArray();
                for (org.tufa.analysis.review.Verdict v : mark.overlapping()) {
                    JsonObject vj = new JsonObject();
                    vj.addProperty("verdict", v.decision().word());
                    vj.addProperty("mode", v.mode());
                    vj.addProperty("kind", v.kind());
                    vj.addProperty("start", v.start().toString());
                    vj.addProperty("end", v.end().toString());
                    near.add(vj);
                }
                fj.add("overlapping_verdicts", near);
            }
            findings.add(fj);
        }
        u.add("findings", findings);
        u.addProperty("findings_below_confidence", o.belowConfidence());
        u.addProperty("findings_not_listed_rejected_by_review", o.review().suppressed().size());
        return write(u);
    }

    private static JsonObject mode(ModeSummary m) {
        JsonObject j = new JsonObject();
        j.addProperty("mode", m.mode());
        j.addProperty("analyzed", m.analyzed());
        j.addProperty("reason", m.reason());
        j.addProperty("mode_samples", m.modeSamples());
        if (m.band() != null) {
            JsonObject b = new JsonObject();
            b.addProperty("kind", m.band().kind().label());
            b.add("q1_kw", number(m.band().q1()));
            b.add("q3_kw", number(m.band().q3()));
            b.add("low_kw", number(m.band().low()));
            b.add("high_kw", number(m.band().high()));
            b.addProperty("in_band", m.band().inBand());
            b.addProperty("out_of_band", m.band().outOfBand());
            b.addProperty("sustained_out_of_band_periods", m.band().sustainedRuns());
            j.add("load_band", b);
        }
        if (!m.analyzed()) {
            return j;
        }
        j.addProperty("samples_clustered", m.samplesClustered());
        j.add("features", strings(m.features()));
        j.add("feature_units", strings(m.featureUnits()));
        j.add("health_features", strings(m.healthFeatures()));
        ModeSummary.Pca pca = m.pca();
        JsonObject p = new JsonObject();
        p.addProperty("components", pca.components());
        JsonArray ratios = new JsonArray();
        for (double r : pca.explainedVarianceRatio()) {
            ratios.add(number(r));
        }
        p.add("explained_variance_ratio", ratios);
        p.add("kept_features", strings(pca.keptFeatures()));
        JsonArray loadings = new JsonArray();
        for (double[] row : pca.loadings()) {
            JsonArray r = new JsonArray();
            for (double v : row) {
                r.add(number(v));
            }
            loadings.add(r);
        }
        p.add("loadings", loadings);
        j.add("pca", p);
        j.addProperty("optics_min_pts", m.minPts());
        j.add("normal_reference_share", number(m.referenceShare()));
        j.addProperty("dominant_regime", m.dominantRegime());
        JsonArray clusters = new JsonArray();
        for (ClusterSummary c : m.clusters()) {
            JsonObject cj = new JsonObject();
            cj.addProperty("cluster", c.label());
            cj.addProperty("size", c.size());
            cj.addProperty("role", c.label() == 0 ? "normal" : c.candidateFault() ? "candidate_fault" : "regime");
            cj.addProperty("direction_check", c.direction() == null ? "" : c.direction().name().toLowerCase(
                    java.util.Locale.ROOT));
            JsonObject shifts = new JsonObject();
            for (Shift s : c.shifts()) {
                shifts.add(s.feature(), number(s.value()));
            }
            cj.add("shift", shifts);
            cj.add("candidate_causes", strings(c.causes()));
            clusters.add(cj);
        }
        j.add("clusters", clusters);
        j.addProperty("noise", m.noise());
        return j;
    }
}
