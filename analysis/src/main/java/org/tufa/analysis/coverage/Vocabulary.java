package org.tufa.analysis.coverage;

import java.nio.file.Path;
import java.util.List;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.ModelFactory;
import org.tufa.vocabulary.Namespaces;

/**
 * The class hierarchy and tufa terms the coverage and query stages reason with: tufa's Brick subset, tufa.ttl, and
 * any files the user adds (the full Brick file, their own roles and profiles).
 */
public final class Vocabulary {
    private final Model model;
    private final ProfileCatalog profiles;

    private Vocabulary(Model model) {
        this.model = model;
        this.profiles = ProfileCatalog.from(model);
    }

    /** The shipped vocabulary: Brick subset plus tufa.ttl. */
    public static Vocabulary standard() {
        return load(List.of());
    }

    /**
     * The shipped vocabulary plus the given files (Turtle, N-Triples, JSON-LD or RDF/XML).
     *
     * @throws org.tufa.common.InputException when a file is missing or does not parse, or when its roles and
     *     profiles are incomplete
     */
    public static Vocabulary load(List<Path> extraFiles) {
        Model model = ModelFactory.createDefaultModel();
        model.add(ModelLoader.loadResource(Namespaces.BRICK_SUBSET_RESOURCE));
        model.add(ModelLoader.loadResource(Namespaces.TUFA_TERMS_RESOURCE));
        for (Path file : extraFiles) {
            model.add(ModelLoader.load(file));
        }
        return new Vocabulary(model);
    }

    /**
     * A vocabulary from triples already loaded (a store's vocabulary graph), plus the given files.
     *
     * @throws org.tufa.common.InputException when a file is missing or does not parse, or roles and profiles are
     *     incomplete
     */
    public static Vocabulary of(Model triples, List<Path> extraFiles) {
        Model model = ModelFactory.createDefaultModel();
        model.add(triples);
        for (Path file : extraFiles) {
            model.add(ModelLoader.load(file));
        }
        return new Vocabulary(model);
    }

    /** The vocabulary triples. Do not modify: queries copy it beside the model. */
    public Model model() {
        return model;
    }

    /** The roles and requirement profiles the vocabulary defines. */
    public ProfileCatalog profiles() {
        return profiles;
    }

    /**
     * The vocabulary and the given model seen as one graph (a union view, nothing copied): what the SPARQL lookups
     * and user queries run on. Do not add to it.
     */
    public Model unionWith(Model data) {
        // Data on the left: its triples come straight through; the small vocabulary is checked for duplicates.
        return ModelFactory.createModelForGraph(new org.apache.jena.graph.compose.Union(data.getGraph(),
                model.getGraph()));
    }

    /** The standard prefixes plus the model's own, for shortening IRIs in output. */
    public static org.apache.jena.shared.PrefixMapping prefixesFor(Model data) {
        org.apache.jena.shared.PrefixMapping pm = StandardPrefixes.mapping();
        data.getNsPrefixMap().forEach((prefix, iri) -> {
            if (pm.getNsPrefixURI(prefix) == null) {
                pm.setNsPrefix(prefix, iri);
            }
        });
        return pm;
    }
}
