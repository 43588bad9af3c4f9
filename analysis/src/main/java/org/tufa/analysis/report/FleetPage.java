package org.tufa.analysis.report;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.RoleMatch;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.Shift;
import org.tufa.analysis.fleet.FleetAnalysis;
import org.tufa.analysis.fleet.FleetOutputs;
import org.tufa.analysis.fleet.UnitOutcome;
import org.tufa.analysis.review.ReviewStep;

/**
 * The fleet page, {@code DIR/report/index.html}: unit counts, ranking, the findings table (sortable), every unit
 * with its status and the coverage matrix (units x roles), linking to the unit pages {@link UnitPages} wrote.
 */
public final class FleetPage {

    private FleetPage() {
    }

    /** The report folder of a run's output directory. */
    public static Path reportDir(Path outDir) {
        return outDir.resolve("report");
    }

    /**
     * Writes {@code reportDir/index.html}; returns its path.
     *
     * @param reportDir {@link #reportDir}
     */
    public static Path write(Path reportDir, FleetAnalysis.Result result, FleetCoverage coverage, ZoneId zone) {
        org.tufa.common.OutputFiles.ensureFolder(reportDir);
        Path index = reportDir.resolve("index.html");
        org.tufa.common.OutputFiles.writeString(index, page(result, coverage, zone));
        return index;
    }

    /** "N files, X.X MB" for a report folder: what the console says after writing it. */
    public static String describeSize(Path reportDir) {
        long files = 0;
        long bytes = 0;
        try (java.util.stream.Stream<Path> s = Files.walk(reportDir)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                files++;
                bytes += Files.size(p);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot list " + reportDir + ": " + e.getMessage(), e);
        }
        return String.format(java.util.Locale.ROOT, "%d files, %.1f MB", files, bytes / 1e6);
    }

    static String page(FleetAnalysis.Result result, FleetCoverage coverage, ZoneId zone) {
        List<UnitOutcome> units = result.units();
        Map<String, UnitOutcome> byUnit = new TreeMap<>();
        units.forEach(u -> byUnit.put(u.unit(), u));
        StringBuilder b = new StringBuilder(65_536);
        Html.open(b, "tufa fleet report", "Fleet report");
        counts(b, result, coverage, zone);
        confidence(b, result);
        ranking(b, units);
        fleetFindings(b, result, zone);
        findings(b, result, zone);
        Html.caution(b);
        unitTable(b, units);
        coverageMatrix(b, coverage, byUnit);
        Html.close(b, units.stream().anyMatch(u -> !u.findings().isEmpty()) ? ReviewControls.SCRIPT : "");
        return b.toString();
    }

    private static String href(UnitOutcome u) {
        return "units/" + u.folder() + "/index.html";
    }

    private static void counts(StringBuilder b, FleetAnalysis.Result result, FleetCoverage coverage, ZoneId zone) {
        Map<String, Integer> byStatus = new TreeMap<>();
        Map<String, Integer> byKind = new TreeMap<>();
        for (UnitOutcome u : result.units()) {
            byStatus.merge(u.status(), 1, Integer::sum);
            u.findings().forEach(f -> byKind.merge(f.kind(), 1, Integer::sum));
        }
        b.append("<p>Profiles <code>").append(Html.esc(String.join(", ", coverage.profilesUsed().stream()
                .map(p -> p.name()).toList()))).append("</code>. ");
        b.append("Times are local to ").append(Html.esc(zone.getId())).append(".</p>\n");
        b.append("<table>\n<thead><tr><th class=\"num\">units found</th><th class=\"num\">analysed</th>"
                + "<th class=\"num\">skipped</th><th class=\"num\">failed</th><th class=\"num\">findings</th>"
                + "</tr></thead>\n<tbody><tr><td class=\"num\">").append(result.units().size())
                .append("</td><td class=\"num\">").append(byStatus.getOrDefault(UnitOutcome.ANALYZED, 0))
                .append("</td><td class=\"num\">").append(byStatus.getOrDefault(UnitOutcome.SKIPPED, 0))
                .append("</td><td class=\"num\">").append(byStatus.getOrDefault(UnitOutcome.FAILED, 0))
                .append("</td><td class=\"num\">").append(byKind.values().stream().mapToInt(Integer::intValue).sum())
                .append("</td></tr></tbody>\n</table>\n");
        if (!byKind.isEmpty()) {
            b.append("<p>Findings by kind: ");
            b.append(Html.esc(String.join(", ", byKind.entrySet().stream().map(e -> e.getValue() + " " + e.getKey())
                    .toList()))).append(".</p>\n");
        }
        var ingest = result.ingest();
        String line = org.tufa.analysis.fleet.FleetReport.ingestLines(ingest).get(0);
        b.append("<p class=\"small\">").append(Html.esc(line)).append("; ").append(ingest.seriesNeverSeen().size())
                .append(" wanted series without data.</p>\n");
    }

