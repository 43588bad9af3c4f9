package org.tufa.analysis.evaluate;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.labels.AnalysisFolder;
import org.tufa.analysis.review.Verdict;

/**
 * The review an analyst who knew the demo's ground truth would write: every listed finding that overlaps an injected
 * fault episode of its unit is confirmed, with that fault's name as the cause (the episode it overlaps most, when
 * several); every other finding is rejected as normal operation. Pure.
 */
public final class TruthReview {

    /** The reviewer named in the derived file. */
    public static final String REVIEWER = "demo (from the simulator's ground truth)";

    private TruthReview() {
    }

    /**
     * The verdicts, one per finding id, in the findings' order; dated the day after the last finding ends. Findings
     * of two channels of the same cluster episode share an id and get one verdict.
     */
    public static List<Verdict> fit(List<AnalysisFolder.Listed> findings, List<TruthEpisode> truth, ZoneId zone) {
        Instant last = findings.stream().map(AnalysisFolder.Listed::end).max(Instant::compareTo).orElse(Instant.EPOCH);
        LocalDate date = last.atZone(zone).toLocalDate().plusDays(1);
        List<Verdict> out = new ArrayList<>();
        java.util.Set<String> seen = new java.util.HashSet<>();
        for (AnalysisFolder.Listed f : findings) {
            if (!seen.add(f.id())) {
                continue; // two channels of one cluster episode: one finding id, one verdict
            }
            TruthEpisode best = mostOverlapping(f.unit(), f.start(), f.end(), truth);
            Verdict.Decision d = best == null ? Verdict.Decision.REJECTED : Verdict.Decision.CONFIRMED;
            String note = best == null ? "no injected fault on this unit at this time"
                    : "overlaps the injected " + best.fault() + " episode from " + best.start() + " to " + best.end();
            out.add(new Verdict(0, f.unit(), f.mode(), f.kind(), f.start(), f.end(), f.id(), d,
                    best == null ? "" : best.fault(), note, REVIEWER, date));
        }
        return out;
    }

    /** The unit's injected episode that overlaps the period most, null when none overlaps it. */
    static TruthEpisode mostOverlapping(String unit, Instant start, Instant end, List<TruthEpisode> truth) {
        TruthEpisode best = null;
        long most = 0;
        for (TruthEpisode e : truth) {
            if (!e.unit().equals(unit)) {
                continue;
            }
            Instant s = start.isAfter(e.start()) ? start : e.start();
            Instant en = end.isBefore(e.end()) ? end : e.end();
            long overlap = Duration.between(s, en).toSeconds();
            if (overlap > most) {
                most = overlap;
                best = e;
            }
        }
        return best;
    }

    /**
     * How a re-run honoured a review: of its listed findings, those with the mode and kind of a rejected verdict of
     * their unit that overlap its period (the target is none), and those that overlap a rejected period in another
     * mode or kind (shown with both).
     */
    public record Honoured(int rejected, int flaggedAgain, int overlapOtherKind) {
    }

    public static Honoured honoured(List<Verdict> verdicts, List<AnalysisFolder.Listed> rerun) {
        int again = 0;
        int other = 0;
        int rejected = 0;
        for (Verdict v : verdicts) {
            if (v.decision() != Verdict.Decision.REJECTED) {
                continue;
            }
            rejected++;
        }
        for (AnalysisFolder.Listed f : rerun) {
            boolean same = false;
            boolean near = false;
            for (Verdict v : verdicts) {
                if (v.decision() != Verdict.Decision.REJECTED || !v.unit().equals(f.unit())
                        || !v.overlaps(f.start(), f.end())) {
                    continue;
                }
                if (v.mode().equals(f.mode()) && v.kind().equals(f.kind())) {
                    same = true;
                } else {
                    near = true;
                }
            }
            again += same ? 1 : 0;
            other += !same && near ? 1 : 0;
        }
        return new Honoured(rejected, again, other);
    }
}
