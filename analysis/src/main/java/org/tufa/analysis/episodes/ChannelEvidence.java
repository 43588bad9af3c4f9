package org.tufa.analysis.episodes;

import java.util.List;
import org.tufa.analysis.findings.Finding;

/**
 * What one channel of one unit hands to the fleet stage: enough to compare the unit with the fleet's healthy
 * units (its scan maximum, for the empirical null), with its peers (its normal level) and to decide its candidate
 * findings. Small: the day series itself stays behind.
 *
 * @param mode            operating mode the channel lives in ("any" for rules across modes)
 * @param channel         feature or rule name
 * @param direction       +1 / -1: the fault side of the channel
 * @param unit            engineering unit of the channel's values ("K", "%", "share")
 * @param center          the channel's normal day value (median of its reference days), NaN when unknown
 * @param spread          the channel's day-to-day spread
 * @param level           the unit's normal level in the channel's engineering unit, for comparing it with its
 *                        peers (a health feature's median over its normal days; a rule's normal share)
 * @param levelSpread     the day-to-day spread of that level
 * @param gate            the engineering gate used for its fault days, in the channel's unit
 * @param informativeDays days with enough samples of the mode
 * @param scanMax         the largest scan statistic over the unit's whole record (NaN without informative days)
 * @param span            a finding covering the channel's informative days (first to last sample of the mode on
 *                        them), with its hours and energy: what a comparison with the peers would report; null
 *                        without informative days
 * @param candidates      the episodes of this channel, each with the finding it would become
 */
public record ChannelEvidence(String mode, String channel, int direction, String unit, double center, double spread,
                              double level, double levelSpread, double gate, int informativeDays, double scanMax, Finding span,
                              List<Candidate> candidates) implements java.io.Serializable {

    public ChannelEvidence {
        candidates = List.copyOf(candidates);
    }

    /** An episode and the finding it would become. */
    public record Candidate(Episode episode, Finding finding) implements java.io.Serializable {
    }

    /** The key under which channels of different units are pooled: mode, channel and fault side. */
    public String key() {
        return mode + "/" + channel + (direction > 0 ? "+" : "-");
    }
}
