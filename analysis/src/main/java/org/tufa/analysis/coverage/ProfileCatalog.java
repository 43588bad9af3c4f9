package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.apache.jena.rdf.model.Literal;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.Property;
import org.apache.jena.rdf.model.RDFList;
import org.apache.jena.rdf.model.RDFNode;
import org.apache.jena.rdf.model.Resource;
import org.apache.jena.rdf.model.Statement;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;
import org.tufa.common.InputException;
import org.tufa.vocabulary.Namespaces;

/**
 * The roles and requirement profiles defined in the vocabulary (tufa.ttl plus user files), read from RDF.
 *
 * <p>Why our own small vocabulary rather than SHACL shapes: a role needs an ordered list of places to look, a
 * winner per place and an "ambiguous" outcome when two points qualify; a profile needs "all required roles of at
 * least one mode". A SHACL report says which shape failed, not which point was chosen, and would need the extra
 * jena-shacl library. The terms are documented in tufa.ttl.
 */
public final class ProfileCatalog {
    /** The fan coil profile the automatic choice gives every fan coil unit (benchmarks and tests name it). */
    public static final String DEFAULT_PROFILE = "fcu-modes";

    private final Map<String, Role> roles;
    private final Map<String, Profile> profiles;

    private ProfileCatalog(Map<String, Role> roles, Map<String, Profile> profiles) {
        this.roles = roles;
        this.profiles = profiles;
    }

    /** Reads every tufa:Role, tufa:RoleChoice and tufa:Profile in the model. */
    public static ProfileCatalog from(Model vocabulary) {
        Map<String, Role> rolesByIri = new TreeMap<>();
        Map<String, Role> rolesByName = new TreeMap<>();
        for (Resource r : vocabulary.listSubjectsWithProperty(RDF.type, tufa(vocabulary, "Role")).toList()) {
            Role role = readRole(vocabulary, r);
            Role clash = rolesByName.put(role.name(), role);
            if (clash != null) {
                throw new InputException("vocabulary: role name '" + role.name() + "' is used by both <" + clash.iri()
                        + "> and <" + role.iri() + ">; give each role its own tufa:roleName");
            }
            rolesByIri.put(role.iri(), role);
        }
        Map<String, Choice> choicesByIri = new TreeMap<>();
        Map<String, String> choiceNames = new TreeMap<>();
        for (Resource c : vocabulary.listSubjectsWithProperty(RDF.type, tufa(vocabulary, "RoleChoice")).toList()) {
            Choice choice = readChoice(vocabulary, c, rolesByIri);
            String name = choice.requirement().name();
            if (rolesByName.containsKey(name) || choiceNames.put(name, choice.iri()) != null) {
                throw new InputException("vocabulary: choice name '" + name + "' of " + describe(c)
                        + " is already a role or choice name; give each tufa:RoleChoice its own tufa:choiceName");
            }
            choicesByIri.put(choice.iri(), choice);
        }
        Map<String, Profile> profiles = new TreeMap<>();
        for (Resource p : vocabulary.listSubjectsWithProperty(RDF.type, tufa(vocabulary, "Profile")).toList()) {
            Profile profile = readProfile(vocabulary, p, rolesByIri, choicesByIri);
            if (profiles.put(profile.name(), profile) != null) {
                throw new InputException("vocabulary: two profiles are named '" + profile.name()
                        + "'; give each tufa:Profile its own tufa:profileName");
            }
        }
        return new ProfileCatalog(java.util.Collections.unmodifiableMap(rolesByName),
                java.util.Collections.unmodifiableMap(profiles));
    }

    /** The profile with this name. */
    public Profile profile(String name) {
        Profile p = profiles.get(name);
        if (p == null) {
            throw new InputException("unknown profile '" + name + "'; known profiles: " + String.join(", ", names())
                    + " (add your own in a Turtle file passed with --vocabulary)");
        }
        return p;
    }

    /** Profile names, sorted. */
    public List<String> names() {
        return List.copyOf(profiles.keySet());
    }

    /**
     * The profiles chosen from automatically (those with tufa:appliesTo and without tufa:onRequest), sorted by
     * name: each unit gets the best fitting one of those that apply to its class.
     */
    public List<Profile> automatic() {
        return profiles.values().stream().filter(Profile::automatic).toList();
    }

