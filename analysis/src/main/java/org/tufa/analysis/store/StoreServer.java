package org.tufa.analysis.store;

import org.apache.jena.fuseki.main.FusekiServer;
import org.apache.jena.query.ARQ;
import org.apache.jena.sparql.core.DatasetGraph;
import org.apache.jena.sparql.function.FunctionFactory;
import org.apache.jena.sparql.function.FunctionRegistry;
import org.apache.jena.sparql.util.Context;
import org.apache.jena.tdb2.TDB2;

/**
 * A store served over the SPARQL 1.1 protocol with Jena Fuseki's embeddable server, read-only: the dataset is
 * registered without update operations, so SPARQL Update and graph-store writes are refused (HTTP 405). Queries see
 * the union of all graphs as their default graph and can name one with GRAPH. Queries cannot reach out: SERVICE is
 * switched off ({@code arq:httpServiceAllowed} false) and functions named by {@code java:} IRIs, which would load
 * classes from the class path, are not found.
 */
public final class StoreServer implements AutoCloseable {

    /** The dataset's path on the server: queries go to /tufa/sparql (or /tufa/query). */
    public static final String DATASET = "/tufa";

    private final FusekiServer server;

    private StoreServer(FusekiServer server) {
        this.server = server;
    }

    /**
     * Starts serving; returns at once.
     *
     * @param loopbackOnly listen on 127.0.0.1 only (the default of tufa serve)
     * @param port the port, 0 for any free one
     */
    public static StoreServer start(ModelStore store, boolean loopbackOnly, int port) {
        DatasetGraph dsg = store.dataset().asDatasetGraph();
        Context context = dsg.getContext();
        context.set(TDB2.symUnionDefaultGraph, true);
        context.set(ARQ.httpServiceAllowed, false);
        FunctionRegistry standard = FunctionRegistry.get();
        FunctionRegistry noJava = new FunctionRegistry() {
            @Override
            public FunctionFactory get(String uri) {
                return uri.startsWith("java:") ? null : standard.get(uri);
            }

            @Override
            public boolean isRegistered(String uri) {
                return !uri.startsWith("java:") && standard.isRegistered(uri);
            }
        };
        FunctionRegistry.set(context, noJava);
        FusekiServer server = FusekiServer.create().port(port).loopback(loopbackOnly).verbose(false)
                .add(DATASET, dsg, false).build();
        server.start();
        return new StoreServer(server);
    }

    /** The port the server listens on. */
    public int port() {
        return server.getHttpPort();
    }

    /** Blocks until the server stops. */
    public void join() {
        server.join();
    }

    @Override
    public void close() {
        server.stop();
    }
}
