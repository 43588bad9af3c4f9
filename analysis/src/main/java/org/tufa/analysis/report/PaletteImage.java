package org.tufa.analysis.report;

import java.awt.image.BufferedImage;
import java.awt.image.IndexColorModel;
import java.util.Arrays;

/**
 * Turns a chart drawn in true colour into an 8-bit palette image, which PNG stores in about half the bytes: a chart
 * has a few hundred colours at most (the Okabe-Ito lines, grays, and the anti-aliased edges between them). The 256
 * most frequent colours form the palette (ties by colour value, so the same chart gives the same bytes); any other
 * colour, an edge pixel, takes the nearest palette colour (squared RGB distance), with no dithering, which would
 * only add noise that compresses badly. Popularity quantisation (Heckbert, "Color image quantization for frame
 * buffer display", SIGGRAPH 1982).
 */
final class PaletteImage {

    private static final int MAX_COLOURS = 256;

    private PaletteImage() {
    }

    static BufferedImage reduce(BufferedImage rgb) {
        int w = rgb.getWidth();
        int h = rgb.getHeight();
        int[] pixels = rgb.getType() == BufferedImage.TYPE_INT_RGB
                ? ((java.awt.image.DataBufferInt) rgb.getRaster().getDataBuffer()).getData().clone()
                : rgb.getRGB(0, 0, w, h, null, 0, w);
        for (int i = 0; i < pixels.length; i++) {
            pixels[i] &= 0xffffff;
        }
        // Distinct colours and their counts in an open-addressing table (linear probing; colour + 1 as key, 0 =
        // empty), grown as it fills: one pass, no boxing. The order of the table does not reach the output: the
        // palette is sorted by count and colour below.
        int size = 1 << 10;
        int[] keys = new int[size];
        int[] tally = new int[size];
        int distinctCount = 0;
        for (int p : pixels) {
            int slot = mix(p) & (size - 1);
            while (keys[slot] != 0 && keys[slot] != p + 1) {
                slot = (slot + 1) & (size - 1);
            }
            if (keys[slot] == 0) {
                keys[slot] = p + 1;
                if (++distinctCount * 2 > size) {
                    int[][] grown = grow(keys, tally, size * 2);
                    keys = grown[0];
                    tally = grown[1];
                    size *= 2;
                    slot = find(keys, p, size);
                }
            }
            tally[slot]++;
        }
        int[] distinct = new int[distinctCount];
        int[] count = new int[distinctCount];
        int m = 0;
        for (int slot = 0; slot < size; slot++) {
            if (keys[slot] != 0) {
                distinct[m] = keys[slot] - 1;
                count[m++] = tally[slot];
            }
        }
        Integer[] byFrequency = new Integer[distinctCount];
        for (int i = 0; i < distinctCount; i++) {
            byFrequency[i] = i;
        }
        int[] counts = count;
        int[] colours = distinct;
        Arrays.sort(byFrequency, (a, b) -> counts[a] != counts[b] ? Integer.compare(counts[b], counts[a])
                : Integer.compare(colours[a], colours[b]));
        int n = Math.min(MAX_COLOURS, distinctCount);
        int[] palette = new int[n];
        byte[] r = new byte[n];
        byte[] g = new byte[n];
        byte[] b = new byte[n];
        int[] paletteIndex = new int[distinctCount];
        Arrays.fill(paletteIndex, -1);
        for (int i = 0; i < n; i++) {
            int c = colours[byFrequency[i]];
            palette[i] = c;
            r[i] = (byte) (c >> 16);
            g[i] = (byte) (c >> 8);
            b[i] = (byte) c;
            paletteIndex[byFrequency[i]] = i;
        }
        for (int d = 0; d < distinctCount; d++) {
            if (paletteIndex[d] < 0) {
                paletteIndex[d] = nearest(palette, colours[d]);
            }
        }
        // Colour -> palette index, in the same table.
        byte[] values = new byte[size];
        for (int d = 0; d < distinctCount; d++) {
            values[find(keys, colours[d], size)] = (byte) paletteIndex[d];
        }
        BufferedImage out = new BufferedImage(w, h, BufferedImage.TYPE_BYTE_INDEXED, new IndexColorModel(8, n, r, g, b));
        byte[] target = ((java.awt.image.DataBufferByte) out.getRaster().getDataBuffer()).getData();
        for (int i = 0; i < pixels.length; i++) {
            int key = pixels[i] + 1;
            int slot = mix(pixels[i]) & (size - 1);
            while (keys[slot] != key) {
                slot = (slot + 1) & (size - 1);
            }
            target[i] = values[slot];
        }
        return out;
    }

    /** The slot of colour {@code c} in a table that holds it. */
    private static int find(int[] keys, int c, int size) {
        int slot = mix(c) & (size - 1);
        while (keys[slot] != c + 1) {
            slot = (slot + 1) & (size - 1);
        }
        return slot;
    }

    /** The table rehashed into {@code size} slots: {keys, counts}. */
    private static int[][] grow(int[] keys, int[] tally, int size) {
        int[] k2 = new int[size];
        int[] t2 = new int[size];
        for (int slot = 0; slot < keys.length; slot++) {
            if (keys[slot] != 0) {
                int s = mix(keys[slot] - 1) & (size - 1);
                while (k2[s] != 0) {
                    s = (s + 1) & (size - 1);
                }
                k2[s] = keys[slot];
                t2[s] = tally[slot];
            }
        }
        return new int[][] {k2, t2};
    }

    /** Spreads an RGB value's bits over the table (Fibonacci hashing, Knuth TAOCP 6.4). */
    private static int mix(int c) {
        return (c * 0x9E3779B9) >>> 7;
    }

    private static int nearest(int[] palette, int c) {
        int best = 0;
        long bestDistance = Long.MAX_VALUE;
        for (int i = 0; i < palette.length; i++) {
            long dr = ((c >> 16) & 255) - ((palette[i] >> 16) & 255);
            long dg = ((c >> 8) & 255) - ((palette[i] >> 8) & 255);
            long db = (c & 255) - (palette[i] & 255);
            long d = dr * dr + dg * dg + db * db;
            if (d < bestDistance) {
                bestDistance = d;
                best = i;
            }
        }
        return best;
    }
}
