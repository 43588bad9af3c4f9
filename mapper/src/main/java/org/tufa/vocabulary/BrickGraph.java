package org.tufa.vocabulary;

import java.util.Map;
import java.util.SortedSet;
import org.apache.jena.datatypes.xsd.XSDDatatype;
import org.apache.jena.graph.Graph;
import org.apache.jena.graph.Node;
import org.apache.jena.graph.NodeFactory;
import org.apache.jena.graph.Triple;
import org.apache.jena.sparql.graph.GraphFactory;
import org.apache.jena.vocabulary.OWL2;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;

/**
 * The RDF statements a {@link BrickVocabulary} stands for, as Brick writes them: the ontology's declaration and
 * owl:versionInfo; for every class rdf:type
 * owl:Class, rdfs:subClassOf, owl:equivalentClass, brick:hasAssociatedTag, the deprecation (owl:deprecated,
 * brick:deprecatedInVersion, brick:deprecationMitigationMessage, brick:isReplacedBy), rdfs:label and
 * skos:definition; every tag as a brick:Tag; properties with their types, owl:inverseOf, label and definition;
 * Brick's quantities with qudt:applicableUnit. What the coverage and query stages reason over (SHACL shapes and
 * tag-inference rules are not carried).
 */
public final class BrickGraph {
    private BrickGraph() {
    }

    /** A new graph holding the vocabulary's statements. */
    public static Graph of(BrickVocabulary v) {
        Graph g = GraphFactory.createDefaultGraph();
        Node type = RDF.type.asNode();
        Node hasTag = uri(Namespaces.BRICK + "hasAssociatedTag");
        Node definition = uri(Namespaces.SKOS + "definition");
        if (!v.ontologyIri().isEmpty()) {
            Node o = uri(v.ontologyIri());
            g.add(Triple.create(o, type, OWL2.Ontology.asNode()));
            if (!v.version().isEmpty()) {
                g.add(Triple.create(o, OWL2.versionInfo.asNode(), NodeFactory.createLiteralString(v.version())));
            }
        }
        for (BrickVocabulary.ClassInfo c : v.classes().values()) {
            Node s = uri(Namespaces.BRICK + c.name());
            g.add(Triple.create(s, type, OWL2.Class.asNode()));
            for (String p : c.parents()) {
                g.add(Triple.create(s, RDFS.subClassOf.asNode(), uri(Namespaces.BRICK + p)));
            }
            for (String e : c.equivalents()) {
                g.add(Triple.create(s, OWL2.equivalentClass.asNode(), uri(Namespaces.BRICK + e)));
            }
            for (String t : c.tags()) {
                g.add(Triple.create(s, hasTag, uri(Namespaces.TAG + t)));
            }
            c.deprecation().ifPresent(d -> {
                g.add(Triple.create(s, OWL2.deprecated.asNode(), NodeFactory.createLiteralDT("true",
                        XSDDatatype.XSDboolean)));
                if (!d.version().isEmpty()) {
                    g.add(Triple.create(s, uri(Namespaces.BRICK + "deprecatedInVersion"),
                            NodeFactory.createLiteralString(d.version())));
                }
                if (!d.message().isEmpty()) {
                    g.add(Triple.create(s, uri(Namespaces.BRICK + "deprecationMitigationMessage"),
                            NodeFactory.createLiteralString(d.message())));
                }
                if (!d.replacementIri().isEmpty()) {
                    g.add(Triple.create(s, uri(Namespaces.BRICK + "isReplacedBy"), uri(d.replacementIri())));
                }
            });
            text(g, s, RDFS.label.asNode(), c.label());
            text(g, s, definition, c.definition());
        }
        Node tagClass = uri(Namespaces.BRICK + "Tag");
        for (String t : v.tagNames()) {
            Node s = uri(Namespaces.TAG + t);
            g.add(Triple.create(s, type, tagClass));
            g.add(Triple.create(s, RDFS.label.asNode(), NodeFactory.createLiteralLang(t, "en")));
        }
        for (BrickVocabulary.Term t : v.terms().values()) {
            Node s = uri(t.iri());
            for (String ty : t.types()) {
                g.add(Triple.create(s, type, uri(ty)));
            }
            if (!t.inverse().isEmpty()) {
                g.add(Triple.create(s, OWL2.inverseOf.asNode(), uri(t.inverse())));
            }
            text(g, s, RDFS.label.asNode(), t.label());
            text(g, s, definition, t.definition());
        }
        Node quantity = uri(Namespaces.BRICK + "Quantity");
        Node applicable = uri(Namespaces.QUDT + "applicableUnit");
        for (Map.Entry<String, SortedSet<String>> u : v.unitQuantities().entrySet()) {
            for (String q : u.getValue()) {
                Node s = uri(Namespaces.BRICK + q);
                g.add(Triple.create(s, type, quantity));
                g.add(Triple.create(s, applicable, uri(Namespaces.UNIT + u.getKey())));
            }
        }
        return g;
    }

    private static void text(Graph g, Node s, Node p, BrickVocabulary.Text t) {
        if (!t.isEmpty()) {
            g.add(Triple.create(s, p, t.language().isEmpty() ? NodeFactory.createLiteralString(t.lexical())
                    : NodeFactory.createLiteralLang(t.lexical(), t.language())));
        }
    }

    private static Node uri(String iri) {
        return NodeFactory.createURI(iri);
    }
}