    /** The named profiles, in the order given; an unknown name is an error listing the known ones. */
    public List<Profile> profiles(List<String> names) {
        List<Profile> out = new ArrayList<>();
        for (String n : new java.util.TreeSet<>(names)) {
            out.add(profile(n));
        }
        return out;
    }

    /** Roles by name, sorted by name. */
    public Map<String, Role> roles() {
        return roles;
    }

    private static Role readRole(Model m, Resource r) {
        String where = "vocabulary: role " + describe(r);
        String name = requiredString(m, r, "roleName", where);
        if (!name.matches("[a-z][a-z0-9_]*")) {
            throw new InputException(where + ": tufa:roleName '" + name
                    + "' must be lower case letters, digits and underscores (it becomes a CSV column name)");
        }
        int order = 1000;
        Statement os = r.getProperty(tufa(m, "columnOrder"));
        if (os != null) {
            order = os.getInt();
        }
        Statement ls = r.getProperty(tufa(m, "lookups"));
        if (ls == null || !ls.getObject().canAs(RDFList.class)) {
            throw new InputException(where + " has no tufa:lookups list; add tufa:lookups ( [ tufa:place ... ] )");
        }
        List<Lookup> lookups = new ArrayList<>();
        List<RDFNode> items = ls.getObject().as(RDFList.class).asJavaList();
        for (int i = 0; i < items.size(); i++) {
            if (!items.get(i).isResource()) {
                throw new InputException(where + ": lookup " + (i + 1) + " is not a node; write [ tufa:place ... ]");
            }
            lookups.add(readLookup(m, items.get(i).asResource(), where + ", lookup " + (i + 1)));
        }
        if (lookups.isEmpty()) {
            throw new InputException(where + ": tufa:lookups is empty; add at least one lookup");
        }
        return new Role(name, r.getURI(), order, lookups);
    }

    private static Lookup readLookup(Model m, Resource l, String where) {
        List<String> places = iris(m, l, "place");
        if (places.size() != 1 || Place.fromIri(places.get(0)) == null) {
            throw new InputException(where + ": needs exactly one tufa:place, one of tufa:OnUnit, tufa:OnPart, "
                    + "tufa:OnZone, tufa:Upstream, tufa:BuildingWide");
        }
        Place place = Place.fromIri(places.get(0));
        // Legacy names (classes older Brick versions defined) qualify like the others; they are kept apart in
        // tufa.ttl only so that a test can check every other name against the current Brick file.
        List<String> pointClasses = new ArrayList<>(iris(m, l, "pointClass"));
        pointClasses.addAll(iris(m, l, "legacyPointClass"));
        pointClasses.sort(null);
        if (pointClasses.isEmpty()) {
            throw new InputException(where + ": needs at least one tufa:pointClass");
        }
        List<String> partClasses = iris(m, l, "partClass");
        if (place == Place.ON_PART && partClasses.isEmpty()) {
            throw new InputException(where + ": tufa:OnPart needs at least one tufa:partClass (e.g. brick:Fan)");
        }
        return new Lookup(place, pointClasses, iris(m, l, "excludedPointClass"), iris(m, l, "anyTag"), partClasses,
                iris(m, l, "preferredHostClass"));
    }

    /** A tufa:RoleChoice read from the vocabulary. */
    private record Choice(String iri, Requirement requirement, List<Role> roles) {
    }

