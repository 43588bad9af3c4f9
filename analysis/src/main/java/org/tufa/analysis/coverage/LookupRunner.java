package org.tufa.analysis.coverage;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Deque;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;
import org.apache.jena.query.QuerySolution;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.Property;
import org.apache.jena.rdf.model.RDFNode;
import org.apache.jena.rdf.model.Resource;
import org.tufa.vocabulary.Namespaces;

/**
 * Runs one {@link Lookup} for every unit at once: one SPARQL query per lookup over the whole model (not one per
 * unit), then groups the rows by unit in Java. Each unit gets its candidates in tiers (lower wins): for zones the
 * served space before its rooms, upstream the nearest feeder first, building-wide the preferred hosts first.
 */
final class LookupRunner {
    private static final String HOSTED_POINTS = """
            SELECT ?host ?pt ?t WHERE {
              VALUES ?t { }
              ?pt rdf:type ?t .
              { ?host brick:hasPoint ?pt } UNION { ?pt brick:isPointOf ?host }
            }""";

    private static final String PART_POINTS = """
            SELECT ?host ?pt ?t WHERE {
              VALUES ?t { }
              VALUES ?pc { }
              ?pt rdf:type ?t .
              { ?part brick:hasPoint ?pt } UNION { ?pt brick:isPointOf ?part }
              ?part rdf:type ?pc .
              ?host (brick:hasPart|^brick:isPartOf)+ ?part .
            }""";

    private static final String ZONE_POINTS = """
            SELECT ?host ?space ?pt ?t ?tier WHERE {
              VALUES ?t { }
              ?pt rdf:type ?t .
              { ?space brick:hasPoint ?pt } UNION { ?pt brick:isPointOf ?space }
              {
                ?host (brick:feeds|^brick:isFedBy|brick:hasLocation|^brick:isLocationOf) ?space .
                BIND(0 AS ?tier)
              } UNION {
                VALUES ?zc { }
                ?space (^brick:hasPart|brick:isPartOf)+ ?zone .
                ?zone rdf:type ?zc .
                ?host (brick:feeds|^brick:isFedBy|brick:hasLocation|^brick:isLocationOf) ?zone .
                BIND(1 AS ?tier)
              }
            }""";

    private static final String ANY_POINTS = """
            SELECT ?pt ?t ?host WHERE {
              VALUES ?t { }
              ?pt rdf:type ?t .
              OPTIONAL { { ?host brick:hasPoint ?pt } UNION { ?pt brick:isPointOf ?host }
                         UNION { ?pt brick:hasLocation ?host } }
            }""";

    /** The candidates a lookup found for one unit, at the best tier that had any. */
    record Hits(List<PointRef> qualified, List<PointRef> untagged) {
    }

    private final Model all;
    private final Set<String> units;
    private final PointDetails details;
    private final Set<String> equipmentClasses;
    private final Set<String> zoneClasses;
    private final Property feeds;
    private final Property isFedBy;
    private final Property hasPart;
    private final Property isPartOf;
    // Cache of subclass closures; keys are looked up, never iterated.
    private final Map<List<String>, Set<String>> closures = new HashMap<>();

    LookupRunner(Model all, Set<String> units, PointDetails details) {
        this.all = all;
        this.units = units;
        this.details = details;
        this.equipmentClasses = Sparql.subclassClosure(all, List.of(Namespaces.BRICK + "Equipment"));
        this.zoneClasses = Sparql.subclassClosure(all, List.of(Namespaces.BRICK + "Zone"));
        this.feeds = all.createProperty(Namespaces.BRICK, "feeds");
        this.isFedBy = all.createProperty(Namespaces.BRICK, "isFedBy");
        this.hasPart = all.createProperty(Namespaces.BRICK, "hasPart");
        this.isPartOf = all.createProperty(Namespaces.BRICK, "isPartOf");
    }

