package org.tufa.analysis.report;

import com.google.gson.Gson;
import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import java.util.ArrayList;
import java.util.List;

/**
 * A table of the fleet page written as data, not markup: its rows go into the page as JSON and the page's script
 * shows them 100 at a time, sorted on any column over all rows. A fleet of 500 units has thousands of findings;
 * as HTML rows they made an 8.8 MB page that a browser lays out slowly, as data they are a third of that and the
 * page shows one screenful. Cells are inserted as text, never as HTML. Without JavaScript the page says where the
 * same rows are as CSV.
 */
final class DataTable {

    /** Rows shown at once. */
    static final int PAGE_ROWS = 100;

    private final String id;
    private final List<String> headers;
    private final List<Boolean> numeric;
    private final String csv;
    private final JsonArray rows = new JsonArray();
    /**
     * Longer texts, each once: a finding's shifts and candidate causes repeat across thousands of rows (on the
     * 500-unit year 4.7 M characters of text held 0.6 M distinct ones). A text cell holds its index here.
     */
    private final java.util.Map<String, Integer> strings = new java.util.LinkedHashMap<>();

    /**
     * @param id an HTML id, unique on the page
     * @param csv the output file holding the same rows, for readers without JavaScript (relative to the page)
     */
    DataTable(String id, String csv) {
        this.id = id;
        this.csv = csv;
        this.headers = new ArrayList<>();
        this.numeric = new ArrayList<>();
    }

    DataTable column(String header, boolean isNumber) {
        headers.add(header);
        numeric.add(isNumber);
        return this;
    }

    int size() {
        return rows.size();
    }

    /** A new row; add its cells in column order. */
    Row row() {
        JsonArray cells = new JsonArray();
        rows.add(cells);
        return new Row(cells);
    }

    /** The cells of one row. */
    final class Row {
        private final JsonArray cells;

        private Row(JsonArray cells) {
            this.cells = cells;
        }

        Row text(String text) {
            String t = text == null ? "" : text;
            if (t.length() < 12) {
                cells.add(t);
            } else {
                cells.add(strings.computeIfAbsent(t, k -> strings.size()));
            }
            return this;
        }

        /** Text that links to a page. */
        Row link(String text, String href) {
            JsonObject c = new JsonObject();
            c.addProperty("t", text);
            c.addProperty("h", href);
            cells.add(c);
            return this;
        }

        /** Text shown, sorted by a number (a time as epoch seconds, a figure). */
        Row sorted(String text, double key) {
            JsonObject c = new JsonObject();
            c.addProperty("t", text);
            c.addProperty("s", Double.isNaN(key) ? -1e300 : key);
            cells.add(c);
            return this;
        }

        /** A time, kept on one line, sorted by its epoch second. */
        Row time(String text, long epochSecond) {
            JsonObject c = new JsonObject();
            c.addProperty("t", text);
            c.addProperty("s", epochSecond);
            c.addProperty("c", "t");
            cells.add(c);
            return this;
        }

        /** A figure, rounded for reading, sorted by its value. */
        Row number(double value, int decimals) {
            return sorted(Html.fixed(value, decimals), value);
        }

        /**
         * A finding's review cell: its status as text, and the finding id the review script builds the verdict
         * controls for ({@link ReviewControls}).
         */
        Row review(String findingId, String status) {
            JsonObject c = new JsonObject();
            c.addProperty("t", status);
            c.addProperty("c", "review");
            c.addProperty("f", findingId);
            cells.add(c);
            return this;
        }

        /** Text with a style class (found, missing, ambiguous, failed) and a tooltip. */
        Row styled(String text, String cssClass, String title) {
            JsonObject c = new JsonObject();
            c.addProperty("t", text);
            c.addProperty("c", cssClass);
            if (title != null && !title.isEmpty()) {
                c.addProperty("ti", title);
            }
            cells.add(c);
            return this;
        }
    }

    /** The table's place on the page and its data. */
    void appendTo(StringBuilder b) {
        JsonObject data = new JsonObject();
        JsonArray head = new JsonArray();
        for (int i = 0; i < headers.size(); i++) {
            JsonObject h = new JsonObject();
            h.addProperty("t", headers.get(i));
            h.addProperty("n", numeric.get(i));
            head.add(h);
        }
        data.add("columns", head);
        JsonArray texts = new JsonArray();
        strings.keySet().forEach(texts::add);
        data.add("strings", texts);
        data.add("rows", rows);
        b.append("<div class=\"datatable\" id=\"").append(Html.esc(id)).append("\" data-rows=\"").append(rows.size())
                .append("\"><noscript><p>").append(rows.size()).append(" rows; this page shows them with JavaScript. "
                        + "The same rows: <a href=\"").append(Html.esc(csv)).append("\">").append(Html.esc(csv))
                .append("</a>.</p></noscript></div>\n");
        // Gson escapes <, >, &, = and ' as \\u sequences, so the JSON cannot end the script element early.
        b.append("<script type=\"application/json\" id=\"").append(Html.esc(id)).append("-data\">")
                .append(new Gson().toJson(data)).append("</script>\n");
    }
}
