package org.tufa.analysis.trends;

/**
 * How a series is read and resampled.
 *
 * <p>{@link #ANALOG}: numbers; a grid cell holds the mean of its samples. {@link #BINARY}: 0/1 (also
 * true/false, on/off, active/inactive, run/stop); a grid cell holds the time-weighted on-fraction of the held
 * signal.
 */
public enum SeriesKind {
    ANALOG,
    BINARY
}
