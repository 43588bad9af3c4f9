package org.tufa.analysis.query;

import java.util.Set;
import org.apache.jena.graph.Node;
import org.apache.jena.graph.Triple;
import org.apache.jena.query.ARQ;
import org.apache.jena.query.Query;
import org.apache.jena.sparql.algebra.Algebra;
import org.apache.jena.sparql.algebra.Op;
import org.apache.jena.sparql.algebra.OpVisitorBase;
import org.apache.jena.sparql.algebra.op.OpBGP;
import org.apache.jena.sparql.algebra.op.OpGroup;
import org.apache.jena.sparql.algebra.op.OpOrder;
import org.apache.jena.sparql.algebra.op.OpTopN;
import org.apache.jena.sparql.algebra.op.OpPropFunc;
import org.apache.jena.sparql.algebra.op.OpService;
import org.apache.jena.sparql.algebra.op.OpTriple;
import org.apache.jena.sparql.algebra.walker.Walker;
import org.apache.jena.sparql.expr.E_Function;
import org.apache.jena.sparql.expr.ExprFunctionN;
import org.apache.jena.sparql.expr.ExprVisitorBase;
import org.apache.jena.sparql.function.FunctionFactory;
import org.apache.jena.sparql.function.FunctionRegistry;
import org.apache.jena.sparql.pfunction.PropertyFunctionFactory;
import org.apache.jena.sparql.pfunction.PropertyFunctionRegistry;
import org.apache.jena.sparql.util.Context;
import org.tufa.common.InputException;

/**
 * What a user's query may do: read the model and the vocabulary, nothing else. A query someone else wrote runs on
 * the machine of whoever runs tufa, so it must not reach the network or the file system, nor load code:
 * <ul>
 * <li>{@code SERVICE} sends the query to another endpoint over HTTP: refused, unless the endpoint is named with
 * {@code --allow-service};</li>
 * <li>{@code FROM} and {@code FROM NAMED} ask the engine to load a file or URL as the dataset: refused (the
 * dataset is the model given with {@code --model}, or read from {@code --store});</li>
 * <li>function and property-function IRIs in the {@code java:} scheme make ARQ load that class by name and run
 * it: refused (a property function is a plain predicate; a longer property path never loads code).</li>
 * </ul>
 * The query is checked on its algebra (so prefixes, sub-queries and {@code EXISTS} patterns are all seen) before
 * it runs, and the execution context repeats the refusal ({@link #sandbox}) in case a form slips past the check.
 */
public final class QueryGuard {

    /** ARQ's scheme for functions loaded as Java classes by name. */
    static final String JAVA_SCHEME = "java:";

    private QueryGuard() {
    }

    /**
     * @param allowedServices endpoint IRIs the user allowed with --allow-service (exact match)
     * @param source names the query in messages ("units.rq", "-e")
     * @throws InputException naming what the query asks for and what to do instead
     */
    static void check(Query query, Set<String> allowedServices, String source) {
        if (!query.getGraphURIs().isEmpty() || !query.getNamedGraphURIs().isEmpty()) {
            String first = !query.getGraphURIs().isEmpty() ? query.getGraphURIs().get(0)
                    : query.getNamedGraphURIs().get(0);
            throw new InputException(source + ": FROM / FROM NAMED <" + first + "> would load another file or URL; "
                    + "tufa query runs on the model of --model or --store (and its vocabulary) only: remove the FROM "
                    + "clause");
        }
        Op op = Algebra.compile(query);
        ExprVisitorBase functions = new ExprVisitorBase() {
            @Override
            public void visit(ExprFunctionN function) {
                if (function instanceof E_Function f && f.getFunctionIRI() != null
                        && f.getFunctionIRI().startsWith(JAVA_SCHEME)) {
                    throw javaRefused(f.getFunctionIRI(), source);
                }
            }
        };
        OpVisitorBase[] ops = new OpVisitorBase[1];
        ops[0] = new OpVisitorBase() {
            // The walker does not enter sort keys or aggregates: walk them here, with the same visitors.
            @Override
            public void visit(OpOrder order) {
                order.getConditions().forEach(c -> Walker.walk(c.getExpression(), ops[0], functions));
            }

            @Override
            public void visit(OpTopN top) {
                top.getConditions().forEach(c -> Walker.walk(c.getExpression(), ops[0], functions));
            }

            @Override
            public void visit(OpGroup group) {
                group.getAggregators().forEach(a -> {
                    if (a.getAggregator().getExprList() != null) {
                        Walker.walk(a.getAggregator().getExprList(), ops[0], functions);
                    }
                });
            }

            @Override
            public void visit(OpService service) {
                Node endpoint = service.getService();
                if (!endpoint.isURI() || !allowedServices.contains(endpoint.getURI())) {
                    throw new InputException(source + ": SERVICE " + (endpoint.isURI() ? "<" + endpoint.getURI()
                            + ">" : endpoint.toString()) + " would send the query over the network; tufa query runs "
                            + "on the model only (pass --allow-service IRI to allow one named endpoint)");
                }
            }

            @Override
            public void visit(OpBGP bgp) {
                bgp.getPattern().forEach(t -> predicate(t, source));
            }

            @Override
            public void visit(OpTriple triple) {
                predicate(triple.getTriple(), source);
            }

            @Override
            public void visit(OpPropFunc function) {
                refuseJava(function.getProperty(), source);
            }
        };
        Walker.walk(op, ops[0], functions);
    }

    private static void predicate(Triple t, String source) {
        refuseJava(t.getPredicate(), source);
    }

    private static void refuseJava(Node node, String source) {
        if (node != null && node.isURI() && node.getURI().startsWith(JAVA_SCHEME)) {
            throw javaRefused(node.getURI(), source);
        }
    }

    private static InputException javaRefused(String iri, String source) {
        return new InputException(source + ": <" + iri + "> would load and run a Java class named by the query; "
                + "tufa query allows SPARQL's own functions only: remove it");
    }

    /**
     * The execution context of a user query: no HTTP SERVICE calls unless endpoints were allowed, and function
     * registries that never load a class named by a {@code java:} IRI.
     */
    public static void sandbox(Context context, boolean servicesAllowed) {
        context.set(ARQ.httpServiceAllowed, servicesAllowed);
        FunctionRegistry functions = new FunctionRegistry() {
            private final FunctionRegistry standard = FunctionRegistry.get();

            @Override
            public FunctionFactory get(String uri) {
                if (uri.startsWith(JAVA_SCHEME)) {
                    throw javaRefused(uri, "query");
                }
                return standard.get(uri);
            }

            @Override
            public boolean isRegistered(String uri) {
                return !uri.startsWith(JAVA_SCHEME) && standard.isRegistered(uri);
            }
        };
        FunctionRegistry.set(context, functions);
        PropertyFunctionRegistry properties = new PropertyFunctionRegistry() {
            private final PropertyFunctionRegistry standard = PropertyFunctionRegistry.get();

            @Override
            public PropertyFunctionFactory get(String uri) {
                return uri.startsWith(JAVA_SCHEME) ? null : standard.get(uri);
            }

            @Override
            public boolean manages(String uri) {
                return !uri.startsWith(JAVA_SCHEME) && standard.manages(uri);
            }

            @Override
            public boolean isRegistered(String uri) {
                return !uri.startsWith(JAVA_SCHEME) && standard.isRegistered(uri);
            }
        };
        PropertyFunctionRegistry.set(context, properties);
    }
}
