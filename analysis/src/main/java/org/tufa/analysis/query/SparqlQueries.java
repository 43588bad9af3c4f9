package org.tufa.analysis.query;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Locale;
import org.apache.jena.query.Query;
import org.apache.jena.query.QueryException;
import org.apache.jena.query.QueryExecution;
import org.apache.jena.query.QueryFactory;
import org.apache.jena.query.QueryParseException;
import org.apache.jena.query.ResultSet;
import org.apache.jena.query.ResultSetFormatter;
import org.apache.jena.query.Syntax;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.riot.Lang;
import org.apache.jena.riot.RDFDataMgr;
import org.apache.jena.shared.PrefixMapping;
import org.tufa.analysis.coverage.StandardPrefixes;
import org.tufa.common.InputException;
import org.tufa.common.Printable;
import java.util.Set;
import org.apache.jena.query.ARQ;
import org.apache.jena.sparql.util.Context;
import org.apache.jena.update.UpdateFactory;
import org.apache.jena.update.UpdateRequest;

/**
 * Parses and runs a user's SPARQL query against a model with the vocabulary beside it, so that
 * {@code rdf:type/rdfs:subClassOf*} paths reach Brick's class hierarchy.
 */
public final class SparqlQueries {
    /** Output formats of {@code tufa query}. */
    public enum Format {
        TABLE, CSV, JSON
    }

    private static final java.util.regex.Pattern AT_LINE =
            java.util.regex.Pattern.compile("\\s*at line (\\d+), column (\\d+)\\.?");

    private SparqlQueries() {
    }

    /**
     * Parses a query with brick, tag, ref, rdf, rdfs, owl, xsd, unit, rec and tufa predeclared. The prefixes are set
     * on the parser rather than pasted in front of the text, so line numbers in errors are those of the user's text.
     *
     * @param source names the query in error messages (the file name, or "-e")
     * @throws InputException with {@code source:line: column C: message} when the query does not parse
     */
    public static Query parse(String text, String source) {
        return parse(text, source, Set.of());
    }

    /**
     * Parses a query and checks that it only reads the model ({@link QueryGuard}): no SERVICE except to the allowed
     * endpoints, no FROM / FROM NAMED, no {@code java:} functions; an update (INSERT, DELETE, LOAD, ...) is refused
     * with its own message.
     *
     * @param allowedServices endpoint IRIs the query may name in SERVICE (normally none)
     */
    public static Query parse(String text, String source, Set<String> allowedServices) {
        Query query = new Query();
        query.setPrefixMapping(StandardPrefixes.mapping());
        try {
            QueryFactory.parse(query, text, null, Syntax.syntaxARQ);
        } catch (QueryParseException e) {
            // JavaCC's message names the offending token ("at line 3, column 3"); the exception's own line and
            // column point at the token before it, so the message is preferred when it has a position.
            String first = firstLine(e.getMessage());
            long line = e.getLine();
            long column = e.getColumn();
            java.util.regex.Matcher at = AT_LINE.matcher(first);
            if (at.find()) {
                line = Long.parseLong(at.group(1));
                column = Long.parseLong(at.group(2));
            }
            if (isUpdate(text)) {
                throw new InputException(source + ": this is a SPARQL update (INSERT, DELETE, LOAD, CLEAR, ...); "
                        + "updates are not supported: tufa query only reads the model, with SELECT, ASK, CONSTRUCT "
                        + "or DESCRIBE");
            }
            String message = Printable.line(AT_LINE.matcher(first).replaceAll(""));
            String where = line > 0 ? ":" + line + ": column " + column + ": " : ": ";
            throw new InputException(source + where + message + "; fix the query there");
        }
        QueryGuard.check(query, allowedServices, source);
        return query;
    }

    /** Whether the text parses as a SPARQL update; parsing runs nothing. */
    private static boolean isUpdate(String text) {
        try {
            UpdateRequest request = new UpdateRequest();
            request.setPrefixMapping(StandardPrefixes.mapping());
            UpdateFactory.parse(request, text);
            return true;
        } catch (RuntimeException e) {
            return false;
        }
    }

    /**
     * Runs the query and renders SELECT/ASK results in the format, CONSTRUCT/DESCRIBE results as Turtle.
     *
     * @param modelPrefixes prefixes for shortening IRIs in table and Turtle output (the query's own are added)
     */
    public static String run(Model data, PrefixMapping modelPrefixes, Query query, Format format) {
        return run(data, modelPrefixes, query, format, false);
    }

    /**
     * Runs the query in a sandboxed context ({@link QueryGuard#sandbox}).
     *
     * @param servicesAllowed whether the user allowed SERVICE endpoints (checked at parse time)
     */
    public static String run(Model data, PrefixMapping modelPrefixes, Query query, Format format,
            boolean servicesAllowed) {
        PrefixMapping prefixes = PrefixMapping.Factory.create().setNsPrefixes(modelPrefixes)
                .setNsPrefixes(query.getPrefixMapping());
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        Context context = ARQ.getContext().copy();
        QueryGuard.sandbox(context, servicesAllowed);
        try (QueryExecution qe = QueryExecution.model(data).query(query).context(context).build()) {
            if (query.isSelectType()) {
                ResultSet rs = qe.execSelect();
                switch (format) {
                    case TABLE -> {
                        return ResultSetFormatter.asText(rs, new org.apache.jena.sparql.core.Prologue(prefixes));
                    }
                    case CSV -> ResultSetFormatter.outputAsCSV(out, rs);
                    case JSON -> ResultSetFormatter.outputAsJSON(out, rs);
                }
            } else if (query.isAskType()) {
                boolean answer = qe.execAsk();
                switch (format) {
                    case TABLE -> {
                        return answer + System.lineSeparator();
                    }
                    case CSV -> ResultSetFormatter.outputAsCSV(out, answer);
                    case JSON -> ResultSetFormatter.outputAsJSON(out, answer);
                }
            } else if (query.isConstructType() || query.isDescribeType()) {
                Model result = query.isConstructType() ? qe.execConstruct() : qe.execDescribe();
                result.setNsPrefixes(prefixes);
                RDFDataMgr.write(out, result, Lang.TURTLE);
            } else {
                throw new InputException("query: only SELECT, ASK, CONSTRUCT and DESCRIBE are supported, not "
                        + query.queryType().toString().toLowerCase(Locale.ROOT));
            }
        } catch (InputException e) {
            throw e;
        } catch (QueryException | org.apache.jena.atlas.web.HttpException | IllegalArgumentException e) {
            throw new InputException("query: cannot run (" + Printable.line(firstLine(e.getMessage()))
                    + "); check the query");
        }
        return out.toString(StandardCharsets.UTF_8);
    }

    private static String firstLine(String message) {
        if (message == null) {
            return "error";
        }
        int nl = message.indexOf('\n');
        return (nl < 0 ? message : message.substring(0, nl)).strip();
    }
}
