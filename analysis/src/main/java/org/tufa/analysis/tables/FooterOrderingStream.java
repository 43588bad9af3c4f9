package org.tufa.analysis.tables;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.Comparator;
import org.apache.parquet.format.ColumnChunk;
import org.apache.parquet.format.FileMetaData;
import org.apache.parquet.format.RowGroup;
import org.apache.parquet.format.Util;
import org.apache.parquet.io.PositionOutputStream;

/**
 * The stream a Parquet file is written through: bytes pass on to {@code out}, except the last {@link #HOLD_BACK}
 * to {@code 2 * HOLD_BACK} of them, which are held until {@link #close}. The file ends with its footer (Thrift
 * {@code FileMetaData}), the footer's length (4 bytes, little-endian) and {@code PAR1} (the Parquet format
 * specification, "File format"); on close the held-back tail holds the whole footer, which is read, given every
 * column chunk's encodings in ascending order, and written again. Reordering a list changes no offset: the data
 * pages before the footer are untouched, and the footer's new length is written after it.
 */
final class FooterOrderingStream extends PositionOutputStream {

    /** Bytes held back at least: far above the footer of a per-sample table (a few kB for ten columns). */
    static final int HOLD_BACK = 1 << 20;

    private static final byte[] MAGIC = "PAR1".getBytes(StandardCharsets.US_ASCII);

    private final OutputStream out;
    private byte[] tail = new byte[1 << 16]; // grows up to 2 * HOLD_BACK: most tables are smaller
    private int held;
    private long position;
    private boolean closed;

    FooterOrderingStream(OutputStream out) {
        this.out = out;
    }

    @Override
    public long getPos() {
        return position;
    }

    @Override
    public void write(int b) throws IOException {
        write(new byte[] {(byte) b}, 0, 1);
    }

    @Override
    public void write(byte[] b, int off, int len) throws IOException {
        position += len;
        while (len > 0) {
            if (held == tail.length && tail.length < 2 * HOLD_BACK) {
                tail = Arrays.copyOf(tail, 2 * tail.length);
            } else if (held == tail.length) {
                // Pass on the older half; keep the newer half held back.
                out.write(tail, 0, HOLD_BACK);
                System.arraycopy(tail, HOLD_BACK, tail, 0, held - HOLD_BACK);
                held -= HOLD_BACK;
            }
            int n = Math.min(len, tail.length - held);
            System.arraycopy(b, off, tail, held, n);
            held += n;
            off += n;
            len -= n;
        }
    }

    @Override
    public void flush() throws IOException {
        out.flush();
    }

    /** Writes the held-back tail with the footer's encodings in order, flushes, and leaves {@code out} open. */
    @Override
    public void close() throws IOException {
        if (closed) {
            return;
        }
        closed = true;
        out.write(ordered(Arrays.copyOf(tail, held)));
        out.flush();
        tail = null;
    }

    /**
     * The tail of a Parquet file with its footer's encoding lists sorted.
     *
     * @throws IOException when the tail does not end with a whole footer (a file that is not Parquet, or a footer
     *                     larger than the held-back bytes)
     */
    static byte[] ordered(byte[] tail) throws IOException {
        int n = tail.length;
        if (n < 8 || !Arrays.equals(Arrays.copyOfRange(tail, n - 4, n), MAGIC)) {
            throw new IOException("the Parquet writer ended its file without the PAR1 magic");
        }
        int footerLength = ByteBuffer.wrap(tail, n - 8, 4).order(ByteOrder.LITTLE_ENDIAN).getInt();
        int footerStart = n - 8 - footerLength;
        if (footerLength < 0 || footerStart < 0) {
            throw new IOException("the Parquet footer (" + footerLength + " bytes) is longer than the "
                    + n + " bytes held back");
        }
        FileMetaData meta = Util.readFileMetaData(new ByteArrayInputStream(tail, footerStart, footerLength));
        if (meta.getRow_groups() != null) {
            for (RowGroup g : meta.getRow_groups()) {
                for (ColumnChunk c : g.getColumns()) {
                    if (c.isSetMeta_data() && c.getMeta_data().getEncodings() != null) {
                        c.getMeta_data().getEncodings().sort(Comparator.comparingInt(e -> e.getValue()));
                    }
                }
            }
        }
        ByteArrayOutputStream footer = new ByteArrayOutputStream(footerLength);
        Util.writeFileMetaData(meta, footer);
        ByteArrayOutputStream result = new ByteArrayOutputStream(n);
        result.write(tail, 0, footerStart);
        footer.writeTo(result);
        result.write(ByteBuffer.allocate(4).order(ByteOrder.LITTLE_ENDIAN).putInt(footer.size()).array());
        result.write(MAGIC);
        return result.toByteArray();
    }
}
