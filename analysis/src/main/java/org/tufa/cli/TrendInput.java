package org.tufa.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.RoleMatch;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.trends.TrendSource;
import org.tufa.analysis.trends.TrendStore;
import org.tufa.analysis.trends.sql.DatabaseLogin;
import org.tufa.analysis.trends.sql.HistorianSettings;
import org.tufa.analysis.trends.sql.HistorianSource;
import org.tufa.analysis.trends.sql.ModelDatabases;
import org.tufa.common.InputException;

/** What {@code analyze --trends} names: trend files, or one PostgreSQL database with its settings and login. */
record TrendInput(List<Path> files, HistorianSettings database, DatabaseLogin login) {

    static TrendInput of(List<String> trends, Path historian, Path dbLogin) {
        List<String> urls = trends.stream().filter(t -> t.startsWith("jdbc:")).toList();
        if (urls.isEmpty()) {
            if (historian != null || dbLogin != null) {
                throw new InputException("--historian and --db-login go with a database (--trends jdbc:postgresql://"
                        + "host/db); the trends given are files");
            }
            List<Path> files = new ArrayList<>();
            for (String t : trends) {
                for (String part : t.split(",")) {
                    files.add(Path.of(part));
                }
            }
            return new TrendInput(files, null, null);
        }
        if (trends.size() > 1) {
            throw new InputException("--trends: give one database URL, or trend files, not both or several databases");
        }
        HistorianSettings settings = HistorianSettings.load(urls.get(0), historian);
        return new TrendInput(List.of(), settings, DatabaseLogin.resolve(dbLogin, System.getenv()));
    }

    /** Opens the trends for a run on this coverage's units. */
    TrendSource.Opener opener(FleetCoverage coverage) {
        if (database == null) {
            return TrendStore.opener(files);
        }
        Set<String> elsewhere = storedElsewhere(coverage);
        return (wanted, ranges, options) -> HistorianSource.open(database, login, wanted, ranges, elsewhere, options);
    }

    /** The database as another engine reads it (null for trend files); {@code loginFile} as given, or null. */
    DatabaseTrends forEngine(FleetCoverage coverage, Path loginFile) {
        return database == null ? null : new DatabaseTrends(database,
                loginFile == null ? null : loginFile.toAbsolutePath().toString(), storedElsewhere(coverage));
    }

    /** The series of this coverage's points that the model stores in another database. */
    private Set<String> storedElsewhere(FleetCoverage coverage) {
        List<PointRef> points = new ArrayList<>();
        for (UnitCoverage u : coverage.units()) {
            u.roles().values().stream().map(RoleMatch::point).forEach(p -> p.ifPresent(points::add));
        }
        return ModelDatabases.storedElsewhere(points, database.modelDatabase(), database.origin());
    }

    /** What run.json records about the trends beyond the files' checksums: never a login. */
    Map<String, Object> parameters() {
        Map<String, Object> p = new LinkedHashMap<>();
        if (database != null) {
            p.put("trends_database", database.where());
            p.put("trends_layout", database.layout().name().toLowerCase(java.util.Locale.ROOT).replace('_', '-'));
            p.put("trends_table", database.table());
        }
        return p;
    }
}
