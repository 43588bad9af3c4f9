package org.tufa.analysis.trends;

/**
 * Layout of a trend CSV, detected from its header row.
 *
 * <p>Rule (column names trimmed, compared case-insensitively): a header of exactly three columns named
 * {@code timestamp}, {@code point} and {@code value}, in any order, is {@link #LONG}; any other header with a
 * {@code timestamp} column is {@link #WIDE}, every other column being one series whose id is the column name;
 * a header without a {@code timestamp} column is an input error. A wide file whose only two series are called
 * "point" and "value" is therefore read as long: rename such columns.
 */
public enum TrendFormat {
    /** One sample per row: {@code timestamp,point,value}. */
    LONG,
    /** One row per time stamp: {@code timestamp,<series id>,<series id>,...}. */
    WIDE
}
