package org.tufa.analysis.episodes;

import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.significance.ScanStatistic;

/**
 * Fault days and the episodes they form on one {@link DayChannel}.
 *
 * <p>A day is a fault day when it is dominated by candidate-fault samples (cluster channels; rule channels need
 * their share instead), its deviation from the unit's normal level reaches the engineering gate in the fault
 * direction, and it lies at least {@code minZ} day-to-day spreads from normal. Three conditions because each
 * alone fails somewhere: the gate alone flags a unit whose normal days vary by more than a sensor's tolerance, the
 * spread alone flags a very steady unit for a tenth of a kelvin, and dominance keeps a pattern that recurs for an
 * hour every afternoon (a coil still cold after cooling, a hot spell) from counting as a fault: that pattern is
 * part of the unit's normal days.
 *
 * <p>Consecutive fault days form an episode; one informative day without a fault between fault days is bridged
 * (a mild day in a week-long fault), and so are days without data, unless the calendar gap exceeds
 * {@code maxGapDays}.
 */
public final class EpisodeFinder {

    /**
     * @param minZ        fewest day-to-day spreads a fault day lies from normal
     * @param gate        smallest deviation from normal that matters, in the channel's unit
     * @param minShare    rule channels only: smallest share of the day's samples the rule flags (NaN for cluster
     *                    channels, which need dominance instead)
     * @param bridgeDays  informative non-fault days bridged inside an episode
     * @param maxGapDays  longest calendar gap between consecutive days of an episode
     * @param maxWindow   longest window of the scan statistic, in informative days
     */
    public record Parameters(double minZ, double gate, double minShare, int bridgeDays, int maxGapDays,
                             int maxWindow) {
    }

    private EpisodeFinder() {
    }

    /** Per informative day: is it a fault day. */
    public static boolean[] faultDays(DayChannel c, Parameters p) {
        boolean[] out = new boolean[c.size()];
        for (int k = 0; k < out.length; k++) {
            boolean dominant = Double.isNaN(p.minShare()) ? c.dominated()[k] : c.value()[k] >= p.minShare();
            out[k] = dominant && c.shift(k) >= p.gate() && c.z()[k] >= p.minZ();
        }
        return out;
    }

    public static List<Episode> find(DayChannel c, Parameters p) {
        boolean[] fault = faultDays(c, p);
        List<Episode> out = new ArrayList<>();
        int k = 0;
        while (k < fault.length) {
            if (!fault[k]) {
                k++;
                continue;
            }
            int start = k;
            int last = k;
            int j = k + 1;
            int skipped = 0;
            while (j < fault.length && c.days()[j] - c.days()[j - 1] <= p.maxGapDays() + 1) {
                if (fault[j]) {
                    last = j;
                    skipped = 0;
                } else if (++skipped > p.bridgeDays()) {
                    break;
                }
                j++;
            }
            int count = 0;
            double shift = 0;
            double z = 0;
            for (int i = start; i <= last; i++) {
                if (fault[i]) {
                    count++;
                    shift += c.shift(i);
                    z += c.z()[i];
                }
            }
            double stat = ScanStatistic.max(c.z(), start, last + 1, p.maxWindow());
            out.add(new Episode(start, last + 1, c.days()[start], c.days()[last], count, stat, shift / count,
                    z / count));
            k = last + 1;
        }
        return out;
    }
}
