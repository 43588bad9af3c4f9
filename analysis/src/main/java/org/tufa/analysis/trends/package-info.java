/**
 * Trend data in: reading BAS trend exports, time stamps, resampling to a common grid.
 *
 * <p>Entry point: {@link org.tufa.analysis.trends.TrendStore#ingest}. Inputs are long CSV
 * ({@code timestamp,point,value}), wide CSV ({@code timestamp,<series>,...}), gzip-compressed CSV (detected by
 * its magic bytes) or folders of them; the layout is detected from the header as described in
 * {@link org.tufa.analysis.trends.TrendFormat}. Time stamps are ISO 8601 with an offset, or naive local times read
 * in a given zone with daylight-saving handling ({@code LocalTimeResolver}). Problems are counted with their
 * {@code file:line:column} in the {@link org.tufa.analysis.trends.IngestReport}, or raised as
 * {@link org.tufa.common.InputException} in strict mode.
 *
 * <p>Memory: samples of the wanted series are spilled to one temp file in per-series chunks ({@code SpillStore});
 * {@link org.tufa.analysis.trends.TrendStore#series} loads and resamples one series at a time, thread-safely, so
 * a fleet job's memory grows with one unit's data.
 */
package org.tufa.analysis.trends;
