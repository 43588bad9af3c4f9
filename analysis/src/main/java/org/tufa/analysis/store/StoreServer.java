package org.tufa.analysis.store;

import org.apache.jena.fuseki.main.FusekiServer;
import org.apache.jena.sparql.core.DatasetGraph;
import org.apache.jena.sparql.util.Context;
import org.apache.jena.tdb2.TDB2;
import org.tufa.analysis.query.QueryGuard;

/**
 * A store served over the SPARQL 1.1 protocol with Jena Fuseki's embeddable server, read-only: the dataset is
 * registered without update operations, so SPARQL Update and graph-store writes are refused (HTTP 405). Queries see
 * the union of all graphs as their default graph and can name one with GRAPH. Queries cannot reach out: the
 * dataset's context is {@code tufa query}'s sandbox ({@link QueryGuard#sandbox}): SERVICE is switched off and
 * functions and property functions named by {@code java:} IRIs, which would load classes from the class path, are
 * refused.
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
        QueryGuard.sandbox(context, false);
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
