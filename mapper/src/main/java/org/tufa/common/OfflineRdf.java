package org.tufa.common;

import com.apicatalog.jsonld.JsonLdError;
import com.apicatalog.jsonld.JsonLdErrorCode;
import com.apicatalog.jsonld.JsonLdOptions;
import org.apache.jena.riot.RDFParserBuilder;
import org.apache.jena.riot.lang.LangJSONLD11;
import org.apache.jena.sparql.util.Context;

/**
 * RDF parsing that never reaches the network: a JSON-LD file whose {@code @context} is a URL would make the
 * JSON-LD processor fetch it over HTTP (JSON-LD 1.1 API, W3C 2020, "remote context"); tufa refuses that with a
 * message naming the URL. Turtle, N-Triples and RDF/XML parsers fetch nothing (owl:imports is plain data).
 */
public final class OfflineRdf {

    private OfflineRdf() {
    }

    /** The parser, set up so that a JSON-LD remote context is an error instead of an HTTP request. */
    public static RDFParserBuilder offline(RDFParserBuilder parser) {
        Context context = new Context();
        JsonLdOptions options = new JsonLdOptions((url, loaderOptions) -> {
            throw new JsonLdError(JsonLdErrorCode.LOADING_DOCUMENT_FAILED, "the JSON-LD context <" + url
                    + "> would be fetched from the network; tufa reads files offline: put the @context in the file");
        });
        context.set(LangJSONLD11.JSONLD_OPTIONS, options);
        return parser.context(context);
    }
}
