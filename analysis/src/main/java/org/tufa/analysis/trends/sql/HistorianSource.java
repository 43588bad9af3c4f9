package org.tufa.analysis.trends.sql;

import java.nio.file.Path;
import java.sql.Array;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Properties;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentLinkedQueue;
import org.tufa.analysis.trends.FileReport;
import org.tufa.analysis.trends.IngestReport;
import org.tufa.analysis.trends.LocalTimeResolver;
import org.tufa.analysis.trends.PlausibleRange;
import org.tufa.analysis.trends.ResampledSeries;
import org.tufa.analysis.trends.Resampler;
import org.tufa.analysis.trends.SeriesKind;
import org.tufa.analysis.trends.SeriesSpan;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.analysis.trends.TrendFormat;
import org.tufa.analysis.trends.TrendGrid;
import org.tufa.analysis.trends.TrendSource;
import org.tufa.analysis.trends.ValueParser;
import org.tufa.common.InputException;

/**
 * Trends read from a PostgreSQL historian, one unit at a time.
 *
 * <p>On opening, the tables and columns are checked against the database's catalog and, unless the window is given
 * at both ends, each series' first and last time is read (two index probes per series with an index on (series,
 * time)) to place the grid exactly where the file reader would place it. {@link #read} then streams a unit's rows
 * in time order (a server-side cursor, a fetch size of 10,000 rows), resamples each series and forgets the rows:
 * memory grows with one unit, not with the fleet. Series ids and times are always bound parameters; table and
 * column names come from the settings, are checked to exist, and are quoted as identifiers.
 *
 * <p>Rows are accounted for as the file reader accounts for a long file's rows ({@link FileReport}): a NULL value
 * is an empty value, then rows outside the window, non-finite values (NaN, Infinity) and values outside the
 * plausible range of the series' unit ({@link PlausibleRange}) are counted and not kept; in strict mode the first
 * of these, and a second value at the same time, stops the run, as it does for a file.
 *
 * <p>Each worker thread borrows a connection of its own; connections are read-only.
 */
public final class HistorianSource implements TrendSource {

    private static final int FETCH_ROWS = 10_000;
    private static final int MAX_EXAMPLES = 5;
    /** Naive local times lie within a day of UTC; the SQL bound is widened by this and refined after resolving. */
    private static final long NAIVE_MARGIN_SECONDS = 26 * 3600L;

    private final HistorianSettings settings;
    private final DatabaseLogin login;
    private final TimeOptions options;
    private final Map<String, SeriesKind> wanted;
    /** Plausible range per series id; series without one are only checked for non-finite values. */
    private final Map<String, PlausibleRange> ranges;
    /** Series id -> quoted table holding it (per-series layout), or the one long table for every id. */
    private final Map<String, String> tables;
    private final Columns columns;
    private final TrendGrid grid;
    private final long keepFrom;
    private final long keepTo;
    private final ConcurrentLinkedQueue<Connection> idle = new ConcurrentLinkedQueue<>();
    private final List<Connection> opened = java.util.Collections.synchronizedList(new ArrayList<>());
    /** What each series gave on its first read (a series shared by units is counted once). */
    private final Map<String, SeriesTally> tallies = new ConcurrentHashMap<>();
    /** How often each series was asked for. */
    private final Map<String, Integer> requests = new ConcurrentHashMap<>();
    /**
     * Series asked for by more than one unit (an outdoor air sensor, a loop's supply temperature), kept once
     * resampled after their second read: a building's few shared series, so memory stays flat in units.
     */
    private final Map<String, ResampledSeries> shared = new ConcurrentHashMap<>();

    /** Checked column names (quoted) and how to read the time and value columns. */
    private record Columns(String series, String time, String value, boolean naiveTime, boolean textValue,
                           String valueCast) {
    }

    /**
     * Counts of one series' rows, in the buckets of {@link FileReport}; first and last are the kept samples', stamps
     * the earliest and latest time of any row with a value.
     */
    private record SeriesTally(long rows, long kept, long outside, long empty, long nonFinite, long implausible,
                               long duplicates, long conflicts, long first, long last, long firstStamp,
                               long lastStamp, long dstFirst, long dstSecond, long dstSkipped, List<String> examples)
            implements java.io.Serializable {
    }

