package org.tufa.analysis.modes;

import java.util.EnumMap;
import java.util.Map;

/**
 * Mode of every sample of one unit.
 *
 * @param codes one {@link OperatingMode#code()} per sample
 * @param counts samples per mode, indexed by code
 * @param fanInferred true when the unit had no fan signal and fan-on was inferred from open valves
 */
public record ModeSplit(byte[] codes, int[] counts, boolean fanInferred) {

    public OperatingMode at(int sample) {
        return OperatingMode.ofCode(codes[sample]);
    }

    public int count(OperatingMode mode) {
        return counts[mode.code()];
    }

    /** Counts per mode in enum order (deterministic iteration). */
    public Map<OperatingMode, Integer> countsByMode() {
        Map<OperatingMode, Integer> map = new EnumMap<>(OperatingMode.class);
        for (OperatingMode mode : OperatingMode.values()) {
            map.put(mode, counts[mode.code()]);
        }
        return map;
    }

    /** Per sample: whether it is in {@code mode} (for masking a series to one mode). */
    public boolean[] mask(OperatingMode mode) {
        boolean[] mask = new boolean[codes.length];
        for (int i = 0; i < codes.length; i++) {
            mask[i] = codes[i] == mode.code();
        }
        return mask;
    }

    /** A copy of {@code values} with NaN wherever the sample is not in {@code mode}. */
    public double[] only(OperatingMode mode, double[] values) {
        if (values.length != codes.length) {
            throw new IllegalArgumentException("series length " + values.length + " != " + codes.length);
        }
        double[] out = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            out[i] = codes[i] == mode.code() ? values[i] : Double.NaN;
        }
        return out;
    }
}
