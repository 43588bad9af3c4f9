package org.tufa.analysis.coverage;

import java.util.ArrayList;
import java.util.Collection;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.apache.jena.graph.NodeFactory;
import org.apache.jena.query.Query;
import org.apache.jena.query.QueryExecution;
import org.apache.jena.query.QueryFactory;
import org.apache.jena.query.QuerySolution;
import org.apache.jena.query.ResultSet;
import org.apache.jena.query.Syntax;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.sparql.core.Var;
import org.apache.jena.sparql.engine.binding.BindingFactory;
import org.apache.jena.sparql.syntax.Element;
import org.apache.jena.sparql.syntax.ElementData;
import org.apache.jena.sparql.syntax.ElementGroup;
import org.apache.jena.sparql.syntax.ElementOptional;
import org.apache.jena.sparql.syntax.ElementUnion;

/**
 * Builds and runs tufa's fixed SPARQL templates. Values that come from files or the command line (class IRIs)
 * never enter the query text: they are added as rows of the template's empty {@code VALUES ?var { }} blocks, as
 * RDF nodes, after parsing. A quote or brace in a value therefore cannot change the query.
 */
final class Sparql {
    /** The subclass step tufa follows: subclass, and owl:equivalentClass in either direction (Brick uses both). */
    static final String SUBCLASS_STEP = "(rdfs:subClassOf|owl:equivalentClass|^owl:equivalentClass)";

    private static final String CLOSURE_DOWN = "SELECT DISTINCT ?t WHERE { VALUES ?root { } ?t " + SUBCLASS_STEP
            + "* ?root . }";
    private static final String CLOSURE_UP = "SELECT DISTINCT ?t WHERE { VALUES ?root { } ?root " + SUBCLASS_STEP
            + "* ?t . }";

    private Sparql() {
    }

    /**
     * Parses a template (a constant of tufa's code) with the standard prefixes and fills its {@code VALUES} blocks.
     *
     * @param values per variable name, the IRIs to bind; every name must have an empty VALUES block in the template
     */
    static Query build(String template, Map<String, ? extends Collection<String>> values) {
        Query query = new Query();
        query.setPrefixMapping(StandardPrefixes.mapping());
        QueryFactory.parse(query, template, null, Syntax.syntaxSPARQL_11);
        Set<String> filled = new HashSet<>();
        fill(query.getQueryPattern(), values, filled);
        if (!filled.equals(values.keySet())) {
            throw new IllegalStateException("template has no VALUES block for " + values.keySet() + ": " + template);
        }
        return query;
    }

    private static void fill(Element element, Map<String, ? extends Collection<String>> values, Set<String> filled) {
        if (element instanceof ElementData data && data.getVars().size() == 1) {
            Var var = data.getVars().get(0);
            Collection<String> iris = values.get(var.getVarName());
            if (iris != null) {
                for (String iri : new TreeSet<>(iris)) {
                    data.add(BindingFactory.binding(var, NodeFactory.createURI(iri)));
                }
                filled.add(var.getVarName());
            }
        } else if (element instanceof ElementGroup group) {
            group.getElements().forEach(e -> fill(e, values, filled));
        } else if (element instanceof ElementUnion union) {
            union.getElements().forEach(e -> fill(e, values, filled));
        } else if (element instanceof ElementOptional optional) {
            fill(optional.getOptionalElement(), values, filled);
        }
    }

    /** Runs a SELECT query and returns every solution (the result sets here are small). */
    static List<QuerySolution> select(Model model, Query query) {
        try (QueryExecution qe = QueryExecution.model(model).query(query).build()) {
            ResultSet rs = qe.execSelect();
            List<QuerySolution> rows = new ArrayList<>();
            rs.forEachRemaining(rows::add);
            return rows;
        }
    }

    /** The classes at or below the given ones (subclasses and equivalent classes, transitively), as IRIs. */
    static Set<String> subclassClosure(Model model, Collection<String> roots) {
        return closure(model, CLOSURE_DOWN, roots);
    }

    /** The classes at or above the given ones (superclasses and equivalent classes, transitively), as IRIs. */
    static Set<String> superclassClosure(Model model, Collection<String> roots) {
        return closure(model, CLOSURE_UP, roots);
    }

    private static Set<String> closure(Model model, String template, Collection<String> roots) {
        Set<String> out = new TreeSet<>(roots);
        if (roots.isEmpty()) {
            return out;
        }
        for (QuerySolution row : select(model, build(template, Map.of("root", roots)))) {
            if (row.get("t").isURIResource()) {
                out.add(row.getResource("t").getURI());
            }
        }
        return out;
    }
}
