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
import org.tufa.analysis.coverage.UnitClasses;
import org.tufa.analysis.coverage.Vocabulary;
import picocli.CommandLine.Option;

/** The options that pick a fleet out of a Brick model: model, profile, unit classes, extra vocabulary. */
public final class FleetModelOptions {

    @Option(names = "--model", required = true, paramLabel = "FILE",
            description = "Brick model (.ttl, .nt, .jsonld or .rdf).")
    Path model;

    @Option(names = "--profile", paramLabel = "NAME", split = ",",
            description = "Requirement profiles to use (repeat or separate with commas); units no named profile "
                    + "applies to are listed without one. Default: each unit gets the best fitting of the automatic "
                    + "profiles (fan coil units fcu-modes, VAV boxes the vav-* variant their class and points show).")
    List<String> profiles = new ArrayList<>();

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

    /** The files these options read, by option, for {@link org.tufa.common.OutputFiles#checkDistinct}. */
    public java.util.Map<String, Path> inputs() {
        java.util.Map<String, Path> in = new java.util.LinkedHashMap<>();
        in.put("--model", model);
        for (int i = 0; i < vocabularies.size(); i++) {
            in.put("--vocabulary " + vocabularies.get(i), vocabularies.get(i));
        }
        return in;
    }

    public Assessed assess() {
        return assess(model, profiles, unitClasses, vocabularies);
    }

    /** The coverage with the named profiles, or the automatic choice per unit when none is named. */
    static Assessed assess(Path model, List<String> profiles, List<String> unitClasses, List<Path> vocabularies) {
        Vocabulary vocabulary = Vocabulary.load(vocabularies);
        var chosen = vocabulary.profiles().profiles(profiles);
        Model data = ModelLoader.load(model);
        Model all = vocabulary.unionWith(data);
        PrefixMapping prefixes = Vocabulary.prefixesFor(data);
        Set<String> classes = UnitClasses.resolve(unitClasses, all, prefixes, vocabulary.hasFullBrick());
        FleetCoverage coverage = profiles.isEmpty() ? Coverage.assess(data, vocabulary, classes)
                : Coverage.assess(data, vocabulary, chosen, false, classes);
        return new Assessed(coverage, prefixes);
    }
}
