package org.tufa.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.shared.PrefixMapping;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.ProfileCatalog;
import org.tufa.analysis.coverage.UnitClasses;
import org.tufa.analysis.coverage.Vocabulary;
import picocli.CommandLine.Option;

/** The options that pick a fleet out of a Brick model: model, profile, unit classes, extra vocabulary. */
public final class FleetModelOptions {

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
            description = "Extra vocabulary: a newer Brick release, or your own roles and profiles (all of Brick 1.4.4 is built in). Repeatable.")
    List<Path> vocabularies = new ArrayList<>();

    /** The coverage of the chosen fleet, and the prefixes to print IRIs with. */
    public record Assessed(FleetCoverage coverage, PrefixMapping prefixes) {
    }

    public Assessed assess() {
        return assess(model, profile, unitClasses, vocabularies);
    }

    static Assessed assess(Path model, String profile, List<String> unitClasses, List<Path> vocabularies) {
        Vocabulary vocabulary = Vocabulary.load(vocabularies);
        var chosen = vocabulary.profiles().profile(profile);
        Model data = ModelLoader.load(model);
        Model all = vocabulary.unionWith(data);
        PrefixMapping prefixes = Vocabulary.prefixesFor(data);
        Set<String> classes = UnitClasses.resolve(unitClasses, all, prefixes);
        return new Assessed(Coverage.assess(data, vocabulary, chosen, classes), prefixes);
    }
}