    /**
     * What the series read so far gave (their rows in the buckets of {@link FileReport}), to be added to another
     * source's {@link #report}: the workers of a distributed run read the series, the driver reports them.
     */
    public static final class ReadCounts implements java.io.Serializable {
        private final TreeMap<String, SeriesTally> bySeries;

        private ReadCounts(Map<String, SeriesTally> bySeries) {
            this.bySeries = new TreeMap<>(bySeries);
        }
    }

    /** The counts of the series this source has read. */
    public ReadCounts readCounts() {
        return new ReadCounts(tallies);
    }

    /**
     * Counts series read by another source on the same database and grid as read here; a series counted already
     * (one shared by units read in two places) keeps its first counts, as a second read here would.
     */
    public void addReadCounts(ReadCounts counts) {
        counts.bySeries.forEach(tallies::putIfAbsent);
    }

    private HistorianSource(HistorianSettings settings, DatabaseLogin login, TimeOptions options,
                            Map<String, SeriesKind> wanted, Map<String, PlausibleRange> ranges,
                            Map<String, String> tables, Columns columns, TrendGrid grid) {
        this.settings = settings;
        this.login = login;
        this.options = options;
        this.wanted = wanted;
        this.ranges = Map.copyOf(ranges);
        this.tables = tables;
        this.columns = columns;
        this.grid = grid;
        this.keepFrom = TrendGrid.keepFrom(options);
        this.keepTo = TrendGrid.keepTo(options);
    }

    /**
     * Connects, checks the layout and places the grid.
     *
     * @param wanted series to read, with how to resample each
     * @param ranges plausible range per series id, from its unit (see {@link TrendSource.Opener})
     * @param storedElsewhere series the model says are stored in another database: never asked for here
     * @throws InputException when the database cannot be reached, refuses the login, or lacks a table or column
     */
    public static HistorianSource open(HistorianSettings settings, DatabaseLogin login, Map<String, SeriesKind> wanted,
                                       Map<String, PlausibleRange> ranges, Set<String> storedElsewhere,
                                       TimeOptions options) {
        return open(settings, login, wanted, ranges, storedElsewhere, options, null);
    }

    /**
     * As {@link #open(HistorianSettings, DatabaseLogin, Map, Map, Set, TimeOptions)}, on a grid placed already
     * (null: place it here): a worker of a distributed run reads its units' series on the grid of the whole run.
     */
    public static HistorianSource open(HistorianSettings settings, DatabaseLogin login, Map<String, SeriesKind> wanted,
                                       Map<String, PlausibleRange> ranges, Set<String> storedElsewhere,
                                       TimeOptions options, TrendGrid placedGrid) {
        Map<String, SeriesKind> asked = new TreeMap<>(wanted);
        asked.keySet().removeAll(storedElsewhere);
        Connection first = connect(settings, login);
        try {
            Catalog catalog = new Catalog(first, settings);
            Map<String, String> tables = new TreeMap<>();
            Columns columns;
            if (settings.layout() == HistorianSettings.Layout.LONG) {
                String table = catalog.table(settings.table());
                if (table == null) {
                    throw new InputException(settings.where() + ": no table '" + settings.table() + "' (in the "
                            + "schemas of the search path); create it (README, 'Trends from a database') or name "
                            + "the table in the historian settings (" + settings.origin() + ")");
                }
                columns = catalog.columns(table, true);
                asked.keySet().forEach(id -> tables.put(id, table));
            } else {
                Map<String, String> found = catalog.tables(asked.keySet());
                columns = null;
                for (Map.Entry<String, String> e : found.entrySet()) {
                    Columns c = catalog.columns(e.getValue(), false);
                    if (columns != null && (c.naiveTime() != columns.naiveTime() || c.textValue() != columns.textValue())) {
                        throw new InputException(settings.where() + ", table " + e.getValue() + ": its time or value "
                                + "column has another type than the other series' tables; give every series table "
                                + "the same column types");
                    }
                    columns = c;
                    tables.put(e.getKey(), e.getValue());
                }
                if (columns == null) {
                    columns = new Columns(null, quote(settings.timeColumn()), quote(settings.valueColumn()), false,
                            false, "::float8");
                }
            }
            if (columns.naiveTime() && options.zone() == null) {
                throw new InputException(settings.where() + ": column " + settings.timeColumn() + " holds time "
                        + "stamps without zone (timestamp without time zone); pass --timezone with the zone the "
                        + "controllers logged in, or store them as timestamptz");
            }
            HistorianSource source = new HistorianSource(settings, login, options, asked, ranges, tables, columns,
                    null);
            TrendGrid grid = placedGrid != null ? placedGrid
                    : options.from() != null && options.to() != null
                    ? TrendGrid.of(options, Long.MAX_VALUE, Long.MIN_VALUE)
                    : source.spanGrid(first);
            HistorianSource placed = new HistorianSource(settings, login, options, asked, ranges, tables, columns,
                    grid);
            placed.opened.add(first);
            placed.idle.add(first);
            return placed;
        } catch (SQLException e) {
            close(first);
            throw SqlProblems.reading(e, settings, login, null);
        } catch (RuntimeException e) {
            close(first);
            throw e;
        }
    }

