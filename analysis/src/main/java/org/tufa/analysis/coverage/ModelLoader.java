package org.tufa.analysis.coverage;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.ModelFactory;
import org.apache.jena.riot.Lang;
import org.apache.jena.riot.RDFParser;
import org.apache.jena.riot.RiotException;
import org.apache.jena.riot.system.ErrorHandler;
import org.tufa.common.InputException;

/** Reads an RDF file (a Brick model or a vocabulary) into a Jena model, with one-line errors. */
public final class ModelLoader {
    private ModelLoader() {
    }

    /**
     * Reads Turtle ({@code .ttl}), N-Triples ({@code .nt}), JSON-LD ({@code .jsonld}, {@code .json}) or RDF/XML
     * ({@code .rdf}, {@code .owl}, {@code .xml}), chosen by the file name's extension.
     *
     * @throws InputException when the file is missing, has another extension or does not parse (the message names
     *     the line and column Jena reports)
     */
    public static Model load(Path file) {
        Lang lang = langOf(file);
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "no such file; check the path");
        }
        Model model = ModelFactory.createDefaultModel();
        try (InputStream in = Files.newInputStream(file)) {
            org.tufa.common.OfflineRdf.offline(RDFParser.source(in).lang(lang).base(file.toUri().toString())
                    .errorHandler(new FailFast(file))).parse(model.getGraph());
        } catch (IOException e) {
            throw InputException.in(file, "cannot read (" + e.getMessage() + ")");
        } catch (RiotException e) {
            // Parsers that report without line numbers (JSON-LD) end up here.
            throw InputException.in(file, "not valid " + lang.getLabel() + ": " + firstLine(e.getMessage()));
        }
        return model;
    }

    /** Reads a classpath resource written in Turtle (tufa's own vocabulary files). */
    static Model loadResource(String resource) {
        ClassLoader loader = ModelLoader.class.getClassLoader();
        try (InputStream in = loader.getResourceAsStream(resource)) {
            if (in == null) {
                throw new IllegalStateException("classpath resource " + resource + " missing: broken build");
            }
            Model model = ModelFactory.createDefaultModel();
            RDFParser.source(in).lang(Lang.TURTLE).parse(model.getGraph());
            return model;
        } catch (IOException e) {
            throw new IllegalStateException("cannot read classpath resource " + resource, e);
        }
    }

    static Lang langOf(Path file) {
        String name = String.valueOf(file.getFileName()).toLowerCase(Locale.ROOT);
        if (name.endsWith(".ttl")) {
            return Lang.TURTLE;
        }
        if (name.endsWith(".nt")) {
            return Lang.NTRIPLES;
        }
        if (name.endsWith(".jsonld") || name.endsWith(".json")) {
            return Lang.JSONLD;
        }
        if (name.endsWith(".rdf") || name.endsWith(".owl") || name.endsWith(".xml")) {
            return Lang.RDFXML;
        }
        throw InputException.in(file,
                "unknown RDF file type; name it .ttl (Turtle), .nt (N-Triples), .jsonld (JSON-LD) or .rdf (RDF/XML)");
    }

    private static String firstLine(String message) {
        if (message == null) {
            return "parse error";
        }
        int nl = message.indexOf('\n');
        return (nl < 0 ? message : message.substring(0, nl)).strip();
    }

    /** Turns the parser's first error into an InputException naming line and column. */
    private record FailFast(Path file) implements ErrorHandler {
        @Override
        public void warning(String message, long line, long col) {
            // Warnings (e.g. an unusual IRI) do not lose data; the triple is still read.
        }

        @Override
        public void error(String message, long line, long col) {
            throw failure(message, line, col);
        }

        @Override
        public void fatal(String message, long line, long col) {
            throw failure(message, line, col);
        }

        private InputException failure(String message, long line, long col) {
            String what = firstLine(message) + "; fix the syntax there";
            if (line < 1) {
                return InputException.in(file, what);
            }
            return InputException.at(file, line, (col > 0 ? "column " + col + ": " : "") + what);
        }
    }
}
