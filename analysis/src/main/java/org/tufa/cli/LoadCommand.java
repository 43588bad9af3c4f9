package org.tufa.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.apache.jena.rdf.model.Model;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.store.ModelStore;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tufa load}: put a building's model into a store (a Jena TDB2 dataset), one named graph per building. */
@Command(name = "load", mixinStandardHelpOptions = true,
        description = {"Load a Brick model into a store (a Jena TDB2 dataset in a folder), as the named graph of its "
                + "building, replacing that graph; the vocabulary (tufa's Brick subset, tufa.ttl and --vocabulary "
                + "files) goes into a graph of its own.",
            "Then coverage, query and analyze read it with --store DIR, and tufa serve serves it."})
public final class LoadCommand implements Callable<Integer> {
    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Option(names = "--store", required = true, paramLabel = "DIR", description = "The store's folder (created).")
    Path store;

    @Option(names = "--model", required = true, paramLabel = "FILE", description = "Brick model to load.")
    Path model;

    @Option(names = "--graph", paramLabel = "IRI",
            description = "The graph's name (default: the IRI of the model's one brick:Building).")
    String graph;

    @Option(names = "--vocabulary", paramLabel = "FILE", description = "Extra vocabulary stored with it. Repeatable.")
    List<Path> vocabularies = new ArrayList<>();

    @Override
    public Integer call() {
        Model data = ModelLoader.load(model);
        Vocabulary vocabulary = Vocabulary.load(vocabularies);
        try (ModelStore s = ModelStore.open(store, true)) {
            String name = s.load(data, graph, vocabulary.model(), model.toString());
            var out = spec.commandLine().getOut();
            out.println("Loaded " + data.size() + " triples of " + model + " into graph " + name + " of " + store
                    + " (" + s.buildings().size() + " building(s) in the store)");
            out.flush();
        }
        return ExitCodes.OK;
    }
}
