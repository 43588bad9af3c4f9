package org.tufa.cli;

import java.nio.file.Path;
import java.util.Set;
import java.util.TreeSet;
import org.tufa.analysis.trends.sql.DatabaseLogin;
import org.tufa.analysis.trends.sql.HistorianSettings;

/**
 * Trends in a PostgreSQL historian as an engine that reads them elsewhere (a Spark executor) needs them: the
 * database and its layout, where the login comes from, and the series the model says are stored in another
 * database. The login itself never travels: each reader resolves it from the same login file or environment
 * variables ({@link DatabaseLogin#resolve}), so no password is sent to another process or written anywhere.
 *
 * @param settings        the database and its layout
 * @param loginFile       the {@code --db-login} file, or null for the environment
 * @param storedElsewhere series ids not asked of this database
 */
public record DatabaseTrends(HistorianSettings settings, String loginFile, Set<String> storedElsewhere)
        implements java.io.Serializable {

    public DatabaseTrends {
        storedElsewhere = new TreeSet<>(storedElsewhere);
    }

    /** The login, resolved where this runs (from the login file, else this process's environment). */
    public DatabaseLogin login() {
        return DatabaseLogin.resolve(loginFile == null ? null : Path.of(loginFile), System.getenv());
    }
}
