package org.tufa.mapper.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;
import org.apache.jena.datatypes.xsd.XSDDatatype;
import org.apache.jena.graph.Graph;
import org.apache.jena.graph.Node;
import org.apache.jena.graph.NodeFactory;
import org.apache.jena.graph.Triple;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.ModelFactory;
import org.apache.jena.sparql.graph.GraphFactory;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;
import org.tufa.common.InputException;
import org.tufa.mapper.match.Assignment;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;
import org.tufa.mapper.points.PointRecord;
import org.tufa.vocabulary.BrickVocabulary;
import org.tufa.vocabulary.Namespaces;

/**
 * Turns a {@link MappingResult} into a Brick model (a Jena {@link Model}), through Jena's API only.
 *
 * <p>Written: the building (brick:Building, rdfs:label); each equipment (its class, rdfs:label = id,
 * brick:hasLocation, brick:feeds / brick:isFedBy, brick:hasPart / brick:isPartOf to its parts, tufa:nominalAirflow);
 * each location (brick:isPartOf the previous one in the rule's chain, the first isPartOf the building, with the
 * inverse brick:hasPart); each point (its class, rdfs:label = the raw name, brick:isPointOf / brick:hasPoint its
 * equipment or part, or the building when the rule names no equipment,
 * brick:hasUnit, ref:hasExternalReference to a ref:TimeseriesReference with ref:hasTimeseriesId = the series id or
 * the name, tufa:mappedBy = "file:line" of the rule, the export's other columns). Rows no rule classified are
 * written as plain brick:Point with tufa:mappingStatus, so nothing in the export is lost.
 *
 * <p>tufa: terms used here (declared in ontology-extensions' tufa.ttl): tufa:mappedBy, tufa:mappingStatus,
 * tufa:exportDescription, tufa:bacnetObjectType, tufa:device, tufa:exportUnits, tufa:exportField, tufa:fieldName,
 * tufa:fieldValue.
 */
public final class ModelBuilder {

    private static final String BRICK = Namespaces.BRICK;
    private static final String TUFA = Namespaces.TUFA;
    private static final String REF = Namespaces.REF;

    private final IriMinter iris;
    private final Graph g = GraphFactory.createDefaultGraph();
    private final SortedMap<String, SortedSet<String>> classesById = new TreeMap<>();
    private final SortedMap<String, String> airflowById = new TreeMap<>();
    private final List<String> warnings = new ArrayList<>();
    /** Whether a RealEstateCore class (Brick 1.4's replacement for its location classes) was written. */
    private boolean usesRec;
    /** Equipment-level statements already written (equipment id + what), so each is added once. */
    private final java.util.Set<String> done = new java.util.HashSet<>();
    /** Class and predicate nodes, made once (point and equipment IRIs are not cached: each is used a few times). */
    private final java.util.Map<String, Node> vocabularyNodes = new java.util.HashMap<>();
    /** brick:feeds and brick:hasPart links between minted nodes (subject IRI to object IRIs), for the cycle check. */
    private final SortedMap<String, SortedSet<String>> feeds = new TreeMap<>();
    private final SortedMap<String, SortedSet<String>> parts = new TreeMap<>();
    /** The rule that first wrote each link ("s o" to "file:line"), to name it in messages. */
    private final java.util.Map<String, String> linkRule = new java.util.HashMap<>();

    private ModelBuilder(IriMinter iris) {
        this.iris = iris;
    }

    /** Builds the model; {@code baseIri} prefixes every minted IRI. */
    public static BuiltModel build(MappingResult result, String baseIri) {
        return new ModelBuilder(new IriMinter(baseIri)).run(result);
    }

    private BuiltModel run(MappingResult result) {
        Node building = uri(iris.building());
        add(building, RDF.type.asNode(), uri(BRICK + "Building"));
        add(building, RDFS.label.asNode(), text(result.rules().building()));
        for (PointMapping m : result.mappings()) {
            if (m.point().name().isEmpty()) {
                continue; // rejected rows: reported, nothing to name a node after
            }
            point(m, building);
        }
        checkLinks();
        classesById.forEach((id, classes) -> {
            if (classes.size() > 1) {
                warnings.add("'" + id + "' is given more than one class (" + String.join(", ", classes)
                        + "); all are written: check the rules' equipment, part and feeds lines");
            }
        });
        Model model = ModelFactory.createModelForGraph(g);
        model.setNsPrefix("brick", BRICK);
        model.setNsPrefix("ref", REF);
        model.setNsPrefix("unit", Namespaces.UNIT);
        model.setNsPrefix("tufa", TUFA);
        if (usesRec) {
            model.setNsPrefix("rec", Namespaces.REC);
        }
        model.setNsPrefix("rdfs", RDFS.getURI());
        model.setNsPrefix("xsd", "http://www.w3.org/2001/XMLSchema#");
        return new BuiltModel(model, warnings);
    }

