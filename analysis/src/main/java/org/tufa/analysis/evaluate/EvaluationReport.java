package org.tufa.analysis.evaluate;

import java.nio.file.Path;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Formats an {@link Evaluation.Result}: the printed table and the CSV files (deterministic, Locale.ROOT). */
public final class EvaluationReport {
    public static final String SUMMARY_FILE = "evaluation.csv";
    public static final String EPISODES_FILE = "evaluation_episodes.csv";

    private EvaluationReport() {
    }

    /** The table printed by {@code tufa evaluate}, goals beside the numbers. */
    public static List<String> table(Evaluation.Result r) {
        List<String> lines = new ArrayList<>();
        lines.add(String.format(Locale.ROOT, "%-28s %6s %9s %11s %10s %8s", "fault", "units", "detected*",
                "analysable_h", "flagged_h", "flagged"));
        for (Evaluation.GroupScore g : r.byFault()) {
            lines.add(row(g));
        }
        lines.add(row(r.allFaults()));
        r.byKind().forEach(g -> lines.add(row(g)));
        Evaluation.GroupScore h = r.healthy();
        lines.add(String.format(Locale.ROOT, "%-28s %6d %9s %11.1f %10.1f %8s", h.scope(), h.units(), "-",
                h.analysableHours(), h.flaggedHours(), percent(h.flaggedShare())));
        lines.add("* detected / episodes on analysed units (+ episodes on units that could not be analysed)"
                + (r.allFaults().outsideWindow() == 0 ? "" : " (~ episodes outside the analysed window)"));
        lines.add(String.format(Locale.ROOT, "goal: every injected episode detected (>= %s h flagged): %d/%d %s%s%s",
                number(r.minHours()), r.allFaults().detected(), r.allFaults().scoredEpisodes(), met(r.allDetected()),
                r.allFaults().notAnalysed() == 0 ? "" : "; " + r.allFaults().notAnalysed()
                        + " more on units not analysed (coverage excluded them, or no detection for their kind yet)",
                r.allFaults().outsideWindow() == 0 ? "" : "; " + r.allFaults().outsideWindow()
                        + " outside the analysed time window (not counted)"));
        lines.add(String.format(Locale.ROOT, "goal: >= 70 %% of analysable fault hours flagged: %s %s",
                percent(r.allFaults().flaggedShare()), met(r.flaggedShareMet())));
        lines.add(String.format(Locale.ROOT, "goal: <= 1 %% of healthy-unit hours flagged: %s %s",
                percent(r.healthy().flaggedShare()), met(r.falseShareMet())));
        lines.add(String.format(Locale.ROOT, "goal: <= 5 %% of healthy units with any finding: %d of %d (%s) %s",
                r.healthyUnitsWithFindings(), r.healthy().units(), percent(r.healthyUnitsShare()),
                met(r.healthyUnitsMet())));
        return lines;
    }

    private static String row(Evaluation.GroupScore g) {
        return String.format(Locale.ROOT, "%-28s %6d %9s %11.1f %10.1f %8s", g.scope(), g.units(),
                g.detected() + "/" + g.scoredEpisodes() + (g.notAnalysed() == 0 ? "" : " +" + g.notAnalysed())
                        + (g.outsideWindow() == 0 ? "" : " ~" + g.outsideWindow()),
                g.analysableHours(), g.flaggedHours(), percent(g.flaggedShare()));
    }

    private static String met(boolean met) {
        return met ? "(met)" : "(NOT met)";
    }

    private static String percent(double share) {
        return Double.isNaN(share) ? "n/a" : String.format(Locale.ROOT, "%.1f%%", 100 * share);
    }

    private static String number(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%.2f", v);
    }

