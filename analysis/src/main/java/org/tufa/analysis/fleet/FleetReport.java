package org.tufa.analysis.fleet;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.tufa.analysis.decision.FleetDecision;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.trends.IngestReport;

/** The console summary of a fleet run, as lines (the command prints them). */
public final class FleetReport {

    /** The caution every report carries. */
    public static final String CAUTION = "Findings are candidate faults for review by qualified staff: verify on site "
            + "before acting; work on HVAC equipment follows local codes and licensed practice. tufa never commands "
            + "equipment.";

    private FleetReport() {
    }

    /** Series ids and problem examples named on the console; run.json lists every unknown id. */
    static final int NAMED = 3;

    /**
     * What the ingest did with every row: kept, and each reason a value was not kept (only the non-zero ones),
     * with the first unknown series ids and the first problems.
     */
    public static List<String> ingestLines(IngestReport ingest) {
        List<String> lines = new ArrayList<>();
        List<String> dropped = new ArrayList<>();
        add(dropped, ingest.samplesOutsideWindow(), "outside the time window");
        if (ingest.unknownSeriesSamples() > 0) {
            List<String> ids = ingest.unknownSeries();
            dropped.add(ingest.unknownSeriesSamples() + " of " + ids.size() + " series no analysed unit reads ("
                    + String.join(", ", ids.subList(0, Math.min(NAMED, ids.size())).stream()
                            .map(org.tufa.common.Printable::excerpt).toList())
                    + (ids.size() > NAMED ? ", ..." : "") + ")");
        }
        add(dropped, ingest.emptyValues(), "empty values");
        add(dropped, ingest.unparsableValues(), "unparsable values");
        add(dropped, ingest.nonFiniteValues(), "non-finite values");
        add(dropped, ingest.implausibleValues(), "values implausible for their unit");
        add(dropped, ingest.unparsableTimestamps(), "rows with unreadable time stamps");
        add(dropped, ingest.malformedRows(), "rows with the wrong number of fields");
        List<String> repeats = new ArrayList<>();
        add(repeats, ingest.duplicateSamples(), "exact duplicates");
        add(repeats, ingest.conflictingDuplicates(), "conflicting duplicates (averaged)");
        lines.add(String.format(Locale.ROOT, "Trends: %d rows read, %d samples kept%s%s; %d repeated and %d skipped DST "
                + "stamps", ingest.rows(), ingest.samplesKept(), repeats.isEmpty() ? "" : " (" + String.join(", ",
                repeats) + ")", dropped.isEmpty() ? ", nothing dropped" : "; not kept: " + String.join(", ", dropped),
                ingest.dstRepeatedFirstPass() + ingest.dstRepeatedSecondPass(), ingest.dstSkipped()));
        for (String example : ingest.problemExamples(NAMED)) {
            lines.add("  e.g. " + example);
        }
        return lines;
    }

    /** Verdicts named on the console when they match no finding; run.json lists them all. */
    static final int UNMATCHED_NAMED = 10;

    /** What the review did, in a few lines (none without a review). */
    public static List<String> reviewLines(org.tufa.analysis.review.ReviewStep.Result review,
                                           List<UnitOutcome> units) {
        if (!review.any()) {
            return List.of();
        }
        List<String> lines = new ArrayList<>();
        Map<String, Integer> byDecision = new java.util.LinkedHashMap<>();
        for (var d : org.tufa.analysis.review.Verdict.Decision.values()) {
            byDecision.put(d.word().replace('_', ' '), (int) review.verdicts().stream()
                    .filter(v -> v.decision() == d).count());
        }
        int confirmed = 0;
        int overlapping = 0;
        for (UnitOutcome u : units) {
            for (Finding f : u.findings()) {
                var mark = u.mark(f);
                confirmed += mark.status().equals("confirmed") ? 1 : 0;
                overlapping += mark.overlapping().isEmpty() ? 0 : 1;
            }
        }
        lines.add(String.format(Locale.ROOT, "Review: %d verdict(s) (%s): %d applied, %d not matched; %d finding(s) "
                        + "not listed, rejected by the analyst as normal operation; %d confirmed finding(s) listed; "
                        + "%d listed finding(s) overlap a verdict of another mode or kind (shown with both)",
                review.verdicts().size(), String.join(", ", byDecision.entrySet().stream()
                        .map(e -> e.getValue() + " " + e.getKey()).toList()), review.applied().size(),
                review.unmatched().size(), review.suppressedCount(), confirmed, overlapping));
        List<org.tufa.analysis.review.ReviewStep.Unmatched> un = review.unmatched();
        for (int i = 0; i < Math.min(UNMATCHED_NAMED, un.size()); i++) {
            var v = un.get(i).verdict();
            lines.add("  not matched: " + v.where() + " " + org.tufa.common.Printable.excerpt(v.unit()) + " " + v.mode()
                    + " " + v.kind() + " from " + v.start() + " (" + v.decision().word() + "): " + un.get(i).reason());
        }
        if (un.size() > UNMATCHED_NAMED) {
            lines.add("  ... and " + (un.size() - UNMATCHED_NAMED) + " more not matched (see run.json)");
        }
        return lines;
    }

