package org.tufa.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.tufa.analysis.store.ModelStore;
import org.tufa.analysis.store.StoreServer;
import org.tufa.common.InputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tufa serve}: a store over the SPARQL protocol, read-only, until stopped. */
@Command(name = "serve", mixinStandardHelpOptions = true,
        description = {"Serve a store read-only over the SPARQL 1.1 protocol (Jena Fuseki): queries at "
                + "http://HOST:PORT/tufa/sparql see every building's graph (GRAPH <iri> picks one) and the "
                + "vocabulary. No updates, no SERVICE, no java: functions. Stop with Ctrl-C."})
public final class ServeCommand implements Callable<Integer> {
    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Option(names = "--store", required = true, paramLabel = "DIR", description = "The store tufa load filled.")
    Path store;

    @Option(names = "--port", paramLabel = "PORT", defaultValue = "3030",
            description = "Port to listen on (default: ${DEFAULT-VALUE}).")
    int port;

    @Option(names = "--all-interfaces",
            description = "Listen on every network interface, not only on 127.0.0.1 (the default): anyone who "
                    + "reaches the machine can then read the models.")
    boolean allInterfaces;

    @Override
    public Integer call() {
        if (port < 1 || port > 65535) {
            throw new InputException("--port " + port + ": give a port from 1 to 65535");
        }
        ModelStore s = ModelStore.open(store, false);
        StoreServer server;
        try {
            server = StoreServer.start(s, !allInterfaces, port);
        } catch (RuntimeException e) {
            s.close();
            throw new InputException("cannot serve on port " + port + " (" + e.getMessage()
                    + "); is the port in use? choose another with --port");
        }
        var out = spec.commandLine().getOut();
        out.println("Serving " + store + " (" + s.buildings().size() + " building(s)) read-only at http://"
                + (allInterfaces ? "0.0.0.0" : "127.0.0.1") + ":" + server.port() + StoreServer.DATASET
                + "/sparql; stop with Ctrl-C");
        out.flush();
        Runtime.getRuntime().addShutdownHook(new Thread(() -> {
            server.close();
            s.close();
        }, "tufa-serve-stop"));
        server.join();
        return ExitCodes.OK;
    }
}
