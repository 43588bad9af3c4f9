package org.tufa.analysis.evaluate;

import java.time.Instant;
import java.util.List;
import java.util.Set;

/**
 * The samples of one analysed unit from its {@code modes.csv}: time and operating mode, in file order.
 * A sample is analysable when its mode is one the detection can judge: a fan coil unit's cooling, heating,
 * ventilation or simultaneous, a VAV box's cooling, deadband or reheat (not off, transition or no_data).
 */
public record UnitSamples(List<Instant> timestamps, List<String> modes) {
    /** Every mode name modes.csv may hold. */
    public static final Set<String> MODES = org.tufa.analysis.kinds.UnitKinds.ALL.stream()
            .flatMap(k -> k.modeLabels().stream()).collect(java.util.stream.Collectors.toUnmodifiableSet());
    /** Modes in which a unit is idle or unknown. */
    static final Set<String> IDLE = Set.of("off", "transition", "no_data");
    /** Modes whose samples count as analysable. */
    public static final Set<String> ANALYSABLE = MODES.stream().filter(m -> !IDLE.contains(m))
            .collect(java.util.stream.Collectors.toUnmodifiableSet());

    public UnitSamples {
        timestamps = List.copyOf(timestamps);
        modes = List.copyOf(modes);
    }

    boolean analysable(int i) {
        return ANALYSABLE.contains(modes.get(i));
    }

    /**
     * Hours one sample stands for: the median gap between consecutive distinct timestamps (a trend log's interval),
     * 0.25 h when there is only one sample.
     */
    double sampleHours() {
        List<Instant> sorted = timestamps.stream().sorted().distinct().toList();
        if (sorted.size() < 2) {
            return 0.25;
        }
        long[] gaps = new long[sorted.size() - 1];
        for (int i = 1; i < sorted.size(); i++) {
            gaps[i - 1] = sorted.get(i).getEpochSecond() - sorted.get(i - 1).getEpochSecond();
        }
        java.util.Arrays.sort(gaps);
        return gaps[(gaps.length - 1) / 2] / 3600.0;
    }
}
