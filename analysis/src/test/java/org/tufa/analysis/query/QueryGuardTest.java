package org.tufa.analysis.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.net.SocketException;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.concurrent.atomic.AtomicInteger;
import org.apache.jena.query.Query;
import org.apache.jena.query.QueryFactory;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.StandardPrefixes;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.common.InputException;

/**
 * A query from someone else never reaches the network, the file system or the class path: a listener on 127.0.0.1
 * counts every connection (there must be none), and a tripwire class tells whether a query made the JVM load it.
 * The forms are those of the SPARQL 1.1 Query and Update recommendations (W3C, 2013) plus ARQ's java: function
 * scheme (Jena's documentation, "writing filter functions").
 */
class QueryGuardTest {
    private static ServerSocket listener;
    private static final AtomicInteger CONNECTIONS = new AtomicInteger();
    private static String endpoint;
    private static Model all;

    @BeforeAll
    static void listen() throws Exception {
        listener = new ServerSocket(0, 50, InetAddress.getLoopbackAddress());
        endpoint = "http://127.0.0.1:" + listener.getLocalPort() + "/sparql";
        Thread t = new Thread(() -> {
            while (!listener.isClosed()) {
                try (Socket s = listener.accept()) {
                    CONNECTIONS.incrementAndGet();
                } catch (SocketException closed) {
                    return;
                } catch (IOException e) {
                    return;
                }
            }
        }, "query-guard-listener");
        t.setDaemon(true);
        t.start();
        Path model = Path.of(QueryGuardTest.class.getResource("/org/tufa/analysis/coverage/quillmoor-hall.ttl").toURI());
        all = Vocabulary.standard().unionWith(ModelLoader.load(model));
    }

    @AfterAll
    static void close() throws IOException {
        listener.close();
    }

    private static final String TRIPWIRE = "java:org.tufa.analysis.query.TripwireFunction";

    private static List<String> hostile() {
        return List.of(
                "SELECT * WHERE { SERVICE <" + endpoint + "> { ?s ?p ?o } }",
                "SELECT * WHERE { SERVICE SILENT <" + endpoint + "> { ?s ?p ?o } }",
                "SELECT * WHERE { ?s ?p ?o FILTER EXISTS { SERVICE SILENT <" + endpoint + "> { ?s ?p ?o } } } LIMIT 1",
                "SELECT * WHERE { { SELECT ?s WHERE { SERVICE <" + endpoint + "> { ?s ?p ?o } } } }",
                "SELECT * WHERE { BIND(<" + endpoint + "> AS ?e) SERVICE ?e { ?s ?p ?o } }",
                "SELECT * WHERE { SERVICE <file:///etc/passwd> { ?s ?p ?o } }",
                "SELECT * FROM <" + endpoint + "> WHERE { ?s ?p ?o }",
                "SELECT * FROM NAMED <file:///etc/hostname> WHERE { GRAPH ?g { ?s ?p ?o } }",
                "PREFIX j: <java:org.tufa.analysis.query.> SELECT (j:TripwireFunction() AS ?x) WHERE { }",
                "SELECT * WHERE { ?s ?p ?o FILTER(<" + TRIPWIRE + ">() = \"x\") }",
                "SELECT * WHERE { ?s ?p ?o FILTER NOT EXISTS { BIND(<" + TRIPWIRE + ">() AS ?y) } }",
                "SELECT ?s WHERE { ?s ?p ?o } ORDER BY <" + TRIPWIRE + ">()",
                "SELECT ?s WHERE { ?s ?p ?o } ORDER BY <" + TRIPWIRE + ">() LIMIT 2",
                "SELECT (MAX(<" + TRIPWIRE + ">()) AS ?m) WHERE { ?s ?p ?o }",
                "SELECT ?s WHERE { ?s ?p ?o } GROUP BY ?s HAVING (<" + TRIPWIRE + ">() = 1)",
                "SELECT * WHERE { ?s <java:org.apache.jena.sparql.pfunction.library.splitIRI> (?a ?b) }");
    }

