package org.tufa.analysis.report;

import java.awt.image.BufferedImage;
import java.awt.image.IndexColorModel;
import java.awt.image.WritableRaster;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

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
        int[] pixels = rgb.getRGB(0, 0, w, h, null, 0, w);
        Map<Integer, int[]> counts = new HashMap<>();
        for (int p : pixels) {
            counts.computeIfAbsent(p & 0xffffff, k -> new int[1])[0]++;
        }
        List<Map.Entry<Integer, int[]>> byFrequency = new ArrayList<>(counts.entrySet());
        byFrequency.sort((a, b) -> a.getValue()[0] != b.getValue()[0] ? Integer.compare(b.getValue()[0],
                a.getValue()[0]) : Integer.compare(a.getKey(), b.getKey()));
        int n = Math.min(MAX_COLOURS, byFrequency.size());
        int[] palette = new int[n];
        byte[] r = new byte[n];
        byte[] g = new byte[n];
        byte[] b = new byte[n];
        Map<Integer, Integer> index = new HashMap<>();
        for (int i = 0; i < n; i++) {
            int c = byFrequency.get(i).getKey();
            palette[i] = c;
            r[i] = (byte) (c >> 16);
            g[i] = (byte) (c >> 8);
            b[i] = (byte) c;
            index.put(c, i);
        }
        BufferedImage out = new BufferedImage(w, h, BufferedImage.TYPE_BYTE_INDEXED, new IndexColorModel(8, n, r, g, b));
        WritableRaster raster = out.getRaster();
        byte[] row = new byte[w];
        for (int y = 0; y < h; y++) {
            for (int x = 0; x < w; x++) {
                int c = pixels[y * w + x] & 0xffffff;
                Integer k = index.get(c);
                if (k == null) {
                    k = nearest(palette, c);
                    index.put(c, k);
                }
                row[x] = (byte) (int) k;
            }
            raster.setDataElements(0, y, w, 1, row);
        }
        return out;
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
