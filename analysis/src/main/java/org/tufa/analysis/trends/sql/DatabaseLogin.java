package org.tufa.analysis.trends.sql;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Properties;
import java.util.Set;
import java.util.TreeSet;
import org.tufa.common.InputException;

/**
 * The user name and password for a database, from a login file ({@code --db-login FILE}: {@code user = ...} and
 * {@code password = ...} lines) or else the environment ({@code TUFA_DB_USER}, {@code TUFA_DB_PASSWORD}); never
 * from the command line, never written anywhere. {@link #toString} hides the password.
 *
 * @param user the user name, or null to let the driver pick (the URL's {@code user=} option)
 * @param password the password, or null
 */
public record DatabaseLogin(String user, String password) {

    public static final String USER_VARIABLE = "TUFA_DB_USER";
    public static final String PASSWORD_VARIABLE = "TUFA_DB_PASSWORD";

    /**
     * @param file the login file, or null for the environment
     * @param environment the process environment (System.getenv() in the command)
     * @throws InputException when the file cannot be read or holds other keys
     */
    public static DatabaseLogin resolve(Path file, Map<String, String> environment) {
        if (file == null) {
            return new DatabaseLogin(blankToNull(environment.get(USER_VARIABLE)),
                    blankToNull(environment.get(PASSWORD_VARIABLE)));
        }
        Properties p = new Properties();
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            p.load(in);
        } catch (java.nio.file.NoSuchFileException e) {
            throw InputException.in(file, "no such login file; check the --db-login path");
        } catch (IOException | IllegalArgumentException e) {
            // The message of a parse error could quote the file's text: the password. Say only what failed.
            throw InputException.in(file, "cannot be read as 'user = ...' and 'password = ...' lines");
        }
        Set<String> unknown = new TreeSet<>(p.stringPropertyNames());
        unknown.removeAll(Set.of("user", "password"));
        if (!unknown.isEmpty()) {
            throw InputException.in(file, "unknown key '" + unknown.iterator().next()
                    + "'; a login file holds only 'user = ...' and 'password = ...'");
        }
        return new DatabaseLogin(blankToNull(p.getProperty("user")), blankToNull(p.getProperty("password")));
    }

    private static String blankToNull(String s) {
        return s == null || s.isBlank() ? null : s.strip();
    }

    /** Removes the password from a text (a driver's message), should it ever appear there. */
    String scrub(String text) {
        if (text == null) {
            return "";
        }
        return password == null || password.isEmpty() ? text : text.replace(password, "********");
    }

    @Override
    public String toString() {
        return "DatabaseLogin[user=" + user + ", password=" + (password == null ? "none" : "********") + "]";
    }
}
