package org.tufa.common;

/**
 * Cells of user text in the CSV files tufa writes, neutralised against formula injection: a spreadsheet runs a
 * cell that starts with {@code =}, {@code +}, {@code -}, {@code @}, a tab or a carriage return as a formula, so
 * such a cell gets a leading apostrophe, as the OWASP "CSV Injection" guidance advises (the cell is then shown as
 * text; the apostrophe is the only change). {@link #restore} undoes it for tufa's own readers of these files.
 */
public final class CsvCells {

    private CsvCells() {
    }

    /** The text, with a leading apostrophe when a spreadsheet would read it as a formula. */
    public static String neutral(String text) {
        if (text == null || text.isEmpty()) {
            return text;
        }
        return startsLikeFormula(text) ? "'" + text : text;
    }

    /** The text as written before {@link #neutral}. */
    public static String restore(String cell) {
        if (cell != null && cell.length() > 1 && cell.charAt(0) == '\'' && startsLikeFormula(cell.substring(1))) {
            return cell.substring(1);
        }
        return cell;
    }

    private static boolean startsLikeFormula(String text) {
        char c = text.charAt(0);
        return c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r';
    }
}
