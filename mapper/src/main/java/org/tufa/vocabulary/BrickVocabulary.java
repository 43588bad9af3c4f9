package org.tufa.vocabulary;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;
import org.apache.jena.graph.Graph;
import org.apache.jena.graph.Node;
import org.apache.jena.graph.NodeFactory;
import org.apache.jena.graph.Triple;
import org.apache.jena.riot.Lang;
import org.apache.jena.riot.RDFParser;
import org.apache.jena.riot.RiotException;
import org.apache.jena.sparql.graph.GraphFactory;
import org.apache.jena.vocabulary.OWL2;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;
import org.tufa.common.InputException;

/**
 * The Brick classes and tags tufa knows, read once from a Brick Turtle file and then immutable (safe to share
 * between threads). Names are Brick local names ("Zone_Air_Temperature_Sensor", tag "Temperature"); every method
 * also accepts "brick:X" / "tag:X" and full IRIs.
 *
 * <p>Load the subset tufa ships with {@link #bundled()}, or a full Brick release with {@link #load(Path)}.
 */
public final class BrickVocabulary {

    /** What the Brick file says about one class. */
    public record ClassInfo(String name, SortedSet<String> parents, SortedSet<String> ancestors,
            SortedSet<String> equivalents, SortedSet<String> tags, Optional<Deprecation> deprecation, int depth) {
    }

    private final String source;
    private final SortedMap<String, ClassInfo> classes;
    private final SortedSet<String> tags;

    private BrickVocabulary(String source, SortedMap<String, ClassInfo> classes, SortedSet<String> tags) {
        this.source = source;
        this.classes = Collections.unmodifiableSortedMap(classes);
        this.tags = Collections.unmodifiableSortedSet(tags);
    }

    /** The Brick subset shipped in ontology-extensions ({@link Namespaces#BRICK_SUBSET_RESOURCE}). */
    public static BrickVocabulary bundled() {
        ClassLoader loader = BrickVocabulary.class.getClassLoader();
        try (InputStream in = loader.getResourceAsStream(Namespaces.BRICK_SUBSET_RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("classpath resource missing: " + Namespaces.BRICK_SUBSET_RESOURCE);
            }
            Graph g = GraphFactory.createDefaultGraph();
            RDFParser.source(in).lang(Lang.TURTLE).parse(g);
            return fromGraph("bundled Brick subset", g);
        } catch (IOException e) {
            throw new IllegalStateException("cannot read " + Namespaces.BRICK_SUBSET_RESOURCE, e);
        }
    }

