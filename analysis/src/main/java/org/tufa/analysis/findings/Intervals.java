package org.tufa.analysis.findings;

import java.util.ArrayList;
import java.util.List;

/**
 * Turns flagged samples into time intervals: consecutive flags merged, short gaps bridged, short runs dropped.
 * The persistence rule is what keeps isolated samples (a spike, a border point of a cluster) from becoming
 * findings: a real fault lasts (common practice, no source; the APAR rules also act only on persistent states,
 * Schein et al., Energy and Buildings 38(12), 2006).
 */
public final class Intervals {

    private Intervals() {
    }

    /**
     * @param flagged   one flag per grid sample
     * @param maxGap    unflagged samples that may be bridged inside an interval
     * @param minLength fewest flagged samples an interval must hold to be kept
     */
    public static List<IndexRange> runs(boolean[] flagged, int maxGap, int minLength) {
        List<IndexRange> out = new ArrayList<>();
        int n = flagged.length;
        int i = 0;
        while (i < n) {
            if (!flagged[i]) {
                i++;
                continue;
            }
            int start = i;
            int lastFlag = i;
            int count = 1;
            int j = i + 1;
            while (j < n && j - lastFlag - 1 <= maxGap) {
                if (flagged[j]) {
                    lastFlag = j;
                    count++;
                }
                j++;
            }
            if (count >= minLength) {
                out.add(new IndexRange(start, lastFlag + 1));
            }
            i = lastFlag + 1;
        }
        return out;
    }
}
