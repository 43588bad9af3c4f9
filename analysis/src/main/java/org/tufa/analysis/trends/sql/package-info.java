/**
 * Trends from a SQL historian (PostgreSQL, plain or with TimescaleDB): {@link
 * org.tufa.analysis.trends.sql.HistorianSource} reads the series of one unit at a time, in time order, with
 * parameterised queries, and resamples them exactly as the file reader's series are resampled.
 *
 * <p>Layouts ({@link org.tufa.analysis.trends.sql.HistorianSettings}): one long table {@code (series_id, ts,
 * value)}, or one table per series {@code (ts, value)}. Logins ({@link org.tufa.analysis.trends.sql.DatabaseLogin})
 * come from the environment or a file, never from the command line.
 */
package org.tufa.analysis.trends.sql;