    private static Connection connect(HistorianSettings settings, DatabaseLogin login) {
        Properties p = new Properties();
        if (login.user() != null) {
            p.setProperty("user", login.user());
        }
        if (login.password() != null) {
            p.setProperty("password", login.password());
        }
        p.setProperty("ApplicationName", "tufa");
        p.setProperty("connectTimeout", "10");
        // Binary results from the first query on (the driver otherwise sends text until a query has run 5 times).
        p.setProperty("prepareThreshold", "-1");
        p.setProperty("loginTimeout", "15");
        // Read-only sessions: tufa never writes to a historian.
        p.setProperty("readOnly", "true");
        p.setProperty("readOnlyMode", "always");
        try {
            Connection c = DriverManager.getConnection(settings.url(), p);
            c.setAutoCommit(false); // a cursor (fetch size) needs a transaction in PostgreSQL's driver
            return c;
        } catch (SQLException e) {
            throw SqlProblems.connecting(e, settings, login);
        }
    }

    /** The grid from each series' first and last kept time, as the file reader computes it. */
    private TrendGrid spanGrid(Connection c) throws SQLException {
        long min = Long.MAX_VALUE;
        long max = Long.MIN_VALUE;
        for (Map.Entry<String, List<String>> e : idsByTable().entrySet()) {
            String table = e.getKey();
            String where = settings.layout() == HistorianSettings.Layout.LONG
                    ? " WHERE t." + columns.series() + " = w.id" + bounds(" AND ") : bounds(" WHERE ");
            String sql = "SELECT w.id, (SELECT floor(date_part('epoch', min(t." + columns.time() + ")))::int8 FROM "
                    + table + " t" + where + "), (SELECT floor(date_part('epoch', max(t." + columns.time()
                    + ")))::int8 FROM " + table + " t" + where + ") FROM unnest(?::text[]) AS w(id)";
            try (PreparedStatement ps = c.prepareStatement(sql)) {
                int k = bindBounds(ps, 1);
                k = bindBounds(ps, k);
                Array ids = c.createArrayOf("text", e.getValue().toArray());
                ps.setArray(k, ids);
                try (ResultSet rs = ps.executeQuery()) {
                    while (rs.next()) {
                        long lo = rs.getLong(2);
                        if (rs.wasNull()) {
                            continue;
                        }
                        long hi = rs.getLong(3);
                        if (columns.naiveTime()) {
                            // Extremes of local wall time, resolved like the first stamps of a file.
                            lo = new LocalTimeResolver(options.zone()).toEpochSecond(lo);
                            hi = new LocalTimeResolver(options.zone()).toEpochSecond(hi);
                            lo = Math.max(lo, keepFrom);
                            hi = Math.min(hi, keepTo - 1);
                            if (lo > hi) {
                                continue;
                            }
                        }
                        min = Math.min(min, lo);
                        max = Math.max(max, hi);
                    }
                }
            }
        }
        c.commit();
        return TrendGrid.of(options, min, max);
    }