    private static void add(List<String> parts, long count, String what) {
        if (count > 0) {
            parts.add(count + " " + what);
        }
    }

    public static List<String> summary(FleetAnalysis.Result result, FleetCoverage coverage, Path out,
                                       double minConfidence) {
        List<String> lines = new ArrayList<>();
        Map<String, Integer> byStatus = new TreeMap<>();
        Map<String, Integer> byKind = new TreeMap<>();
        for (UnitOutcome u : result.units()) {
            byStatus.merge(u.status(), 1, Integer::sum);
            for (Finding f : u.findings()) {
                byKind.merge(f.kind(), 1, Integer::sum);
            }
        }
        lines.add(String.format(Locale.ROOT, "Units: %d found, %d analysed, %d skipped, %d failed",
                result.units().size(), byStatus.getOrDefault(UnitOutcome.ANALYZED, 0),
                byStatus.getOrDefault(UnitOutcome.SKIPPED, 0), byStatus.getOrDefault(UnitOutcome.FAILED, 0)));
        lines.addAll(ingestLines(result.ingest()));
        int total = byKind.values().stream().mapToInt(Integer::intValue).sum();
        int below = result.units().stream().mapToInt(UnitOutcome::belowConfidence).sum();
        long unitsWith = result.units().stream().filter(u -> !u.findings().isEmpty()).count();
        lines.add(String.format(Locale.ROOT, "Findings at confidence >= %.2f: %d on %d unit(s)%s; %d candidate(s) "
                        + "below it not listed; %d tests, false-discovery rate controlled per kind of unit",
                minConfidence,
                total, unitsWith, total == 0 ? "" : " (" + String.join(", ", byKind.entrySet().stream()
                        .map(e -> e.getValue() + " " + e.getKey()).toList()) + ")", below, result.tests()));
        lines.addAll(reviewLines(result.review(), result.units()));
        for (FleetDecision.FleetFinding f : result.fleetFindings()) {
            lines.add(String.format(Locale.ROOT, "Fleet-wide: %s %s, %s to %s, %d units, confidence %.3f",
                    f.finding().mode(), f.finding().kind(), f.finding().start(), f.finding().end(), f.units().size(),
                    f.finding().confidence()));
        }
        List<UnitOutcome> ranked = FleetOutputs.ranked(result.units());
        if (!ranked.isEmpty()) {
            lines.add("Units by their most confident finding:");
            for (int i = 0; i < Math.min(10, ranked.size()); i++) {
                UnitOutcome u = ranked.get(i);
                lines.add(String.format(Locale.ROOT, "  %2d. %-28s confidence %.3f %7.1f h %9.1f kWh  %d finding(s)",
                        i + 1, u.displayName(), u.topConfidence(), u.faultHours(), u.faultEnergyKwh(),
                        u.findings().size()));
            }
        }
        List<UnitOutcome> notAnalysed = result.units().stream()
                .filter(u -> !u.status().equals(UnitOutcome.ANALYZED)).toList();
        if (!notAnalysed.isEmpty()) {
            lines.add("Not analysed:");
            for (int i = 0; i < Math.min(10, notAnalysed.size()); i++) {
                UnitOutcome u = notAnalysed.get(i);
                lines.add("  " + u.displayName() + " (" + u.status() + "): " + u.reason());
            }
            if (notAnalysed.size() > 10) {
                lines.add("  ... and " + (notAnalysed.size() - 10) + " more (see fleet.csv)");
            }
        }
        lines.add("Outputs: " + out.resolve("fleet.csv") + ", " + out.resolve("findings.csv") + ", "
                + out.resolve("fleet_findings.csv") + ", " + out.resolve("units"));
        lines.add(CAUTION);
        return lines;
    }
}
