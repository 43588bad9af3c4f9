package org.tufa.analysis.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.net.SocketTimeoutException;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.riot.RDFDataMgr;
import org.apache.jena.riot.RDFFormat;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.fleet.bench.FanCoilFleetModel;
import org.tufa.cli.Tufa;

/**
 * Models in a Jena TDB2 store: coverage and queries from the store answer what they answer from the Turtle file
 * (same bytes); two buildings live in two graphs; {@code tufa serve} answers SPARQL over HTTP on 127.0.0.1 with the
 * same rows, and refuses updates and SERVICE (the reference for the protocol: SPARQL 1.1 Protocol, W3C 2013).
 */
class ModelStoreTest {

    static Path dir;
    static Path modelA;
    static Path modelB;
    static Path store;

    static final String UNITS_QUERY = "SELECT ?unit ?label WHERE { ?unit a/rdfs:subClassOf* brick:Terminal_Unit ; "
            + "rdfs:label ?label } ORDER BY ?unit";

    @BeforeAll
    static void load(@TempDir Path tmp) throws Exception {
        dir = tmp;
        modelA = write("a.ttl", "urn:example:hollins#", "Hollins Yard", 3);
        modelB = write("b.ttl", "urn:example:pelham#", "Pelham Works", 2);
        store = dir.resolve("store");
        for (Path m : List.of(modelA, modelB)) {
            Run r = tufa("load", "--store", store.toString(), "--model", m.toString());
            assertEquals(0, r.code(), r.err());
            assertTrue(r.out().contains("into graph urn:example:"), r.out());
        }
    }

    private static Path write(String name, String base, String building, int units) throws Exception {
        List<FanCoilFleetModel.Unit> list = new ArrayList<>();
        for (int u = 1; u <= units; u++) {
            list.add(new FanCoilFleetModel.Unit("FCU-" + u, "FCU-" + u, "DEG_C", u % 2 == 0));
        }
        Model m = FanCoilFleetModel.build(base, building, "", list);
        Path file = dir.resolve(name);
        try (OutputStream out = Files.newOutputStream(file)) {
            RDFDataMgr.write(out, m, RDFFormat.TURTLE);
        }
        return file;
    }

    private record Run(int code, String out, String err) {
    }

    private static Run tufa(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Tufa.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Run(code, out.toString(), err.toString());
    }

    @Test
    void coverageFromTheStoreIsTheCoverageFromTheFile() throws Exception {
        Path fromFile = dir.resolve("cov-file");
        Path fromStore = dir.resolve("cov-store");
        Run a = tufa("coverage", "--model", modelA.toString(), "--out", fromFile.toString());
        Run b = tufa("coverage", "--store", store.toString(), "--graph", "urn:example:hollins#building", "--out",
                fromStore.toString());
        assertEquals(0, a.code(), a.err());
        assertEquals(0, b.code(), b.err());
        for (String f : List.of("coverage.csv", "coverage.json")) {
            assertEquals(Files.readString(fromFile.resolve(f)), Files.readString(fromStore.resolve(f)), f);
        }
        assertTrue(Files.readString(fromStore.resolve("coverage.csv")).lines().count() == 4, "three units");
    }