    /** The wanted series grouped by the table that holds them, tables in name order. */
    private Map<String, List<String>> idsByTable() {
        Map<String, List<String>> out = new TreeMap<>();
        tables.forEach((id, table) -> out.computeIfAbsent(table, k -> new ArrayList<>()).add(id));
        return out;
    }

    /** The window as SQL (with parameters), or "" when there is none. */
    private String bounds(String joiner) {
        List<String> parts = new ArrayList<>();
        if (keepFrom != Long.MIN_VALUE) {
            parts.add("t." + columns.time() + " >= ?");
        }
        if (keepTo != Long.MAX_VALUE) {
            parts.add("t." + columns.time() + " < ?");
        }
        return parts.isEmpty() ? "" : joiner + String.join(" AND ", parts);
    }

    private int bindBounds(PreparedStatement ps, int k) throws SQLException {
        if (keepFrom != Long.MIN_VALUE) {
            ps.setObject(k++, boundValue(keepFrom, -NAIVE_MARGIN_SECONDS));
        }
        if (keepTo != Long.MAX_VALUE) {
            ps.setObject(k++, boundValue(keepTo, NAIVE_MARGIN_SECONDS));
        }
        return k;
    }

    private Object boundValue(long epochSecond, long naiveMargin) {
        if (columns.naiveTime()) {
            return LocalDateTime.ofEpochSecond(epochSecond + naiveMargin, 0, ZoneOffset.UTC);
        }
        return OffsetDateTime.ofInstant(Instant.ofEpochSecond(epochSecond), ZoneOffset.UTC);
    }

    @Override
    public Instant gridStart() {
        return Instant.ofEpochSecond(grid.start());
    }

    @Override
    public Duration interval() {
        return Duration.ofSeconds(grid.interval());
    }

    @Override
    public int gridLength() {
        return grid.cells();
    }

    @Override
    public Map<String, ResampledSeries> read(Collection<String> seriesIds) {
        List<String> ids = new ArrayList<>(new TreeSet<>(seriesIds));
        ids.removeIf(id -> !tables.containsKey(id));
        Map<String, ResampledSeries> out = new TreeMap<>();
        for (java.util.Iterator<String> it = ids.iterator(); it.hasNext(); ) {
            String id = it.next();
            requests.merge(id, 1, Integer::sum);
            ResampledSeries kept = shared.get(id);
            if (kept != null) {
                out.put(id, copy(kept));
                it.remove();
            }
        }
        if (ids.isEmpty()) {
            return out;
        }
        Connection c = borrow();
        String table = null;
        try {
            if (settings.layout() == HistorianSettings.Layout.LONG) {
                table = tables.get(ids.get(0));
                String sql = "SELECT t." + columns.series() + ", " + timeExpression() + ", " + valueExpression()
                        + " FROM " + table + " t WHERE t." + columns.series() + " = ANY (?::text[])" + bounds(" AND ")
                        + " ORDER BY t." + columns.series() + ", t." + columns.time() + ", 3";
                try (PreparedStatement ps = c.prepareStatement(sql)) {
                    ps.setFetchSize(FETCH_ROWS);
                    int k = 1;
                    ps.setArray(k++, c.createArrayOf("text", ids.toArray()));
                    bindBounds(ps, k);
                    try (ResultSet rs = ps.executeQuery()) {
                        SeriesRows rows = null;
                        while (rs.next()) {
                            String id = rs.getString(1);
                            if (rows == null || !rows.id.equals(id)) {
                                if (rows != null) {
                                    out.put(rows.id, finish(rows, table));
                                }
                                rows = new SeriesRows(id, wanted.get(id));
                            }
                            rows.add(rs, 2, table, this);
                        }
                        if (rows != null) {
                            out.put(rows.id, finish(rows, table));
                        }
                    }
                }
            } else {
                for (String id : ids) {
                    table = tables.get(id);
                    String sql = "SELECT " + timeExpression() + ", " + valueExpression() + " FROM " + table + " t"
                            + bounds(" WHERE ") + " ORDER BY t." + columns.time() + ", 2";
                    try (PreparedStatement ps = c.prepareStatement(sql)) {
                        ps.setFetchSize(FETCH_ROWS);
                        bindBounds(ps, 1);
                        try (ResultSet rs = ps.executeQuery()) {
                            SeriesRows rows = new SeriesRows(id, wanted.get(id));
                            while (rs.next()) {
                                rows.add(rs, 1, table, this);
                            }
                            out.put(id, finish(rows, table));
                        }
                    }
                }
            }
            c.commit();
            release(c);
            for (String id : ids) {
                ResampledSeries r = out.get(id);
                if (r != null && requests.getOrDefault(id, 0) > 1) {
                    shared.putIfAbsent(id, copy(r));
                }
            }
            return out;
        } catch (SQLException e) {
            close(c);
            throw SqlProblems.reading(e, settings, login, table);
        } catch (RuntimeException e) {
            release(c);
            throw e;
        }
    }

