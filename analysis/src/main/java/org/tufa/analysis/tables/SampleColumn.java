package org.tufa.analysis.tables;

/**
 * One column of a per-sample table.
 *
 * @param name the column name, as in the CSV header
 * @param kind what it holds
 */
public record SampleColumn(String name, Kind kind) {

    /** What a column holds, and how each format stores it. */
    public enum Kind {
        /** An instant: CSV ISO-8601 with offset; Parquet INT64 TIMESTAMP(MILLIS, adjusted to UTC). */
        TIME,
        /** Text: CSV as is; Parquet BINARY (STRING). */
        TEXT,
        /** true, false or no value: CSV true/false/empty; Parquet optional BOOLEAN. */
        FLAG,
        /** A double at full precision: CSV Double.toString (inf, -inf, nan); Parquet DOUBLE. */
        REAL,
        /**
         * A number kept to single precision (about 7 significant digits), for values derived from the full-precision
         * ones and read for plots: CSV Float.toString of the rounded value (inf, -inf, nan); Parquet FLOAT.
         */
        SINGLE,
        /** A whole number: CSV decimal; Parquet INT32. */
        INTEGER
    }

    public static SampleColumn time(String name) {
        return new SampleColumn(name, Kind.TIME);
    }

    public static SampleColumn text(String name) {
        return new SampleColumn(name, Kind.TEXT);
    }

    public static SampleColumn flag(String name) {
        return new SampleColumn(name, Kind.FLAG);
    }

    public static SampleColumn real(String name) {
        return new SampleColumn(name, Kind.REAL);
    }

    public static SampleColumn single(String name) {
        return new SampleColumn(name, Kind.SINGLE);
    }

    public static SampleColumn integer(String name) {
        return new SampleColumn(name, Kind.INTEGER);
    }
}
