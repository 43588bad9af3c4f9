package org.tufa.analysis.findings;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

class IntervalsTest {

    private static boolean[] flags(String pattern) {
        boolean[] f = new boolean[pattern.length()];
        for (int i = 0; i < f.length; i++) {
            f[i] = pattern.charAt(i) == 'x';
        }
        return f;
    }

    // Worked examples, computed by hand.
    @Test
    void bridgesShortGapsAndDropsShortRuns() {
        //                                      0123456789012345
        List<IndexRange> r = Intervals.runs(flags("xx.xxx...x..xxxx"), 1, 3);
        assertEquals(List.of(new IndexRange(0, 6), new IndexRange(12, 16)), r);
    }

    @Test
    void isolatedFlagsNeverBecomeIntervals() {
        assertEquals(List.of(), Intervals.runs(flags("x..x..x..x"), 1, 2));
    }

    @Test
    void gapEqualToLimitIsBridgedOneMoreIsNot() {
        assertEquals(List.of(new IndexRange(0, 5)), Intervals.runs(flags("xx..x"), 2, 1));
        assertEquals(List.of(new IndexRange(0, 2), new IndexRange(5, 6)), Intervals.runs(flags("xx...x"), 2, 1));
    }
}