    /** A series with its own values array: callers may change theirs. */
    private static ResampledSeries copy(ResampledSeries r) {
        return new ResampledSeries(r.id(), r.kind(), r.gridStart(), r.interval(), r.values().clone(), r.rawSamples(),
                r.cellsWithSamples(), r.cellsHeld());
    }

    /**
     * Epoch seconds (local ones for a timestamp without zone), truncated as the file reader truncates fractions.
     * date_part gives a double; extract gives a numeric, which on the 500-unit year made each unit's query 2.5
     * times as slow on the server.
     */
    private String timeExpression() {
        return "floor(date_part('epoch', t." + columns.time() + "))::int8";
    }

    private String valueExpression() {
        return "t." + columns.value() + columns.valueCast();
    }

    /**
     * Resolves, filters, sorts and resamples one series' rows, and tallies them on the series' first read, in the
     * file reader's order: a NULL value is empty; then a row outside the window, a non-finite value, a value outside
     * the plausible range.
     */
    private ResampledSeries finish(SeriesRows rows, String table) {
        int n = rows.size;
        long[] times = Arrays.copyOf(rows.times, n);
        double[] values = Arrays.copyOf(rows.values, n);
        LocalTimeResolver resolver = columns.naiveTime() ? new LocalTimeResolver(options.zone()) : null;
        PlausibleRange range = ranges.get(rows.id);
        List<String> examples = new ArrayList<>();
        int kept = 0;
        long empty = 0;
        long outside = 0;
        long nonFinite = 0;
        long implausible = 0;
        long firstKept = Long.MAX_VALUE;
        long lastKept = Long.MIN_VALUE;
        long firstStamp = Long.MAX_VALUE;
        long lastStamp = Long.MIN_VALUE;
        for (int i = 0; i < n; i++) {
            long t = resolver == null ? times[i] : resolver.toEpochSecond(times[i]);
            if (rows.nulls.get(i)) {
                empty++;
                if (options.strict()) {
                    throw new InputException(where(table, rows.id, times[i]) + ": the value is NULL; fill it in or "
                            + "delete the row (or run without --strict to count such rows)");
                }
                continue;
            }
            firstStamp = Math.min(firstStamp, t);
            lastStamp = Math.max(lastStamp, t);
            if (t < keepFrom || t >= keepTo) {
                outside++;
                continue;
            }
            double v = values[i];
            if (!Double.isFinite(v)) {
                nonFinite++;
                problem(examples, where(table, rows.id, times[i]) + ": value " + v + " is not a finite number",
                        "store NULL where there is no data");
                continue;
            }
            if (range != null && !range.contains(v)) {
                implausible++;
                problem(examples, where(table, rows.id, times[i]) + ": value " + v + " is outside the plausible "
                        + "range " + range.min() + ".." + range.max() + " of its unit", "correct the value or the "
                        + "point's unit");
                continue;
            }
            times[kept] = t;
            values[kept] = v;
            firstKept = Math.min(firstKept, t);
            lastKept = Math.max(lastKept, t);
            kept++;
        }
        long[] keptTimes = Arrays.copyOf(times, kept);
        double[] keptValues = Arrays.copyOf(values, kept);
        Resampler.sortByTime(keptTimes, keptValues);
        // Two rows at one time (a timestamp column without a key, or two local times made one by the fall-back
        // hour): both are kept and averaged, as the file reader keeps them, and counted.
        long duplicates = 0;
        long conflicts = 0;
        int runStart = 0;
        for (int k = 1; k < kept; k++) {
            if (keptTimes[k] != keptTimes[runStart]) {
                runStart = k;
            } else if (Double.compare(keptValues[k], keptValues[runStart]) == 0) {
                duplicates++;
            } else {
                conflicts++;
                problem(examples, where(table, rows.id, keptTimes[k]) + ": a second value (" + keptValues[k]
                        + ", the first was " + keptValues[runStart] + ") at the same time; both are kept and "
                        + "averaged", "delete one of the two rows");
            }
        }
        SeriesTally tally = new SeriesTally(n, kept, outside, empty, nonFinite, implausible, duplicates, conflicts,
                firstKept, lastKept, firstStamp, lastStamp,
                resolver == null ? 0 : resolver.repeatedFirstPass(), resolver == null ? 0 : resolver.repeatedSecondPass(),
                resolver == null ? 0 : resolver.skipped(), List.copyOf(examples));
        tallies.putIfAbsent(rows.id, tally);
        return Resampler.resample(rows.id, rows.kind, keptTimes, keptValues, grid, options.maxGap().getSeconds());
    }

