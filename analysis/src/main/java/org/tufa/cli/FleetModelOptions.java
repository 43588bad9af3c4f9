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
import org.tufa.analysis.store.ModelStore;
import picocli.CommandLine.Option;

/** The options that pick a fleet out of a Brick model: model, profile, unit classes, extra vocabulary. */
public final class FleetModelOptions {

    @Option(names = "--model", paramLabel = "FILE",
            description = "Brick model (.ttl, .nt, .jsonld or .rdf). Or --store.")
    Path model;

    @Option(names = "--store", paramLabel = "DIR",
            description = "A store tufa load filled (Jena TDB2), instead of --model: the building's graph and the "
                    + "vocabulary stored with it.")
    Path store;

    @Option(names = "--graph", paramLabel = "IRI",
            description = "With --store: the building's graph (default: the store's only building).")
    String graph;

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
        if (store == null) {
            if (model == null) {
                throw new org.tufa.common.InputException("give the model with --model FILE, or a store with --store DIR");
            }
            return assess(model, profiles, unitClasses, vocabularies);
        }
        if (model != null) {
            throw new org.tufa.common.InputException("--model and --store: give one of them, not both");
        }
        try (ModelStore s = ModelStore.open(store, false)) {
            return s.read(graph, (data, stored) -> assess(data, Vocabulary.of(stored, vocabularies), profiles,
                    unitClasses));
        }
    }

    /** What the model is, for messages and run.json: the file, or the store and graph. */
    public String source() {
        return store == null ? String.valueOf(model) : store + " (graph " + (graph == null ? "the only building"
                : graph) + ")";
    }

    /** The coverage with the named profiles, or the automatic choice per unit when none is named. */
    static Assessed assess(Path model, List<String> profiles, List<String> unitClasses, List<Path> vocabularies) {
        return assess(ModelLoader.load(model), Vocabulary.load(vocabularies), profiles, unitClasses);
    }

    static Assessed assess(Model data, Vocabulary vocabulary, List<String> profiles, List<String> unitClasses) {
        var chosen = vocabulary.profiles().profiles(profiles);
        Model all = vocabulary.unionWith(data);
        PrefixMapping prefixes = Vocabulary.prefixesFor(data);
        Set<String> classes = UnitClasses.resolve(unitClasses, all, prefixes, vocabulary.hasFullBrick());
        FleetCoverage coverage = profiles.isEmpty() ? Coverage.assess(data, vocabulary, classes)
                : Coverage.assess(data, vocabulary, chosen, false, classes);
        return new Assessed(coverage, prefixes);
    }
}
