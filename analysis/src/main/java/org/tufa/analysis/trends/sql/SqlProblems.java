package org.tufa.analysis.trends.sql;

import java.sql.SQLException;
import org.tufa.common.InputException;

/**
 * Turns a driver's {@link SQLException} into the one-line error a user reads: which database, what went wrong, what
 * to do. Chosen by SQLSTATE (PostgreSQL Appendix A, "PostgreSQL Error Codes"); the password is scrubbed from every
 * message.
 */
final class SqlProblems {

    private SqlProblems() {
    }

    static InputException connecting(SQLException e, HistorianSettings settings, DatabaseLogin login) {
        String state = e.getSQLState() == null ? "" : e.getSQLState();
        String what = login.scrub(firstLine(e.getMessage()));
        String where = settings.where();
        if (state.startsWith("28")) {
            return new InputException(where + ": the server refused the login" + (login.user() == null ? ""
                    : " of user '" + login.user() + "'") + " (" + what + "); check " + DatabaseLogin.USER_VARIABLE
                    + " and " + DatabaseLogin.PASSWORD_VARIABLE + ", or the --db-login file");
        }
        if (state.equals("3D000")) {
            return new InputException(where + ": " + what + "; check the database name at the end of the URL");
        }
        if (state.startsWith("08") || state.isEmpty()) {
            return new InputException(where + ": cannot connect (" + what + "); check the host and port, that the "
                    + "server is running and accepts TCP connections from this machine");
        }
        return new InputException(where + ": cannot connect (" + what + ", SQLSTATE " + state + ")");
    }

    static InputException reading(SQLException e, HistorianSettings settings, DatabaseLogin login, String table) {
        String state = e.getSQLState() == null ? "" : e.getSQLState();
        String what = login.scrub(firstLine(e.getMessage()));
        String where = settings.where() + (table == null ? "" : ", table " + table);
        if (state.startsWith("08")) {
            return new InputException(where + ": the connection broke while reading (" + what
                    + "); check the server and run again");
        }
        if (state.equals("42501")) {
            return new InputException(where + ": " + what + "; grant the user SELECT on the trend tables");
        }
        return new InputException(where + ": the query failed (" + what + (state.isEmpty() ? "" : ", SQLSTATE "
                + state) + "); check the historian settings (" + settings.origin() + ")");
    }

    private static String firstLine(String message) {
        if (message == null) {
            return "no message";
        }
        int nl = message.indexOf('\n');
        return (nl < 0 ? message : message.substring(0, nl)).strip();
    }
}
