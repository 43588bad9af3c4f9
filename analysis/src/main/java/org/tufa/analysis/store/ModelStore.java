package org.tufa.analysis.store;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.function.BiFunction;
import org.apache.jena.query.Dataset;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.Resource;
import org.apache.jena.system.Txn;
import org.apache.jena.tdb2.TDB2Factory;
import org.apache.jena.vocabulary.RDF;
import org.tufa.common.InputException;
import org.tufa.vocabulary.Namespaces;

/**
 * A folder holding a Jena TDB2 dataset of building models: each building's model in a named graph (by default the
 * IRI of the model's one {@code brick:Building}), and the vocabulary the models were loaded with (tufa's Brick
 * subset, tufa.ttl and any extra files) in the graph {@link #VOCABULARY_GRAPH}. Reads and writes run in TDB2
 * transactions; close the store when done.
 */
public final class ModelStore implements AutoCloseable {

    /** The named graph holding the vocabulary. */
    public static final String VOCABULARY_GRAPH = "urn:tufa:graph:vocabulary";

    private final Path dir;
    private final Dataset dataset;

    private ModelStore(Path dir, Dataset dataset) {
        this.dir = dir;
        this.dataset = dataset;
    }

    /**
     * Opens (or, with {@code create}, creates) the store in a folder.
     *
     * @throws InputException when the folder is missing (and not to be created) or is not a TDB2 store
     */
    public static ModelStore open(Path dir, boolean create) {
        if (!Files.isDirectory(dir)) {
            if (!create) {
                throw InputException.in(dir, "no such store folder; create it with tufa load --store " + dir
                        + " --model MODEL.ttl");
            }
        } else if (!create && !Files.exists(dir.resolve("tdb.lock")) && !hasDataFolder(dir)) {
            throw InputException.in(dir, "is not a tufa store (no TDB2 dataset in it); load a model into it with "
                    + "tufa load");
        }
        try {
            Files.createDirectories(dir);
            return new ModelStore(dir, TDB2Factory.connectDataset(dir.toString()));
        } catch (java.io.IOException | RuntimeException e) {
            throw InputException.in(dir, "cannot be opened as a TDB2 store (" + e.getMessage()
                    + "); is another tufa serve or load using it?");
        }
    }

    private static boolean hasDataFolder(Path dir) {
        try (var s = Files.list(dir)) {
            return s.anyMatch(p -> p.getFileName().toString().startsWith("Data-"));
        } catch (java.io.IOException e) {
            return false;
        }
    }

    /** The dataset, for the SPARQL server. */
    Dataset dataset() {
        return dataset;
    }

    /** The folder. */
    public Path dir() {
        return dir;
    }

    /**
     * Puts a building's model into its graph (replacing what the graph held) and the vocabulary into its own graph.
     *
     * @param graph the graph name, or null for the IRI of the model's one brick:Building
     * @return the graph name used
     * @throws InputException when no graph is given and the model has not exactly one building
     */
    public String load(Model model, String graph, Model vocabulary, String modelName) {
        String name = graph != null ? graph : buildingIri(model, modelName);
        if (name.equals(VOCABULARY_GRAPH)) {
            throw new InputException("--graph " + name + " is the store's vocabulary graph; name the building's "
                    + "graph otherwise");
        }
        Txn.executeWrite(dataset, () -> {
            dataset.replaceNamedModel(name, model);
            dataset.replaceNamedModel(VOCABULARY_GRAPH, vocabulary);
        });
        return name;
    }

    private static String buildingIri(Model model, String modelName) {
        Resource building = model.createResource(Namespaces.BRICK + "Building");
        List<String> iris = new ArrayList<>();
        model.listSubjectsWithProperty(RDF.type, building).forEachRemaining(r -> {
            if (r.isURIResource()) {
                iris.add(r.getURI());
            }
        });
        if (iris.size() != 1) {
            throw new InputException(modelName + ": has " + iris.size() + " brick:Building nodes, so the store "
                    + "cannot name its graph after the building; give the graph's IRI with --graph");
        }
        return iris.get(0);
    }

    /** The building graphs, sorted. */
    public List<String> buildings() {
        return Txn.calculateRead(dataset, () -> {
            Set<String> names = new TreeSet<>();
            dataset.listModelNames().forEachRemaining(r -> names.add(r.getURI()));
            names.remove(VOCABULARY_GRAPH);
            return List.copyOf(names);
        });
    }

    /**
     * Runs a computation on one building's model and the stored vocabulary, inside a read transaction. Whatever
     * it returns must not hold on to the models.
     *
     * @param graph the building's graph, or null for the store's only building
     * @throws InputException when the graph is not in the store, or no graph is given and the store has several
     */
    public <T> T read(String graph, BiFunction<Model, Model, T> work) {
        String name = choose(graph);
        return Txn.calculateRead(dataset, () -> work.apply(dataset.getNamedModel(name),
                dataset.getNamedModel(VOCABULARY_GRAPH)));
    }

    /** As {@link #read}, on every building's model at once (their union) and the vocabulary. */
    public <T> T readAll(BiFunction<Model, Model, T> work) {
        if (buildings().isEmpty()) {
            throw InputException.in(dir, "holds no building yet; load one with tufa load --store " + dir
                    + " --model MODEL.ttl");
        }
        List<String> names = buildings();
        return Txn.calculateRead(dataset, () -> {
            org.apache.jena.graph.Graph union = null;
            for (String n : names) {
                org.apache.jena.graph.Graph next = dataset.getNamedModel(n).getGraph();
                union = union == null ? next : new org.apache.jena.graph.compose.Union(union, next);
            }
            return work.apply(org.apache.jena.rdf.model.ModelFactory.createModelForGraph(union),
                    dataset.getNamedModel(VOCABULARY_GRAPH));
        });
    }

    /** The graph a command means: the one given (which must exist), else the store's only building. */
    public String choose(String graph) {
        List<String> names = buildings();
        if (graph != null) {
            if (!names.contains(graph)) {
                throw InputException.in(dir, "has no graph " + graph + "; it holds " + (names.isEmpty() ? "none"
                        : String.join(", ", names)));
            }
            return graph;
        }
        if (names.size() != 1) {
            throw InputException.in(dir, names.isEmpty() ? "holds no building yet; load one with tufa load"
                    : "holds " + names.size() + " buildings (" + String.join(", ", names)
                    + "); say which with --graph IRI");
        }
        return names.get(0);
    }

    @Override
    public void close() {
        dataset.close();
        org.apache.jena.tdb2.sys.TDBInternal.expel(dataset.asDatasetGraph());
    }
}
