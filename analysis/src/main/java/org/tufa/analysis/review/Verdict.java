package org.tufa.analysis.review;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Locale;

/**
 * One analyst's verdict on one finding: one row of a review file ({@link ReviewFile}).
 *
 * @param line      the row's line in its review file (0 for a verdict not read from a file)
 * @param unit      the unit's IRI
 * @param mode      the finding's operating mode ("any" for findings across modes)
 * @param kind      the finding's kind (fault_cluster, a rule's name, ...)
 * @param start     the finding's start
 * @param end       its end
 * @param findingId the finding's id ({@link FindingIds}); empty when the row was written by hand
 * @param decision  confirmed, rejected or not sure
 * @param cause     the cause the analyst names (one of the candidate causes or their own words); may be empty
 * @param note      free text; may be empty
 * @param reviewer  who gave the verdict; may be empty
 * @param date      when; null when the row gives none
 */
public record Verdict(long line, String unit, String mode, String kind, Instant start, Instant end, String findingId,
                      Decision decision, String cause, String note, String reviewer, LocalDate date)
        implements java.io.Serializable {

    /** What the analyst decided. */
    public enum Decision {
        /** A fault, verified: the finding stays listed and marked, and its samples become labelled fault data. */
        CONFIRMED("confirmed"),
        /** Normal operation: the period and signature are not flagged again for the unit. */
        REJECTED("rejected"),
        /** Looked at, undecided: the finding stays listed and marked. */
        NOT_SURE("not_sure");

        private final String word;

        Decision(String word) {
            this.word = word;
        }

        /** The word in the review file. */
        public String word() {
            return word;
        }

        /** The decision a review-file cell names ("not sure" with a space, any case, is accepted too); null if none. */
        public static Decision parse(String cell) {
            String w = cell.strip().toLowerCase(Locale.ROOT).replace(' ', '_').replace('-', '_');
            for (Decision d : values()) {
                if (d.word.equals(w)) {
                    return d;
                }
            }
            return null;
        }
    }

    public Verdict {
        findingId = findingId == null ? "" : findingId;
        cause = cause == null ? "" : cause;
        note = note == null ? "" : note;
        reviewer = reviewer == null ? "" : reviewer;
    }

    /** Whether the verdict's period and the interval [start, end) share time. */
    public boolean overlaps(Instant otherStart, Instant otherEnd) {
        return start.isBefore(otherEnd) && otherStart.isBefore(end);
    }

    /** "review.csv line 4" style reference, or the finding id for a verdict not read from a file. */
    public String where() {
        return line > 0 ? "line " + line : findingId;
    }
}
