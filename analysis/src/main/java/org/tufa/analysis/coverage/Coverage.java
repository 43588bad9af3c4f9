package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import org.apache.jena.query.QuerySolution;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.Property;
import org.apache.jena.rdf.model.RDFNode;
import org.apache.jena.rdf.model.Resource;
import org.apache.jena.rdf.model.Statement;
import org.tufa.common.InputException;
import org.tufa.vocabulary.Namespaces;

/**
 * Finds the terminal units of a Brick model and, per unit, the point for each role a requirement profile names.
 *
 * <p>Terminal units are the instances of brick:Terminal_Unit or its subclasses (or of the classes asked for). Each
 * role is looked up with one SPARQL query per {@link Lookup} over all units (see {@link LookupRunner}); the first
 * lookup that finds points decides: one point is found, several are ambiguous.
 */
public final class Coverage {
    /** brick:Terminal_Unit: the default unit class. */
    public static final String TERMINAL_UNIT = Namespaces.BRICK + "Terminal_Unit";

    private static final String UNITS = """
            SELECT ?unit ?type WHERE {
              VALUES ?type { }
              ?unit rdf:type ?type .
            }""";

    private Coverage() {
    }

    /** Assesses with tufa's shipped vocabulary (Brick 1.4.4 and tufa.ttl). */
    public static FleetCoverage assess(Model model, Profile profile, Set<String> unitClasses) {
        return assess(model, Vocabulary.standard(), profile, unitClasses);
    }

    /**
     * Assesses every terminal unit of the model for the profile.
     *
     * @param model the Brick model (not modified)
     * @param vocabulary class hierarchy the lookups reason with
     * @param profile what to look for
     * @param unitClasses IRIs of the unit classes to include (subclasses too); empty means brick:Terminal_Unit
     * @throws InputException when a terminal unit is a blank node (it cannot be named in a report)
     */
    public static FleetCoverage assess(Model model, Vocabulary vocabulary, Profile profile, Set<String> unitClasses) {
        Model all = vocabulary.unionWith(model);
        Set<String> classes = new TreeSet<>(unitClasses.isEmpty() ? Set.of(TERMINAL_UNIT) : unitClasses);
        Map<String, Set<String>> unitTypes = findUnits(all, classes);
        PointDetails details = new PointDetails(all);
        LookupRunner runner = new LookupRunner(all, unitTypes.keySet(), details);

        // One run per distinct lookup; the map is a cache only, results are read by key.
        Map<Lookup, Map<String, LookupRunner.Hits>> results = new HashMap<>();
        for (Role role : profile.roles()) {
            for (Lookup lookup : role.lookups()) {
                results.computeIfAbsent(lookup, runner::run);
            }
        }
        Map<String, String> mostSpecific = mostSpecificClasses(all, unitTypes);
        List<UnitCoverage> out = new ArrayList<>();
        for (String unit : unitTypes.keySet()) {
            Map<String, RoleMatch> roles = new LinkedHashMap<>();
            for (Role role : profile.roles()) {
                roles.put(role.name(), match(role, unit, results));
            }
            Map<String, Boolean> modes = new TreeMap<>();
            for (ModeRequirement mode : profile.modes()) {
                modes.put(mode.name(), mode.required().stream().allMatch(r -> roles.get(r).found()));
            }
            List<String> problems = new ArrayList<>();
            Optional<NominalAirflow> airflow = nominalAirflow(all, unit, problems);
            String label = details.label(unit);
            out.add(new UnitCoverage(unit, label == null ? "" : label, mostSpecific.get(unit), roles, airflow, modes,
                    problems));
        }
        return new FleetCoverage(profile, List.copyOf(classes), out, undeclaredBrickClasses(model, all));
    }

    private static RoleMatch match(Role role, String unit, Map<Lookup, Map<String, LookupRunner.Hits>> results) {
        Set<PointRef> untagged = new java.util.LinkedHashSet<>();
        for (Lookup lookup : role.lookups()) {
            LookupRunner.Hits hits = results.get(lookup).get(unit);
            if (hits == null) {
                continue;
            }
            untagged.addAll(hits.untagged());
            if (!hits.qualified().isEmpty()) {
                return RoleMatch.decide(role.name(), lookup.place(), hits.qualified());
            }
        }
        List<PointRef> hints = new ArrayList<>(untagged);
        hints.sort(java.util.Comparator.comparing(PointRef::iri));
        return RoleMatch.missing(role.name(), hints);
    }

