package org.tufa.analysis.tables;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.parquet.format.ColumnChunk;
import org.apache.parquet.format.Encoding;
import org.apache.parquet.format.FileMetaData;
import org.apache.parquet.format.RowGroup;
import org.apache.parquet.format.Util;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Same table, same bytes, in every JVM run: parquet-java orders each column chunk's encodings by a hash set of
 * enum constants (identity hash codes, new in every run); {@link FooterOrderingStream} sorts them. The footer
 * layout is the Parquet format specification's ("File format": footer, 4-byte little-endian length, PAR1).
 */
class ParquetBytesAcrossRunsTest {

    static final List<SampleColumn> COLUMNS = List.of(SampleColumn.time("timestamp"), SampleColumn.text("mode"),
            SampleColumn.flag("in_band"), SampleColumn.real("value"), SampleColumn.integer("cluster"));

    /**
     * Writes the fixture table into the folder named by the first argument (run in a child JVM by the test), after
     * asking for the identity hash codes of as many new objects as the second says: another history of the
     * program before it writes, as a real run has (threads, other tables), which moves every identity hash code
     * given out after it.
     */
    public static void main(String[] args) {
        int spent = 0;
        for (int i = 0; i < Integer.parseInt(args[1]); i++) {
            spent ^= System.identityHashCode(new Object());
        }
        write(Path.of(args[0]));
        System.out.println(spent == 42 ? "" : "written");
    }

    static Path write(Path dir) {
        SampleTable.write(dir, "fixture", SampleFormat.PARQUET, COLUMNS, t -> {
            for (int i = 0; i < 5000; i++) {
                t.time(1_900_000_000L + 900L * i, "");
                t.text(i % 3 == 0 ? "cooling" : i % 3 == 1 ? "heating" : "off");
                t.flag(i % 7 == 0 ? null : i % 2 == 0);
                t.real(Math.sin(i / 10.0) * 3 + (i % 5) * 0.01);
                t.integer(i % 4 - 1);
                t.endRow();
            }
        });
        return dir.resolve("fixture.parquet");
    }

    static FileMetaData footer(byte[] file) throws Exception {
        int n = file.length;
        int length = ByteBuffer.wrap(file, n - 8, 4).order(ByteOrder.LITTLE_ENDIAN).getInt();
        return Util.readFileMetaData(new ByteArrayInputStream(file, n - 8 - length, length));
    }

    @Test
    void everyColumnListsItsEncodingsInAscendingOrder(@TempDir Path dir) throws Exception {
        FileMetaData meta = footer(Files.readAllBytes(write(dir)));
        int chunks = 0;
        for (RowGroup g : meta.getRow_groups()) {
            for (ColumnChunk c : g.getColumns()) {
                List<Encoding> encodings = c.getMeta_data().getEncodings();
                List<Encoding> sorted = new ArrayList<>(encodings);
                sorted.sort(java.util.Comparator.comparingInt(Encoding::getValue));
                assertEquals(sorted, encodings, c.getMeta_data().getPath_in_schema().toString());
                chunks++;
            }
        }
        assertEquals(COLUMNS.size(), chunks);
        assertEquals(5000, meta.getNum_rows());
    }

    @Test
    void threeJvmRunsWriteTheSameBytes(@TempDir Path dir) throws Exception {
        String javaBin = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        byte[] first = null;
        for (int run = 0; run < 3; run++) {
            Path out = Files.createDirectories(dir.resolve("run" + run));
            Process p = new ProcessBuilder(javaBin, "-cp", System.getProperty("java.class.path"),
                    ParquetBytesAcrossRunsTest.class.getName(), out.toString(), String.valueOf(run * 997))
                    .redirectErrorStream(true).start();
            String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            assertEquals(0, p.waitFor(), log);
            byte[] bytes = Files.readAllBytes(out.resolve("fixture.parquet"));
            assertTrue(bytes.length > 1000);
            if (first == null) {
                first = bytes;
            } else {
                assertArrayEquals(first, bytes, "run " + run + " wrote other bytes");
            }
        }
        // The child runs write what this JVM writes.
        assertArrayEquals(first, Files.readAllBytes(write(dir)));
    }
}
