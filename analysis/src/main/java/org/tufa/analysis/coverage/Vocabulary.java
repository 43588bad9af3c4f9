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

    /** The vocabulary triples. Do not modify: queries copy it beside the model. */
    public Model model() {
        return model;
    }

    /** The roles and requirement profiles the vocabulary defines. */
    public ProfileCatalog profiles() {
        return profiles;
    }

    /** A new model holding the vocabulary and the given model: what the SPARQL lookups run on. */
    public Model unionWith(Model data) {
        Model all = ModelFactory.createDefaultModel();
        all.add(model);
        all.add(data);
        all.setNsPrefixes(StandardPrefixes.mapping());
        data.getNsPrefixMap().forEach((prefix, iri) -> {
            if (all.getNsPrefixURI(prefix) == null) {
                all.setNsPrefix(prefix, iri);
            }
        });
        return all;
    }
}