    @Test
    void analyzeFromTheStoreGivesTheFindingsOfTheFile() throws Exception {
        Model m = org.tufa.analysis.coverage.ModelLoader.load(modelA);
        var v = org.tufa.analysis.coverage.Vocabulary.standard();
        var coverage = org.tufa.analysis.coverage.Coverage.assess(m, v, v.profiles().profile("fcu-modes"),
                Set.of(org.tufa.analysis.coverage.Coverage.TERMINAL_UNIT));
        var targets = org.tufa.analysis.simulate.DemoTargets.from(coverage);
        var season = new org.tufa.analysis.simulate.Season(java.time.LocalDate.of(2031, 7, 1),
                java.time.LocalDate.of(2031, 7, 14), org.tufa.analysis.simulate.Season.DEMO_ZONE);
        Path trends = dir.resolve("trends-a.csv");
        org.tufa.analysis.simulate.DemoTrends.writeLong(trends, org.tufa.analysis.simulate.Simulator.run(
                new org.tufa.analysis.simulate.SimulationPlan(targets.units(), targets.building(), season, 9L,
                        List.of())));
        Path a = dir.resolve("an-file");
        Path b = dir.resolve("an-store");
        Run file = tufa("analyze", "--model", modelA.toString(), "--trends", trends.toString(), "--out",
                a.toString(), "--no-report", "--timezone", "America/Toronto");
        Run fromStore = tufa("analyze", "--store", store.toString(), "--graph", "urn:example:hollins#building",
                "--trends", trends.toString(), "--out", b.toString(), "--no-report", "--timezone", "America/Toronto");
        assertEquals(0, file.code(), file.err());
        assertEquals(0, fromStore.code(), fromStore.err());
        assertTrue(Files.readString(a.resolve("fleet.csv")).contains(",analyzed,"));
        for (String f : List.of("fleet.csv", "findings.csv", "ranking.csv", "coverage.csv")) {
            assertEquals(Files.readString(a.resolve(f)), Files.readString(b.resolve(f)), f);
        }
        assertTrue(Files.readString(b.resolve("run.json")).contains("\"model_store\""));
    }

    @Test
    void withTwoBuildingsTheGraphMustBeNamed() {
        Run r = tufa("coverage", "--store", store.toString(), "--out", dir.resolve("x").toString());
        assertEquals(1, r.code());
        assertTrue(r.err().contains("holds 2 buildings (urn:example:hollins#building, urn:example:pelham#building)")
                && r.err().contains("--graph"), r.err());
        Run missing = tufa("coverage", "--store", store.toString(), "--graph", "urn:example:nowhere", "--out",
                dir.resolve("y").toString());
        assertEquals(1, missing.code());
        assertTrue(missing.err().contains("has no graph urn:example:nowhere"), missing.err());
    }

    @Test
    void aQueryAnswersTheSameRowsFromTheStore() {
        Run file = tufa("query", "--model", modelB.toString(), "--format", "csv", "-e", UNITS_QUERY);
        Run graph = tufa("query", "--store", store.toString(), "--graph", "urn:example:pelham#building", "--format",
                "csv", "-e", UNITS_QUERY);
        assertEquals(0, file.code(), file.err());
        assertEquals(file.out(), graph.out());
        // Without --graph the query sees every building: 3 + 2 units.
        Run all = tufa("query", "--store", store.toString(), "--format", "csv", "-e", UNITS_QUERY);
        assertEquals(0, all.code(), all.err());
        assertEquals(1 + 5, all.out().strip().lines().count(), all.out());
    }

