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
import org.apache.jena.riot.RDFParser;
import org.apache.jena.riot.RiotException;
import org.apache.jena.sparql.graph.GraphFactory;
import org.apache.jena.vocabulary.OWL2;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;
import org.tufa.common.InputException;

/**
 * The Brick classes and tags tufa knows, read once and then immutable (safe to share between threads). Names are
 * Brick local names ("Zone_Air_Temperature_Sensor", tag "Temperature"); every method also accepts "brick:X" /
 * "tag:X" and full IRIs.
 *
 * <p>{@link #bundled()} reads the complete Brick 1.4.4 vocabulary tufa ships as a compact index
 * ({@link VocabularyIndex}, made from the published Brick file by {@link BundleBrick}); {@link #load(Path)} reads
 * any Brick release in RDF. Location classes that Brick 1.4 deprecated in favour of RealEstateCore classes
 * (Floor -> rec:Level, Room -> rec:Room, HVAC_Zone -> rec:HVACZone) are known by those replacements too, so a rule
 * file can write them ({@link #isReplacementClass}).
 */
public final class BrickVocabulary {

    /** A literal as Brick states it: text and language tag ("" when none). */
    public record Text(String lexical, String language) {
        /** No text. */
        public static final Text NONE = new Text("", "");

        public boolean isEmpty() {
            return lexical.isEmpty();
        }
    }

    /** What the Brick file says about one class. */
    public record ClassInfo(String name, SortedSet<String> parents, SortedSet<String> ancestors,
            SortedSet<String> equivalents, SortedSet<String> tags, Optional<Deprecation> deprecation, int depth,
            Text label, Text definition) {
    }

    /** A Brick or Brick-ref property or reference class (brick:hasPoint, ref:hasTimeseriesId): for the RDF view. */
    public record Term(String iri, SortedSet<String> types, String inverse, Text label, Text definition) {
    }

    /** The class facts as read, before ancestors and depths are derived. */
    record RawClass(String name, SortedSet<String> parents, SortedSet<String> equivalents, SortedSet<String> tags,
            Optional<Deprecation> deprecation, Text label, Text definition) {
    }

    private final String source;
    private final String version;
    private final String ontologyIri;
    private final SortedMap<String, ClassInfo> classes;
    private final SortedSet<String> tags;
    private final Map<String, String> tagsByLowerCase;
    private final SortedMap<String, Term> terms;
    private final SortedMap<String, SortedSet<String>> unitQuantities;
    private final SortedSet<String> replacementClasses;

    BrickVocabulary(String source, String version, String ontologyIri, List<RawClass> raw, SortedSet<String> tags,
            SortedMap<String, Term> terms, SortedMap<String, SortedSet<String>> unitQuantities) {
        this.source = source;
        this.version = version;
        this.ontologyIri = ontologyIri;
        Map<String, SortedSet<String>> parents = new HashMap<>();
        for (RawClass r : raw) {
            parents.put(r.name(), r.parents());
        }
        SortedMap<String, ClassInfo> infos = new TreeMap<>();
        Map<String, Integer> depthMemo = new HashMap<>();
        SortedSet<String> replacements = new TreeSet<>();
        for (RawClass r : raw) {
            SortedSet<String> ps = new TreeSet<>(r.parents());
            ps.retainAll(parents.keySet());
            infos.put(r.name(), new ClassInfo(r.name(), Collections.unmodifiableSortedSet(ps),
                    Collections.unmodifiableSortedSet(ancestors(r.name(), parents)),
                    Collections.unmodifiableSortedSet(new TreeSet<>(r.equivalents())),
                    Collections.unmodifiableSortedSet(new TreeSet<>(r.tags())), r.deprecation(),
                    depth(r.name(), parents, depthMemo, new TreeSet<>()), r.label(), r.definition()));
            r.deprecation().map(Deprecation::replacementIri).filter(i -> !i.isEmpty() && !i.startsWith(Namespaces.BRICK))
                    .flatMap(Namespaces::compact).ifPresent(replacements::add);
        }
        this.classes = Collections.unmodifiableSortedMap(infos);
        this.tags = Collections.unmodifiableSortedSet(new TreeSet<>(tags));
        Map<String, String> lower = new HashMap<>();
        for (String t : this.tags) {
            lower.putIfAbsent(t.toLowerCase(java.util.Locale.ROOT), t);
        }
        this.tagsByLowerCase = lower;
        this.terms = Collections.unmodifiableSortedMap(new TreeMap<>(terms));
        this.unitQuantities = Collections.unmodifiableSortedMap(new TreeMap<>(unitQuantities));
        this.replacementClasses = Collections.unmodifiableSortedSet(replacements);
    }

