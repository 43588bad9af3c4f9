package org.tufa.analysis.tables;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

/**
 * A per-sample table being written, one row at a time: call the value method of each column in column order, then
 * {@link #endRow}. Not thread-safe: one writer per file.
 */
public interface SampleTable extends AutoCloseable {

    /**
     * Opens {@code dir/<name>.<extension>} for writing, replacing it.
     *
     * @throws IOException when the file cannot be created
     */
    static SampleTable open(Path dir, String name, SampleFormat format, List<SampleColumn> columns)
            throws IOException {
        Path file = dir.resolve(name + "." + format.extension());
        return format == SampleFormat.PARQUET ? new ParquetSampleTable(file, columns)
                : new CsvSampleTable(file, columns);
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

    /** A TIME value: the instant in epoch seconds, and its ISO-8601 text with offset (what CSV writes). */
    void time(long epochSecond, String text) throws IOException;

    void text(String value) throws IOException;

    /** A FLAG value; null for none. */
    void flag(Boolean value) throws IOException;

    void real(double value) throws IOException;

    void integer(int value) throws IOException;

    /** Ends the current row. */
    void endRow() throws IOException;

    @Override
    void close() throws IOException;
}