    private static Choice readChoice(Model m, Resource c, Map<String, Role> rolesByIri) {
        String where = "vocabulary: choice " + describe(c);
        String name = requiredString(m, c, "choiceName", where);
        if (!name.matches("[a-z][a-z0-9_]*")) {
            throw new InputException(where + ": tufa:choiceName '" + name
                    + "' must be lower case letters, digits and underscores");
        }
        Statement os = c.getProperty(tufa(m, "options"));
        if (os == null || !os.getObject().canAs(RDFList.class)) {
            throw new InputException(where + " has no tufa:options list; add tufa:options ( tufa:RoleA ( tufa:RoleB "
                    + "tufa:RoleC ) ), each item a role or a list of roles that together stand in");
        }
        List<List<String>> options = new ArrayList<>();
        Set<Role> roles = new LinkedHashSet<>();
        for (RDFNode item : os.getObject().as(RDFList.class).asJavaList()) {
            List<RDFNode> members = item.canAs(RDFList.class) && !item.isURIResource()
                    ? item.as(RDFList.class).asJavaList() : List.of(item);
            List<String> option = new ArrayList<>();
            for (RDFNode member : members) {
                Role role = member.isURIResource() ? rolesByIri.get(member.asResource().getURI()) : null;
                if (role == null) {
                    throw new InputException(where + ": option " + (options.size() + 1) + " names " + member
                            + ", which is not a tufa:Role in the loaded vocabulary");
                }
                option.add(role.name());
                roles.add(role);
            }
            if (option.isEmpty()) {
                throw new InputException(where + ": option " + (options.size() + 1) + " is an empty list");
            }
            options.add(option);
        }
        if (options.size() < 2) {
            throw new InputException(where + ": a choice needs at least two options");
        }
        return new Choice(c.getURI(), new Requirement(name, options), List.copyOf(roles));
    }

    private static Profile readProfile(Model m, Resource p, Map<String, Role> rolesByIri,
            Map<String, Choice> choicesByIri) {
        String where = "vocabulary: profile " + describe(p);
        String name = requiredString(m, p, "profileName", where);
        Statement comment = p.getProperty(RDFS.comment);
        String description = comment != null && comment.getObject().isLiteral() ? comment.getString() : "";
        List<String> kinds = p.listProperties(tufa(m, "unitKind")).toList().stream()
                .map(s -> s.getObject().isLiteral() ? s.getString().strip() : "").toList();
        if (kinds.size() > 1 || kinds.stream().anyMatch(k -> !k.matches("[a-z][a-z0-9_]*"))) {
            throw new InputException(where + ": at most one tufa:unitKind, a lower-case name such as \""
                    + Profile.FAN_COIL + "\" or \"" + Profile.VAV + "\"");
        }
        String kind = kinds.isEmpty() ? Profile.FAN_COIL : kinds.get(0);
        List<Statement> requestOnly = p.listProperties(tufa(m, "onRequest")).toList();
        boolean onRequest = false;
        if (!requestOnly.isEmpty()) {
            if (requestOnly.size() > 1 || !requestOnly.get(0).getObject().isLiteral()
                    || !(requestOnly.get(0).getObject().asLiteral().getValue() instanceof Boolean)) {
                throw new InputException(where + ": tufa:onRequest must be given once, as true or false");
            }
            onRequest = requestOnly.get(0).getBoolean();
        }
        List<Statement> specificities = p.listProperties(tufa(m, "specificity")).toList();
        int specificity = 0;
        if (!specificities.isEmpty()) {
            if (specificities.size() > 1 || !specificities.get(0).getObject().isLiteral()
                    || !(specificities.get(0).getObject().asLiteral().getValue() instanceof Number)) {
                throw new InputException(where + ": tufa:specificity must be given once, as an integer");
            }
            specificity = specificities.get(0).getInt();
        }
        List<ModeRequirement> modes = new ArrayList<>();
        Set<Role> used = new LinkedHashSet<>();
        for (Statement s : p.listProperties(tufa(m, "mode")).toList()) {
            if (!s.getObject().isResource()) {
                throw new InputException(where + ": tufa:mode must be a node with tufa:modeName and tufa:requires");
            }
            Resource mode = s.getResource();
            String modeName = requiredString(m, mode, "modeName", where + ", a mode");
            List<Requirement> required = requirements(m, mode, "requires", rolesByIri, choicesByIri, used,
                    where + ", mode " + modeName);
            List<Requirement> optional = requirements(m, mode, "uses", rolesByIri, choicesByIri, used,
                    where + ", mode " + modeName);
            if (required.isEmpty()) {
                throw new InputException(where + ", mode " + modeName + ": needs at least one tufa:requires role");
            }
            modes.add(new ModeRequirement(modeName, required,
                    optional.stream().filter(r -> !required.contains(r)).toList()));
        }
        if (modes.isEmpty()) {
            throw new InputException(where + ": needs at least one tufa:mode");
        }
        modes.sort(Comparator.comparing(ModeRequirement::name));
        for (int i = 1; i < modes.size(); i++) {
            if (modes.get(i).name().equals(modes.get(i - 1).name())) {
                throw new InputException(where + ": two modes are named '" + modes.get(i).name() + "'");
            }
        }
        List<Role> evidence = roles(m, p, "evidenceRole", rolesByIri, where);
        used.addAll(evidence);
        // Read where present, never a requirement: found in coverage, never listed as missing.
        used.addAll(roles(m, p, "readsWhenPresent", rolesByIri, where));
        List<Role> roles = new ArrayList<>(used);
        roles.sort(ROLE_ORDER);
        return new Profile(name, p.getURI(), description, kind, iris(m, p, "appliesTo"), onRequest, specificity,
                evidence.stream().map(Role::name).toList(), iris(m, p, "evidenceClass"), modes, roles);
    }

