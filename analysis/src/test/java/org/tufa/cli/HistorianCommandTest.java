package org.tufa.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.Reader;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.SQLException;
import java.time.LocalDate;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.riot.RDFDataMgr;
import org.apache.jena.riot.RDFFormat;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.postgresql.PGConnection;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.analysis.fleet.bench.FanCoilFleetModel;
import org.tufa.analysis.simulate.DemoTargets;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.Season;
import org.tufa.analysis.simulate.SimulationPlan;
import org.tufa.analysis.simulate.Simulator;
import org.tufa.analysis.trends.sql.TestDatabase;

/**
 * {@code analyze --trends jdbc:postgresql://...} on a real server: a database that is down, a wrong password, a
 * missing table or column, a value that is not a number, stamps without zone. Each is one line naming the database
 * and what to do, exit code 1, no stack trace, and the password appears in no message and no file. A series id
 * full of quotes is data, not SQL: it is read like any other.
 */
class HistorianCommandTest {

    static final String SECRET = "s3cret-Pa55-word";
    /** A series prefix that would break any query that pasted it into SQL text. */
    static final String QUOTED = "FCU'; DROP TABLE trend_samples; --\"x";
    static TestDatabase db;
    static Path dir;
    static Path model;
    static Path trends;
    static Path login;

    @BeforeAll
    static void setUp(@TempDir Path tmp) throws Exception {
        db = TestDatabase.connectOrSkip("historian command tests");
        dir = tmp;
        Model m = FanCoilFleetModel.build("urn:example:ashby#", "Ashby Lodge", "",
                List.of(new FanCoilFleetModel.Unit("FCU-1", QUOTED, "DEG_C", false)));
        model = dir.resolve("model.ttl");
        try (OutputStream out = Files.newOutputStream(model)) {
            RDFDataMgr.write(out, m, RDFFormat.TURTLE);
        }
        Vocabulary v = Vocabulary.standard();
        var coverage = Coverage.assess(m, v, v.profiles().profile("fcu-modes"), Set.of(Coverage.TERMINAL_UNIT));
        Season season = new Season(LocalDate.of(2031, 7, 1), LocalDate.of(2031, 7, 14), Season.DEMO_ZONE);
        DemoTargets targets = DemoTargets.from(coverage);
        trends = dir.resolve("trends.csv");
        DemoTrends.writeLong(trends, Simulator.run(new SimulationPlan(targets.units(), targets.building(), season,
                5L, List.of())));
        db.execute("CREATE TABLE trend_samples (series_id text, ts timestamptz, value double precision)");
        db.execute("CREATE INDEX ON trend_samples (series_id, ts)");
        try (Reader in = Files.newBufferedReader(trends, StandardCharsets.UTF_8)) {
            db.admin().unwrap(PGConnection.class).getCopyAPI().copyIn(
                    "COPY trend_samples (ts, series_id, value) FROM STDIN WITH (FORMAT csv, HEADER true)", in);
        }
        db.execute("CREATE TABLE text_samples (series_id text, ts timestamptz, value text)");
        db.execute("INSERT INTO text_samples SELECT series_id, ts, value::text FROM trend_samples");
        db.execute("UPDATE text_samples SET value = 'n/a' WHERE ts = (SELECT min(ts) + interval '1 day' FROM text_samples)");
        db.execute("CREATE TABLE naive_samples (series_id text, ts timestamp, value double precision)");
        db.execute("INSERT INTO naive_samples SELECT series_id, ts AT TIME ZONE 'America/Toronto', value FROM trend_samples");
        login = dir.resolve("login.properties");
        Files.writeString(login, "user = " + db.user + "\npassword = " + db.password + "\n");
    }

    @AfterAll
    static void drop() throws SQLException {
        if (db != null) {
            db.close();
        }
    }

    private record Run(int code, String out, String err, Path dir) {
    }

    private static Run analyze(Path out, String url, String... more) {
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        List<String> args = new java.util.ArrayList<>(List.of("analyze", "--model", model.toString(), "--trends", url,
                "--out", out.toString(), "--no-report", "--timezone", "America/Toronto", "--threads", "2"));
        args.addAll(List.of(more));
        int code = Tufa.execute(args.toArray(String[]::new), new PrintWriter(o, true), new PrintWriter(e, true));
        return new Run(code, o.toString(), e.toString(), out);
    }

