package org.tufa.analysis.fleet;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.tufa.analysis.decision.FleetDecision;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.Shift;
import org.tufa.analysis.review.ReviewStep;
import org.tufa.analysis.review.Verdict;
import org.tufa.analysis.trends.IngestReport;
import org.tufa.common.OutputFiles;

/**
 * The fleet-level files of a run: {@code fleet.csv}, {@code findings.csv}, {@code fleet_findings.csv},
 * {@code ranking.csv} and {@code run.json}. Their names and columns are fixed: other tools and tufa's own report
 * read them (new columns are only ever added at the end).
 */
public final class FleetOutputs {

    public static final String FLEET_HEADER =
            "unit,label,folder,status,reason,modes,samples_used,clusters,fault_clusters,fault_hours,energy_kwh,"
                    + "findings,below_confidence,top_confidence";
    public static final String FINDINGS_HEADER =
            "unit,mode,kind,cluster,start,end,hours,energy_kwh,shift,candidate_causes,confidence,p_value,evidence,"
                    + "finding_id,review,review_cause,review_overlaps";
    public static final String FLEET_FINDINGS_HEADER =
            "mode,kind,start,end,hours,energy_kwh,units,shift,candidate_causes,confidence,p_value,evidence,unit_list";
    public static final String RANKING_HEADER = "rank,unit,label,top_confidence,fault_hours,energy_kwh,findings";

    private FleetOutputs() {
    }

    /** Writes the fleet files; returns their paths. */
    public static List<Path> write(Path dir, FleetAnalysis.Result result, ZoneId zone, Map<String, Object> parameters,
                                   List<Path> inputs) {
        try {
            OutputFiles.ensureFolder(dir);
            List<Path> out = new ArrayList<>();
            out.add(write(dir.resolve("fleet.csv"), fleet(result.units())));
            out.add(write(dir.resolve("findings.csv"), findings(result.units(), zone)));
            out.add(write(dir.resolve("fleet_findings.csv"), fleetFindings(result.fleetFindings(), zone)));
            out.add(write(dir.resolve("ranking.csv"), ranking(result.units())));
            out.add(write(dir.resolve("run.json"), runJson(parameters, inputs, result)));
            return out;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write to " + dir + ": " + e.getMessage(), e);
        }
    }

    private static Path write(Path file, String text) {
        OutputFiles.writeString(file, text);
        return file;
    }

    static String fleet(List<UnitOutcome> units) {
        StringBuilder b = new StringBuilder(FLEET_HEADER).append('\n');
        for (UnitOutcome u : units) {
            b.append(Csv.field(u.unit())).append(',').append(Csv.field(u.label())).append(',')
                    .append(Csv.field(u.folder())).append(',').append(u.status()).append(',')
                    .append(Csv.field(u.reason())).append(',').append(u.analyzedModes()).append(',')
                    .append(u.samplesUsed()).append(',').append(u.clusters()).append(',')
                    .append(u.faultClusters()).append(',').append(Csv.fixed(u.faultHours(), 2)).append(',')
                    .append(Csv.fixed(u.faultEnergyKwh(), 1)).append(',').append(u.findings().size()).append(',')
                    .append(u.belowConfidence()).append(',').append(Csv.fixed(u.topConfidence(), 4)).append('\n');
        }
        return b.toString();
    }

    static String findings(List<UnitOutcome> units, ZoneId zone) {
        StringBuilder b = new StringBuilder(FINDINGS_HEADER).append('\n');
        for (UnitOutcome u : units) {
            for (Finding f : u.findings()) {
                String shift = f.shifts().stream().map(Shift::describe).collect(Collectors.joining("; "));
                b.append(Csv.field(u.unit())).append(',').append(f.mode()).append(',').append(f.kind()).append(',')
                        .append(f.cluster() < 0 ? "" : Integer.toString(f.cluster())).append(',')
                        .append(Csv.time(f.start(), zone)).append(',').append(Csv.time(f.end(), zone)).append(',')
                        .append(Csv.fixed(f.hours(), 2)).append(',').append(Csv.fixed(f.energyKwh(), 1)).append(',')
                        .append(Csv.field(shift)).append(',')
                        .append(Csv.field(String.join(" | ", f.causes()))).append(',')
                        .append(Csv.fixed(f.confidence(), 4)).append(',').append(Csv.number(f.pValue())).append(',')
                        .append(Csv.field(f.evidence())).append(',');
                ReviewStep.Mark mark = u.mark(f);
                b.append(mark.findingId()).append(',').append(mark.status()).append(',')
                        .append(Csv.field(mark.own() == null ? "" : mark.own().cause())).append(',')
                        .append(Csv.field(overlaps(mark, zone))).append('\n');
            }
        }
        return b.toString();
    }

