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
 * <p>Consecutive fault days form an episode; up to {@code bridgeDays} informative workdays without a fault between
 * fault days are bridged (a mild day in a week-long fault), and so are weekend days without a fault (a workday
 * fault need not show against the unit's weekends) and days without data, unless the calendar gap exceeds
 * {@code maxGapDays}. An episode needs {@code minDays} fault days: one odd day (a holiday, a storm, a test by the
 * commissioning engineer) is part of any unit's record, a fault lasts.
 */
public final class EpisodeFinder {

    /**
     * @param minZ        fewest day-to-day spreads a fault day lies from normal
     * @param gate        smallest deviation from normal that matters, in the channel's unit
     * @param minShare    rule channels only: smallest share of the day's samples the rule flags (NaN for cluster
     *                    channels, which need dominance instead)
     * @param bridgeDays  informative non-fault workdays bridged inside an episode (weekend days are bridged besides)
     * @param maxGapDays  longest calendar gap between consecutive days of an episode
     * @param maxWindow   longest window of the scan statistic, in informative days
     * @param minDays     fewest fault days an episode needs
     */
    public record Parameters(double minZ, double gate, double minShare, int bridgeDays, int maxGapDays,
                             int maxWindow, int minDays) {
    }

    /**
     * Informative workdays without a fault that an episode bridges: one (a mild day in a week-long fault). Weekend
     * days without a fault are bridged besides: they are judged against the unit's weekends, and a fault that shows
     * on workdays (a schedule left extended, a coil short of capacity at workday loads) can look normal there; with
     * weekends counted as any day, a week-long fault fell apart into pieces of two or three workdays, each weaker
     * against the fleet's null than the whole.
     */
    public static final int BRIDGED_DAYS = 1;

    private EpisodeFinder() {
    }

    /** Per informative day: is it a fault day. */
    public static boolean[] faultDays(DayChannel c, Parameters p, double[] magnitude, double magnitudeGate) {
        boolean[] out = new boolean[c.size()];
        for (int k = 0; k < out.length; k++) {
            boolean dominant = Double.isNaN(p.minShare()) ? c.dominated()[k] : c.value()[k] >= p.minShare();
            boolean large = magnitude == null || magnitude[k] >= magnitudeGate;
            out[k] = dominant && large && c.shift(k) >= p.gate() && c.z()[k] >= p.minZ();
        }
        return out;
    }

    /** The episodes of a channel whose own values carry the engineering size (feature medians, rule shares). */
    public static List<Episode> find(DayChannel c, Parameters p) {
        return find(c, p, null, Double.NaN);
    }

    /**
     * The episodes of a share channel whose engineering size is carried apart: {@code magnitude} per informative
     * day (e.g. how far the day's candidate samples lie from normal, in kelvin, fault side positive), which a fault
     * day must bring to {@code magnitudeGate}; the episode's mean shift is then the mean magnitude.
     */
    public static List<Episode> find(DayChannel c, Parameters p, double[] magnitude, double magnitudeGate) {
        boolean[] fault = faultDays(c, p, magnitude, magnitudeGate);
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
                } else if (!DayChannel.weekend(c.days()[j]) && ++skipped > p.bridgeDays()) {
                    break;
                }
                j++;
            }
            int count = 0;
            double shift = 0;
            double z = 0;
            double value = 0;
            double normal = 0;
            for (int i = start; i <= last; i++) {
                if (fault[i]) {
                    count++;
                    shift += magnitude == null ? c.shift(i) : magnitude[i];
                    z += c.z()[i];
                    value += c.value()[i];
                    normal += c.normal()[i];
                }
            }
            double stat = ScanStatistic.max(c.z(), start, last + 1, p.maxWindow());
            k = last + 1;
            if (count < p.minDays()) {
                continue;
            }
            out.add(new Episode(start, last + 1, c.days()[start], c.days()[last], count, stat, shift / count,
                    z / count, value / count, normal / count));
        }
        return out;
    }
}
