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

    /** Assesses with tufa's shipped vocabulary (Brick 1.4.4 and tufa.ttl) and one profile. */
    public static FleetCoverage assess(Model model, Profile profile, Set<String> unitClasses) {
        return assess(model, Vocabulary.standard(), profile, unitClasses);
    }

    /**
     * Assesses every terminal unit of the model for one profile asked for by name: the units it applies to get it,
     * the others are listed without a profile.
     */
    public static FleetCoverage assess(Model model, Vocabulary vocabulary, Profile profile, Set<String> unitClasses) {
        return assess(model, vocabulary, List.of(profile), false, unitClasses);
    }

    /** Assesses every terminal unit of the model, each with the best fitting of the vocabulary's automatic profiles. */
    public static FleetCoverage assess(Model model, Vocabulary vocabulary, Set<String> unitClasses) {
        return assess(model, vocabulary, vocabulary.profiles().automatic(), true, unitClasses);
    }

    /**
     * Assesses every terminal unit of the model, each with the best fitting profile among the candidates.
     *
     * <p>A profile applies to a unit when the unit is an instance of one of its tufa:appliesTo classes (subclasses
     * and equivalent classes included; a profile without tufa:appliesTo applies to every unit). Among those that
     * apply, a profile that declares evidence (tufa:evidenceRole, tufa:evidenceClass) fits only when at least one
     * piece is present; the unit gets the fitting profile of highest tufa:specificity, then with the most evidence
     * roles found, then the most evidence classes matched (the unit's own classes and those of its parts), then the
     * first by name. A tie is noted among the unit's problems, so the model author can add the class that tells
     * them apart.
     *
     * @param model the Brick model (not modified)
     * @param vocabulary class hierarchy the lookups reason with
     * @param candidates the profiles to choose from
     * @param automatic whether the candidates are the automatic ones (reported in the summary)
     * @param unitClasses IRIs of the unit classes to include (subclasses too); empty means brick:Terminal_Unit
     * @throws InputException when a terminal unit is a blank node (it cannot be named in a report)
     */
    public static FleetCoverage assess(Model model, Vocabulary vocabulary, List<Profile> candidates,
            boolean automatic, Set<String> unitClasses) {
        Model all = vocabulary.unionWith(model);
        Set<String> classes = new TreeSet<>(unitClasses.isEmpty() ? Set.of(TERMINAL_UNIT) : unitClasses);
        Map<String, Set<String>> unitTypes = findUnits(all, classes);
        PointDetails details = new PointDetails(all);
        LookupRunner runner = new LookupRunner(all, unitTypes.keySet(), details);
        List<Profile> profiles = new ArrayList<>(candidates);
        profiles.sort(java.util.Comparator.comparing(Profile::name));

        // One run per distinct lookup; the map is a cache only, results are read by key.
        Map<Lookup, Map<String, LookupRunner.Hits>> results = new HashMap<>();
        Map<String, Role> roles = new TreeMap<>();
        for (Profile profile : profiles) {
            for (Role role : profile.roles()) {
                roles.putIfAbsent(role.name(), role);
                for (Lookup lookup : role.lookups()) {
                    results.computeIfAbsent(lookup, runner::run);
                }
            }
        }
        Map<String, Set<String>> appliesTo = new HashMap<>();
        Map<String, Set<String>> evidenceClosures = new HashMap<>();
        for (Profile profile : profiles) {
            appliesTo.put(profile.name(), Sparql.subclassClosure(all, profile.appliesTo()));
            for (String c : profile.evidenceClasses()) {
                evidenceClosures.computeIfAbsent(c, k -> Sparql.subclassClosure(all, List.of(k)));
            }
        }
        Map<String, String> mostSpecific = mostSpecificClasses(all, unitTypes);
        List<UnitCoverage> out = new ArrayList<>();
        for (Map.Entry<String, Set<String>> entry : unitTypes.entrySet()) {
            String unit = entry.getKey();
            Map<String, RoleMatch> matches = new TreeMap<>();
            roles.forEach((name, role) -> matches.put(name, match(role, unit, results)));
            Set<String> withParts = new TreeSet<>(entry.getValue());
            runner.partsOf(unit).forEach(part -> withParts.addAll(details.types(part)));
            List<String> problems = new ArrayList<>();
            Optional<Profile> chosen = choose(profiles, entry.getValue(), withParts, matches, appliesTo,
                    evidenceClosures, problems);
            Map<String, RoleMatch> unitRoles = new LinkedHashMap<>();
            Map<String, Boolean> modes = new TreeMap<>();
            chosen.ifPresent(p -> {
                p.roles().forEach(r -> unitRoles.put(r.name(), matches.get(r.name())));
                for (ModeRequirement mode : p.modes()) {
                    modes.put(mode.name(), mode.required().stream().allMatch(r -> r.metBy(
                            role -> matches.get(role).found())));
                }
            });
            Optional<NominalAirflow> airflow = nominalAirflow(all, unit, problems);
            String label = details.label(unit);
            out.add(new UnitCoverage(unit, label == null ? "" : label, mostSpecific.get(unit), chosen, unitRoles,
                    airflow, modes, problems));
        }
        return new FleetCoverage(profiles, automatic, List.copyOf(classes), out,
                undeclaredBrickClasses(model, all), vocabulary.hasFullBrick());
    }

    /** The profile for one unit (see {@link #assess(Model, Vocabulary, List, boolean, Set)}), or empty. */
    private static Optional<Profile> choose(List<Profile> profiles, Set<String> unitTypes, Set<String> withParts,
            Map<String, RoleMatch> matches, Map<String, Set<String>> appliesTo,
            Map<String, Set<String>> evidenceClosures, List<String> problems) {
        Profile best = null;
        int[] bestScore = null;
        List<Profile> tied = new ArrayList<>();
        for (Profile p : profiles) {
            if (!p.appliesTo().isEmpty() && java.util.Collections.disjoint(unitTypes, appliesTo.get(p.name()))) {
                continue;
            }
            int roleEvidence = (int) p.evidenceRoles().stream()
                    .filter(r -> matches.get(r).status() != MatchStatus.MISSING).count();
            int classEvidence = (int) p.evidenceClasses().stream()
                    .filter(c -> !java.util.Collections.disjoint(withParts, evidenceClosures.get(c))).count();
            boolean declaresEvidence = !p.evidenceRoles().isEmpty() || !p.evidenceClasses().isEmpty();
            if (declaresEvidence && roleEvidence + classEvidence == 0) {
                continue;
            }
            int[] score = {p.specificity(), roleEvidence, classEvidence};
            int cmp = bestScore == null ? 1 : java.util.Arrays.compare(score, bestScore);
            if (cmp > 0) {
                best = p;
                bestScore = score;
                tied.clear();
                tied.add(p);
            } else if (cmp == 0) {
                tied.add(p); // profiles come sorted by name: the first stays the choice
            }
        }
        if (tied.size() > 1) {
            problems.add("profiles " + String.join(", ", tied.stream().map(Profile::name).toList())
                    + " fit equally well; " + best.name() + " was chosen (first by name); give the unit a class "
                    + "that tells them apart (one of their tufa:evidenceClass)");
        }
        return Optional.ofNullable(best);
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
