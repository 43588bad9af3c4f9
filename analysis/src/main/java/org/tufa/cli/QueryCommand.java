package org.tufa.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.apache.jena.query.Query;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.query.SparqlQueries;
import org.tufa.analysis.store.ModelStore;
import org.tufa.common.InputException;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tufa query}: run a SPARQL query on a model with the Brick vocabulary beside it. */
@Command(name = "query", mixinStandardHelpOptions = true,
        description = {"Run a SPARQL query (SELECT, ASK, CONSTRUCT, DESCRIBE) on a Brick model. The vocabulary is "
                + "loaded beside the model, so rdf:type/rdfs:subClassOf* reaches Brick's class hierarchy.",
            "Predeclared prefixes: brick, tag, ref, rdf, rdfs, owl, xsd, unit, rec, tufa."})
public final class QueryCommand implements Callable<Integer> {
    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Option(names = "--model", paramLabel = "FILE", description = "Brick model. Or --store.")
    Path model;

    @Option(names = "--store", paramLabel = "DIR",
            description = "A store tufa load filled, instead of --model: one building's graph (--graph), or all "
                    + "of them at once, with the vocabulary stored beside them.")
    Path store;

    @Option(names = "--graph", paramLabel = "IRI", description = "With --store: only this building's graph.")
    String graph;

    @ArgGroup(exclusive = true, multiplicity = "1")
    Source source;

    static final class Source {
        @Parameters(paramLabel = "QUERY.rq", description = "File holding the query.")
        Path file;

        @Option(names = "-e", paramLabel = "SPARQL", description = "The query text itself.")
        String text;
    }

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "table",
            description = "table, csv or json (SELECT and ASK; CONSTRUCT and DESCRIBE always print Turtle).")
    String format;

    @Option(names = "--vocabulary", paramLabel = "FILE", description = "Extra vocabulary, e.g. a newer Brick release (all of Brick 1.4.4 is built in).")
    List<Path> vocabularies = new ArrayList<>();

    @Option(names = "--allow-service", paramLabel = "IRI",
            description = "Let SERVICE reach this one SPARQL endpoint (exact IRI; repeatable). Without it a query "
                    + "never leaves the machine.")
    List<String> allowedServices = new ArrayList<>();

    @Override
    public Integer call() {
        SparqlQueries.Format chosen = switch (format.toLowerCase(java.util.Locale.ROOT)) {
            case "table" -> SparqlQueries.Format.TABLE;
            case "csv" -> SparqlQueries.Format.CSV;
            case "json" -> SparqlQueries.Format.JSON;
            default -> throw new InputException("--format " + format + ": use table, csv or json");
        };
        for (String iri : allowedServices) {
            if (!iri.matches("https?://[^\\s<>\"{}|\\\\^`]+")) {
                throw new InputException("--allow-service '" + org.tufa.common.Printable.excerpt(iri)
                        + "': name an http:// or https:// SPARQL endpoint IRI");
            }
        }
        java.util.Set<String> allowed = java.util.Set.copyOf(allowedServices);
        Query query = source.file != null
                ? SparqlQueries.parse(read(source.file), source.file.toString(), allowed)
                : SparqlQueries.parse(source.text, "-e", allowed);
        boolean servicesAllowed = !allowed.isEmpty();
        String answer;
        if (store == null) {
            if (model == null) {
                throw new InputException("give the model with --model FILE, or a store with --store DIR");
            }
            Vocabulary vocabulary = Vocabulary.load(vocabularies);
            var data = ModelLoader.load(model);
            answer = SparqlQueries.run(vocabulary.unionWith(data), Vocabulary.prefixesFor(data), query, chosen,
                    servicesAllowed);
        } else {
            if (model != null) {
                throw new InputException("--model and --store: give one of them, not both");
            }
            try (ModelStore s = ModelStore.open(store, false)) {
                java.util.function.BiFunction<org.apache.jena.rdf.model.Model, org.apache.jena.rdf.model.Model,
                        String> run = (data, stored) -> SparqlQueries.run(Vocabulary.of(stored, vocabularies)
                        .unionWith(data), Vocabulary.prefixesFor(data), query, chosen, servicesAllowed);
                answer = graph != null ? s.read(graph, run) : s.readAll(run);
            }
        }
        var out = spec.commandLine().getOut();
        out.print(answer);
        out.flush();
        return ExitCodes.OK;
    }

    private static String read(Path file) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "no such query file; check the path");
        }
        try {
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw InputException.in(file, "cannot read (" + e.getMessage() + ")");
        }
    }
}