    /** The database, table, series and time of a row, for messages. */
    private String where(String table, String id, long seconds) {
        return settings.where() + ", table " + table + ", series '" + id + "' at " + describeTime(seconds);
    }

    /** A problem row: refused in strict mode, else counted and kept as an example. */
    private void problem(List<String> examples, String what, String todo) {
        if (options.strict()) {
            throw new InputException(what + "; " + todo + " (or run without --strict to count and skip such rows)");
        }
        if (examples.size() < MAX_EXAMPLES) {
            examples.add(what);
        }
    }

    /** One series' rows as they stream in: times (epoch or local seconds) and values as stored. */
    private static final class SeriesRows {
        final String id;
        final SeriesKind kind;
        long[] times = new long[1024];
        double[] values = new double[1024];
        int size;
        /** Positions of rows whose value is NULL. */
        final java.util.BitSet nulls = new java.util.BitSet();

        SeriesRows(String id, SeriesKind kind) {
            this.id = id;
            this.kind = kind == null ? SeriesKind.ANALOG : kind;
        }

        void add(ResultSet rs, int column, String table, HistorianSource source) throws SQLException {
            long t = rs.getLong(column);
            if (rs.wasNull()) {
                throw new InputException(source.settings.where() + ", table " + table + ", series '" + id
                        + "': a row has no time; fill column " + source.settings.timeColumn()
                        + " (NOT NULL) or delete the row");
            }
            double v;
            boolean isNull;
            if (source.columns.textValue()) {
                String text = rs.getString(column + 1);
                isNull = text == null || text.isBlank();
                v = isNull ? Double.NaN : ValueParser.parse(text, kind);
                if (!isNull && Double.isNaN(v) && !ValueParser.isNonFinite(text)) {
                    throw new InputException(source.where(table, id, t) + ": value '" + abbreviate(text) + "' is "
                            + "not a number" + (kind == SeriesKind.BINARY ? " nor a binary word (on/off, true/false)"
                            : "") + "; store numbers in column " + source.settings.valueColumn()
                            + " (double precision), NULL where there is no data");
                }
                if (!isNull && Double.isNaN(v)) {
                    v = Double.POSITIVE_INFINITY; // NaN or Infinity as text: counted as a non-finite value
                }
            } else {
                v = rs.getDouble(column + 1);
                isNull = rs.wasNull();
            }
            if (size == times.length) {
                times = Arrays.copyOf(times, size * 2);
                values = Arrays.copyOf(values, size * 2);
            }
            if (isNull) {
                nulls.set(size);
            }
            times[size] = t;
            values[size] = v;
            size++;
        }
    }

    private String describeTime(long seconds) {
        return columns.naiveTime() ? LocalDateTime.ofEpochSecond(seconds, 0, ZoneOffset.UTC).toString()
                : Instant.ofEpochSecond(seconds).toString();
    }

