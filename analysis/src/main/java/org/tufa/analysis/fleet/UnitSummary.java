package org.tufa.analysis.fleet;

import java.time.Duration;
import java.time.Instant;
import java.util.List;

/**
 * What stays of one analysed unit once its samples are written: its grid, how many samples each mode had, and
 * each mode's summary.
 *
 * @param gridStart   start of sample 0
 * @param interval    grid step
 * @param samples     samples on the grid
 * @param modeLabels  the unit's operating modes (its kind's), in code order
 * @param modeCounts  samples per mode, indexed by code
 * @param fanInferred true when the fan was inferred from open valves
 * @param modes       one summary per clustered mode, in the analysis' order
 */
public record UnitSummary(Instant gridStart, Duration interval, int samples, List<String> modeLabels,
                          int[] modeCounts, boolean fanInferred, List<ModeSummary> modes) implements java.io.Serializable {

    public UnitSummary {
        modeLabels = List.copyOf(modeLabels);
        modeCounts = modeCounts.clone();
        modes = List.copyOf(modes);
    }

    /** The summary of a detailed result. */
    public static UnitSummary of(UnitAnalysis.Result r) {
        return new UnitSummary(r.gridStart(), r.interval(), r.modes().codes().length, r.modes().labels(),
                r.modes().counts(),
                r.modes().fanInferred(), r.modeResults().stream().map(ModeSummary::of).toList());
    }

    @Override
    public int[] modeCounts() {
        return modeCounts.clone();
    }

    /** Hours per grid sample. */
    public double hoursPerSample() {
        return interval.toMillis() / 3_600_000.0;
    }

    /** Start time of grid sample {@code i}. */
    public Instant time(int i) {
        return gridStart.plus(interval.multipliedBy(i));
    }
}
