package org.tufa.analysis.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.awt.image.BufferedImage;
import java.awt.image.IndexColorModel;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.util.Arrays;
import java.util.SplittableRandom;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;

/**
 * The palette PNG encoder against a decoder that is not ours: the JDK's ImageIO PNG reader must give back every
 * pixel's colour, and the header must carry the fields of the PNG specification (W3C PNG 2nd edition, section
 * 11.2.2: width, height, bit depth 8, colour type 3).
 */
class PalettePngTest {

    @Test
    void theJdkReaderDecodesEveryPixelBack() throws IOException {
        int w = 37;
        int h = 23;
        byte[] red = {(byte) 255, 0, (byte) 230, 86};
        byte[] green = {(byte) 255, 114, (byte) 159, (byte) 180};
        byte[] blue = {(byte) 255, (byte) 178, 0, (byte) 233};
        byte[] indices = new byte[w * h];
        SplittableRandom random = new SplittableRandom(7);
        for (int i = 0; i < indices.length; i++) {
            indices[i] = (byte) random.nextInt(red.length);
        }
        byte[] png = PalettePng.encode(w, h, indices, red, green, blue);
        assertArrayEquals(new byte[] {(byte) 137, 80, 78, 71, 13, 10, 26, 10}, Arrays.copyOf(png, 8));
        assertEquals("IHDR", new String(png, 12, 4, java.nio.charset.StandardCharsets.US_ASCII));
        assertEquals(w, readInt(png, 16));
        assertEquals(h, readInt(png, 20));
        assertEquals(8, png[24]);
        assertEquals(3, png[25]);
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(png));
        assertEquals(w, back.getWidth());
        assertEquals(h, back.getHeight());
        for (int y = 0; y < h; y++) {
            for (int x = 0; x < w; x++) {
                int k = indices[y * w + x];
                int expected = ((red[k] & 255) << 16) | ((green[k] & 255) << 8) | (blue[k] & 255);
                assertEquals(expected, back.getRGB(x, y) & 0xffffff, "pixel " + x + "," + y);
            }
        }
    }

    /** A reduced chart image written and read back is the same picture, and the same pixels give the same bytes. */
    @Test
    void aReducedImageRoundTripsAndEncodesTheSameTwice() throws IOException {
        BufferedImage rgb = new BufferedImage(64, 40, BufferedImage.TYPE_INT_RGB);
        for (int y = 0; y < 40; y++) {
            for (int x = 0; x < 64; x++) {
                rgb.setRGB(x, y, x < 32 ? 0xffffff : (y < 20 ? 0x0072b2 : 0xe69f00));
            }
        }
        BufferedImage palette = PaletteImage.reduce(rgb);
        IndexColorModel model = (IndexColorModel) palette.getColorModel();
        byte[] r = new byte[model.getMapSize()];
        byte[] g = new byte[model.getMapSize()];
        byte[] b = new byte[model.getMapSize()];
        model.getReds(r);
        model.getGreens(g);
        model.getBlues(b);
        byte[] indices = ((java.awt.image.DataBufferByte) palette.getRaster().getDataBuffer()).getData();
        byte[] once = PalettePng.encode(64, 40, indices, r, g, b);
        assertArrayEquals(once, PalettePng.encode(64, 40, indices, r, g, b));
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(once));
        for (int y = 0; y < 40; y++) {
            for (int x = 0; x < 64; x++) {
                assertEquals(rgb.getRGB(x, y) & 0xffffff, back.getRGB(x, y) & 0xffffff);
            }
        }
    }

    @Test
    void aPaletteOfMoreThan256ColoursIsRefused() {
        byte[] big = new byte[257];
        assertThrows(IllegalArgumentException.class, () -> PalettePng.encode(1, 1, new byte[1], big, big, big));
    }

    private static int readInt(byte[] b, int at) {
        return ((b[at] & 255) << 24) | ((b[at + 1] & 255) << 16) | ((b[at + 2] & 255) << 8) | (b[at + 3] & 255);
    }
}
