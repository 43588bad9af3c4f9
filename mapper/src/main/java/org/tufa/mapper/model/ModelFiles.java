package org.tufa.mapper.model;

import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.jena.graph.Graph;
import org.apache.jena.graph.Node;
import org.apache.jena.graph.Triple;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.ModelFactory;
import org.apache.jena.riot.Lang;
import org.apache.jena.riot.RDFDataMgr;
import org.apache.jena.riot.RDFFormat;
import org.apache.jena.riot.RDFLanguages;
import org.apache.jena.riot.RDFParser;
import org.apache.jena.riot.RiotException;
import org.apache.jena.riot.system.StreamRDF;
import org.apache.jena.riot.system.StreamRDFWriter;
import org.apache.jena.sparql.graph.GraphFactory;
import org.apache.jena.vocabulary.RDF;
import org.tufa.common.InputException;
import org.tufa.common.OutputFiles;

/**
 * Reads and writes Brick models. Writing is deterministic: triples are sorted (subject, then rdf:type before
 * other predicates, then predicate, then object) and fed to Jena's streaming Turtle (TURTLE_BLOCKS) or
 * N-Triples writer, so the same model always gives the same bytes; JSON-LD goes through Jena's JSON-LD writer on
 * a graph filled in that sorted order.
 */
public final class ModelFiles {
    private ModelFiles() {
    }

    /** The RDF syntax for an output file name: .nt N-Triples, .jsonld JSON-LD, anything else Turtle. */
    public static Lang langFor(Path file) {
        String n = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (n.endsWith(".nt")) {
            return Lang.NTRIPLES;
        }
        if (n.endsWith(".jsonld") || n.endsWith(".json")) {
            return Lang.JSONLD;
        }
        return Lang.TURTLE;
    }

    /**
     * Writes the model to {@code file} in the syntax its extension names: to a temporary file beside it, renamed
     * into place ({@link OutputFiles}), so a failed write never leaves half a model.
     */
    public static void write(Model model, Path file) {
        Lang lang = langFor(file);
        OutputFiles.write(file, out -> write(model, lang, out));
    }

    /** Writes the model in a given syntax. */
    public static void write(Model model, Lang lang, OutputStream out) {
        List<Triple> triples = sorted(model.getGraph());
        if (lang.equals(Lang.JSONLD)) {
            Graph g = GraphFactory.createDefaultGraph();
            triples.forEach(g::add);
            Model m = ModelFactory.createModelForGraph(g);
            m.setNsPrefixes(model.getNsPrefixMap());
            RDFDataMgr.write(out, m, RDFFormat.JSONLD11_PRETTY);
            return;
        }
        RDFFormat format = lang.equals(Lang.NTRIPLES) ? RDFFormat.NTRIPLES_UTF8 : RDFFormat.TURTLE_BLOCKS;
        StreamRDF stream = StreamRDFWriter.getWriterStream(out, format);
        stream.start();
        if (!lang.equals(Lang.NTRIPLES)) {
            // prefixes in name order: a prefix map's own order is a hash order
            new java.util.TreeMap<>(model.getNsPrefixMap()).forEach(stream::prefix);
        }
        triples.forEach(stream::triple);
        stream.finish();
    }

    /** The graph's triples in the writer's fixed order. */
    public static List<Triple> sorted(Graph g) {
        List<Triple> list = new ArrayList<>(g.size());
        g.find().forEachRemaining(list::add);
        Node type = RDF.type.asNode();
        list.sort((a, b) -> {
            int c = compare(a.getSubject(), b.getSubject());
            if (c != 0) {
                return c;
            }
            boolean at = a.getPredicate().equals(type);
            boolean bt = b.getPredicate().equals(type);
            if (at != bt) {
                return at ? -1 : 1;
            }
            c = compare(a.getPredicate(), b.getPredicate());
            return c != 0 ? c : compare(a.getObject(), b.getObject());
        });
        return list;
    }

    /** IRIs before blank nodes before literals; IRIs by text; literals by lexical form, datatype, language. */
    static int compare(Node a, Node b) {
        int ka = kind(a);
        int kb = kind(b);
        if (ka != kb) {
            return Integer.compare(ka, kb);
        }
        if (a.isURI()) {
            return a.getURI().compareTo(b.getURI());
        }
        if (a.isLiteral()) {
            int c = a.getLiteralLexicalForm().compareTo(b.getLiteralLexicalForm());
            if (c == 0) {
                c = a.getLiteralDatatypeURI().compareTo(b.getLiteralDatatypeURI());
            }
            return c != 0 ? c : a.getLiteralLanguage().compareTo(b.getLiteralLanguage());
        }
        return a.toString().compareTo(b.toString());
    }

    private static int kind(Node n) {
        return n.isURI() ? 0 : n.isBlank() ? 1 : 2;
    }

    /** Reads a model (Turtle, N-Triples, JSON-LD by extension); bad files are an {@link InputException}. */
    public static Model read(Path file) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "model file not found; run 'tufa map' first or check the path");
        }
        Lang lang = RDFLanguages.filenameToLang(file.toString(), Lang.TURTLE);
        Model m = ModelFactory.createDefaultModel();
        try {
            org.tufa.common.OfflineRdf.offline(RDFParser.source(file).lang(lang)).parse(m);
        } catch (RiotException e) {
            String msg = String.valueOf(e.getMessage()).lines().findFirst().orElse("");
            throw InputException.in(file, "not a readable " + lang.getLabel() + " file (" + msg + ")");
        }
        return m;
    }
}
