package org.tufa.analysis.fleet;

import java.util.EnumMap;
import java.util.Map;
import java.util.concurrent.atomic.LongAdder;

/** Wall time spent per pipeline stage, summed over worker threads (so it can exceed the elapsed time). */
public final class StageTimes {

    /** The stages timed. */
    public enum Stage { READ, RESAMPLE, FEATURES, PCA, OPTICS, FINDINGS, DECISION, WRITE }

    private final Map<Stage, LongAdder> nanos = new EnumMap<>(Stage.class);

    public StageTimes() {
        for (Stage s : Stage.values()) {
            nanos.put(s, new LongAdder());
        }
    }

    public void add(Stage stage, long elapsedNanos) {
        nanos.get(stage).add(elapsedNanos);
    }

    /** Seconds spent in a stage. */
    public double seconds(Stage stage) {
        return nanos.get(stage).sum() / 1e9;
    }

    /** One line, e.g. {@code read 3.1 s, resample 0.8 s, ...}. */
    public String summary() {
        StringBuilder b = new StringBuilder();
        for (Stage s : Stage.values()) {
            if (b.length() > 0) {
                b.append(", ");
            }
            b.append(s.name().toLowerCase(java.util.Locale.ROOT)).append(' ')
                    .append(String.format(java.util.Locale.ROOT, "%.2f s", seconds(s)));
        }
        return b.toString();
    }
}
