package org.tufa.analysis.coverage;

import java.util.HashMap;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.Property;
import org.apache.jena.rdf.model.RDFNode;
import org.apache.jena.rdf.model.Resource;
import org.apache.jena.rdf.model.Statement;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;
import org.tufa.vocabulary.Namespaces;

/** Reads what tufa reports about points and other nodes (labels, types, tags, time-series ids) from the model. */
final class PointDetails {
    private final Model all;
    private final Property hasTag;
    private final Property hasAssociatedTag;
    private final Property hasUnit;
    private final Property hasExternalReference;
    private final Property hasTimeseriesId;
    private final Property storedAt;
    // Caches only; never iterated for output.
    private final Map<String, Set<String>> typesCache = new HashMap<>();
    private final Map<String, Set<String>> tagsCache = new HashMap<>();
    private final Map<String, PointRef> refCache = new HashMap<>();

    PointDetails(Model all) {
        this.all = all;
        this.hasTag = all.createProperty(Namespaces.BRICK, "hasTag");
        this.hasAssociatedTag = all.createProperty(Namespaces.BRICK, "hasAssociatedTag");
        this.hasUnit = all.createProperty(Namespaces.BRICK, "hasUnit");
        this.hasExternalReference = all.createProperty(Namespaces.REF, "hasExternalReference");
        this.hasTimeseriesId = all.createProperty(Namespaces.REF, "hasTimeseriesId");
        this.storedAt = all.createProperty(Namespaces.REF, "storedAt");
    }

    /** Asserted rdf:type IRIs of a node, sorted. */
    Set<String> types(String iri) {
        return typesCache.computeIfAbsent(iri, k -> {
            Set<String> out = new TreeSet<>();
            all.listObjectsOfProperty(all.createResource(k), RDF.type).forEachRemaining(o -> {
                if (o.isURIResource()) {
                    out.add(o.asResource().getURI());
                }
            });
            return out;
        });
    }

    /** Tags of a point: its brick:hasTag values and the brick:hasAssociatedTag values of its asserted classes. */
    Set<String> tags(String iri) {
        return tagsCache.computeIfAbsent(iri, k -> {
            Set<String> out = new TreeSet<>();
            Resource r = all.createResource(k);
            all.listObjectsOfProperty(r, hasTag).forEachRemaining(o -> addIri(out, o));
            for (String type : types(k)) {
                all.listObjectsOfProperty(all.createResource(type), hasAssociatedTag).forEachRemaining(o -> addIri(out, o));
            }
            return out;
        });
    }

    /** The smallest rdfs:label of a node, or null. */
    String label(String iri) {
        Set<String> labels = new TreeSet<>();
        all.listObjectsOfProperty(all.createResource(iri), RDFS.label).forEachRemaining(o -> {
            if (o.isLiteral()) {
                labels.add(o.asLiteral().getLexicalForm());
            }
        });
        return labels.isEmpty() ? null : labels.iterator().next();
    }

    /** The reference to a point that qualified through the given class. */
    PointRef pointRef(String iri, String brickClass) {
        return refCache.computeIfAbsent(iri + " " + brickClass, k -> {
            Resource r = all.createResource(iri);
            String label = label(iri);
            // Series id -> the database its reference says it is stored at (the smallest IRI), or "" when none.
            java.util.TreeMap<String, String> ids = new java.util.TreeMap<>();
            for (Statement s : all.listStatements(r, hasExternalReference, (RDFNode) null).toList()) {
                if (s.getObject().isResource()) {
                    Set<String> databases = new TreeSet<>();
                    all.listObjectsOfProperty(s.getResource(), storedAt).forEachRemaining(o -> addIri(databases, o));
                    String database = databases.isEmpty() ? "" : databases.iterator().next();
                    all.listObjectsOfProperty(s.getResource(), hasTimeseriesId).forEachRemaining(o -> {
                        if (o.isLiteral()) {
                            ids.merge(o.asLiteral().getLexicalForm(), database,
                                    (a, b) -> a.isEmpty() ? b : b.isEmpty() ? a : a.compareTo(b) <= 0 ? a : b);
                        }
                    });
                }
            }
            String timeseriesId = ids.isEmpty() ? label : ids.firstKey();
            String database = ids.isEmpty() || ids.firstEntry().getValue().isEmpty() ? null : ids.firstEntry().getValue();
            Set<String> units = new TreeSet<>();
            all.listObjectsOfProperty(r, hasUnit).forEachRemaining(o -> addIri(units, o));
            String unit = units.isEmpty() ? null : units.iterator().next();
            return new PointRef(iri, label, timeseriesId, unit, brickClass, database);
        });
    }

    private static void addIri(Set<String> out, RDFNode node) {
        if (node.isURIResource()) {
            out.add(node.asResource().getURI());
        }
    }
}