    /** Brick classes the data model uses that neither it nor the vocabulary declares, with instance counts. */
    static Map<String, Integer> undeclaredBrickClasses(Model data, Model all) {
        Map<String, Set<String>> instances = new TreeMap<>();
        data.listStatements(null, org.apache.jena.vocabulary.RDF.type, (RDFNode) null).forEachRemaining(s -> {
            RDFNode c = s.getObject();
            if (c.isURIResource() && c.asResource().getURI().startsWith(Namespaces.BRICK)
                    && !all.contains(c.asResource(), org.apache.jena.vocabulary.RDF.type,
                            org.apache.jena.vocabulary.OWL.Class)) {
                instances.computeIfAbsent(c.asResource().getURI(), k -> new TreeSet<>()).add(s.getSubject().toString());
            }
        });
        Map<String, Integer> out = new TreeMap<>();
        instances.forEach((c, xs) -> out.put(c, xs.size()));
        return out;
    }

    /** Units (IRI, sorted) with their asserted types that fall under the given classes. */
    static Map<String, Set<String>> findUnits(Model all, Set<String> unitClasses) {
        Set<String> closure = Sparql.subclassClosure(all, unitClasses);
        Map<String, Set<String>> units = new TreeMap<>();
        for (QuerySolution row : Sparql.select(all, Sparql.build(UNITS, Map.of("type", closure)))) {
            RDFNode unit = row.get("unit");
            if (!unit.isURIResource()) {
                throw new InputException("model: a terminal unit of class <" + row.getResource("type").getURI()
                        + "> has no IRI (blank node); give every unit an IRI so reports can name it");
            }
            units.computeIfAbsent(unit.asResource().getURI(), k -> new TreeSet<>()).add(row.getResource("type").getURI());
        }
        return units;
    }

    /**
     * For each unit the most specific of its matching classes: a class that is not an ancestor of another of the
     * unit's classes (equivalent classes do not hide each other); the smallest IRI among several.
     */
    private static Map<String, String> mostSpecificClasses(Model all, Map<String, Set<String>> unitTypes) {
        Map<String, Set<String>> ancestors = new TreeMap<>();
        unitTypes.values().forEach(types -> types.forEach(
                t -> ancestors.computeIfAbsent(t, k -> Sparql.superclassClosure(all, List.of(k)))));
        Map<String, String> out = new TreeMap<>();
        unitTypes.forEach((unit, types) -> {
            String best = null;
            for (String t : types) {
                boolean hidden = types.stream().anyMatch(s -> !s.equals(t) && ancestors.get(s).contains(t)
                        && !ancestors.get(t).contains(s));
                if (!hidden && (best == null || t.compareTo(best) < 0)) {
                    best = t;
                }
            }
            out.put(unit, best);
        });
        return out;
    }

    private static Optional<NominalAirflow> nominalAirflow(Model all, String unit, List<String> problems) {
        Property nominal = all.createProperty(Namespaces.TUFA, "nominalAirflow");
        Property value = all.createProperty(Namespaces.BRICK, "value");
        Property hasUnit = all.createProperty(Namespaces.BRICK, "hasUnit");
        Set<NominalAirflow> found = new TreeSet<>(java.util.Comparator.comparingDouble(NominalAirflow::cubicMetresPerSecond)
                .thenComparing(NominalAirflow::unitIri).thenComparingDouble(NominalAirflow::value));
        for (Statement s : all.listStatements(all.createResource(unit), nominal, (RDFNode) null).toList()) {
            if (!s.getObject().isResource()) {
                problems.add("tufa:nominalAirflow must be a node [ brick:value V ; brick:hasUnit U ], not a literal");
                continue;
            }
            Resource node = s.getResource();
            Statement v = node.getProperty(value);
            Statement u = node.getProperty(hasUnit);
            if (v == null || !v.getObject().isLiteral() || u == null || !u.getObject().isURIResource()) {
                problems.add("tufa:nominalAirflow needs brick:value (a number) and brick:hasUnit (a unit IRI)");
                continue;
            }
            double number;
            try {
                number = Double.parseDouble(v.getLiteral().getLexicalForm().strip());
            } catch (NumberFormatException e) {
                problems.add("tufa:nominalAirflow value '" + v.getLiteral().getLexicalForm() + "' is not a number");
                continue;
            }
            String unitIri = u.getResource().getURI();
            OptionalDouble factor = AirflowUnits.toCubicMetresPerSecond(unitIri);
            if (factor.isEmpty()) {
                problems.add("tufa:nominalAirflow unit <" + unitIri + "> is not a volume-flow unit tufa knows; use one of "
                        + AirflowUnits.known());
                continue;
            }
            if (!(number > 0) || Double.isInfinite(number)) {
                problems.add("tufa:nominalAirflow value " + number + " must be positive");
                continue;
            }
            found.add(new NominalAirflow(number, unitIri, number * factor.getAsDouble()));
        }
        if (found.size() > 1) {
            problems.add("tufa:nominalAirflow is given " + found.size() + " times with different values; keep one");
            return Optional.empty();
        }
        return found.stream().findFirst();
    }
}
