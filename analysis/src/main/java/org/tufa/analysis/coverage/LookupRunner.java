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

    // One query per lookup finds the qualifying points and what they hang on; the unit's parts, zones and feeders
    // are followed in Java on the model (cached per unit). Part and zone classes are checked in Java too, so the
    // query stays a flat chain of patterns that ARQ evaluates left to right with its variables bound.

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
    private final Property hasLocation;
    private final Property isLocationOf;
    // Cache of subclass closures; keys are looked up, never iterated.
    private final Map<List<String>, Set<String>> closures = new HashMap<>();
    private final Map<String, SortedMap<Integer, Set<String>>> upstreamCache = new HashMap<>();
    private final Map<String, Set<String>> partsCache = new HashMap<>();
    private final Map<String, SortedMap<Integer, Set<String>>> spacesCache = new HashMap<>();
    private final Map<Set<String>, Map<String, SortedMap<String, Set<String>>>> hostedCache = new HashMap<>();

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
        this.hasLocation = all.createProperty(Namespaces.BRICK, "hasLocation");
        this.isLocationOf = all.createProperty(Namespaces.BRICK, "isLocationOf");
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
                Map<String, SortedMap<String, Set<String>>> pointsByHost = pointsByHost(accepted);
                for (String unit : units) {
                    addHostPoints(tiers, unit, 0, pointsByHost.get(unit));
                }
            }
            case ON_PART -> {
                Set<String> partClasses = closure(lookup.partClasses());
                Map<String, SortedMap<String, Set<String>>> pointsByHost = pointsByHost(accepted);
                for (String unit : units) {
                    for (String part : partsOf(unit)) {
                        if (pointsByHost.containsKey(part) && !Collections.disjoint(details.types(part), partClasses)) {
                            addHostPoints(tiers, unit, 0, pointsByHost.get(part));
                        }
                    }
                }
            }
            case ON_ZONE -> {
                Map<String, SortedMap<String, Set<String>>> pointsByHost = pointsByHost(accepted);
                for (String unit : units) {
                    for (Map.Entry<Integer, Set<String>> tier : spacesOf(unit).entrySet()) {
                        for (String space : tier.getValue()) {
                            addHostPoints(tiers, unit, tier.getKey(), pointsByHost.get(space));
                        }
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

    /** A unit may feed equipment too; only spaces (not equipment) count as its zone. */
    private boolean isSpace(String node) {
        return node != null && Collections.disjoint(details.types(node), equipmentClasses);
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
        Map<String, SortedMap<String, Set<String>>> pointsByHost = pointsByHost(accepted);
        if (pointsByHost.isEmpty()) {
            return;
        }
        for (String unit : units) {
            for (Map.Entry<Integer, Set<String>> tier : upstreamTiers(unit).entrySet()) {
                for (String host : tier.getValue()) {
                    addHostPoints(tiers, unit, tier.getKey(), pointsByHost.get(host));
                }
            }
        }
    }

    /** Qualifying points per host (equipment, part or space that has them), from one query per class set. */
    private Map<String, SortedMap<String, Set<String>>> pointsByHost(Set<String> accepted) {
        return hostedCache.computeIfAbsent(accepted, this::queryPointsByHost);
    }

    private Map<String, SortedMap<String, Set<String>>> queryPointsByHost(Set<String> accepted) {
        Map<String, SortedMap<String, Set<String>>> pointsByHost = new HashMap<>();
        for (QuerySolution row : Sparql.select(all, Sparql.build(HOSTED_POINTS, Map.of("t", accepted)))) {
            String host = iri(row, "host");
            String pt = iri(row, "pt");
            if (host != null && pt != null) {
                pointsByHost.computeIfAbsent(host, k -> new TreeMap<>()).computeIfAbsent(pt, k -> new TreeSet<>())
                        .add(row.getResource("t").getURI());
            }
        }
        return pointsByHost;
    }

    /**
     * The spaces a unit serves, by tier: 0 what it brick:feeds or brick:hasLocation (and the inverses), 1 the parts
     * (rooms) of those that are zones. Equipment it feeds is not a space.
     */
    private SortedMap<Integer, Set<String>> spacesOf(String unit) {
        return spacesCache.computeIfAbsent(unit, u -> {
            Resource r = all.createResource(u);
            Set<String> direct = new TreeSet<>();
            all.listObjectsOfProperty(r, feeds).forEachRemaining(o -> addIri(direct, o));
            all.listObjectsOfProperty(r, hasLocation).forEachRemaining(o -> addIri(direct, o));
            all.listSubjectsWithProperty(isFedBy, r).forEachRemaining(x -> addIri(direct, x));
            all.listSubjectsWithProperty(isLocationOf, r).forEachRemaining(x -> addIri(direct, x));
            direct.removeIf(x -> !isSpace(x));
            Set<String> rooms = new TreeSet<>();
            for (String space : direct) {
                if (!Collections.disjoint(details.types(space), zoneClasses)) {
                    rooms.addAll(parts(space));
                }
            }
            rooms.removeAll(direct);
            rooms.removeIf(x -> !isSpace(x));
            SortedMap<Integer, Set<String>> out = new TreeMap<>();
            if (!direct.isEmpty()) {
                out.put(0, direct);
            }
            if (!rooms.isEmpty()) {
                out.put(1, rooms);
            }
            return out;
        });
    }

    /** The parts of a unit, transitively; cached. */
    Set<String> partsOf(String unit) {
        return partsCache.computeIfAbsent(unit, this::parts);
    }

    /** Per tier (2k: feeders k steps away, 2k+1: their parts), the upstream nodes of a unit; cached per unit. */
    private SortedMap<Integer, Set<String>> upstreamTiers(String unit) {
        return upstreamCache.computeIfAbsent(unit, u -> {
            SortedMap<Integer, Set<String>> out = new TreeMap<>();
            Set<String> visited = new TreeSet<>(partsOf(u));
            visited.add(u);
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
                if (!next.isEmpty()) {
                    out.put(2 * distance, next);
                }
                Set<String> feederParts = new TreeSet<>();
                for (String feeder : next) {
                    for (String part : parts(feeder)) {
                        if (!visited.contains(part)) {
                            feederParts.add(part);
                        }
                    }
                }
                if (!feederParts.isEmpty()) {
                    out.put(2 * distance + 1, feederParts);
                }
                frontier = next;
            }
            return out;
        });
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
