package org.tufa.analysis.trends;

import java.time.LocalDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.zone.ZoneOffsetTransition;
import java.time.ZonedDateTime;
import java.time.zone.ZoneRules;
import java.util.List;

/**
 * Turns naive local wall-clock stamps of ONE sequence (a series of a long file, or the rows of a wide file) into
 * instants, handling daylight-saving transitions and counting them.
 *
 * <ul>
 *   <li>Fall-back (the repeated hour): a stamp in the overlap takes the earlier (summer) offset on the first pass;
 *       once the sequence steps backwards while inside the overlap, it and the following stamps of the overlap
 *       take the later (winter) offset. A log that skips the first pass entirely cannot be told apart and is read
 *       as the first pass.</li>
 *   <li>Spring-forward (the skipped hour): a stamp that cannot exist is shifted forward by the length of the gap,
 *       as {@link ZonedDateTime#ofLocal} does.</li>
 * </ul>
 *
 * <p>Controllers usually log local time, producing both effects at each transition (notes section 9). Within an
 * unambiguous stretch the offset is cached, so the common case costs no allocation. Not thread-safe.
 */
public final class LocalTimeResolver {

    private final ZoneId zone;
    private final ZoneRules rules;
    private long fixedFromLocal = Long.MAX_VALUE;
    private long fixedToLocal = Long.MIN_VALUE;
    private long fixedOffsetSeconds;
    private long previousLocal = Long.MIN_VALUE;
    private boolean secondPass;

    /** Stamps in a fall-back overlap read with the earlier offset (first pass). */
    long repeatedFirstPass;
    /** Stamps in a fall-back overlap read with the later offset (second pass). */
    long repeatedSecondPass;
    /** Stamps inside a spring-forward gap, shifted forward. */
    long skipped;

    public LocalTimeResolver(ZoneId zone) {
        this.zone = zone;
        this.rules = zone.getRules();
    }

    /** Epoch seconds of a local wall time given as seconds since 1970-01-01T00:00 (local). */
    public long toEpochSecond(long local) {
        if (local >= fixedFromLocal && local < fixedToLocal) {
            secondPass = false;
            previousLocal = local;
            return local - fixedOffsetSeconds;
        }
        LocalDateTime ldt = LocalDateTime.ofEpochSecond(local, 0, ZoneOffset.UTC);
        List<ZoneOffset> offsets = rules.getValidOffsets(ldt);
        long result;
        if (offsets.size() == 1) {
            ZoneOffset offset = offsets.get(0);
            cacheUnambiguousStretch(ldt, offset);
            secondPass = false;
            result = local - offset.getTotalSeconds();
        } else if (offsets.isEmpty()) {
            skipped++;
            secondPass = false;
            result = ZonedDateTime.ofLocal(ldt, zone, null).toEpochSecond();
        } else {
            ZoneOffsetTransition overlap = rules.getTransition(ldt);
            long overlapStart = overlap.getDateTimeAfter().toEpochSecond(ZoneOffset.UTC);
            if (!secondPass && previousLocal != Long.MIN_VALUE && local < previousLocal && previousLocal >= overlapStart) {
                secondPass = true;
            }
            ZoneOffset offset = secondPass ? overlap.getOffsetAfter() : overlap.getOffsetBefore();
            if (secondPass) {
                repeatedSecondPass++;
            } else {
                repeatedFirstPass++;
            }
            result = local - offset.getTotalSeconds();
        }
        previousLocal = local;
        return result;
    }

    /** Stamps read so far in a fall-back overlap with the earlier offset. */
    public long repeatedFirstPass() {
        return repeatedFirstPass;
    }

    /** Stamps read so far in a fall-back overlap with the later offset. */
    public long repeatedSecondPass() {
        return repeatedSecondPass;
    }

    /** Stamps read so far inside a spring-forward gap. */
    public long skipped() {
        return skipped;
    }

    /** Remembers the local-time stretch around {@code ldt} in which {@code offset} holds without ambiguity. */
    private void cacheUnambiguousStretch(LocalDateTime ldt, ZoneOffset offset) {
        java.time.Instant instant = ldt.toInstant(offset);
        ZoneOffsetTransition previous = rules.previousTransition(instant.plusSeconds(1));
        ZoneOffsetTransition next = rules.nextTransition(instant);
        fixedFromLocal = previous == null ? Long.MIN_VALUE
                : Math.max(previous.getDateTimeBefore().toEpochSecond(ZoneOffset.UTC),
                        previous.getDateTimeAfter().toEpochSecond(ZoneOffset.UTC));
        fixedToLocal = next == null ? Long.MAX_VALUE
                : Math.min(next.getDateTimeBefore().toEpochSecond(ZoneOffset.UTC),
                        next.getDateTimeAfter().toEpochSecond(ZoneOffset.UTC));
        fixedOffsetSeconds = offset.getTotalSeconds();
    }
}