    /** How many findings at what confidence: the listed ones by band, and the candidates below the threshold. */
    private static void confidence(StringBuilder b, FleetAnalysis.Result result) {
        double[] edges = {0.999, 0.99, 0.95, 0.9};
        int[] counts = new int[edges.length + 1];
        for (UnitOutcome u : result.units()) {
            for (Finding f : u.findings()) {
                int k = 0;
                while (k < edges.length && f.confidence() < edges[k]) {
                    k++;
                }
                counts[k]++;
            }
        }
        int below = result.units().stream().mapToInt(UnitOutcome::belowConfidence).sum();
        b.append("<h2>Confidence</h2>\n<p>A finding's confidence is 1 minus its false-discovery-rate q-value "
                + "(Benjamini and Hochberg 1995) over all ").append(result.tests()).append(" tests of this run: "
                + "among the findings at or above a confidence c, at most a share 1 - c is expected to be false. "
                + "Each test compares the unit with the fleet's healthy units, with its peers, or both.</p>\n"
                + "<table>\n<thead><tr><th class=\"num\">&ge; 0.999</th><th class=\"num\">0.99-0.999</th>"
                + "<th class=\"num\">0.95-0.99</th><th class=\"num\">0.90-0.95</th>"
                + "<th class=\"num\">below 0.90, listed</th><th class=\"num\">below the run's minimum, not listed"
                + "</th></tr></thead>\n<tbody><tr>");
        for (int c : counts) {
            b.append("<td class=\"num\">").append(c).append("</td>");
        }
        b.append("<td class=\"num\">").append(below).append("</td></tr></tbody>\n</table>\n");
    }

    private static void fleetFindings(StringBuilder b, FleetAnalysis.Result result, ZoneId zone) {
        if (result.fleetFindings().isEmpty()) {
            return;
        }
        b.append("<h2>Fleet-wide findings</h2>\n<p>Many units strayed from their normal days on the same days: "
                + "something they share (plant, weather, schedule) is the first suspect. Reported once here, not "
                + "on each unit.</p>\n<table>\n<thead><tr><th class=\"num\">confidence</th><th>mode</th>"
                + "<th>start</th><th>end</th><th class=\"num\">units</th><th>evidence</th><th>candidate causes"
                + "</th></tr></thead>\n<tbody>\n");
        for (var ff : result.fleetFindings()) {
            Finding f = ff.finding();
            b.append("<tr><td class=\"num\">").append(Html.fixed(f.confidence(), 3)).append("</td><td>")
                    .append(Html.esc(f.mode())).append("</td><td class=\"t\">").append(Times.local(f.start(), zone))
                    .append("</td><td class=\"t\">").append(Times.local(f.end(), zone)).append("</td><td class=\"num\" "
                            + "title=\"").append(Html.esc(String.join(", ", ff.units()))).append("\">")
                    .append(ff.units().size()).append("</td><td>").append(Html.esc(f.evidence())).append("</td><td>")
                    .append(Html.esc(String.join(" | ", f.causes()))).append("</td></tr>\n");
        }
        b.append("</tbody>\n</table>\n");
    }

    private static void ranking(StringBuilder b, List<UnitOutcome> units) {
        b.append("<h2>Ranking</h2>\n");
        List<UnitOutcome> ranked = FleetOutputs.ranked(units);
        if (ranked.isEmpty()) {
            b.append("<p>No unit has findings.</p>\n");
            return;
        }
        b.append("<p>Units with findings, by their most confident finding, then fault hours (overlapping findings "
                + "counted once), then estimated sensible energy moved during the findings.</p>\n");
        DataTable t = new DataTable("ranking", "../ranking.csv").column("rank", true).column("unit", false)
                .column("top confidence", true).column("fault hours", true).column("energy (kWh)", true)
                .column("findings", true);
        int rank = 1;
        for (UnitOutcome u : ranked) {
            t.row().sorted(Integer.toString(rank), rank).link(u.displayName(), href(u)).number(u.topConfidence(), 3)
                    .number(u.faultHours(), 1).number(u.faultEnergyKwh(), 0)
                    .sorted(Integer.toString(u.findings().size()), u.findings().size());
            rank++;
        }
        t.appendTo(b);
    }