    @Test
    void everyFormThatReachesOutIsAOneLineErrorAndNothingConnectsOrLoads() {
        for (String text : hostile()) {
            InputException e = assertThrows(InputException.class, () -> SparqlQueries.parse(text, "-e"), text);
            assertEquals(1, e.getMessage().lines().count(), e.getMessage());
            assertTrue(e.getMessage().startsWith("-e: "), e.getMessage());
        }
        assertEquals(0, CONNECTIONS.get(), "connections to the listener");
        assertNull(System.getProperty(TripwireFunction.LOADED), "a query loaded a class");
    }

    @Test
    void theExecutionSandboxRefusesTooWhenTheCheckIsBypassed() {
        // Parsed with Jena directly, so QueryGuard.check never sees them: the execution context must still refuse.
        for (String text : List.of(
                "SELECT * WHERE { SERVICE <" + endpoint + "> { ?s ?p ?o } }",
                "SELECT (<" + TRIPWIRE + ">() AS ?x) WHERE { }")) {
            Query q = QueryFactory.create(text);
            assertThrows(RuntimeException.class, () -> SparqlQueries.run(all, StandardPrefixes.mapping(), q,
                    SparqlQueries.Format.CSV), text);
        }
        assertEquals(0, CONNECTIONS.get(), "connections to the listener");
        assertNull(System.getProperty(TripwireFunction.LOADED), "a query loaded a class");
    }

    @Test
    void updatesAreRefusedAsUpdatesNotAsParserTokens() {
        for (String text : List.of("INSERT DATA { <urn:a> <urn:b> <urn:c> }", "DELETE WHERE { ?s ?p ?o }",
                "LOAD <" + endpoint + ">", "CLEAR ALL", "DROP GRAPH <urn:g>")) {
            InputException e = assertThrows(InputException.class, () -> SparqlQueries.parse(text, "q.rq"), text);
            assertTrue(e.getMessage().contains("updates are not supported"), e.getMessage());
            assertTrue(!e.getMessage().contains("Encountered"), e.getMessage());
        }
        assertEquals(0, CONNECTIONS.get());
    }

    @Test
    void anAllowedEndpointPassesTheCheckAndOthersStillDoNot() {
        Query q = SparqlQueries.parse("SELECT * WHERE { SERVICE <" + endpoint + "> { ?s ?p ?o } }", "-e",
                Set.of(endpoint));
        assertTrue(q.isSelectType());
        assertThrows(InputException.class, () -> SparqlQueries.parse(
                "SELECT * WHERE { SERVICE <http://127.0.0.1:1/other> { ?s ?p ?o } }", "-e", Set.of(endpoint)));
    }

    @Test
    void ordinaryQueriesStillRun() {
        String csv = SparqlQueries.run(all, StandardPrefixes.mapping(), SparqlQueries.parse(
                "SELECT (COUNT(?u) AS ?n) WHERE { ?u a/rdfs:subClassOf* brick:Terminal_Unit FILTER(STRLEN(STR(?u)) > 0) }",
                "-e"), SparqlQueries.Format.CSV);
        // Quillmoor Hall holds five fan coil units and one VAV box (see SparqlQueriesTest).
        assertEquals("n\r\n6\r\n", csv);
    }

    @Test
    void aJsonLdModelWithARemoteContextIsRefusedWithoutAConnection(@org.junit.jupiter.api.io.TempDir Path dir)
            throws Exception {
        // JSON-LD 1.1 (W3C 2020): a string @context is a remote context the processor would dereference.
        Path model = dir.resolve("remote.jsonld");
        java.nio.file.Files.writeString(model, "{\"@context\": \"" + endpoint + "/context.jsonld\", "
                + "\"@id\": \"urn:x#fcu\", \"@type\": \"Fan_Coil_Unit\"}");
        InputException e = assertThrows(InputException.class, () -> ModelLoader.load(model));
        assertTrue(e.getMessage().contains("would be fetched from the network"), e.getMessage());
        assertEquals(0, CONNECTIONS.get(), "connections to the listener");
        Path inline = dir.resolve("inline.jsonld");
        java.nio.file.Files.writeString(inline, "{\"@context\": {\"brick\": \"https://brickschema.org/schema/Brick#\"},"
                + " \"@id\": \"urn:x#fcu\", \"@type\": \"brick:Fan_Coil_Unit\"}");
        assertEquals(1, ModelLoader.load(inline).size());
    }
}
