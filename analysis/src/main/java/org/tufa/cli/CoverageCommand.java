package org.tufa.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.tufa.analysis.coverage.CoverageFiles;
import org.tufa.analysis.coverage.CoverageSummary;
import org.tufa.analysis.coverage.FleetCoverage;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tufa coverage}: which terminal units have the points an analysis needs. */
@Command(name = "coverage", mixinStandardHelpOptions = true,
        description = {"Find every terminal unit in a Brick model and the point for each role a requirement profile "
                + "needs; say which units can be analysed and what is missing.",
            "Writes DIR/coverage.csv and DIR/coverage.json. Exit code 3 when the model has no terminal units."})
public final class CoverageCommand implements Callable<Integer> {
    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Mixin
    FleetModelOptions fleet;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output directory.")
    Path out;

    @Option(names = "--list", paramLabel = "N", defaultValue = "20",
            description = "List at most N units that cannot be analysed (default: ${DEFAULT-VALUE}).")
    int maxListed;

    @Override
    public Integer call() {
        var stdout = spec.commandLine().getOut();
        if (maxListed < 0) {
            throw new org.tufa.common.InputException("--list " + maxListed
                    + ": give how many units to list, 0 or more (0 lists none)");
        }
        org.tufa.common.OutputFiles.checkFolder("--out", out);
        org.tufa.common.OutputFiles.checkDistinct(fleet.inputs(), Map.of("--out (coverage.csv)",
                out.resolve(CoverageFiles.CSV_FILE), "--out (coverage.json)", out.resolve(CoverageFiles.JSON_FILE)));
        FleetModelOptions.Assessed assessed = fleet.assess();
        FleetCoverage coverage = assessed.coverage();
        CoverageSummary.lines(coverage, assessed.prefixes(), maxListed).forEach(stdout::println);
        if (coverage.units().isEmpty()) {
            stdout.println("Nothing to analyse in " + fleet.source() + ": no instance of the unit classes above. "
                    + "Check the unit classes" + (coverage.fullBrick() ? "." : ", or " + CoverageSummary.FULL_BRICK_HINT
                    + " if the model uses classes the loaded vocabulary lacks."));
            stdout.flush();
            return ExitCodes.CHECK_FAILED;
        }
        List<Path> written = CoverageFiles.write(coverage, out);
        stdout.println("Wrote " + String.join(", ", written.stream().map(Path::toString).toList()));
        stdout.flush();
        return ExitCodes.OK;
    }
}