    /** Per unit IRI (only units with at least one candidate): the hits of this lookup. */
    Map<String, Hits> run(Lookup lookup) {
        Set<String> excluded = closure(lookup.excludedPointClasses());
        Set<String> accepted = new TreeSet<>(closure(lookup.pointClasses()));
        accepted.removeAll(excluded);
        // unit -> tier -> point -> matched classes
        Map<String, SortedMap<Integer, SortedMap<String, Set<String>>>> tiers = new TreeMap<>();
        switch (lookup.place()) {
            case ON_UNIT -> {
                for (QuerySolution row : Sparql.select(all, Sparql.build(HOSTED_POINTS, Map.of("t", accepted)))) {
                    add(tiers, iri(row, "host"), 0, row);
                }
            }
            case ON_PART -> {
                Map<String, Set<String>> values = Map.of("t", accepted, "pc", closure(lookup.partClasses()));
                for (QuerySolution row : Sparql.select(all, Sparql.build(PART_POINTS, values))) {
                    add(tiers, iri(row, "host"), 0, row);
                }
            }
            case ON_ZONE -> {
                Map<String, Set<String>> values = Map.of("t", accepted, "zc", zoneClasses);
                for (QuerySolution row : Sparql.select(all, Sparql.build(ZONE_POINTS, values))) {
                    String space = iri(row, "space");
                    // A unit may feed equipment too; only spaces count as its zone.
                    if (space != null && Collections.disjoint(details.types(space), equipmentClasses)) {
                        add(tiers, iri(row, "host"), row.getLiteral("tier").getInt(), row);
                    }
                }
            }
            case UPSTREAM -> upstream(accepted, tiers);
            case BUILDING_WIDE -> buildingWide(accepted, closure(lookup.preferredHostClasses()), tiers);
        }
        Map<String, Hits> out = new TreeMap<>();
        tiers.forEach((unit, byTier) -> out.put(unit, choose(byTier, excluded, lookup.anyTags())));
        return out;
    }

    private Hits choose(SortedMap<Integer, SortedMap<String, Set<String>>> byTier, Set<String> excluded,
            List<String> anyTags) {
        List<PointRef> untagged = new ArrayList<>();
        for (SortedMap<String, Set<String>> points : byTier.values()) {
            List<PointRef> qualified = new ArrayList<>();
            points.forEach((pt, classes) -> {
                if (!Collections.disjoint(details.types(pt), excluded)) {
                    return; // also typed with an excluded class, e.g. an average of several zones
                }
                PointRef ref = details.pointRef(pt, classes.iterator().next());
                if (anyTags.isEmpty() || !Collections.disjoint(details.tags(pt), anyTags)) {
                    qualified.add(ref);
                } else {
                    untagged.add(ref);
                }
            });
            if (!qualified.isEmpty()) {
                return new Hits(qualified, untagged);
            }
        }
        return new Hits(List.of(), untagged);
    }

    private void add(Map<String, SortedMap<Integer, SortedMap<String, Set<String>>>> tiers, String unit, int tier,
            QuerySolution row) {
        String pt = iri(row, "pt");
        if (unit == null || pt == null || !units.contains(unit)) {
            return;
        }
        add(tiers, unit, tier, pt, row.getResource("t").getURI());
    }

    private static void add(Map<String, SortedMap<Integer, SortedMap<String, Set<String>>>> tiers, String unit,
            int tier, String pt, String cls) {
        tiers.computeIfAbsent(unit, k -> new TreeMap<>()).computeIfAbsent(tier, k -> new TreeMap<>())
                .computeIfAbsent(pt, k -> new TreeSet<>()).add(cls);
    }