    private static Path settings(String name, String text) throws Exception {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    /** One line on stderr, exit 1, no stack trace, the password nowhere: not in the output nor in any file. */
    private static void assertOneLineError(Run r, String... expected) throws Exception {
        assertEquals(ExitCodes.INPUT_ERROR, r.code(), r.err());
        String err = r.err().strip();
        assertEquals(1, err.lines().count(), err);
        assertTrue(err.startsWith("tufa: "), err);
        assertFalse(err.contains("\tat ") || err.contains("Exception"), err);
        for (String e : expected) {
            assertTrue(err.contains(e), "expected '" + e + "' in: " + err);
        }
        assertNoSecret(r);
    }

    private static void assertNoSecret(Run r) throws Exception {
        for (String text : List.of(r.out(), r.err())) {
            assertFalse(text.contains(SECRET) || text.contains(db.password), text);
        }
        if (Files.isDirectory(r.dir())) {
            try (Stream<Path> s = Files.walk(r.dir())) {
                for (Path p : s.filter(Files::isRegularFile).toList()) {
                    String content = new String(Files.readAllBytes(p), StandardCharsets.ISO_8859_1);
                    assertFalse(content.contains(SECRET) || content.contains(db.password), p.toString());
                }
            }
        }
    }

    @Test
    void aSeriesIdFullOfQuotesIsReadAsDataAndGivesTheCsvRunsFindings() throws Exception {
        Run fromDb = analyze(dir.resolve("quoted-db"), db.schemaUrl(), "--db-login", login.toString());
        assertEquals(ExitCodes.OK, fromDb.code(), fromDb.err());
        Run fromFile = analyze(dir.resolve("quoted-csv"), trends.toString());
        assertEquals(ExitCodes.OK, fromFile.code(), fromFile.err());
        String fleet = Files.readString(fromDb.dir().resolve("fleet.csv"));
        assertTrue(fleet.contains(",analyzed,"), fleet);
        for (String f : List.of("fleet.csv", "findings.csv", "ranking.csv")) {
            assertEquals(Files.readString(fromFile.dir().resolve(f)), Files.readString(fromDb.dir().resolve(f)), f);
        }
        // The table is still there, and run.json names the database without login or URL options.
        db.execute("SELECT count(*) FROM trend_samples");
        String run = Files.readString(fromDb.dir().resolve("run.json"));
        assertTrue(run.contains("\"trends_database\": \"jdbc:postgresql://"), run);
        assertFalse(run.contains("currentSchema"), run);
        assertNoSecret(fromDb);
    }

    @Test
    void aServerThatIsNotThereIsOneLine(@TempDir Path out) throws Exception {
        Run r = analyze(out, "jdbc:postgresql://127.0.0.1:1/historian", "--db-login", login.toString());
        assertOneLineError(r, "jdbc:postgresql://127.0.0.1:1/historian", "cannot connect", "check the host and port");
    }

    @Test
    void aWrongPasswordIsRefusedWithoutShowingIt(@TempDir Path out) throws Exception {
        Path wrong = settings("wrong-login.properties", "user = " + db.user + "\npassword = " + SECRET + "\n");
        Run r = analyze(out, db.schemaUrl(), "--db-login", wrong.toString());
        assertOneLineError(r, "refused the login of user '" + db.user + "'", "--db-login");
    }

    @Test
    void aPasswordOnTheCommandLineIsRefused(@TempDir Path out) throws Exception {
        Run r = analyze(out, db.url + "?user=" + db.user + "&password=" + SECRET);
        assertOneLineError(r, "the URL holds a password", "TUFA_DB_PASSWORD");
    }

    @Test
    void aMissingTableNamesItAndTheSettingsFile(@TempDir Path out) throws Exception {
        Path s = settings("missing-table.properties", "table = trend_history\n");
        Run r = analyze(out, db.schemaUrl(), "--db-login", login.toString(), "--historian", s.toString());
        assertOneLineError(r, "no table 'trend_history'", s.toString());
    }

    @Test
    void aDatabaseWithoutTheModelsSeriesSaysSo(@TempDir Path out) throws Exception {
        // Every series of another building: not an input error, a model and a database that do not match (exit 3).
        db.execute("CREATE TABLE other_samples (series_id text, ts timestamptz, value double precision)");
        db.execute("INSERT INTO other_samples VALUES ('OTHER.ZN-T', '2031-07-01T00:00:00Z', 21.5)");
        Path s = settings("other.properties", "table = other_samples\n");
        Run r = analyze(out, db.schemaUrl(), "--db-login", login.toString(), "--historian", s.toString());
        assertEquals(ExitCodes.CHECK_FAILED, r.code(), r.err());
        String err = r.err().strip();
        assertTrue(err.lines().anyMatch(l -> l.startsWith("tufa: the database (") && l.contains("holds no row of "
                + "any series of the model") && l.contains("ref:hasTimeseriesId")), err);
        assertFalse(err.contains("trend files"), err);
        assertNoSecret(r);
    }

    @Test
    void aMissingColumnListsTheColumnsThereAre(@TempDir Path out) throws Exception {
        Path s = settings("missing-column.properties", "value_column = reading\n");
        Run r = analyze(out, db.schemaUrl(), "--db-login", login.toString(), "--historian", s.toString());
        assertOneLineError(r, "no column 'reading'", "it has series_id, ts, value", "value_column");
    }

    @Test
    void aValueThatIsNotANumberNamesSeriesTimeAndValue(@TempDir Path out) throws Exception {
        Path s = settings("text.properties", "table = text_samples\n");
        Run r = analyze(out, db.schemaUrl(), "--db-login", login.toString(), "--historian", s.toString());
        assertOneLineError(r, "table text_samples", "value 'n/a' is not a number",
                "double precision");
    }

    @Test
    void stampsWithoutZoneNeedTheTimezoneOption(@TempDir Path out) throws Exception {
        Path s = settings("naive.properties", "table = naive_samples\n");
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = Tufa.execute(new String[] {"analyze", "--model", model.toString(), "--trends", db.schemaUrl(),
            "--out", out.toString(), "--no-report", "--db-login", login.toString(), "--historian", s.toString()},
                new PrintWriter(o, true), new PrintWriter(e, true));
        assertOneLineError(new Run(code, o.toString(), e.toString(), out), "time stamps without zone",
                "--timezone");
    }

    @Test
    void stampsWithoutZoneReadWithTheTimezoneGiveTheSameFindings(@TempDir Path out) throws Exception {
        Path s = settings("naive-ok.properties", "table = naive_samples\n");
        Run naive = analyze(out.resolve("naive"), db.schemaUrl(), "--db-login", login.toString(), "--historian",
                s.toString());
        assertEquals(ExitCodes.OK, naive.code(), naive.err());
        Run zoned = analyze(out.resolve("zoned"), db.schemaUrl(), "--db-login", login.toString());
        // July: no daylight-saving change inside the data, so local times map one to one onto instants.
        assertEquals(Files.readString(zoned.dir().resolve("findings.csv")),
                Files.readString(naive.dir().resolve("findings.csv")));
    }
}