    @Test
    void serveAnswersSparqlOverHttpReadOnly() throws Exception {
        Run file = tufa("query", "--model", modelA.toString(), "--format", "csv", "-e", UNITS_QUERY);
        Set<String> expected = new TreeSet<>(file.out().strip().lines().skip(1).toList());
        HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
        try (ModelStore s = ModelStore.open(store, false);
             StoreServer server = StoreServer.start(s, true, 0)) {
            String endpoint = "http://127.0.0.1:" + server.port() + StoreServer.DATASET + "/sparql";
            String q = "PREFIX brick: <https://brickschema.org/schema/Brick#> PREFIX rdfs: "
                    + "<http://www.w3.org/2000/01/rdf-schema#> SELECT ?unit ?label WHERE { GRAPH "
                    + "<urn:example:hollins#building> { ?unit a brick:Fan_Coil_Unit ; rdfs:label ?label } }";
            HttpResponse<String> answer = http.send(HttpRequest.newBuilder(URI.create(endpoint + "?query="
                    + URLEncoder.encode(q, StandardCharsets.UTF_8))).header("Accept", "text/csv").GET().build(),
                    HttpResponse.BodyHandlers.ofString());
            assertEquals(200, answer.statusCode(), answer.body());
            Set<String> rows = new TreeSet<>(answer.body().strip().lines().skip(1).map(String::strip).toList());
            assertEquals(expected, rows);

            // The union default graph holds both buildings and the vocabulary (subclass reasoning over HTTP too).
            String all = "PREFIX brick: <https://brickschema.org/schema/Brick#> PREFIX rdfs: "
                    + "<http://www.w3.org/2000/01/rdf-schema#> SELECT (COUNT(?u) AS ?n) WHERE { ?u a/rdfs:subClassOf* "
                    + "brick:Terminal_Unit }";
            HttpResponse<String> count = http.send(HttpRequest.newBuilder(URI.create(endpoint + "?query="
                    + URLEncoder.encode(all, StandardCharsets.UTF_8))).header("Accept", "text/csv").GET().build(),
                    HttpResponse.BodyHandlers.ofString());
            assertEquals("5", count.body().strip().lines().skip(1).findFirst().orElse("").strip(), count.body());

            // No updates: the dataset has no update endpoint.
            HttpResponse<String> update = http.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:"
                    + server.port() + StoreServer.DATASET + "/update")).header("Content-Type",
                    "application/sparql-update").POST(HttpRequest.BodyPublishers.ofString(
                    "INSERT DATA { <urn:x> <urn:y> <urn:z> }")).build(), HttpResponse.BodyHandlers.ofString());
            assertTrue(update.statusCode() >= 400, "update refused: " + update.statusCode());
            HttpResponse<String> viaQuery = http.send(HttpRequest.newBuilder(URI.create(endpoint)).header(
                    "Content-Type", "application/sparql-update").POST(HttpRequest.BodyPublishers.ofString(
                    "INSERT DATA { <urn:x> <urn:y> <urn:z> }")).build(), HttpResponse.BodyHandlers.ofString());
            assertTrue(viaQuery.statusCode() >= 400, "update refused: " + viaQuery.statusCode());

            // SERVICE never connects: a listener on 127.0.0.1 sees no connection.
            try (ServerSocket trap = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
                trap.setSoTimeout(1500);
                String service = "SELECT * WHERE { SERVICE <http://127.0.0.1:" + trap.getLocalPort()
                        + "/sparql> { ?s ?p ?o } }";
                HttpResponse<String> refused = http.send(HttpRequest.newBuilder(URI.create(endpoint + "?query="
                        + URLEncoder.encode(service, StandardCharsets.UTF_8))).GET().build(),
                        HttpResponse.BodyHandlers.ofString());
                assertFalse(refused.statusCode() == 200 && refused.body().contains("\"s\""), refused.body());
                boolean connected;
                try {
                    trap.accept().close();
                    connected = true;
                } catch (SocketTimeoutException e) {
                    connected = false;
                }
                assertFalse(connected, "a SERVICE query reached the network");
            }
            // java: functions are not found, so no class is loaded by name.
            String java = "SELECT ?x WHERE { BIND(<java:org.apache.jena.sparql.function.library.sqrt>(4) AS ?x) }";
            HttpResponse<String> noJava = http.send(HttpRequest.newBuilder(URI.create(endpoint + "?query="
                    + URLEncoder.encode(java, StandardCharsets.UTF_8))).header("Accept", "text/csv").GET().build(),
                    HttpResponse.BodyHandlers.ofString());
            assertFalse(noJava.body().contains("2"), "java: function ran: " + noJava.body());
        }
        // The store is still as loaded.
        Run after = tufa("query", "--store", store.toString(), "--format", "csv", "-e",
                "SELECT * WHERE { <urn:x> ?p ?o }");
        assertEquals(1, after.out().strip().lines().count(), after.out());
    }
}