    private static String abbreviate(String s) {
        String one = s.replaceAll("\\p{Cntrl}", "?");
        return one.length() > 40 ? one.substring(0, 40) + "..." : one;
    }

    @Override
    public IngestReport report() {
        long[] sum = new long[13];
        List<String> examples = new ArrayList<>();
        List<SeriesSpan> spans = new ArrayList<>();
        List<String> neverSeen = new ArrayList<>();
        long firstStamp = Long.MAX_VALUE;
        long lastStamp = Long.MIN_VALUE;
        for (String id : wanted.keySet()) {
            SeriesTally t = tallies.get(id);
            if (t == null || t.kept() == 0) {
                neverSeen.add(id);
            } else {
                spans.add(new SeriesSpan(id, Instant.ofEpochSecond(t.first()), Instant.ofEpochSecond(t.last()),
                        t.kept()));
            }
            if (t != null) {
                long[] counts = {t.rows(), t.kept(), t.outside(), t.empty(), t.nonFinite(), t.implausible(),
                    t.duplicates(), t.conflicts(), t.dstFirst(), t.dstSecond(), t.dstSkipped()};
                for (int k = 0; k < counts.length; k++) {
                    sum[k] += counts[k];
                }
                firstStamp = Math.min(firstStamp, t.firstStamp());
                lastStamp = Math.max(lastStamp, t.lastStamp());
                for (String example : t.examples()) {
                    if (examples.size() < MAX_EXAMPLES) {
                        examples.add(example);
                    }
                }
            }
        }
        // No unknown series (only the model's are asked for), no unparsable values or stamps (refused at once),
        // no malformed rows (a table has its columns).
        FileReport source = new FileReport(Path.of(settings.where()), TrendFormat.LONG, sum[0], sum[1], sum[2], 0, 0,
                0, 0, examples, sum[8], sum[9], sum[10], sum[3], sum[4], sum[5], sum[6], sum[7], firstStamp,
                lastStamp);
        return new IngestReport(List.of(source), List.of(), spans, neverSeen);
    }

    private Connection borrow() {
        Connection c = idle.poll();
        if (c != null) {
            return c;
        }
        c = connect(settings, login);
        opened.add(c);
        return c;
    }

    private void release(Connection c) {
        try {
            if (!c.isClosed()) {
                c.rollback(); // ends the transaction of a read that failed half way; a no-op after commit
                idle.add(c);
            }
        } catch (SQLException e) {
            close(c);
        }
    }

    private static void close(Connection c) {
        try {
            c.close();
        } catch (SQLException ignored) {
            // closing a broken connection: nothing more to do
        }
    }

    @Override
    public void close() {
        synchronized (opened) {
            opened.forEach(HistorianSource::close);
            opened.clear();
        }
        idle.clear();
    }

    /** Double quotes an identifier, doubling any quote inside (SQL's delimited identifiers). */
    static String quote(String identifier) {
        return "\"" + identifier.replace("\"", "\"\"") + "\"";
    }

    /** Lookups in PostgreSQL's catalog, all with bound parameters. */
    private static final class Catalog {
        private static final String FIND_TABLE = "SELECT w.name, (SELECT c.oid::regclass::text FROM pg_catalog.pg_class c"
                + " JOIN pg_catalog.pg_namespace n ON n.oid = c.relnamespace WHERE c.relname = w.name"
                + " AND c.relkind IN ('r', 'p', 'v', 'm', 'f') AND n.nspname = ANY (current_schemas(false))"
                + " ORDER BY array_position(current_schemas(false), n.nspname::text) LIMIT 1)"
                + " FROM unnest(?::text[]) AS w(name)";
        private static final String COLUMNS = "SELECT a.attname, format_type(a.atttypid, a.atttypmod)"
                + " FROM pg_catalog.pg_attribute a WHERE a.attrelid = ?::regclass AND a.attnum > 0"
                + " AND NOT a.attisdropped ORDER BY a.attnum";

        private final Connection c;
        private final HistorianSettings settings;

        Catalog(Connection c, HistorianSettings settings) {
            this.c = c;
            this.settings = settings;
        }

