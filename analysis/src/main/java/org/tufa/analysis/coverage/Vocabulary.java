package org.tufa.analysis.coverage;

import java.nio.file.Path;
import java.util.List;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.ModelFactory;
import org.apache.jena.graph.GraphUtil;
import org.tufa.vocabulary.BrickGraph;
import org.tufa.vocabulary.BrickVocabulary;
import org.tufa.vocabulary.Namespaces;

/**
 * The class hierarchy and tufa terms the coverage and query stages reason with: the Brick vocabulary tufa ships
 * (Brick 1.4.4, {@link BrickGraph}), tufa.ttl, and any files the user adds (another Brick release, their own roles
 * and profiles).
 */
public final class Vocabulary {
    private final Model model;
    private final ProfileCatalog profiles;
    private final boolean fullBrick;

    private Vocabulary(Model model) {
        this.model = model;
        this.profiles = ProfileCatalog.from(model);
        // The published Brick file declares its ontology (https://brickschema.org/schema/1.4/Brick a owl:Ontology),
        // and so does the RDF view of the Brick tufa bundles (BrickGraph): the whole ontology is there.
        this.fullBrick = model.listSubjectsWithProperty(org.apache.jena.vocabulary.RDF.type,
                org.apache.jena.vocabulary.OWL.Ontology).toList().stream()
                .anyMatch(o -> o.isURIResource() && o.getURI().startsWith("https://brickschema.org/schema/1.")
                        && o.getURI().endsWith("/Brick"));
    }

    /** True when the vocabulary holds the whole Brick ontology (always, with the bundled Brick 1.4.4). */
    public boolean hasFullBrick() {
        return fullBrick;
    }

    /** The shipped vocabulary: Brick plus tufa.ttl. */
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
        GraphUtil.addInto(model.getGraph(), BrickGraph.of(BrickVocabulary.bundled()));
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