    /** A Brick vocabulary file (Turtle, or any RDF syntax Jena recognises by extension). */
    public static BrickVocabulary load(Path file) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "vocabulary file not found; give the path of a Brick .ttl file");
        }
        if (!Files.isReadable(file)) {
            throw InputException.in(file, "vocabulary file is not readable; check its permissions");
        }
        Graph g = GraphFactory.createDefaultGraph();
        try {
            org.tufa.common.OfflineRdf.offline(RDFParser.source(file)).parse(g);
        } catch (RiotException e) {
            String msg = String.valueOf(e.getMessage()).lines().findFirst().orElse("");
            throw InputException.in(file, "not a readable RDF file (" + msg + "); give a Brick .ttl file");
        }
        BrickVocabulary v = fromGraph(file.toString(), g);
        if (v.classes.isEmpty()) {
            throw InputException.in(file, "holds no Brick classes (owl:Class in " + Namespaces.BRICK
                    + "); give a Brick vocabulary file");
        }
        return v;
    }

    /** Reads classes and tags from a graph holding (part of) the Brick vocabulary. */
    public static BrickVocabulary fromGraph(String source, Graph g) {
        Node brickTag = NodeFactory.createURI(Namespaces.BRICK + "Tag");
        Node hasTag = NodeFactory.createURI(Namespaces.BRICK + "hasAssociatedTag");
        Node replacedBy = NodeFactory.createURI(Namespaces.BRICK + "isReplacedBy");
        Node inVersion = NodeFactory.createURI(Namespaces.BRICK + "deprecatedInVersion");
        Node mitigation = NodeFactory.createURI(Namespaces.BRICK + "deprecationMitigationMessage");

        SortedSet<String> names = new TreeSet<>();
        g.find(Node.ANY, RDF.type.asNode(), OWL2.Class.asNode()).forEach(t -> brickName(t.getSubject())
                .ifPresent(names::add));
        SortedSet<String> tagNames = new TreeSet<>();
        g.find(Node.ANY, RDF.type.asNode(), brickTag).forEach(t -> tagName(t.getSubject()).ifPresent(tagNames::add));
        g.find(Node.ANY, hasTag, Node.ANY).forEach(t -> tagName(t.getObject()).ifPresent(tagNames::add));

        Map<String, SortedSet<String>> parents = new HashMap<>();
        for (String n : names) {
            Node c = brickNode(n);
            SortedSet<String> ps = new TreeSet<>();
            g.find(c, RDFS.subClassOf.asNode(), Node.ANY).forEach(t -> brickName(t.getObject())
                    .filter(names::contains).ifPresent(ps::add));
            parents.put(n, ps);
        }
        SortedMap<String, ClassInfo> infos = new TreeMap<>();
        Map<String, Integer> depthMemo = new HashMap<>();
        for (String n : names) {
            Node c = brickNode(n);
            SortedSet<String> eq = new TreeSet<>();
            g.find(c, OWL2.equivalentClass.asNode(), Node.ANY).forEach(t -> brickName(t.getObject())
                    .filter(names::contains).ifPresent(eq::add));
            g.find(Node.ANY, OWL2.equivalentClass.asNode(), c).forEach(t -> brickName(t.getSubject())
                    .filter(names::contains).ifPresent(eq::add));
            eq.remove(n);
            SortedSet<String> ts = new TreeSet<>();
            g.find(c, hasTag, Node.ANY).forEach(t -> tagName(t.getObject()).ifPresent(ts::add));
            Optional<Deprecation> dep = Optional.empty();
            if (g.contains(c, OWL2.deprecated.asNode(), Node.ANY)
                    && g.find(c, OWL2.deprecated.asNode(), Node.ANY).toList().stream()
                    .anyMatch(t -> t.getObject().isLiteral()
                            && "true".equals(t.getObject().getLiteralLexicalForm()))) {
                dep = Optional.of(new Deprecation(firstIri(g, c, replacedBy), firstLiteral(g, c, inVersion),
                        firstLiteral(g, c, mitigation)));
            }
            infos.put(n, new ClassInfo(n, Collections.unmodifiableSortedSet(parents.get(n)),
                    Collections.unmodifiableSortedSet(ancestors(n, parents)), Collections.unmodifiableSortedSet(eq),
                    Collections.unmodifiableSortedSet(ts), dep, depth(n, parents, depthMemo, new TreeSet<>())));
        }
        return new BrickVocabulary(source, infos, tagNames);
    }

    private static SortedSet<String> ancestors(String n, Map<String, SortedSet<String>> parents) {
        SortedSet<String> seen = new TreeSet<>();
        List<String> stack = new ArrayList<>(parents.get(n));
        while (!stack.isEmpty()) {
            String p = stack.remove(stack.size() - 1);
            if (seen.add(p)) {
                stack.addAll(parents.getOrDefault(p, Collections.emptySortedSet()));
            }
        }
        seen.remove(n);
        return seen;
    }

    /** Longest rdfs:subClassOf chain up to a root; cycles (never in Brick, but possible in a bad file) cut. */
    private static int depth(String n, Map<String, SortedSet<String>> parents, Map<String, Integer> memo,
            SortedSet<String> path) {
        Integer known = memo.get(n);
        if (known != null) {
            return known;
        }
        path.add(n);
        int d = 0;
        for (String p : parents.get(n)) {
            if (!path.contains(p)) {
                d = Math.max(d, 1 + depth(p, parents, memo, path));
            }
        }
        path.remove(n);
        memo.put(n, d);
        return d;
    }

    private static String firstIri(Graph g, Node s, Node p) {
        return g.find(s, p, Node.ANY).toList().stream().map(Triple::getObject).filter(Node::isURI)
                .map(Node::getURI).sorted().findFirst().orElse("");
    }

    private static String firstLiteral(Graph g, Node s, Node p) {
        return g.find(s, p, Node.ANY).toList().stream().map(Triple::getObject).filter(Node::isLiteral)
                .map(Node::getLiteralLexicalForm).sorted().findFirst().orElse("");
    }

    private static Optional<String> brickName(Node n) {
        return n.isURI() && n.getURI().startsWith(Namespaces.BRICK) && n.getURI().length() > Namespaces.BRICK.length()
                && n.getURI().indexOf('/', Namespaces.BRICK.length()) < 0
                ? Optional.of(n.getURI().substring(Namespaces.BRICK.length())) : Optional.empty();
    }

    private static Optional<String> tagName(Node n) {
        return n.isURI() && n.getURI().startsWith(Namespaces.TAG)
                ? Optional.of(n.getURI().substring(Namespaces.TAG.length())) : Optional.empty();
    }

    private static Node brickNode(String name) {
        return NodeFactory.createURI(Namespaces.BRICK + name);
    }

    /** Strips "brick:" or the Brick namespace IRI from a class name. */
    public static String className(String name) {
        if (name.startsWith(Namespaces.BRICK)) {
            return name.substring(Namespaces.BRICK.length());
        }
        return name.startsWith("brick:") ? name.substring(6) : name;
    }

    /** Strips "tag:" or the BrickTag namespace IRI from a tag name. */
    public static String tagName(String name) {
        if (name.startsWith(Namespaces.TAG)) {
            return name.substring(Namespaces.TAG.length());
        }
        return name.startsWith("tag:") ? name.substring(4) : name;
    }

    /** Where this vocabulary was read from (a file path, or "bundled Brick subset"). */
    public String source() {
        return source;
    }

    /** The full IRI of a Brick class name. */
    public static String iri(String className) {
        return Namespaces.BRICK + className(className);
    }

    /** Is this a Brick class (owl:Class in the Brick namespace)? */
    public boolean isClass(String name) {
        return classes.containsKey(className(name));
    }

    /** Everything known about a class; empty when it is not one. */
    public Optional<ClassInfo> info(String name) {
        return Optional.ofNullable(classes.get(className(name)));
    }

    /** All class names, sorted. */
    public SortedSet<String> classNames() {
        return Collections.unmodifiableSortedSet(new TreeSet<>(classes.keySet()));
    }

    /** All tag names, sorted. */
    public SortedSet<String> tagNames() {
        return tags;
    }

    /** rdfs:subClassOf+ (transitive, without the class itself); empty for an unknown class. */
    public SortedSet<String> superclasses(String name) {
        return info(name).map(ClassInfo::ancestors).orElse(Collections.emptySortedSet());
    }

    /** Direct rdfs:subClassOf parents. */
    public SortedSet<String> parents(String name) {
        return info(name).map(ClassInfo::parents).orElse(Collections.emptySortedSet());
    }

    /** owl:equivalentClass partners (both directions). */
    public SortedSet<String> equivalents(String name) {
        return info(name).map(ClassInfo::equivalents).orElse(Collections.emptySortedSet());
    }

    /**
     * rdfs:subClassOf* with equivalence: true when {@code name} is {@code ancestor}, a subclass of it, or of a
     * class equivalent to it (so Discharge_Air_Temperature_Sensor counts as an Air_Temperature_Sensor).
     */
    public boolean isA(String name, String ancestor) {
        String n = className(name);
        String a = className(ancestor);
        if (n.equals(a) || superclasses(n).contains(a) || equivalents(n).contains(a)) {
            return true;
        }
        for (String e : equivalents(n)) {
            if (superclasses(e).contains(a)) {
                return true;
            }
        }
        return false;
    }

    /** Are the two names the same class or declared owl:equivalentClass? */
    public boolean sameClass(String a, String b) {
        return className(a).equals(className(b)) || equivalents(a).contains(className(b));
    }

    /** brick:hasAssociatedTag of the class itself (not inherited, as Brick states them). */
    public SortedSet<String> associatedTags(String name) {
        return info(name).map(ClassInfo::tags).orElse(Collections.emptySortedSet());
    }

    /** Is this a Brick tag? Case-sensitive, as in Brick ("Temperature"). */
    public boolean isTag(String name) {
        return tags.contains(tagName(name));
    }

    /** The tag with this name ignoring case ("temp" finds nothing, "TEMPERATURE" finds "Temperature"). */
    public Optional<String> tagIgnoringCase(String name) {
        String t = tagName(name);
        for (String tag : tags) {
            if (tag.equalsIgnoreCase(t)) {
                return Optional.of(tag);
            }
        }
        return Optional.empty();
    }

    /** owl:deprecated true classes: the replacement and message; empty for current (or unknown) classes. */
    public Optional<Deprecation> deprecation(String name) {
        return info(name).flatMap(ClassInfo::deprecation);
    }

    /** Longest rdfs:subClassOf chain to a root class (0 for a root); a proxy for specificity. */
    public int depth(String name) {
        return info(name).map(ClassInfo::depth).orElse(0);
    }

    /** Up to 3 existing class names nearest to an unknown one (see {@link NameSuggester}). */
    public List<String> nearestClasses(String unknown) {
        return NameSuggester.nearestAlways(className(unknown), classes.keySet(), 3);
    }

    /** Up to 3 existing tag names nearest to an unknown one. */
    public List<String> nearestTags(String unknown) {
        return NameSuggester.nearestAlways(tagName(unknown), tags, 3);
    }

    /** "unknown Brick class X; nearest: A, B, C" style hint, for error messages. */
    public String unknownClassMessage(String unknown) {
        List<String> near = nearestClasses(unknown);
        return "unknown Brick class '" + className(unknown) + "' in " + source
                + (near.isEmpty() ? "" : "; nearest: " + String.join(", ", near));
    }

    /** "unknown Brick tag X; nearest: ..." hint, for error messages. */
    public String unknownTagMessage(String unknown) {
        List<String> near = nearestTags(unknown);
        return "unknown Brick tag '" + tagName(unknown) + "' in " + source
                + (near.isEmpty() ? "" : "; nearest: " + String.join(", ", near));
    }
}
