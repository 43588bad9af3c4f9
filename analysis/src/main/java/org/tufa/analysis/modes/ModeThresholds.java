package org.tufa.analysis.modes;

/**
 * Thresholds of the mode split.
 *
 * @param valveOpenPercent a valve command above this (percent) counts as open (default 5 %, notes section 4)
 * @param fanStatusOnFraction a status on-fraction at or above this counts as fan on (default 0.5: on for at least
 *     half of the interval)
 * @param fanSpeedOnFraction a speed fraction above this counts as fan on (default 0: any speed)
 * @param settlingSamples samples marked transition after each mode change (default 1 = 15 min at the default grid;
 *     notes section 4 suggests dropping 15-30 min)
 */
public record ModeThresholds(double valveOpenPercent, double fanStatusOnFraction, double fanSpeedOnFraction,
        int settlingSamples) implements java.io.Serializable {

    public ModeThresholds {
        if (settlingSamples < 0) {
            throw new IllegalArgumentException("settlingSamples must be >= 0");
        }
    }

    public static ModeThresholds defaults() {
        return new ModeThresholds(5.0, 0.5, 0.0, 1);
    }

    public ModeThresholds withSettlingSamples(int samples) {
        return new ModeThresholds(valveOpenPercent, fanStatusOnFraction, fanSpeedOnFraction, samples);
    }
}
