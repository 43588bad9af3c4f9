package org.tufa.analysis.findings;

/**
 * Hunting: a unit that keeps switching operating mode. Counting mode changes per hour is how the APAR rule set
 * detects unstable control in air handlers (House, Vaezi-Nejad and Whitcomb, ASHRAE Transactions 107(1), 2001;
 * Schein et al., Energy and Buildings 38(12), 2006); ASHRAE Guideline 36 uses the same test (from memory: at most
 * 7 state changes per hour at one-minute samples). At 15-minute samples a loop that swings between heating and
 * cooling spends little time in any one mode, so clustering within a mode cannot see it; the count of changes can.
 */
public final class ModeHunting {

    private ModeHunting() {
    }

    /**
     * Flags samples whose centred window holds at least {@code minChanges} mode changes.
     *
     * @param changed    per sample: true where the sample starts a new mode run (a change or settling sample)
     * @param halfWindow samples on each side of the centre
     * @param minChanges changes in the window that count as hunting
     */
    public static boolean[] flags(boolean[] changed, int halfWindow, int minChanges) {
        int n = changed.length;
        int[] prefix = new int[n + 1];
        for (int i = 0; i < n; i++) {
            prefix[i + 1] = prefix[i] + (changed[i] ? 1 : 0);
        }
        boolean[] out = new boolean[n];
        for (int i = 0; i < n; i++) {
            int lo = Math.max(0, i - halfWindow);
            int hi = Math.min(n, i + halfWindow + 1);
            out[i] = prefix[hi] - prefix[lo] >= minChanges;
        }
        return out;
    }
}
