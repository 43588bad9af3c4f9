package org.tufa.analysis.tables;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.util.zip.GZIPInputStream;
import java.util.zip.CRC32;
import java.util.zip.Deflater;
import org.apache.parquet.bytes.BytesInput;
import org.apache.parquet.compression.CompressionCodecFactory;
import org.apache.parquet.hadoop.metadata.CompressionCodecName;

/**
 * Parquet page compression with {@code java.util.zip}: GZIP, one of the codecs the Parquet format defines (RFC 1952
 * streams) and every reader supports, and UNCOMPRESSED. Parquet-java's own codec factory goes through Hadoop's
 * codec classes, and its Snappy and Zstandard paths load native libraries; this one needs neither, which keeps
 * tufa's jar free of Hadoop and of native code for four platforms. The gzip header carries no time, so the same
 * pages give the same bytes.
 */
final class GzipCodecs implements CompressionCodecFactory {

    /** Deflate level 1: on the demo summer's tables as small as zlib's default level 6 (31 vs 30 MB), much faster. */
    private static final int LEVEL = 1;

    /** Deflaters of the compressors handed out, ended on {@link #release}. */
    private final java.util.List<Deflater> deflaters = new java.util.ArrayList<>();

    @Override
    public synchronized BytesInputCompressor getCompressor(CompressionCodecName codec) {
        check(codec);
        if (codec == CompressionCodecName.UNCOMPRESSED) {
            return new Uncompressed();
        }
        Deflater deflater = new Deflater(LEVEL, true);
        deflaters.add(deflater);
        return new GzipCompressor(deflater);
    }

    @Override
    public BytesInputDecompressor getDecompressor(CompressionCodecName codec) {
        check(codec);
        return new BytesInputDecompressor() {
            @Override
            public BytesInput decompress(BytesInput bytes, int uncompressedSize) throws IOException {
                if (codec == CompressionCodecName.UNCOMPRESSED) {
                    return bytes;
                }
                try (InputStream in = new GZIPInputStream(bytes.toInputStream())) {
                    return BytesInput.from(in.readNBytes(uncompressedSize));
                }
            }

            @Override
            public void decompress(ByteBuffer input, int compressedSize, ByteBuffer output, int uncompressedSize)
                    throws IOException {
                byte[] compressed = new byte[compressedSize];
                input.get(compressed);
                BytesInput out = decompress(BytesInput.from(compressed), uncompressedSize);
                output.put(out.toByteArray());
            }

            @Override
            public void release() {
                // nothing pooled
            }
        };
    }

    private static void check(CompressionCodecName codec) {
        if (codec != CompressionCodecName.GZIP && codec != CompressionCodecName.UNCOMPRESSED) {
            throw new UnsupportedOperationException("tufa reads and writes Parquet pages compressed with GZIP or "
                    + "not at all, not " + codec);
        }
    }

    @Override
    public synchronized void release() {
        deflaters.forEach(Deflater::end);
        deflaters.clear();
    }

    /** Pages as they are. */
    private static final class Uncompressed implements BytesInputCompressor {
        @Override
        public BytesInput compress(BytesInput bytes) {
            return bytes;
        }

        @Override
        public CompressionCodecName getCodecName() {
            return CompressionCodecName.UNCOMPRESSED;
        }

        @Override
        public void release() {
            // nothing held
        }
    }

    /**
     * One gzip member per page (RFC 1952: a 10-byte header without name or time, the raw deflate stream, CRC-32
     * and length), with one deflater reused from page to page: a column chunk's pages are compressed one after
     * another on one thread.
     */
    private static final class GzipCompressor implements BytesInputCompressor {
        private static final byte[] HEADER = {0x1f, (byte) 0x8b, 8, 0, 0, 0, 0, 0, 0, (byte) 0xff};
        private final Deflater deflater;
        private final CRC32 crc = new CRC32();
        private byte[] buffer = new byte[1 << 16];

        GzipCompressor(Deflater deflater) {
            this.deflater = deflater;
        }

        @Override
        public BytesInput compress(BytesInput bytes) throws IOException {
            byte[] input = bytes.toByteArray();
            deflater.reset();
            deflater.setInput(input);
            deflater.finish();
            crc.reset();
            crc.update(input);
            ByteArrayOutputStream out = new ByteArrayOutputStream(Math.max(64, input.length / 4));
            out.write(HEADER);
            while (!deflater.finished()) {
                int n = deflater.deflate(buffer);
                out.write(buffer, 0, n);
            }
            int sum = (int) crc.getValue();
            int size = input.length;
            out.write(new byte[] {(byte) sum, (byte) (sum >> 8), (byte) (sum >> 16), (byte) (sum >> 24),
                (byte) size, (byte) (size >> 8), (byte) (size >> 16), (byte) (size >> 24)});
            return BytesInput.from(out.toByteArray());
        }

        @Override
        public CompressionCodecName getCodecName() {
            return CompressionCodecName.GZIP;
        }

        @Override
        public void release() {
            // the factory ends the deflater
        }
    }
}
