package org.tufa.analysis.episodes;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Episodes from fault days, on hand-built day channels (worked by hand; the bridging rule is common practice, no
 * source).
 */
class EpisodeFinderTest {

    /** Monday 2031-06-02: days 0-4 a workweek, 5-6 its weekend. */
    private static final int MONDAY = (int) LocalDate.of(2031, 6, 2).toEpochDay();

    /** Normal level 0, spread 0.05: a day at share 0.6 lies 12 spreads out, one at 0 none. */
    private static DayChannel channel(double[] share) {
        int n = share.length;
        int[] days = new int[n];
        int[] samples = new int[n];
        double[] normal = new double[n];
        double[] z = new double[n];
        for (int k = 0; k < n; k++) {
            days[k] = MONDAY + k;
            samples[k] = 96;
            z[k] = share[k] / 0.05;
        }
        return new DayChannel("rule", 1, days, samples, share, new boolean[n], 0, 0.05, normal, z);
    }

    private static EpisodeFinder.Parameters parameters(int bridged) {
        return new EpisodeFinder.Parameters(3, 0.1, 0.25, bridged, 4, 30, 2);
    }

    /**
     * A fault on Thursday, Friday, Monday and Tuesday that the weekend between does not show (share 0 on
     * Saturday and Sunday): one episode of 4 fault days from Thursday to Tuesday, the weekend bridged.
     */
    @Test
    void aWeekendInsideAFaultIsBridged() {
        DayChannel c = channel(new double[] {0, 0, 0, 0.6, 0.6, 0, 0, 0.6, 0.6, 0, 0, 0});
        List<Episode> episodes = EpisodeFinder.find(c, parameters(EpisodeFinder.BRIDGED_DAYS));
        assertEquals(1, episodes.size());
        assertEquals(MONDAY + 3, episodes.get(0).firstDay());
        assertEquals(MONDAY + 8, episodes.get(0).lastDay());
        assertEquals(4, episodes.get(0).faultDays());
    }

    /**
     * Two ordinary workdays (Wednesday, Thursday) between two pairs of fault days are more than the one workday
     * bridged: two episodes; one ordinary workday (Wednesday) is bridged.
     */
    @Test
    void twoOrdinaryWorkdaysEndAnEpisode() {
        DayChannel two = channel(new double[] {0.6, 0.6, 0, 0, 0.6, 0, 0, 0.6});
        List<Episode> apart = EpisodeFinder.find(two, parameters(EpisodeFinder.BRIDGED_DAYS));
        assertEquals(2, apart.size(), "the second pair is Friday and the Monday after an empty weekend");
        assertEquals(MONDAY + 1, apart.get(0).lastDay());
        DayChannel one = channel(new double[] {0.6, 0.6, 0, 0.6, 0.6, 0});
        List<Episode> joined = EpisodeFinder.find(one, parameters(EpisodeFinder.BRIDGED_DAYS));
        assertEquals(1, joined.size());
        assertEquals(4, joined.get(0).faultDays());
    }
}