        /** The quoted, possibly schema-qualified name of a table as PostgreSQL prints it, or null. */
        String table(String name) throws SQLException {
            return tablesNamed(List.of(name)).get(name);
        }

        /** Per series id, the table the per-series pattern names for it, for those that exist. */
        Map<String, String> tables(Collection<String> ids) throws SQLException {
            Map<String, String> nameToId = new TreeMap<>();
            for (String id : ids) {
                nameToId.put(settings.table().replace(HistorianSettings.SERIES_PLACEHOLDER, id), id);
            }
            Map<String, String> found = tablesNamed(nameToId.keySet());
            Map<String, String> out = new TreeMap<>();
            found.forEach((name, table) -> out.put(nameToId.get(name), table));
            return out;
        }

        private Map<String, String> tablesNamed(Collection<String> names) throws SQLException {
            Map<String, String> out = new TreeMap<>();
            try (PreparedStatement ps = c.prepareStatement(FIND_TABLE)) {
                ps.setArray(1, c.createArrayOf("text", names.toArray()));
                try (ResultSet rs = ps.executeQuery()) {
                    while (rs.next()) {
                        if (rs.getString(2) != null) {
                            out.put(rs.getString(1), rs.getString(2));
                        }
                    }
                }
            }
            return out;
        }

        Columns columns(String table, boolean withSeries) throws SQLException {
            Map<String, String> types = new TreeMap<>();
            List<String> inOrder = new ArrayList<>();
            try (PreparedStatement ps = c.prepareStatement(COLUMNS)) {
                ps.setString(1, table);
                try (ResultSet rs = ps.executeQuery()) {
                    while (rs.next()) {
                        types.put(rs.getString(1), rs.getString(2));
                        inOrder.add(rs.getString(1));
                    }
                }
            }
            String seriesType = withSeries ? type(types, inOrder, table, settings.seriesColumn(), "series_column") : null;
            String timeType = type(types, inOrder, table, settings.timeColumn(), "time_column");
            String valueType = type(types, inOrder, table, settings.valueColumn(), "value_column");
            if (seriesType != null && !isText(seriesType)) {
                throw new InputException(settings.where() + ", table " + table + ": column " + settings.seriesColumn()
                        + " is " + seriesType + "; series ids are matched as text, so make it text (or varchar)");
            }
            boolean naive = timeType.equals("timestamp without time zone");
            if (!naive && !timeType.equals("timestamp with time zone")) {
                throw new InputException(settings.where() + ", table " + table + ": column " + settings.timeColumn()
                        + " is " + timeType + "; sample times must be timestamptz (or timestamp with --timezone)");
            }
            boolean text = isText(valueType);
            if (!text && !isNumber(valueType)) {
                throw new InputException(settings.where() + ", table " + table + ": column " + settings.valueColumn()
                        + " is " + valueType + "; values must be numbers (double precision, real, numeric, integer)"
                        + " or boolean");
            }
            String cast = text ? "::text" : valueType.equals("boolean") ? "::int::float8" : "::float8";
            return new Columns(withSeries ? quote(settings.seriesColumn()) : null, quote(settings.timeColumn()),
                    quote(settings.valueColumn()), naive, text, cast);
        }

        private String type(Map<String, String> types, List<String> inOrder, String table, String column, String key) {
            String t = types.get(column);
            if (t == null) {
                throw new InputException(settings.where() + ", table " + table + ": no column '" + column + "' (it has "
                        + String.join(", ", inOrder) + "); name the column with " + key + " in the historian settings"
                        + " (" + settings.origin() + ")");
            }
            return t;
        }

        private static boolean isText(String type) {
            String t = type.toLowerCase(Locale.ROOT);
            return t.equals("text") || t.startsWith("character varying") || t.startsWith("character(")
                    || t.equals("character") || t.equals("name");
        }

        private static boolean isNumber(String type) {
            String t = type.toLowerCase(Locale.ROOT);
            return t.equals("double precision") || t.equals("real") || t.startsWith("numeric") || t.equals("integer")
                    || t.equals("bigint") || t.equals("smallint") || t.equals("boolean");
        }
    }
}
