package org.tufa.analysis.tables;

import java.io.IOException;
import java.io.OutputStream;
import org.apache.parquet.io.OutputFile;
import org.apache.parquet.io.PositionOutputStream;

/**
 * A Parquet output over a stream someone else owns: the temporary file {@link org.tufa.common.OutputFiles} renames
 * into place once the footer is written. Closing the Parquet writer flushes the stream and leaves it open.
 */
final class StreamOutputFile implements OutputFile {

    private final OutputStream out;
    private final String path;

    /**
     * @param out the stream to write to
     * @param path the file it becomes, for parquet-java's messages
     */
    StreamOutputFile(OutputStream out, String path) {
        this.out = out;
        this.path = path;
    }

    @Override
    public PositionOutputStream create(long blockSizeHint) {
        return new PositionOutputStream() {
            private long position;

            @Override
            public long getPos() {
                return position;
            }

            @Override
            public void write(int b) throws IOException {
                out.write(b);
                position++;
            }

            @Override
            public void write(byte[] b, int off, int len) throws IOException {
                out.write(b, off, len);
                position += len;
            }

            @Override
            public void flush() throws IOException {
                out.flush();
            }

            @Override
            public void close() throws IOException {
                out.flush();
            }
        };
    }

    @Override
    public PositionOutputStream createOrOverwrite(long blockSizeHint) {
        return create(blockSizeHint);
    }

    @Override
    public boolean supportsBlockSize() {
        return false;
    }

    @Override
    public long defaultBlockSize() {
        return 0;
    }

    @Override
    public String getPath() {
        return path;
    }
}
