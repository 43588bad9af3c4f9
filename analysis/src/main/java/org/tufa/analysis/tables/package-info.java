/**
 * Per-sample output tables (a unit's modes, features, PCA scores, OPTICS ordering): one writer interface, {@link
 * org.tufa.analysis.tables.SampleTable}, written as Apache Parquet (the default: typed columns, compressed, readable
 * by pandas, DuckDB and Spark) or as CSV with the same columns. Parquet pages are gzip-compressed with
 * {@code java.util.zip} ({@link org.tufa.analysis.tables.GzipCodecs}), so no Hadoop and no native library is needed
 * to write or read them.
 */
package org.tufa.analysis.tables;