    /**
     * Breadth-first search against the flow (brick:isFedBy, inverse brick:feeds) from the unit and its parts. Tier
     * 2k holds the points of the feeders k steps away, tier 2k+1 the points of their parts (a loop's chiller).
     */
    private void upstream(Set<String> accepted, Map<String, SortedMap<Integer, SortedMap<String, Set<String>>>> tiers) {
        Map<String, SortedMap<String, Set<String>>> pointsByHost = new HashMap<>();
        for (QuerySolution row : Sparql.select(all, Sparql.build(HOSTED_POINTS, Map.of("t", accepted)))) {
            String host = iri(row, "host");
            String pt = iri(row, "pt");
            if (host != null && pt != null) {
                pointsByHost.computeIfAbsent(host, k -> new TreeMap<>()).computeIfAbsent(pt, k -> new TreeSet<>())
                        .add(row.getResource("t").getURI());
            }
        }
        if (pointsByHost.isEmpty()) {
            return;
        }
        for (String unit : units) {
            Set<String> visited = new TreeSet<>(parts(unit));
            visited.add(unit);
            Set<String> frontier = new TreeSet<>(visited);
            for (int distance = 1; !frontier.isEmpty(); distance++) {
                Set<String> next = new TreeSet<>();
                for (String node : frontier) {
                    for (String feeder : feeders(node)) {
                        if (!visited.contains(feeder)) {
                            next.add(feeder);
                        }
                    }
                }
                visited.addAll(next);
                for (String feeder : next) {
                    addHostPoints(tiers, unit, 2 * distance, pointsByHost.get(feeder));
                    for (String part : parts(feeder)) {
                        if (!visited.contains(part)) {
                            addHostPoints(tiers, unit, 2 * distance + 1, pointsByHost.get(part));
                        }
                    }
                }
                frontier = next;
            }
        }
    }

    private static void addHostPoints(Map<String, SortedMap<Integer, SortedMap<String, Set<String>>>> tiers,
            String unit, int tier, SortedMap<String, Set<String>> points) {
        if (points != null) {
            points.forEach((pt, classes) -> classes.forEach(c -> add(tiers, unit, tier, pt, c)));
        }
    }

    private Set<String> feeders(String node) {
        Resource r = all.createResource(node);
        Set<String> out = new TreeSet<>();
        all.listSubjectsWithProperty(feeds, r).forEachRemaining(s -> addIri(out, s));
        all.listObjectsOfProperty(r, isFedBy).forEachRemaining(o -> addIri(out, o));
        return out;
    }

    /** Parts of a node, transitively (brick:hasPart, inverse brick:isPartOf). */
    private Set<String> parts(String node) {
        Set<String> out = new TreeSet<>();
        Deque<String> todo = new ArrayDeque<>(List.of(node));
        while (!todo.isEmpty()) {
            Resource r = all.createResource(todo.pop());
            Set<String> direct = new TreeSet<>();
            all.listObjectsOfProperty(r, hasPart).forEachRemaining(o -> addIri(direct, o));
            all.listSubjectsWithProperty(isPartOf, r).forEachRemaining(s -> addIri(direct, s));
            for (String p : direct) {
                if (!p.equals(node) && out.add(p)) {
                    todo.push(p);
                }
            }
        }
        return out;
    }

    private void buildingWide(Set<String> accepted, Set<String> preferredHosts,
            Map<String, SortedMap<Integer, SortedMap<String, Set<String>>>> tiers) {
        SortedMap<Integer, SortedMap<String, Set<String>>> shared = new TreeMap<>();
        for (QuerySolution row : Sparql.select(all, Sparql.build(ANY_POINTS, Map.of("t", accepted)))) {
            String pt = iri(row, "pt");
            if (pt == null) {
                continue;
            }
            String host = iri(row, "host");
            boolean preferred = host != null && !Collections.disjoint(details.types(host), preferredHosts);
            shared.computeIfAbsent(preferred ? 0 : 1, k -> new TreeMap<>()).computeIfAbsent(pt, k -> new TreeSet<>())
                    .add(row.getResource("t").getURI());
        }
        if (shared.containsKey(0) && shared.containsKey(1)) {
            // A point on a preferred host and on another one counts once, as preferred.
            shared.get(1).keySet().removeAll(shared.get(0).keySet());
        }
        if (shared.isEmpty()) {
            return;
        }
        for (String unit : units) {
            shared.forEach((tier, points) -> points.forEach((pt, cs) -> cs.forEach(c -> add(tiers, unit, tier, pt, c))));
        }
    }

    private Set<String> closure(List<String> classes) {
        return closures.computeIfAbsent(classes, k -> Sparql.subclassClosure(all, k));
    }

    private static String iri(QuerySolution row, String var) {
        RDFNode n = row.get(var);
        return n != null && n.isURIResource() ? n.asResource().getURI() : null;
    }

    private static void addIri(Set<String> out, RDFNode node) {
        if (node.isURIResource()) {
            out.add(node.asResource().getURI());
        }
    }
}