    /** The Brick vocabulary shipped in ontology-extensions ({@link Namespaces#BRICK_INDEX_RESOURCE}). */
    public static BrickVocabulary bundled() {
        ClassLoader loader = BrickVocabulary.class.getClassLoader();
        try (InputStream in = loader.getResourceAsStream(Namespaces.BRICK_INDEX_RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("classpath resource missing: " + Namespaces.BRICK_INDEX_RESOURCE);
            }
            return VocabularyIndex.read(in, "bundled Brick");
        } catch (IOException e) {
            throw new IllegalStateException("cannot read " + Namespaces.BRICK_INDEX_RESOURCE, e);
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

    /** Reads classes, tags, properties and units from a graph holding (part of) the Brick vocabulary. */
    public static BrickVocabulary fromGraph(String source, Graph g) {
        Node brickTag = NodeFactory.createURI(Namespaces.BRICK + "Tag");
        Node hasTag = NodeFactory.createURI(Namespaces.BRICK + "hasAssociatedTag");
        Node replacedBy = NodeFactory.createURI(Namespaces.BRICK + "isReplacedBy");
        Node inVersion = NodeFactory.createURI(Namespaces.BRICK + "deprecatedInVersion");
        Node mitigation = NodeFactory.createURI(Namespaces.BRICK + "deprecationMitigationMessage");
        Node definition = NodeFactory.createURI(Namespaces.SKOS + "definition");

        SortedSet<String> names = new TreeSet<>();
        g.find(Node.ANY, RDF.type.asNode(), OWL2.Class.asNode()).forEach(t -> brickName(t.getSubject())
                .ifPresent(names::add));
        SortedSet<String> tagNames = new TreeSet<>();
        g.find(Node.ANY, RDF.type.asNode(), brickTag).forEach(t -> tagName(t.getSubject()).ifPresent(tagNames::add));
        g.find(Node.ANY, hasTag, Node.ANY).forEach(t -> tagName(t.getObject()).ifPresent(tagNames::add));

        List<RawClass> raw = new ArrayList<>();
        for (String n : names) {
            Node c = brickNode(n);
            SortedSet<String> ps = new TreeSet<>();
            g.find(c, RDFS.subClassOf.asNode(), Node.ANY).forEach(t -> brickName(t.getObject())
                    .filter(names::contains).ifPresent(ps::add));
            SortedSet<String> eq = new TreeSet<>();
            g.find(c, OWL2.equivalentClass.asNode(), Node.ANY).forEach(t -> brickName(t.getObject())
                    .filter(names::contains).ifPresent(eq::add));
            g.find(Node.ANY, OWL2.equivalentClass.asNode(), c).forEach(t -> brickName(t.getSubject())
                    .filter(names::contains).ifPresent(eq::add));
            eq.remove(n);
            SortedSet<String> ts = new TreeSet<>();
            g.find(c, hasTag, Node.ANY).forEach(t -> tagName(t.getObject()).ifPresent(ts::add));
            Optional<Deprecation> dep = Optional.empty();
            if (g.find(c, OWL2.deprecated.asNode(), Node.ANY).toList().stream()
                    .anyMatch(t -> t.getObject().isLiteral() && "true".equals(t.getObject().getLiteralLexicalForm()))) {
                dep = Optional.of(new Deprecation(firstIri(g, c, replacedBy), firstLiteral(g, c, inVersion).lexical(),
                        firstLiteral(g, c, mitigation).lexical()));
            }
            raw.add(new RawClass(n, ps, eq, ts, dep, firstLiteral(g, c, RDFS.label.asNode()),
                    firstLiteral(g, c, definition)));
        }

        SortedMap<String, Term> terms = new TreeMap<>();
        for (Node type : List.of(OWL2.ObjectProperty.asNode(), OWL2.DatatypeProperty.asNode(), OWL2.Class.asNode())) {
            g.find(Node.ANY, RDF.type.asNode(), type).forEach(t -> {
                Node s = t.getSubject();
                boolean property = !type.equals(OWL2.Class.asNode());
                if (s.isURI() && (s.getURI().startsWith(Namespaces.REF)
                        || property && s.getURI().startsWith(Namespaces.BRICK))) {
                    SortedSet<String> types = new TreeSet<>();
                    g.find(s, RDF.type.asNode(), Node.ANY).forEach(x -> {
                        if (x.getObject().isURI()) {
                            types.add(x.getObject().getURI());
                        }
                    });
                    terms.put(s.getURI(), new Term(s.getURI(), Collections.unmodifiableSortedSet(types),
                            firstIri(g, s, OWL2.inverseOf.asNode()), firstLiteral(g, s, RDFS.label.asNode()),
                            firstLiteral(g, s, definition)));
                }
            });
        }

        SortedMap<String, SortedSet<String>> units = new TreeMap<>();
        Node quantity = NodeFactory.createURI(Namespaces.BRICK + "Quantity");
        Node applicableUnit = NodeFactory.createURI(Namespaces.QUDT + "applicableUnit");
        g.find(Node.ANY, RDF.type.asNode(), quantity).forEach(t -> brickName(t.getSubject()).ifPresent(q ->
                g.find(t.getSubject(), applicableUnit, Node.ANY).forEach(u -> {
                    if (u.getObject().isURI() && u.getObject().getURI().startsWith(Namespaces.UNIT)
                            && u.getObject().getURI().length() > Namespaces.UNIT.length()) {
                        units.computeIfAbsent(u.getObject().getURI().substring(Namespaces.UNIT.length()),
                                k -> new TreeSet<>()).add(q);
                    }
                })));

        String version = g.find(Node.ANY, OWL2.versionInfo.asNode(), Node.ANY).toList().stream()
                .filter(t -> t.getSubject().isURI() && t.getSubject().getURI().startsWith("https://brickschema.org/"))
                .map(t -> t.getObject().isLiteral() ? t.getObject().getLiteralLexicalForm() : "")
                .sorted().findFirst().orElse("");
        String ontology = g.find(Node.ANY, RDF.type.asNode(), OWL2.Ontology.asNode()).toList().stream()
                .map(Triple::getSubject).filter(s -> s.isURI() && s.getURI().startsWith("https://brickschema.org/"))
                .map(Node::getURI).sorted().findFirst().orElse("");
        return new BrickVocabulary(source, version, ontology, raw, tagNames, terms, units);
    }

    private static SortedSet<String> ancestors(String n, Map<String, SortedSet<String>> parents) {
        SortedSet<String> seen = new TreeSet<>();
        List<String> stack = new ArrayList<>(parents.get(n));
        while (!stack.isEmpty()) {
            String p = stack.remove(stack.size() - 1);
            if (parents.containsKey(p) && seen.add(p)) {
                stack.addAll(parents.get(p));
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
            if (parents.containsKey(p) && !path.contains(p)) {
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

    private static Text firstLiteral(Graph g, Node s, Node p) {
        return g.find(s, p, Node.ANY).toList().stream().map(Triple::getObject).filter(Node::isLiteral)
                .map(o -> new Text(o.getLiteralLexicalForm(), o.getLiteralLanguage()))
                .sorted(java.util.Comparator.comparing(Text::lexical).thenComparing(Text::language))
                .findFirst().orElse(Text.NONE);
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

    /** Strips "brick:" or the Brick namespace IRI from a class name; "rec:X" and other prefixes stay. */
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

    /** Where this vocabulary was read from (a file path, or "bundled Brick"), with the version when known. */
    public String source() {
        return version.isEmpty() ? source : source + " " + version;
    }

    /** The owl:Ontology the Brick file declares (https://brickschema.org/schema/1.4/Brick), or "". */
    public String ontologyIri() {
        return ontologyIri;
    }

    /** The Brick release (owl:versionInfo), or "" when the file does not say. */
    public String version() {
        return version;
    }

    /** The full IRI of a class name: a Brick local name, "brick:X", "rec:X" or a full IRI. */
    public static String iri(String className) {
        if (className.contains("://")) {
            return className;
        }
        int colon = className.indexOf(':');
        if (colon > 0) {
            Optional<String> ns = Namespaces.expand(className.substring(0, colon));
            if (ns.isPresent()) {
                return ns.get() + className.substring(colon + 1);
            }
        }
        return Namespaces.BRICK + className(className);
    }

    /** Is this a Brick class (owl:Class in the Brick namespace)? */
    public boolean isClass(String name) {
        return classes.containsKey(className(name));
    }

    /**
     * Is this a class outside Brick that Brick names as the replacement of a deprecated class ("rec:Level" for
     * Floor, "rec:HVACZone" for HVAC_Zone)? Written as prefix:name or as a full IRI.
     */
    public boolean isReplacementClass(String name) {
        return replacementClasses.contains(name) || Namespaces.compact(name).map(replacementClasses::contains)
                .orElse(false);
    }

    /** The compact names ("rec:Level", ...) of the non-Brick classes Brick names as replacements. */
    public SortedSet<String> replacementClasses() {
        return replacementClasses;
    }

    /** Everything known about a class; empty when it is not one. */
    public Optional<ClassInfo> info(String name) {
        return Optional.ofNullable(classes.get(className(name)));
    }

    /** All class names, sorted. */
    public SortedSet<String> classNames() {
        return Collections.unmodifiableSortedSet(new TreeSet<>(classes.keySet()));
    }

    /** Every class, by name (sorted). */
    public SortedMap<String, ClassInfo> classes() {
        return classes;
    }

    /** All tag names, sorted. */
    public SortedSet<String> tagNames() {
        return tags;
    }

    /** Brick and Brick-ref properties and reference classes, by IRI. */
    public SortedMap<String, Term> terms() {
        return terms;
    }

    /** QUDT units (local names) that Brick lists as applicable to its quantities, with those quantities. */
    public SortedMap<String, SortedSet<String>> unitQuantities() {
        return unitQuantities;
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
        for (String e : equivalents(a)) {
            if (superclasses(n).contains(e)) {
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
        return Optional.ofNullable(tagsByLowerCase.get(tagName(name).toLowerCase(java.util.Locale.ROOT)));
    }

    /** owl:deprecated true classes: the replacement and message; empty for current (or unknown) classes. */
    public Optional<Deprecation> deprecation(String name) {
        return info(name).flatMap(ClassInfo::deprecation);
    }

    /**
     * The current class for a name: the name itself when it is current, else the end of its brick:isReplacedBy
     * chain when that is a current Brick class (Zone_Air_Temperature_Setpoint -> Target_Zone_Air_Temperature_Setpoint);
     * empty when the name is no Brick class or its replacement lies outside Brick.
     */
    public Optional<String> current(String name) {
        String n = className(name);
        for (int hops = 0; hops < 10; hops++) {
            Optional<ClassInfo> info = info(n);
            if (info.isEmpty()) {
                return Optional.empty();
            }
            if (info.get().deprecation().isEmpty()) {
                return Optional.of(n);
            }
            String r = info.get().deprecation().get().replacementIri();
            if (!r.startsWith(Namespaces.BRICK)) {
                return Optional.empty();
            }
            n = r.substring(Namespaces.BRICK.length());
        }
        return Optional.empty();
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
        return "unknown Brick class '" + className(unknown) + "' in " + source()
                + (near.isEmpty() ? "" : "; nearest: " + String.join(", ", near));
    }

    /** "unknown Brick tag X; nearest: ..." hint, for error messages. */
    public String unknownTagMessage(String unknown) {
        List<String> near = nearestTags(unknown);
        return "unknown Brick tag '" + tagName(unknown) + "' in " + source()
                + (near.isEmpty() ? "" : "; nearest: " + String.join(", ", near));
    }
}
