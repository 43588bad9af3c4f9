package org.tufa.analysis.trends;

import java.time.Instant;

/** First and last sample time of one series and its number of stored samples. */
public record SeriesSpan(String id, Instant first, Instant last, long samples) {
}