    /** The other verdicts that overlap a finding, in words: "rejected any mode_hunting from 2031-... (line 4)". */
    public static String overlaps(ReviewStep.Mark mark, ZoneId zone) {
        return mark.overlapping().stream().map(v -> v.decision().word() + " " + v.mode() + " " + v.kind() + " from "
                + Csv.time(v.start(), zone) + " to " + Csv.time(v.end(), zone) + " (review " + v.where() + ")")
                .collect(Collectors.joining("; "));
    }

    static String fleetFindings(List<FleetDecision.FleetFinding> fleet, ZoneId zone) {
        StringBuilder b = new StringBuilder(FLEET_FINDINGS_HEADER).append('\n');
        for (FleetDecision.FleetFinding ff : fleet) {
            Finding f = ff.finding();
            String shift = f.shifts().stream().map(Shift::describe).collect(Collectors.joining("; "));
            b.append(f.mode()).append(',').append(f.kind()).append(',').append(Csv.time(f.start(), zone)).append(',')
                    .append(Csv.time(f.end(), zone)).append(',').append(Csv.fixed(f.hours(), 2)).append(',')
                    .append(Csv.fixed(f.energyKwh(), 1)).append(',').append(ff.units().size()).append(',')
                    .append(Csv.field(shift)).append(',').append(Csv.field(String.join(" | ", f.causes())))
                    .append(',').append(Csv.fixed(f.confidence(), 4)).append(',').append(Csv.number(f.pValue()))
                    .append(',').append(Csv.field(f.evidence())).append(',')
                    .append(Csv.field(String.join(" ", ff.units()))).append('\n');
        }
        return b.toString();
    }

    /**
     * Units with findings ranked by their most confident finding, then fault hours, then energy, then IRI (a total
     * order: deterministic).
     */
    public static List<UnitOutcome> ranked(List<UnitOutcome> units) {
        return units.stream().filter(u -> !u.findings().isEmpty())
                .sorted(Comparator.comparingDouble(UnitOutcome::topConfidence).reversed()
                        .thenComparing(Comparator.comparingDouble(UnitOutcome::faultHours).reversed())
                        .thenComparing(Comparator.comparingDouble(UnitOutcome::faultEnergyKwh).reversed())
                        .thenComparing(UnitOutcome::unit))
                .toList();
    }

    static String ranking(List<UnitOutcome> units) {
        StringBuilder b = new StringBuilder(RANKING_HEADER).append('\n');
        int rank = 1;
        for (UnitOutcome u : ranked(units)) {
            b.append(rank++).append(',').append(Csv.field(u.unit())).append(',').append(Csv.field(u.label()))
                    .append(',').append(Csv.fixed(u.topConfidence(), 4)).append(',')
                    .append(Csv.fixed(u.faultHours(), 2)).append(',')
                    .append(Csv.fixed(u.faultEnergyKwh(), 1)).append(',').append(u.findings().size()).append('\n');
        }
        return b.toString();
    }

    static String runJson(Map<String, Object> parameters, List<Path> inputs, FleetAnalysis.Result result)
            throws IOException {
        JsonObject run = new JsonObject();
        run.addProperty("tool", "tufa");
        String version = FleetOutputs.class.getPackage().getImplementationVersion();
        run.addProperty("version", version == null ? "development" : version);
        JsonObject libs = new JsonObject();
        libs.addProperty("jena", "5.6.0");
        libs.addProperty("smile", "3.1.1");
        run.add("libraries", libs);
        JsonObject p = new JsonObject();
        for (Map.Entry<String, Object> e : new java.util.TreeMap<>(parameters).entrySet()) {
            p.addProperty(e.getKey(), String.valueOf(e.getValue()));
        }
        run.add("parameters", p);
        JsonArray files = new JsonArray();
        for (Path in : expand(inputs)) {
            JsonObject f = new JsonObject();
            f.addProperty("path", in.toString());
            f.addProperty("bytes", Files.size(in));
            f.addProperty("sha256", sha256(in));
            files.add(f);
        }
        run.add("inputs", files);
        run.add("ingest", ingestJson(result == null ? null : result.ingest()));
        if (result != null) {
            run.add("decision", decision(result));
            if (result.review().any()) {
                run.add("review", review(result.review()));
            }
        }
        return Json.write(run);
    }