    /**
     * {@code evaluation.csv}: {@code scope,units,episodes,not_analysed,outside_window,detected,analysable_hours,
     * flagged_hours,flagged_share,goal,goal_met}; one row per fault type, then all_faults, then all_<kind>_faults per
     * unit kind (when the fleet has several), then healthy_units, then healthy_units_with_findings (units: how many
     * healthy units have any flagged hour; flagged_share: their share of the healthy units). The share is empty when
     * there are no analysable hours.
     */
    public static void writeSummary(Path file, Evaluation.Result r) {
        StringBuilder out = new StringBuilder(
                "scope,units,episodes,not_analysed,outside_window,detected,analysable_hours,flagged_hours,flagged_share,goal,"
                        + "goal_met\n");
        for (Evaluation.GroupScore g : r.byFault()) {
            boolean met = g.detected() == g.scoredEpisodes()
                    && g.flaggedShare() >= Evaluation.GOAL_FLAGGED_SHARE;
            summaryRow(out, g, "all episodes detected; flagged share >= 0.70", met);
        }
        summaryRow(out, r.allFaults(), "all episodes detected; flagged share >= 0.70",
                r.allDetected() && r.flaggedShareMet());
        for (Evaluation.GroupScore g : r.byKind()) {
            summaryRow(out, g, "all episodes detected; flagged share >= 0.70", g.detected() == g.episodes()
                    - g.notAnalysed() && g.flaggedShare() >= Evaluation.GOAL_FLAGGED_SHARE);
        }
        summaryRow(out, r.healthy(), "flagged share <= 0.01", r.falseShareMet());
        out.append("healthy_units_with_findings,").append(r.healthyUnitsWithFindings()).append(",0,0,0,0,,,")
                .append(Double.isNaN(r.healthyUnitsShare()) ? "" : String.format(Locale.ROOT, "%.4f",
                        r.healthyUnitsShare())).append(",share of healthy units <= 0.05,").append(r.healthyUnitsMet())
                .append('\n');
        write(file, out);
    }

    private static void summaryRow(StringBuilder out, Evaluation.GroupScore g, String goal, boolean met) {
        double share = g.flaggedShare();
        out.append(g.scope()).append(',').append(g.units()).append(',').append(g.episodes()).append(',')
                .append(g.notAnalysed()).append(',').append(g.outsideWindow()).append(',').append(g.detected()).append(',').append(String.format(Locale.ROOT, "%.2f", g.analysableHours()))
                .append(',').append(String.format(Locale.ROOT, "%.2f", g.flaggedHours())).append(',')
                .append(Double.isNaN(share) ? "" : String.format(Locale.ROOT, "%.4f", share)).append(',')
                .append(goal).append(',').append(met).append('\n');
    }

    /**
     * {@code evaluation_episodes.csv}: {@code unit,fault,start,end,severity,analysed,in_window,analysable_hours,
     * flagged_hours,detected}, in truth order; times in UTC.
     */
    public static void writeEpisodes(Path file, Evaluation.Result r) {
        StringBuilder out = new StringBuilder(
                "unit,fault,start,end,severity,analysed,in_window,analysable_hours,flagged_hours,detected\n");
        for (Evaluation.EpisodeScore s : r.episodes()) {
            TruthEpisode e = s.episode();
            out.append(csv(e.unit())).append(',').append(csv(e.fault())).append(',')
                    .append(e.start().atOffset(ZoneOffset.UTC)).append(',').append(e.end().atOffset(ZoneOffset.UTC))
                    .append(',').append(String.format(Locale.ROOT, "%.3f", e.severity())).append(',')
                    .append(s.analysed()).append(',').append(s.inWindow()).append(',')
                    .append(String.format(Locale.ROOT, "%.2f", s.analysableHours()))
                    .append(',').append(String.format(Locale.ROOT, "%.2f", s.flaggedHours())).append(',')
                    .append(s.detected()).append('\n');
        }
        write(file, out);
    }

    private static String csv(String text) {
        String s = org.tufa.common.CsvCells.neutral(text);
        return s.contains(",") || s.contains("\"") ? '"' + s.replace("\"", "\"\"") + '"' : s;
    }

    private static void write(Path file, CharSequence text) {
        org.tufa.common.OutputFiles.writeString(file, text);
    }
}
