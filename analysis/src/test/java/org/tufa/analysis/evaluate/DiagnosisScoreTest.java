package org.tufa.analysis.evaluate;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Diagnosed periods scored per period and per injected episode (worked by hand). */
class DiagnosisScoreTest {

    private static final Instant T0 = Instant.parse("2031-07-01T00:00:00Z");

    private static Instant at(long hours) {
        return T0.plus(Duration.ofHours(hours));
    }

    private static DiagnosisScore.Diagnosed period(String unit, long from, long to, String cause) {
        return new DiagnosisScore.Diagnosed(unit, at(from), at(to), cause);
    }

    /**
     * Unit A's leak (hours 0-100) is covered by three findings: two short ones named right (2 h each) and a long
     * one named wrong (10 h): 2 of its 3 periods are right but the episode is not named, since its wrong hours
     * (10) outweigh the right ones (4). Unit B's fan failure (0-50) has one period, named right. A period of B
     * at hours 200-210 overlaps no episode. Periods: 3 of 4 right; episodes: 1 of 2 named, 50 %, short of 80 %.
     */
    @Test
    void anEpisodeCountsOnceWeightedByTheHoursOfItsPeriods() {
        List<TruthEpisode> truth = List.of(new TruthEpisode("A", "leak", at(0), at(100), 0.5),
                new TruthEpisode("B", "fan_failure", at(0), at(50), 0.5));
        List<DiagnosisScore.Diagnosed> rows = List.of(period("A", 5, 7, "leak"), period("A", 20, 22, "leak"),
                period("A", 40, 50, "low_flow"), period("B", 10, 20, "fan_failure"),
                period("B", 200, 210, "fan_failure"));
        DiagnosisScore.Score s = DiagnosisScore.fit(rows, truth);
        assertEquals(4, s.onFaults());
        assertEquals(3, s.right());
        assertEquals(1, s.offFaults());
        assertEquals(2, s.episodes());
        assertEquals(1, s.namedEpisodes());
        assertEquals("50.0 %", s.episodeShare());
        assertEquals("75.0 %", s.share());
        assertArrayEquals(new int[] {2, 3, 0, 1}, s.byFault().get("leak"));
        assertArrayEquals(new int[] {1, 1, 1, 1}, s.byFault().get("fan_failure"));
        assertFalse(s.episodesNamedAtLeast(0.8));
        assertTrue(s.episodesNamedAtLeast(0.5));
    }
}