    /** Every count of the ingest, per file and in total, with every unknown series id: nothing dropped unsaid. */
    static JsonObject ingestJson(IngestReport ingest) {
        JsonObject o = new JsonObject();
        if (ingest == null) {
            return o;
        }
        o.addProperty("rows", ingest.rows());
        o.addProperty("samples_kept", ingest.samplesKept());
        o.addProperty("outside_window", ingest.samplesOutsideWindow());
        o.addProperty("unknown_series_values", ingest.unknownSeriesSamples());
        o.addProperty("empty_values", ingest.emptyValues());
        o.addProperty("unparsable_values", ingest.unparsableValues());
        o.addProperty("non_finite_values", ingest.nonFiniteValues());
        o.addProperty("implausible_values", ingest.implausibleValues());
        o.addProperty("exact_duplicates", ingest.duplicateSamples());
        o.addProperty("conflicting_duplicates", ingest.conflictingDuplicates());
        o.addProperty("unreadable_time_stamps", ingest.unparsableTimestamps());
        o.addProperty("malformed_rows", ingest.malformedRows());
        o.addProperty("dst_repeated", ingest.dstRepeatedFirstPass() + ingest.dstRepeatedSecondPass());
        o.addProperty("dst_skipped", ingest.dstSkipped());
        JsonArray unknown = new JsonArray();
        ingest.unknownSeries().forEach(unknown::add);
        o.add("unknown_series", unknown);
        JsonArray never = new JsonArray();
        ingest.seriesNeverSeen().forEach(never::add);
        o.add("series_without_data", never);
        JsonArray files = new JsonArray();
        for (var f : ingest.files()) {
            JsonObject fo = new JsonObject();
            fo.addProperty("path", f.file().toString());
            fo.addProperty("format", f.format().toString().toLowerCase(java.util.Locale.ROOT));
            fo.addProperty("rows", f.rows());
            fo.addProperty("samples_stored", f.samplesKept());
            fo.addProperty("outside_window", f.samplesOutsideWindow());
            fo.addProperty("unknown_series_values", f.unknownSeriesSamples());
            fo.addProperty("empty_values", f.emptyValues());
            fo.addProperty("unparsable_values", f.unparsableValues());
            fo.addProperty("non_finite_values", f.nonFiniteValues());
            fo.addProperty("implausible_values", f.implausibleValues());
            fo.addProperty("unreadable_time_stamps", f.unparsableTimestamps());
            fo.addProperty("malformed_rows", f.malformedRows());
            JsonArray examples = new JsonArray();
            f.problemExamples().forEach(examples::add);
            fo.add("problem_examples", examples);
            files.add(fo);
        }
        o.add("files", files);
        return o;
    }

    /** The fleet stage's figures: tests, findings listed and below confidence, every channel's null. */
    private static JsonObject decision(FleetAnalysis.Result result) {
        JsonObject d = new JsonObject();
        d.addProperty("tests", result.tests());
        d.addProperty("findings_listed", result.units().stream().mapToInt(u -> u.findings().size()).sum());
        d.addProperty("findings_below_confidence", result.units().stream().mapToInt(UnitOutcome::belowConfidence)
                .sum());
        d.addProperty("fleet_findings_listed", result.fleetFindings().size());
        d.addProperty("fleet_findings_below_confidence", result.fleetBelowConfidence());
        JsonArray nulls = new JsonArray();
        for (FleetDecision.ChannelNull n : result.nulls()) {
            JsonObject j = new JsonObject();
            j.addProperty("channel", n.key());
            j.addProperty("units", n.units());
            j.addProperty("candidates", n.candidates());
            j.add("gumbel_location", Json.number(n.nullDistribution().location()));
            j.add("gumbel_scale", Json.number(n.nullDistribution().scale()));
            j.addProperty("fitted_to_fleet", n.nullDistribution().fitted());
            nulls.add(j);
        }
        d.add("channel_nulls", nulls);
        return d;
    }

    /** What the review did: verdicts by decision, applied, findings taken out, and every verdict that matched none. */
    private static JsonObject review(ReviewStep.Result review) {
        JsonObject o = new JsonObject();
        o.addProperty("verdicts", review.verdicts().size());
        for (Verdict.Decision d : Verdict.Decision.values()) {
            o.addProperty(d.word(), review.verdicts().stream().filter(v -> v.decision() == d).count());
        }
        o.addProperty("applied", review.applied().size());
        o.addProperty("findings_not_listed_rejected", review.suppressedCount());
        JsonArray unmatched = new JsonArray();
        for (ReviewStep.Unmatched u : review.unmatched()) {
            JsonObject j = new JsonObject();
            Verdict v = u.verdict();
            j.addProperty("line", v.line());
            j.addProperty("unit", v.unit());
            j.addProperty("mode", v.mode());
            j.addProperty("kind", v.kind());
            j.addProperty("start", v.start().toString());
            j.addProperty("end", v.end().toString());
            j.addProperty("finding_id", v.findingId());
            j.addProperty("verdict", v.decision().word());
            j.addProperty("reason", u.reason());
            unmatched.add(j);
        }
        o.add("unmatched", unmatched);
        return o;
    }

    private static List<Path> expand(List<Path> inputs) throws IOException {
        List<Path> out = new ArrayList<>();
        for (Path p : inputs) {
            if (Files.isDirectory(p)) {
                try (var s = Files.list(p)) {
                    s.filter(Files::isRegularFile).sorted().forEach(out::add);
                }
            } else {
                out.add(p);
            }
        }
        return out;
    }

    static String sha256(Path file) throws IOException {
        try (InputStream in = Files.newInputStream(file)) {
            MessageDigest d = MessageDigest.getInstance("SHA-256");
            byte[] buf = new byte[1 << 16];
            for (int r; (r = in.read(buf)) > 0; ) {
                d.update(buf, 0, r);
            }
            return HexFormat.of().formatHex(d.digest());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