    private void point(PointMapping m, Node building) {
        PointRecord p = m.point();
        String pointIri = iris.point(p.device(), p.name(), m.occurrence());
        Node point = uri(pointIri);
        add(point, RDFS.label.asNode(), text(p.name()));
        Node ref = uri(IriMinter.timeseries(pointIri));
        add(point, uri(REF + "hasExternalReference"), ref);
        add(ref, RDF.type.asNode(), uri(REF + "TimeseriesReference"));
        add(ref, uri(REF + "hasTimeseriesId"), text(p.seriesId().isEmpty() ? p.name() : p.seriesId()));
        if (!p.description().isEmpty()) {
            add(point, uri(TUFA + "exportDescription"), text(p.description()));
        }
        if (!p.rawObjectType().isEmpty()) {
            add(point, uri(TUFA + "bacnetObjectType"), text(p.objectType().isEmpty() ? p.rawObjectType()
                    : p.objectType()));
        }
        if (!p.device().isEmpty()) {
            add(point, uri(TUFA + "device"), text(p.device()));
        }
        if (!p.units().isEmpty()) {
            add(point, uri(TUFA + "exportUnits"), text(p.units()));
        }
        for (Map.Entry<String, String> e : p.extras().entrySet()) {
            Node f = uri(IriMinter.field(pointIri, e.getKey()));
            add(point, uri(TUFA + "exportField"), f);
            add(f, uri(TUFA + "fieldName"), text(e.getKey()));
            add(f, uri(TUFA + "fieldValue"), text(e.getValue()));
        }
        if (!m.classified()) {
            add(point, RDF.type.asNode(), uri(BRICK + "Point"));
            add(point, uri(TUFA + "mappingStatus"), text(m.assignment().isPresent() && m.status().name()
                    .equals("DUPLICATE") ? "duplicate" : m.status().label()));
            return;
        }
        Assignment a = m.assignment().get();
        add(point, RDF.type.asNode(), uri(BrickVocabulary.iri(a.className())));
        add(point, uri(TUFA + "mappedBy"), text(a.ruleLabel()));
        a.unit().ifPresent(u -> add(point, uri(BRICK + "hasUnit"), uri(Namespaces.UNIT + u)));
        if (a.equipment().isEmpty()) {
            // A classified point that belongs to no equipment (a roof weather sensor, a site meter, a room sensor)
            // is a point of its location, or of the building: Brick lets a location have points, and consumers
            // looking for building-wide points (the outdoor air temperature) find them there.
            Node place = locationChain(a.locations(), building);
            add(place, uri(BRICK + "hasPoint"), point);
            add(point, uri(BRICK + "isPointOf"), place);
            return;
        }
        Assignment.Equipment eq = a.equipment().get();
        Node equipment = uri(iris.equipment(eq.id()));
        Node holder = equipment;
        if (a.part().isPresent()) {
            Assignment.Part part = a.part().get();
            if (part.localId().equals(eq.id())) {
                throw new InputException(a.ruleLabel() + ": equipment '" + eq.id() + "' would be its own part "
                        + "(part id '" + part.localId() + "'); give the part an id of its own, e.g. FAN or CHWV");
            }
            Node pn = uri(iris.part(eq.id(), part.localId()));
            link(parts, iris.equipment(eq.id()), iris.part(eq.id(), part.localId()), a.ruleLabel());
            if (done.add("part\u0000" + part.id() + "\u0000" + part.className())) {
                typed(pn, part.id(), part.className());
                add(equipment, uri(BRICK + "hasPart"), pn);
                add(pn, uri(BRICK + "isPartOf"), equipment);
            }
            holder = pn;
        }
        add(holder, uri(BRICK + "hasPoint"), point);
        add(point, uri(BRICK + "isPointOf"), holder);
        // equipment-level statements depend only on the rule's output for this equipment: write them once per
        // distinct (equipment, class, locations, links, airflow)
        if (!done.add("eq\u0000" + eq.id() + "\u0000" + eq.className() + "\u0000" + a.locations() + a.feeds()
                + a.fedBy() + a.airflow())) {
            return;
        }
        typed(equipment, eq.id(), eq.className());

        add(equipment, uri(BRICK + "hasLocation"), locationChain(a.locations(), building));
        for (Assignment.Link f : a.feeds()) {
            if (f.id().equals(eq.id())) {
                throw new InputException(a.ruleLabel() + ": equipment '" + eq.id() + "' would feed itself; a "
                        + "'feeds' line names the equipment downstream, not the rule's own equipment");
            }
            link(feeds, iris.equipment(eq.id()), iris.equipment(f.id()), a.ruleLabel());
            Node t = uri(iris.equipment(f.id()));
            typed(t, f.id(), f.className());
            add(equipment, uri(BRICK + "feeds"), t);
            add(t, uri(BRICK + "isFedBy"), equipment);
        }
        for (Assignment.Link f : a.fedBy()) {
            if (f.id().equals(eq.id())) {
                throw new InputException(a.ruleLabel() + ": equipment '" + eq.id() + "' would be fed by itself; a "
                        + "'fed-by' line names the equipment upstream, not the rule's own equipment");
            }
            link(feeds, iris.equipment(f.id()), iris.equipment(eq.id()), a.ruleLabel());
            Node s = uri(iris.equipment(f.id()));
            typed(s, f.id(), f.className());
            add(s, uri(BRICK + "feeds"), equipment);
            add(equipment, uri(BRICK + "isFedBy"), s);
        }
        if (a.airflow().isPresent()) {
            Assignment.Airflow af = a.airflow().get();
            String value = af.value().toPlainString() + " " + af.unit();
            String before = airflowById.putIfAbsent(eq.id(), value);
            if (before == null) {
                String eqIri = iris.equipment(eq.id());
                Node n = uri(IriMinter.airflow(eqIri));
                add(equipment, uri(TUFA + "nominalAirflow"), n);
                add(n, uri(BRICK + "value"), NodeFactory.createLiteralDT(af.value().toPlainString(),
                        XSDDatatype.XSDdecimal));
                add(n, uri(BRICK + "hasUnit"), uri(Namespaces.UNIT + af.unit()));
            } else if (!before.equals(value)) {
                warnings.add("equipment '" + eq.id() + "' gets nominal airflow " + before + " and " + value
                        + "; the first is kept");
            }
        }
    }

