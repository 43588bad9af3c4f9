package org.tufa.analysis.report;

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
import org.tufa.analysis.fleet.FleetAnalysis;
import org.tufa.analysis.fleet.FleetOutputs;
import org.tufa.analysis.fleet.UnitOutcome;

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

    private static String link(UnitOutcome u) {
        String name = u.label().isEmpty() ? u.unit() : u.label();
        return "<a href=\"units/" + Html.esc(u.folder()) + "/index.html\">" + Html.esc(name) + "</a>";
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
                + "counted once), then estimated sensible energy moved during the findings.</p>\n"
                + "<table class=\"sortable\">\n<thead><tr><th class=\"num\">rank</th><th>unit</th>"
                + "<th class=\"num\">top confidence</th><th class=\"num\">fault hours</th>"
                + "<th class=\"num\">energy (kWh)</th><th class=\"num\">findings</th></tr></thead>\n<tbody>\n");
        int rank = 1;
        for (UnitOutcome u : ranked) {
            b.append("<tr><td class=\"num\" data-sort=\"").append(rank).append("\">").append(rank).append("</td><td>")
                    .append(link(u)).append("</td>");
            num(b, u.topConfidence(), 3);
            num(b, u.faultHours(), 1);
            num(b, u.faultEnergyKwh(), 0);
            b.append("<td class=\"num\" data-sort=\"").append(u.findings().size()).append("\">")
                    .append(u.findings().size()).append("</td></tr>\n");
            rank++;
        }
        b.append("</tbody>\n</table>\n");
    }

    private static void num(StringBuilder b, double v, int decimals) {
        b.append("<td class=\"num\" data-sort=\"").append(Double.isNaN(v) ? "-1e300" : Html.fixed(v, 6))
                .append("\">").append(Html.fixed(v, decimals)).append("</td>");
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
        b.append("<p>Click a column header to sort (needs JavaScript; without it the table stays in unit and time "
                + "order). Details, charts and candidate causes on each unit's page.</p>\n"
                + "<table class=\"sortable\">\n<thead><tr><th>unit</th><th class=\"num\">confidence</th>"
                + "<th>mode</th><th>kind</th><th>cluster</th>"
                + "<th>start</th><th>end</th><th class=\"num\">hours</th><th class=\"num\">energy (kWh)</th>"
                + "<th>evidence</th><th>shift from normal</th><th>candidate causes</th><th>id</th>"
                + "<th>review: verdict, cause, note</th></tr></thead>\n<tbody>\n");
        for (UnitOutcome u : units) {
            for (Finding f : u.findings()) {
                b.append("<tr><td>").append(link(u)).append("</td>");
                num(b, f.confidence(), 3);
                b.append("<td>").append(Html.esc(f.mode()))
                        .append("</td><td>").append(Html.esc(f.kind())).append("</td><td>")
                        .append(f.cluster() < 0 ? "" : "C" + f.cluster()).append("</td><td class=\"t\" data-sort=\"")
                        .append(f.start().getEpochSecond()).append("\">").append(Times.local(f.start(), zone))
                        .append("</td><td class=\"t\" data-sort=\"").append(f.end().getEpochSecond()).append("\">")
                        .append(Times.local(f.end(), zone)).append("</td>");
                num(b, f.hours(), 1);
                num(b, f.energyKwh(), 1);
                b.append("<td>").append(Html.esc(f.evidence())).append("</td><td>").append(Html.shifts(f.shifts()))
                        .append("</td><td>").append(Html.esc(String.join(" | ", f.causes())))
                        .append("</td><td><code>").append(u.mark(f).findingId()).append("</code></td>")
                        .append(ReviewControls.cell(u, f, zone)).append("</tr>\n");
            }
        }
        b.append("</tbody>\n</table>\n");
    }

    private static void unitTable(StringBuilder b, List<UnitOutcome> units) {
        b.append("<h2>Units</h2>\n<table class=\"sortable\">\n<thead><tr><th>unit</th><th>IRI</th><th>status</th>"
                + "<th>modes clustered</th><th class=\"num\">fault hours</th><th class=\"num\">energy (kWh)</th>"
                + "<th>reason</th></tr></thead>\n<tbody>\n");
        for (UnitOutcome u : units) {
            b.append("<tr><td>").append(link(u)).append("</td><td><code>").append(Html.esc(u.unit()))
                    .append("</code></td><td").append(u.status().equals(UnitOutcome.FAILED) ? " class=\"failed\"" : "")
                    .append('>').append(Html.esc(u.status())).append("</td><td>")
                    .append(Html.esc(u.analyzedModes().replace(";", ", "))).append("</td>");
            num(b, u.faultHours(), 1);
            num(b, u.faultEnergyKwh(), 0);
            b.append("<td>").append(Html.esc(u.reason())).append("</td></tr>\n");
        }
        b.append("</tbody>\n</table>\n");
    }

    private static void coverageMatrix(StringBuilder b, FleetCoverage coverage, Map<String, UnitOutcome> byUnit) {
        List<String> roles = coverage.roleNames();
        b.append("<h2>Coverage: points found per unit and role</h2>\n<p>&quot;found&quot;: exactly one point "
                + "qualifies (hover for its name); <strong>missing</strong>: none does; <em>ambiguous</em>: "
                + "several do and the model must say which is meant (the role is then not used).</p>\n"
                + "<table>\n<thead><tr><th>unit</th><th>profile</th>");
        roles.forEach(r -> b.append("<th>").append(Html.esc(r.replace('_', ' '))).append("</th>"));
        b.append("</tr></thead>\n<tbody>\n");
        for (UnitCoverage u : coverage.units()) {
            UnitOutcome o = byUnit.get(u.unit());
            b.append("<tr><td>").append(o == null ? Html.esc(u.label().isEmpty() ? u.unit() : u.label()) : link(o))
                    .append("</td><td>").append(Html.esc(u.profileName())).append("</td>");
            for (String role : roles) {
                RoleMatch m = u.roles().get(role);
                if (m == null) {
                    b.append("<td></td>"); // not a role of this unit's profile
                    continue;
                }
                switch (m.status()) {
                    case FOUND -> {
                        PointRef p = m.point().orElse(null);
                        String name = p == null ? "" : p.label() != null ? p.label() : p.iri();
                        b.append("<td class=\"found\" title=\"").append(Html.esc(name)).append("\">found</td>");
                    }
                    case MISSING -> b.append("<td class=\"missing\">missing</td>");
                    case AMBIGUOUS -> b.append("<td class=\"ambiguous\" title=\"")
                            .append(Html.esc(String.join(", ", m.candidates().stream().map(p -> p.label() != null
                                    ? p.label() : p.iri()).toList()))).append("\">ambiguous (")
                            .append(m.candidates().size()).append(")</td>");
                    default -> throw new IllegalStateException("unknown match status " + m.status());
                }
            }
            b.append("</tr>\n");
        }
        b.append("</tbody>\n</table>\n");
    }
}
