package org.tufa.analysis.tables;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.util.List;

/**
 * A per-sample table as CSV: a header row of the column names, then one line per row. Text values are written as
 * they are (tufa's per-sample text columns hold mode names only); numbers read back to the same double.
 */
final class CsvSampleTable implements SampleTable {

    private final BufferedWriter out;
    private boolean rowStarted;

    CsvSampleTable(OutputStream stream, List<SampleColumn> columns) throws IOException {
        this.out = new BufferedWriter(new OutputStreamWriter(stream, StandardCharsets.UTF_8), 1 << 16);
        out.write(String.join(",", columns.stream().map(SampleColumn::name).toList()));
        out.write('\n');
    }

    private void next() throws IOException {
        if (rowStarted) {
            out.write(',');
        }
        rowStarted = true;
    }

    @Override
    public void time(long epochSecond, String text) throws IOException {
        next();
        out.write(text);
    }

    @Override
    public void text(String value) throws IOException {
        next();
        out.write(value);
    }

    @Override
    public void flag(Boolean value) throws IOException {
        next();
        if (value != null) {
            out.write(value ? "true" : "false");
        }
    }

    @Override
    public void real(double value) throws IOException {
        next();
        out.write(SampleTable.csvNumber(value));
    }

    @Override
    public void single(double value) throws IOException {
        next();
        out.write(SampleTable.csvSingle(value));
    }

    @Override
    public void integer(int value) throws IOException {
        next();
        out.write(Integer.toString(value));
    }

    @Override
    public void endRow() throws IOException {
        out.write('\n');
        rowStarted = false;
    }

    @Override
    public void close() throws IOException {
        out.flush(); // the stream is closed (and renamed into place) by SampleTable.write
    }
}