    private void link(SortedMap<String, SortedSet<String>> links, String from, String to, String rule) {
        links.computeIfAbsent(from, k -> new TreeSet<>()).add(to);
        linkRule.putIfAbsent(from + " " + to, rule);
    }

    /**
     * Cycles in the links: a part chain that comes back to its start is an error (a thing cannot contain itself);
     * a feeds cycle of several pieces of equipment is a warning (a closed water loop may be drawn that way, but a
     * coverage lookup upstream then goes round it).
     */
    private void checkLinks() {
        List<String> partCycle = LinkCycles.first(parts);
        if (!partCycle.isEmpty()) {
            throw new InputException(linkRule.get(partCycle.get(0) + " " + partCycle.get(1)) + ": brick:hasPart goes "
                    + "round in a circle (" + String.join(" has part ", partCycle) + "); a part cannot contain its "
                    + "equipment: fix the rules' part lines");
        }
        List<String> feedCycle = LinkCycles.first(feeds);
        if (!feedCycle.isEmpty()) {
            warnings.add(linkRule.get(feedCycle.get(0) + " " + feedCycle.get(1)) + ": brick:feeds goes round in a "
                    + "circle (" + String.join(" feeds ", feedCycle) + "); check the rules' feeds and fed-by lines");
        }
    }

    /** Writes a rule's location chain (outermost first, the first part of the building); returns the innermost. */
    private Node locationChain(List<Assignment.Link> chain, Node building) {
        Node parent = building;
        for (Assignment.Link loc : chain) {
            Node l = uri(iris.location(loc.className(), loc.id()));
            typed(l, "location " + loc.className() + " " + loc.id(), loc.className());
            add(l, RDFS.label.asNode(), text(loc.id()));
            add(l, uri(BRICK + "isPartOf"), parent);
            add(parent, uri(BRICK + "hasPart"), l);
            parent = l;
        }
        return parent;
    }

    private void typed(Node n, String id, String className) {
        classesById.computeIfAbsent(id, k -> new TreeSet<>()).add(className);
        String iri = BrickVocabulary.iri(className);
        usesRec |= iri.startsWith(Namespaces.REC);
        add(n, RDF.type.asNode(), uri(iri));
        if (!id.startsWith("location ")) {
            add(n, RDFS.label.asNode(), text(id));
        }
    }

    private void add(Node s, Node p, Node o) {
        g.add(Triple.create(s, p, o));
    }

    private Node uri(String iri) {
        if (iri.startsWith(BRICK) || iri.startsWith(REF) || iri.startsWith(TUFA) || iri.startsWith(Namespaces.UNIT)) {
            return vocabularyNodes.computeIfAbsent(iri, NodeFactory::createURI);
        }
        return NodeFactory.createURI(iri);
    }

    private static Node text(String s) {
        return NodeFactory.createLiteralString(s);
    }
}
