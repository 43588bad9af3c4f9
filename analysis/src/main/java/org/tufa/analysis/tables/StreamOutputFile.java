package org.tufa.analysis.tables;

import java.io.OutputStream;
import org.apache.parquet.io.OutputFile;
import org.apache.parquet.io.PositionOutputStream;

/**
 * A Parquet output over a stream someone else owns: the temporary file {@link org.tufa.common.OutputFiles} renames
 * into place once the footer is written. Closing the Parquet writer flushes the stream and leaves it open.
 *
 * <p>parquet-java lists each column chunk's encodings in the footer in the order of a {@code HashSet} of enum
 * constants, whose iteration order follows identity hash codes and so changes from one JVM run to the next: the
 * same table would get other bytes on every run. The stream therefore holds back the end of the file and, once the
 * writer closes it, writes the footer again with every encoding list in ascending order of its Thrift value
 * ({@link FooterOrderingStream}); the data pages are passed on as they come.
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
        return new FooterOrderingStream(out);
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
