package org.tufa.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.jena.riot.RDFDataMgr;
import org.apache.jena.riot.RDFFormat;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.fleet.bench.FanCoilFleetModel;

/** The analyze command's answers to input it cannot use: one line, a reason, a non-zero exit code. */
class AnalyzeCommandTest {

    private static Path model(Path dir) throws Exception {
        Path file = dir.resolve("model.ttl");
        try (OutputStream out = Files.newOutputStream(file)) {
            RDFDataMgr.write(out, FanCoilFleetModel.build("urn:example:ashby#", "Ashby Lodge", "",
                    List.of(new FanCoilFleetModel.Unit("FCU-1", "FCU-1", "DEG_C", false))), RDFFormat.TURTLE);
        }
        return file;
    }

    private static int run(StringWriter out, StringWriter err, String... args) {
        return Tufa.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
    }

    @Test
    void trendsWithNoSeriesOfTheModelSaySoAndExitThree(@TempDir Path dir) throws Exception {
        Path trends = dir.resolve("trends.csv");
        Files.writeString(trends, "timestamp,point,value\n2031-07-01T08:00:00Z,ROOM-TEMP-7,21.5\n");
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = run(out, err, "analyze", "--model", model(dir).toString(), "--trends", trends.toString(),
                "--out", dir.resolve("out").toString(), "--no-report");
        assertEquals(ExitCodes.CHECK_FAILED, code, err.toString());
        assertTrue(err.toString().contains("no trend sample belongs to a point of the model")
                && err.toString().contains("ROOM-TEMP-7"), err.toString());
        // Every unit is still accounted for.
        assertTrue(Files.readString(dir.resolve("out").resolve("fleet.csv")).contains("FCU-1,FCU-1,skipped"));
    }

    @Test
    void badOptionValuesAreOneLineErrorsBeforeAnyFileIsRead(@TempDir Path dir) {
        StringWriter err = new StringWriter();
        int code = run(new StringWriter(), err, "analyze", "--model", dir.resolve("absent.ttl").toString(),
                "--trends", "t.csv", "--out", dir.toString(), "--xi", "2");
        assertEquals(ExitCodes.INPUT_ERROR, code);
        assertEquals(1, err.toString().trim().lines().count(), err.toString());
        assertTrue(err.toString().startsWith("tufa: --min-pts must be >= 2"), err.toString());
    }

    @Test
    void missingTrendFileNamesIt(@TempDir Path dir) throws Exception {
        StringWriter err = new StringWriter();
        int code = run(new StringWriter(), err, "analyze", "--model", model(dir).toString(), "--trends",
                dir.resolve("none.csv").toString(), "--out", dir.resolve("out").toString());
        assertEquals(ExitCodes.INPUT_ERROR, code);
        assertTrue(err.toString().contains("none.csv") && err.toString().lines().count() == 1, err.toString());
    }
}
