package org.tufa.analysis.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.awt.image.BufferedImage;
import org.junit.jupiter.api.Test;

/** Palette reduction of chart images, on images built pixel by pixel (worked examples, computed by hand). */
class PaletteImageTest {

    @Test
    void anImageOfAtMost256ColoursKeepsEveryPixel() {
        BufferedImage rgb = new BufferedImage(16, 16, BufferedImage.TYPE_INT_RGB);
        for (int y = 0; y < 16; y++) {
            for (int x = 0; x < 16; x++) {
                rgb.setRGB(x, y, (x * 16) << 16 | (y * 16) << 8 | 0x40); // 256 distinct colours
            }
        }
        BufferedImage out = PaletteImage.reduce(rgb);
        assertEquals(BufferedImage.TYPE_BYTE_INDEXED, out.getType());
        for (int y = 0; y < 16; y++) {
            for (int x = 0; x < 16; x++) {
                assertEquals(rgb.getRGB(x, y), out.getRGB(x, y), x + "," + y);
            }
        }
    }

    @Test
    void aRareColourBeyondThePaletteTakesTheNearestOne() {
        // 256 frequent colours (grays 0..255, four pixels each) and one rare colour (250, 250, 10): the palette is
        // the grays, and the rare pixel becomes the gray nearest in squared RGB distance:
        // d(g) = 2 (250 - g)^2 + (10 - g)^2 is least at g = 170 (d = 12800 + 25600 = 38400).
        BufferedImage rgb = new BufferedImage(256, 5, BufferedImage.TYPE_INT_RGB);
        for (int x = 0; x < 256; x++) {
            for (int y = 0; y < 4; y++) {
                rgb.setRGB(x, y, x << 16 | x << 8 | x);
            }
            rgb.setRGB(x, 4, x << 16 | x << 8 | x);
        }
        rgb.setRGB(0, 4, 250 << 16 | 250 << 8 | 10);
        BufferedImage out = PaletteImage.reduce(rgb);
        assertEquals(170 << 16 | 170 << 8 | 170, out.getRGB(0, 4) & 0xffffff);
        assertEquals(255 << 16 | 255 << 8 | 255, out.getRGB(255, 0) & 0xffffff);
    }
}
