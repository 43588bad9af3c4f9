package org.tufa.analysis.trends.sql;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Properties;
import java.util.Set;
import java.util.TreeSet;
import org.tufa.common.InputException;

/**
 * Where the trends sit in a PostgreSQL database, and how its tables are laid out.
 *
 * <p>Read from an optional settings file ({@code analyze --historian FILE}), {@code key = value} lines, {@code #}
 * comments; every key is optional:
 * <pre>
 * layout = long                 # long: one table (series, time, value); per-series: one table per series
 * table = trend_samples         # long: the table; per-series: a pattern where {series} stands for the series id
 * series_column = series_id     # long only
 * time_column = ts              # timestamptz (or timestamp without time zone, read with --timezone)
 * value_column = value          # a number (double precision, real, numeric, integer) or boolean, or text
 * model_database = IRI          # the ref:Database of the model this database is, when the model names several
 * </pre>
 *
 * @param url the JDBC URL, without credentials
 * @param layout how series map to tables
 * @param table the long table, or the per-series table-name pattern
 * @param seriesColumn column holding the series id (long layout)
 * @param timeColumn column holding the sample time
 * @param valueColumn column holding the value
 * @param modelDatabase IRI of the model's {@code ref:Database} this is, or null
 * @param origin where the settings came from (the file, or "defaults"), for messages
 */
public record HistorianSettings(String url, Layout layout, String table, String seriesColumn, String timeColumn,
                                String valueColumn, String modelDatabase, String origin)
        implements java.io.Serializable {

    /** How series map to tables. */
    public enum Layout {
        /** One table of (series id, time, value) rows: a plain table or a TimescaleDB hypertable. */
        LONG,
        /** One table of (time, value) rows per series, named by a pattern holding the series id. */
        PER_SERIES
    }

    /** The placeholder for the series id in a per-series table pattern. */
    public static final String SERIES_PLACEHOLDER = "{series}";

    private static final Set<String> KEYS = Set.of("layout", "table", "series_column", "time_column", "value_column",
            "model_database");

    /** The defaults: a long table {@code trend_samples(series_id, ts, value)}. */
    public static HistorianSettings defaults(String url) {
        return new HistorianSettings(checkUrl(url), Layout.LONG, "trend_samples", "series_id", "ts", "value", null,
                "defaults");
    }

    /**
     * Reads a settings file (null: the defaults).
     *
     * @throws InputException for an unreadable file, an unknown key or layout, or a pattern without {series}
     */
    public static HistorianSettings load(String url, Path file) {
        if (file == null) {
            return defaults(url);
        }
        Properties p = new Properties();
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            p.load(in);
        } catch (java.nio.file.NoSuchFileException e) {
            throw InputException.in(file, "no such historian settings file; check the --historian path");
        } catch (IOException | IllegalArgumentException e) {
            throw InputException.in(file, "cannot be read as key = value lines (" + e.getMessage() + ")");
        }
        Set<String> unknown = new TreeSet<>(p.stringPropertyNames());
        unknown.removeAll(KEYS);
        if (!unknown.isEmpty()) {
            throw InputException.in(file, "unknown key '" + unknown.iterator().next() + "'; the keys are "
                    + String.join(", ", new TreeSet<>(KEYS)));
        }
        String layoutText = p.getProperty("layout", "long").strip().toLowerCase(Locale.ROOT);
        Layout layout = switch (layoutText) {
            case "long" -> Layout.LONG;
            case "per-series" -> Layout.PER_SERIES;
            default -> throw InputException.in(file, "layout '" + layoutText + "' is not known; use long or per-series");
        };
        String table = value(p, "table", layout == Layout.LONG ? "trend_samples" : SERIES_PLACEHOLDER, file);
        if (layout == Layout.PER_SERIES && !table.contains(SERIES_PLACEHOLDER)) {
            throw InputException.in(file, "table '" + table + "' of the per-series layout must hold "
                    + SERIES_PLACEHOLDER + " where the series id goes (e.g. trend_{series})");
        }
        if (layout == Layout.LONG && table.contains(SERIES_PLACEHOLDER)) {
            throw InputException.in(file, "table '" + table + "' holds " + SERIES_PLACEHOLDER
                    + ", which only the per-series layout uses; set layout = per-series or name one table");
        }
        String database = p.getProperty("model_database");
        return new HistorianSettings(checkUrl(url), layout, table, value(p, "series_column", "series_id", file),
                value(p, "time_column", "ts", file), value(p, "value_column", "value", file),
                database == null || database.isBlank() ? null : database.strip(), file.toString());
    }

    private static String value(Properties p, String key, String fallback, Path file) {
        String v = p.getProperty(key, fallback).strip();
        if (v.isEmpty()) {
            throw InputException.in(file, key + " is empty; give a name or leave the line out for '" + fallback + "'");
        }
        return v;
    }

    /**
     * Checks a JDBC URL: PostgreSQL only, and no password in it (it would show in the process list and shell
     * history).
     */
    static String checkUrl(String url) {
        if (!url.startsWith("jdbc:postgresql:")) {
            throw new InputException("--trends " + redacted(url) + ": only PostgreSQL databases are supported "
                    + "(jdbc:postgresql://host:port/database); for files give a path");
        }
        String lower = url.toLowerCase(Locale.ROOT);
        int query = lower.indexOf('?');
        if (query >= 0) {
            for (String pair : lower.substring(query + 1).split("&")) {
                if (pair.startsWith("password=") || pair.startsWith("sslpassword=")) {
                    throw new InputException("--trends " + redacted(url) + ": the URL holds a password; remove it and "
                            + "set TUFA_DB_PASSWORD or name a login file with --db-login (a password on the command "
                            + "line is visible to every user of the machine)");
                }
            }
        }
        return url;
    }

    /** The URL up to its query string, for messages and run.json: options after '?' are never shown. */
    public static String redacted(String url) {
        int query = url.indexOf('?');
        return query < 0 ? url : url.substring(0, query) + "?...";
    }

    /** Host, port and database of the URL, for messages. */
    public String where() {
        return redacted(url);
    }
}
