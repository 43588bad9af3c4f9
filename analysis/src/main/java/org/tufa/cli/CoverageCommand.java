package org.tufa.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.Callable;
import org.apache.jena.rdf.model.Model;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.CoverageFiles;
import org.tufa.analysis.coverage.CoverageSummary;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.Profile;
import org.tufa.analysis.coverage.ProfileCatalog;
import org.tufa.analysis.coverage.UnitClasses;
import org.tufa.analysis.coverage.Vocabulary;
import picocli.CommandLine.Command;
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

    @Option(names = "--model", required = true, paramLabel = "FILE",
            description = "Brick model (.ttl, .nt, .jsonld or .rdf).")
    Path model;

    @Option(names = "--profile", paramLabel = "NAME", defaultValue = ProfileCatalog.DEFAULT_PROFILE,
            description = "Requirement profile (default: ${DEFAULT-VALUE}).")
    String profile;

    @Option(names = "--unit-class", paramLabel = "CLASS", split = ",",
            description = "Only units of these classes (e.g. brick:Fan_Coil_Unit or a full IRI); "
                    + "repeat or separate with commas. Default: brick:Terminal_Unit.")
    List<String> unitClasses = new ArrayList<>();

    @Option(names = "--vocabulary", paramLabel = "FILE",
            description = "Extra vocabulary: the full Brick file, or your own roles and profiles. Repeatable.")
    List<Path> vocabularies = new ArrayList<>();

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output directory.")
    Path out;

    @Option(names = "--list", paramLabel = "N", defaultValue = "20",
            description = "List at most N units that cannot be analysed (default: ${DEFAULT-VALUE}).")
    int maxListed;

    @Override
    public Integer call() {
        var stdout = spec.commandLine().getOut();
        Vocabulary vocabulary = Vocabulary.load(vocabularies);
        Profile chosen = vocabulary.profiles().profile(profile);
        Model data = ModelLoader.load(model);
        Model all = vocabulary.unionWith(data);
        org.apache.jena.shared.PrefixMapping prefixes = Vocabulary.prefixesFor(data);
        Set<String> classes = UnitClasses.resolve(unitClasses, all, prefixes);
        FleetCoverage coverage = Coverage.assess(data, vocabulary, chosen, classes);
        CoverageSummary.lines(coverage, prefixes, maxListed).forEach(stdout::println);
        if (coverage.units().isEmpty()) {
            stdout.println("Nothing to analyse in " + model + ": no instance of the unit classes above. "
                    + "Check the unit classes, or pass the full Brick file with --vocabulary if the model uses "
                    + "classes outside tufa's Brick subset.");
            stdout.flush();
            return ExitCodes.CHECK_FAILED;
        }
        List<Path> written = CoverageFiles.write(coverage, out);
        stdout.println("Wrote " + String.join(", ", written.stream().map(Path::toString).toList()));
        stdout.flush();
        return ExitCodes.OK;
    }
}