    /** The requirements a mode names with the property: roles or choices, in column order of their first role. */
    private static List<Requirement> requirements(Model m, Resource mode, String property,
            Map<String, Role> rolesByIri, Map<String, Choice> choicesByIri, Set<Role> used, String where) {
        List<Requirement> out = new ArrayList<>();
        List<Integer> order = new ArrayList<>();
        for (String iri : iris(m, mode, property)) {
            Role role = rolesByIri.get(iri);
            Choice choice = choicesByIri.get(iri);
            if (role != null) {
                out.add(Requirement.of(role.name()));
                order.add(role.columnOrder());
                used.add(role);
            } else if (choice != null) {
                out.add(choice.requirement());
                order.add(choice.roles().stream().mapToInt(Role::columnOrder).min().orElse(1000));
                used.addAll(choice.roles());
            } else {
                throw new InputException(where + ": <" + iri + "> is not a tufa:Role or tufa:RoleChoice in the "
                        + "loaded vocabulary");
            }
        }
        Integer[] idx = new Integer[out.size()];
        for (int i = 0; i < idx.length; i++) {
            idx[i] = i;
        }
        java.util.Arrays.sort(idx, Comparator.<Integer>comparingInt(order::get).thenComparing(i -> out.get(i).name()));
        List<Requirement> sorted = new ArrayList<>();
        for (Integer i : idx) {
            sorted.add(out.get(i));
        }
        return sorted;
    }

    private static final Comparator<Role> ROLE_ORDER = Comparator.comparingInt(Role::columnOrder)
            .thenComparing(Role::name);

    private static List<Role> roles(Model m, Resource mode, String property, Map<String, Role> rolesByIri,
            String where) {
        List<Role> out = new ArrayList<>();
        for (String iri : iris(m, mode, property)) {
            Role role = rolesByIri.get(iri);
            if (role == null) {
                throw new InputException(where + ": <" + iri + "> is not a tufa:Role in the loaded vocabulary");
            }
            out.add(role);
        }
        out.sort(ROLE_ORDER);
        return out;
    }

    private static String requiredString(Model m, Resource r, String property, String where) {
        List<Statement> values = r.listProperties(tufa(m, property)).toList();
        if (values.size() != 1 || !values.get(0).getObject().isLiteral()) {
            throw new InputException(where + ": needs exactly one tufa:" + property + " (a string)");
        }
        Literal l = values.get(0).getLiteral();
        return l.getLexicalForm().strip();
    }

    /** IRIs of the property's values, sorted; blank-node or literal values are an error. */
    private static List<String> iris(Model m, Resource r, String property) {
        List<String> out = new ArrayList<>();
        for (Statement s : r.listProperties(tufa(m, property)).toList()) {
            if (!s.getObject().isURIResource()) {
                throw new InputException("vocabulary: tufa:" + property + " of " + describe(r)
                        + " must be an IRI such as brick:Valve_Command, not " + s.getObject());
            }
            out.add(s.getObject().asResource().getURI());
        }
        out.sort(null);
        return out;
    }

    private static String describe(Resource r) {
        return r.isURIResource() ? "<" + r.getURI() + ">" : "(blank node)";
    }

    private static Property tufa(Model m, String local) {
        return m.createProperty(Namespaces.TUFA, local);
    }
}
