package org.tufa.analysis.report;

import java.awt.Color;

/**
 * Colours readable by colour-blind readers: the eight-colour palette of Okabe and Ito, "Color Universal Design
 * (CUD): how to make figures and presentations that are friendly to colorblind people", 2008. Clusters take them
 * in a fixed order (normal blue, then vermillion, orange, reddish purple, bluish green, sky blue, yellow); noise
 * is grey. Colours are never the only carrier: every chart has a legend with names and every table says in words.
 */
final class Palette {

    static final Color BLACK = new Color(0x000000);
    static final Color ORANGE = new Color(0xE69F00);
    static final Color SKY_BLUE = new Color(0x56B4E9);
    static final Color BLUISH_GREEN = new Color(0x009E73);
    static final Color YELLOW = new Color(0xF0E442);
    static final Color BLUE = new Color(0x0072B2);
    static final Color VERMILLION = new Color(0xD55E00);
    static final Color REDDISH_PURPLE = new Color(0xCC79A7);
    static final Color NOISE_GREY = new Color(0x999999);

    private static final Color[] CLUSTERS = {BLUE, VERMILLION, ORANGE, REDDISH_PURPLE, BLUISH_GREEN, SKY_BLUE,
        YELLOW};

    private Palette() {
    }

    /** Colour of a cluster label: 0 (normal) blue, -1 (noise) grey, others in palette order, repeating. */
    static Color cluster(int label) {
        return label < 0 ? NOISE_GREY : CLUSTERS[label % CLUSTERS.length];
    }

    /** CSS hex of a colour, e.g. #0072B2. */
    static String hex(Color c) {
        return String.format(java.util.Locale.ROOT, "#%06X", c.getRGB() & 0xFFFFFF);
    }
}
