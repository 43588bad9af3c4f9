package org.tufa.analysis.findings;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import org.junit.jupiter.api.Test;

/**
 * Counting mode changes in a window, the hunting test of the APAR rules (House, Vaezi-Nejad and Whitcomb, ASHRAE
 * Transactions 107(1), 2001). The expected flags are worked examples, computed by hand.
 */
class ModeHuntingTest {

    private static boolean[] marks(String pattern) {
        boolean[] f = new boolean[pattern.length()];
        for (int i = 0; i < f.length; i++) {
            f[i] = pattern.charAt(i) == 'x';
        }
        return f;
    }

    @Test
    void windowOfFiveWithTwoChanges() {
        // Changes at 2, 4, 6 and 13; window [i-2, i+2] (cut at the ends). Counts by hand:
        //   i:      0 1 2 3 4 5 6 7 8 9 10 11 12 13 14 15
        //   count:  1 1 2 2 3 2 2 1 1 0  0  1  1  1  1  1
        // At least 2 -> samples 2..6; the lone change at 13 never reaches 2.
        //                                  0123456789012345
        boolean[] flags = ModeHunting.flags(marks("..x.x.x......x.."), 2, 2);
        assertArrayEquals(marks("..xxxxx........."), flags);
    }

    @Test
    void higherThresholdKeepsOnlyTheDensestWindow() {
        // Same changes, at least 3: only i = 4 sees 2, 4 and 6.
        assertArrayEquals(marks("....x..........."), ModeHunting.flags(marks("..x.x.x......x.."), 2, 3));
    }

    @Test
    void windowIsCutAtTheEnds() {
        // Changes at 0 and 1, half window 1: i=0 sees {0,1} -> 2, i=1 {0,1,2} -> 2, i=2 {1,2,3} -> 1.
        assertArrayEquals(marks("xx..."), ModeHunting.flags(marks("xx..."), 1, 2));
        // No changes, never flagged.
        assertArrayEquals(marks("....."), ModeHunting.flags(marks("....."), 1, 1));
    }
}