    private static void findings(StringBuilder b, FleetAnalysis.Result result, ZoneId zone) {
        List<UnitOutcome> units = result.units();
        b.append("<h2>Findings</h2>\n");
        org.tufa.analysis.fleet.FleetReport.reviewLines(result.review(), units)
                .forEach(l -> b.append("<p class=\"small\">").append(Html.esc(l.strip())).append("</p>\n"));
        if (units.stream().allMatch(u -> u.findings().isEmpty())) {
            b.append("<p>No findings.</p>\n");
            return;
        }
        ReviewControls.toolbar(b, result, zone);
        b.append("<p>Click a column header to sort. Details, charts and candidate causes on each unit's page.</p>\n");
        DataTable t = new DataTable("findings", "../findings.csv").column("unit", false).column("confidence", true)
                .column("mode", false).column("kind", false).column("cluster", false).column("start", true)
                .column("end", true).column("hours", true).column("energy (kWh)", true).column("evidence", false)
                .column("shift from normal", false).column("candidate causes", false).column("id", false)
                .column("review: verdict, cause, note", false);
        for (UnitOutcome u : units) {
            for (Finding f : u.findings()) {
                ReviewStep.Mark mark = u.mark(f);
                t.row().link(u.displayName(), href(u)).number(f.confidence(), 3).text(f.mode()).text(f.kind())
                        .text(f.cluster() < 0 ? "" : "C" + f.cluster())
                        .time(Times.local(f.start(), zone), f.start().getEpochSecond())
                        .time(Times.local(f.end(), zone), f.end().getEpochSecond())
                        .number(f.hours(), 1).number(f.energyKwh(), 1).text(f.evidence())
                        .text(String.join("\n", f.shifts().stream().map(Shift::describe).toList()))
                        .text(String.join(" | ", f.causes())).text(mark.findingId())
                        .review(mark.findingId(), ReviewControls.statusText(mark, zone));
            }
        }
        t.appendTo(b);
    }

    private static void unitTable(StringBuilder b, List<UnitOutcome> units) {
        b.append("<h2>Units</h2>\n");
        DataTable t = new DataTable("units", "../fleet.csv").column("unit", false).column("IRI", false)
                .column("status", false).column("modes clustered", false).column("fault hours", true)
                .column("energy (kWh)", true).column("reason", false);
        for (UnitOutcome u : units) {
            DataTable.Row r = t.row().link(u.displayName(), href(u)).text(u.unit());
            if (u.status().equals(UnitOutcome.FAILED)) {
                r.styled(u.status(), "failed", null);
            } else {
                r.text(u.status());
            }
            r.text(u.analyzedModes().replace(";", ", ")).number(u.faultHours(), 1).number(u.faultEnergyKwh(), 0)
                    .text(u.reason());
        }
        t.appendTo(b);
    }

    private static void coverageMatrix(StringBuilder b, FleetCoverage coverage, Map<String, UnitOutcome> byUnit) {
        List<String> roles = coverage.roleNames();
        b.append("<h2>Coverage: points found per unit and role</h2>\n<p>&quot;found&quot;: exactly one point "
                + "qualifies (hover for its name); <strong>missing</strong>: none does; <em>ambiguous</em>: "
                + "several do and the model must say which is meant (the role is then not used); empty: not a "
                + "role of the unit's profile.</p>\n");
        DataTable t = new DataTable("coverage", "../coverage.csv").column("unit", false).column("profile", false);
        roles.forEach(r -> t.column(r.replace('_', ' '), false));
        for (UnitCoverage u : coverage.units()) {
            UnitOutcome o = byUnit.get(u.unit());
            DataTable.Row row = o == null ? t.row().text(u.label().isEmpty() ? u.unit() : u.label())
                    : t.row().link(o.displayName(), href(o));
            row.text(u.profileName());
            for (String role : roles) {
                RoleMatch m = u.roles().get(role);
                if (m == null) {
                    row.text("");
                    continue;
                }
                switch (m.status()) {
                    case FOUND -> {
                        PointRef p = m.point().orElse(null);
                        row.styled("found", "found", p == null ? "" : p.label() != null ? p.label() : p.iri());
                    }
                    case MISSING -> row.styled("missing", "missing", null);
                    case AMBIGUOUS -> row.styled("ambiguous (" + m.candidates().size() + ")", "ambiguous",
                            String.join(", ", m.candidates().stream().map(p -> p.label() != null ? p.label()
                                    : p.iri()).toList()));
                    default -> throw new IllegalStateException("unknown match status " + m.status());
                }
            }
        }
        t.appendTo(b);
    }
}
