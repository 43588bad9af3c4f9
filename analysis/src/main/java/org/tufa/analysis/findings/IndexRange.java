package org.tufa.analysis.findings;

/** Grid samples {@code start} (inclusive) to {@code end} (exclusive). */
public record IndexRange(int start, int end) implements java.io.Serializable {
    public IndexRange {
        if (start < 0 || end < start) {
            throw new IllegalArgumentException("bad range " + start + ".." + end);
        }
    }

    public int length() {
        return end - start;
    }
}
