package org.tufa.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Bad input to tufa labels and tufa diagnose: a one-line error naming the file and what to do, exit code 1. */
class ReviewCommandsTest {

    record Run(int code, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Tufa.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Run(code, out.toString(), err.toString());
    }

    static void oneLineError(Run r, String... parts) {
        assertEquals(ExitCodes.INPUT_ERROR, r.code(), r.err());
        assertEquals(1, r.err().strip().lines().count(), "one line: " + r.err());
        assertFalse(r.err().contains("Exception"), r.err());
        for (String p : parts) {
            assertTrue(r.err().contains(p), "names " + p + ": " + r.err());
        }
    }

    @Test
    void labelsNamesTheMissingAnalysisFolderAndTheBadFormat(@TempDir Path dir) throws Exception {
        Path review = Files.writeString(dir.resolve("review.csv"), "unit,mode,kind,start,end,finding_id,verdict,"
                + "cause,note,reviewer,date\n");
        oneLineError(run("labels", "--analysis", dir.resolve("nowhere").toString(), "--review", review.toString(),
                "--out", dir.resolve("out").toString()), "nowhere", "tufa analyze");
        oneLineError(run("labels", "--analysis", dir.toString(), "--review", review.toString(), "--out",
                dir.resolve("out").toString(), "--format", "xlsx"), "--format", "parquet or csv");
        Files.createDirectories(dir.resolve("run"));
        Files.writeString(dir.resolve("run").resolve("fleet.csv"), "unit,label,folder\nu,l,f\n");
        oneLineError(run("labels", "--analysis", dir.resolve("run").toString(), "--review", review.toString(),
                "--out", dir.resolve("out").toString()), "fleet.csv", "status");
    }

    @Test
    void diagnoseNamesTheMissingIndexAndABrokenOne(@TempDir Path dir) throws Exception {
        oneLineError(run("diagnose", "--labels", dir.toString(), "--out", dir.resolve("out").toString()),
                "labels.json", "tufa labels");
        Files.writeString(dir.resolve("labels.json"), "{\"files\": 3}");
        oneLineError(run("diagnose", "--labels", dir.toString(), "--out", dir.resolve("out").toString()),
                "labels.json", "run tufa labels again");
        Files.writeString(dir.resolve("labels.json"), "{\"files\": [], \"verdicts\": []}");
        oneLineError(run("diagnose", "--labels", dir.toString(), "--out", dir.resolve("out").toString()),
                "no reviewed unit");
        oneLineError(run("diagnose", "--labels", dir.toString(), "--out", dir.resolve("out").toString(),
                "--trees", "0"), "--trees");
    }
}
