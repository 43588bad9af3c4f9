package org.tufa.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.tufa.analysis.evaluate.Evaluation;
import org.tufa.analysis.evaluate.EvaluationFiles;
import org.tufa.analysis.evaluate.EvaluationReport;
import org.tufa.common.InputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tufa evaluate}: scores an analysis output directory against a ground-truth file. */
@Command(name = "evaluate", mixinStandardHelpOptions = true,
        description = {"Scores findings against ground truth (truth.csv from the demo simulator): episodes "
                + "detected, share of fault hours flagged, share of healthy-unit hours flagged, healthy units with "
                + "findings.",
            "Writes evaluation.csv and evaluation_episodes.csv into the findings directory."})
public final class EvaluateCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Option(names = "--findings", required = true, paramLabel = "DIR",
            description = "Directory the analysis wrote (fleet.csv, findings.csv, units/<folder>/modes.parquet or .csv).")
    Path findings;

    @Option(names = "--truth", required = true, paramLabel = "FILE", description = "Ground truth, truth.csv.")
    Path truth;

    @Option(names = "--min-hours", paramLabel = "H", defaultValue = "2",
            description = "Flagged hours inside an episode for it to count as detected (default: ${DEFAULT-VALUE}).")
    double minHours;

    @Option(names = "--min-confidence", paramLabel = "C", defaultValue = "0",
            description = "Score only findings with at least this confidence (findings.csv's confidence column; "
                    + "default: ${DEFAULT-VALUE}, every listed finding). For curves of recall against false flags.")
    double minConfidence;

    @Option(names = "--review", paramLabel = "FILE",
            description = "The review.csv the run in --findings was made with: count its findings that flag a "
                    + "rejected period again (the target is none).")
    Path review;

    @Option(names = "--diagnosis", paramLabel = "FILE",
            description = "diagnosis.csv of tufa diagnose: score the diagnosed causes against the truth (and the "
                    + "leave-one-unit-out held_out.csv beside it, when there is one).")
    Path diagnosis;

    @Option(names = "--require-goals",
            description = "Exit with code 3 when a goal is not met (for scripted checks).")
    boolean requireGoals;

    @Override
    public Integer call() {
        if (!(minHours >= 0)) {
            throw new InputException("--min-hours: must be a number >= 0, got " + minHours);
        }
        java.util.Map<String, Path> outputs = new java.util.LinkedHashMap<>();
        outputs.put("--findings (" + EvaluationReport.SUMMARY_FILE + ")", findings.resolve(EvaluationReport.SUMMARY_FILE));
        outputs.put("--findings (" + EvaluationReport.EPISODES_FILE + ")",
                findings.resolve(EvaluationReport.EPISODES_FILE));
        org.tufa.common.OutputFiles.checkDistinct(java.util.Map.of("--truth", truth), outputs);
        if (!(minConfidence >= 0 && minConfidence <= 1)) {
            throw new InputException("--min-confidence: must be in [0, 1], got " + minConfidence);
        }
        org.tufa.analysis.evaluate.EvaluationInput input = EvaluationFiles.read(findings, truth, minConfidence);
        Evaluation.Result result = Evaluation.fit(input, minHours);
        EvaluationReport.table(result).forEach(spec.commandLine().getOut()::println);
        if (input.repeatedEpisodes() > 0) {
            spec.commandLine().getOut().println("note: " + input.repeatedEpisodes() + " row(s) of " + truth
                    + " repeat an earlier episode (same unit, fault, start and end); each episode is counted once");
        }
        if (review != null) {
            org.tufa.analysis.labels.AnalysisFolder folder = org.tufa.analysis.labels.AnalysisFolder.open(findings);
            var verdicts = org.tufa.analysis.review.ReviewFile.read(review, folder.knownUnits());
            var h = org.tufa.analysis.evaluate.TruthReview.honoured(verdicts, folder.findings());
            spec.commandLine().getOut().printf(java.util.Locale.ROOT, "review: %d rejected verdict(s); listed "
                    + "findings that flag a rejected period again (same unit, mode and kind): %d (target 0)%s; "
                    + "overlapping a rejected period in another mode or kind (shown with both): %d%n", h.rejected(),
                    h.flaggedAgain(), h.flaggedAgain() == 0 ? " (met)" : " (NOT met)", h.overlapOtherKind());
        }
        if (diagnosis != null) {
            var score = org.tufa.analysis.evaluate.DiagnosisScore.fit(
                    org.tufa.analysis.evaluate.DiagnosisScore.read(diagnosis), input.truth());
            org.tufa.analysis.evaluate.DiagnosisScore.lines("diagnosed causes of the listed findings (in-sample "
                    + "for units the classifier was trained on)", score).forEach(spec.commandLine().getOut()::println);
            Path heldOut = diagnosis.resolveSibling(org.tufa.analysis.diagnose.DiagnosisFiles.HELD_OUT);
            if (java.nio.file.Files.isRegularFile(heldOut)) {
                var loo = org.tufa.analysis.evaluate.DiagnosisScore.fit(
                        org.tufa.analysis.evaluate.DiagnosisScore.read(heldOut), input.truth());
                org.tufa.analysis.evaluate.DiagnosisScore.lines("diagnosed causes leaving one unit out (confirmed "
                        + "findings)", loo).forEach(spec.commandLine().getOut()::println);
                spec.commandLine().getOut().println("goal: the diagnosis names the injected fault for >= 80 % of "
                        + "confirmed episodes leaving one unit out: " + loo.episodeShare()
                        + (loo.episodesNamedAtLeast(0.8) ? " (met)" : " (NOT met)"));
            }
        }
        EvaluationReport.writeSummary(findings.resolve(EvaluationReport.SUMMARY_FILE), result);
        EvaluationReport.writeEpisodes(findings.resolve(EvaluationReport.EPISODES_FILE), result);
        spec.commandLine().getOut().flush();
        return requireGoals && !result.goalsMet() ? ExitCodes.CHECK_FAILED : ExitCodes.OK;
    }
}
