package org.tufa.common;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The shared writer: all or nothing, no temporary file left, outputs that would destroy inputs refused first. */
class OutputFilesTest {
    @TempDir
    Path dir;

    private long files() throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.count();
        }
    }

    @Test
    void aWriteThatFailsHalfWayLeavesTheOldFileAndNoTemporaryFile() throws IOException {
        Path target = dir.resolve("model.ttl");
        Files.writeString(target, "old complete content\n");
        InputException e = assertThrows(InputException.class, () -> OutputFiles.write(target, out -> {
            out.write("half of the new".getBytes());
            throw new IOException("No space left on device");
        }));
        assertTrue(e.getMessage().startsWith(target + ": cannot write (the disk is full"), e.getMessage());
        assertEquals("old complete content\n", Files.readString(target));
        assertEquals(1, files(), "no temporary file left");
        OutputFiles.writeString(target, "new\n");
        assertEquals("new\n", Files.readString(target));
        assertEquals(1, files());
    }

    @Test
    void aFolderThatIsAFileIsOneLineErrorNotABug() throws IOException {
        Path plain = dir.resolve("plain");
        Files.writeString(plain, "x");
        InputException e = assertThrows(InputException.class, () -> OutputFiles.checkFolder("--out", plain));
        assertTrue(e.getMessage().contains("--out names a file, not a folder"), e.getMessage());
        assertThrows(InputException.class, () -> OutputFiles.writeString(plain.resolve("fleet.csv"), "x"));
        assertThrows(InputException.class, () -> OutputFiles.checkFolder("--out", plain.resolve("sub")));
        OutputFiles.checkFolder("--out", dir.resolve("new").resolve("deeper"));
        assertEquals(1, files(), "checkFolder creates nothing");
    }

    @Test
    void outputsThatAreAnInputOrEachOtherAreRefused() throws IOException {
        Path points = dir.resolve("points.csv");
        Files.writeString(points, "Point Name\nA\n");
        Map<String, Path> in = new LinkedHashMap<>();
        in.put("--points", points);
        Map<String, Path> out = new LinkedHashMap<>();
        // The same file by another spelling: a ./ and a .. step.
        out.put("--out", dir.resolve("sub").resolve("..").resolve("./points.csv"));
        InputException e = assertThrows(InputException.class, () -> OutputFiles.checkDistinct(in, out));
        assertTrue(e.getMessage().contains("--out names the same file as --points"), e.getMessage());
        Map<String, Path> two = new LinkedHashMap<>();
        two.put("--out", dir.resolve("o.ttl"));
        two.put("--report", dir.resolve("o.ttl"));
        e = assertThrows(InputException.class, () -> OutputFiles.checkDistinct(in, two));
        assertTrue(e.getMessage().contains("--report and --out name the same file"), e.getMessage());
        Path link = dir.resolve("link.csv");
        Files.createSymbolicLink(link, points);
        assertThrows(InputException.class, () -> OutputFiles.checkDistinct(in, Map.of("--out", link)));
        assertEquals("Point Name\nA\n", Files.readString(points));
    }
}
