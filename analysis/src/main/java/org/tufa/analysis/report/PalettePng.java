package org.tufa.analysis.report;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.zip.CRC32;
import java.util.zip.Deflater;

/**
 * Encodes an 8-bit palette image as PNG (W3C Portable Network Graphics Specification, 2nd edition, 2003;
 * ISO/IEC 15948): signature, IHDR (colour type 3, bit depth 8), PLTE, one IDAT of zlib-deflated scanlines, IEND,
 * each chunk with its CRC-32. Every scanline uses filter type None, which the specification recommends for
 * palette images (section 12.8: "filter type None is usually the most effective" for them); the JDK's writer
 * tries all five filters on every row, which took most of a chart's encoding time. No time stamp or other
 * ancillary chunk, so the same pixels give the same bytes.
 */
final class PalettePng {

    private static final byte[] SIGNATURE = {(byte) 137, 80, 78, 71, 13, 10, 26, 10};
    /** Deflate level: 6, zlib's default, the usual balance of time and size (common practice, no source). */
    static final int LEVEL = 6;

    private PalettePng() {
    }

    /**
     * @param width   pixels per row
     * @param height  rows
     * @param indices palette index of every pixel, row by row ({@code width * height} entries)
     * @param red     palette reds (1 to 256 entries); green and blue the same length
     */
    static byte[] encode(int width, int height, byte[] indices, byte[] red, byte[] green, byte[] blue) {
        if (width <= 0 || height <= 0 || indices.length != width * height) {
            throw new IllegalArgumentException(width + " x " + height + " pixels, " + indices.length + " indices");
        }
        int colours = red.length;
        if (colours < 1 || colours > 256 || green.length != colours || blue.length != colours) {
            throw new IllegalArgumentException("a palette has 1 to 256 colours of three components");
        }
        ByteArrayOutputStream out = new ByteArrayOutputStream(indices.length / 8 + 1024);
        out.writeBytes(SIGNATURE);
        byte[] header = new byte[13];
        putInt(header, 0, width);
        putInt(header, 4, height);
        header[8] = 8; // bit depth
        header[9] = 3; // colour type: palette
        // compression method 0, filter method 0, no interlace: bytes 10-12 stay 0
        chunk(out, "IHDR", header);
        byte[] palette = new byte[3 * colours];
        for (int i = 0; i < colours; i++) {
            palette[3 * i] = red[i];
            palette[3 * i + 1] = green[i];
            palette[3 * i + 2] = blue[i];
        }
        chunk(out, "PLTE", palette);
        byte[] raw = new byte[height * (width + 1)];
        for (int y = 0; y < height; y++) {
            // raw[y * (width + 1)] stays 0: filter type None
            System.arraycopy(indices, y * width, raw, y * (width + 1) + 1, width);
        }
        Deflater deflater = new Deflater(LEVEL);
        try {
            deflater.setInput(raw);
            deflater.finish();
            ByteArrayOutputStream data = new ByteArrayOutputStream(raw.length / 8 + 64);
            byte[] buffer = new byte[1 << 16];
            while (!deflater.finished()) {
                int n = deflater.deflate(buffer);
                data.write(buffer, 0, n);
            }
            chunk(out, "IDAT", data.toByteArray());
        } finally {
            deflater.end();
        }
        chunk(out, "IEND", new byte[0]);
        return out.toByteArray();
    }

    private static void chunk(ByteArrayOutputStream out, String type, byte[] data) {
        byte[] length = new byte[4];
        putInt(length, 0, data.length);
        out.writeBytes(length);
        byte[] name = type.getBytes(StandardCharsets.US_ASCII);
        out.writeBytes(name);
        out.writeBytes(data);
        CRC32 crc = new CRC32();
        crc.update(name);
        crc.update(data);
        byte[] check = new byte[4];
        putInt(check, 0, (int) crc.getValue());
        out.writeBytes(check);
    }

    private static void putInt(byte[] b, int at, int v) {
        b[at] = (byte) (v >>> 24);
        b[at + 1] = (byte) (v >>> 16);
        b[at + 2] = (byte) (v >>> 8);
        b[at + 3] = (byte) v;
    }
}
