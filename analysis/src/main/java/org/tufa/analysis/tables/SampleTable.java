package org.tufa.analysis.tables;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.tufa.common.OutputFiles;

/**
 * A per-sample table being written, one row at a time: call the value method of each column in column order, then
 * {@link #endRow}. Not thread-safe: one writer per file. Closing it ends the table; the stream it writes to belongs
 * to {@link #write}.
 */
public interface SampleTable extends AutoCloseable {

    /**
     * Writes {@code dir/<name>.<extension>}, replacing it, through {@link OutputFiles}: to a temporary file beside it,
     * renamed into place once complete, so a reader never sees half a table.
     *
     * @param rows writes every row
     * @throws org.tufa.common.InputException when the file cannot be written (naming it and why)
     */
    static void write(Path dir, String name, SampleFormat format, List<SampleColumn> columns,
                      OutputFiles.Content<SampleTable> rows) {
        Path file = dir.resolve(name + "." + format.extension());
        OutputFiles.write(file, out -> {
            try (SampleTable t = format == SampleFormat.PARQUET
                    ? new ParquetSampleTable(new StreamOutputFile(out, file.toString()), columns)
                    : new CsvSampleTable(out, columns)) {
                rows.writeTo(t);
            }
        });
    }

    /**
     * Removes {@code dir/<name>.<extension>} in every format but {@code keep} (none when {@code keep} is null): a
     * table left by an earlier run into the same folder, in the other format or of a mode no longer analysed, would
     * otherwise be read back as this run's.
     *
     * @throws org.tufa.common.InputException when a file cannot be removed (naming it and why)
     */
    static void removeStale(Path dir, String name, SampleFormat keep) {
        for (SampleFormat f : SampleFormat.values()) {
            if (f != keep) {
                Path file = dir.resolve(name + "." + f.extension());
                try {
                    java.nio.file.Files.deleteIfExists(file);
                } catch (java.io.IOException e) {
                    throw org.tufa.common.InputException.in(file, "cannot remove this table of an earlier run ("
                            + OutputFiles.reason(e) + "); remove it, or give another output folder");
                }
            }
        }
    }

    /**
     * A double as tufa's CSV files write it: a decimal that parses back to the same double (Double.toString);
     * inf, -inf and nan as numpy and pandas read them.
     */
    static String csvNumber(double v) {
        if (Double.isNaN(v)) {
            return "nan";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        return Double.toString(v);
    }

    /** A number rounded to single precision as tufa's CSV files write it: Float.toString; inf, -inf, nan. */
    static String csvSingle(double v) {
        float f = (float) v;
        if (Float.isNaN(f)) {
            return "nan";
        }
        if (Float.isInfinite(f)) {
            return f > 0 ? "inf" : "-inf";
        }
        return Float.toString(f);
    }

    /** A TIME value: the instant in epoch seconds, and its ISO-8601 text with offset (what CSV writes). */
    void time(long epochSecond, String text) throws IOException;

    void text(String value) throws IOException;

    /** A FLAG value; null for none. */
    void flag(Boolean value) throws IOException;

    void real(double value) throws IOException;

    /** A SINGLE value: rounded to the nearest float. */
    void single(double value) throws IOException;

    void integer(int value) throws IOException;

    /** Ends the current row. */
    void endRow() throws IOException;

    @Override
    void close() throws IOException;
}
