package org.tufa.analysis.trends.sql;

import java.util.Collection;
import java.util.Set;
import java.util.TreeSet;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.common.InputException;

/**
 * Which series the database at hand holds, by the model's {@code ref:storedAt}: a point whose time-series reference
 * names another {@code ref:Database} is not looked for here. Points without {@code ref:storedAt} are.
 */
public final class ModelDatabases {

    private ModelDatabases() {
    }

    /**
     * The series ids stored in another database than the one read.
     *
     * @param points the points a run reads
     * @param thisDatabase the model's IRI for the database read ({@code model_database} in the historian settings), or
     *     null: then the model may name at most one database, taken to be this one
     * @throws InputException when the model names several databases and the settings do not say which one this is,
     *     or name one the model does not know
     */
    public static Set<String> storedElsewhere(Collection<PointRef> points, String thisDatabase, String settingsOrigin) {
        Set<String> named = new TreeSet<>();
        for (PointRef p : points) {
            if (p.database() != null) {
                named.add(p.database());
            }
        }
        Set<String> elsewhere = new TreeSet<>();
        if (named.isEmpty()) {
            return elsewhere;
        }
        String chosen = thisDatabase;
        if (chosen == null) {
            if (named.size() > 1) {
                throw new InputException("the model stores series in " + named.size() + " databases ("
                        + String.join(", ", named) + "); say which one this is with model_database = IRI in the "
                        + "historian settings (" + settingsOrigin + ")");
            }
            chosen = named.iterator().next();
        } else if (!named.contains(chosen)) {
            throw new InputException("model_database " + chosen + " (" + settingsOrigin + ") is not a ref:Database "
                    + "the model's points are stored at; the model names " + String.join(", ", named));
        }
        for (PointRef p : points) {
            if (p.database() != null && !p.database().equals(chosen) && p.timeseriesId() != null) {
                elsewhere.add(p.timeseriesId());
            }
        }
        return elsewhere;
    }
}
