package org.tufa.analysis.modes;

import java.util.Arrays;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * Mode of every sample of one unit. The codes index a list of mode labels that the kind of unit defines: a fan
 * coil unit's are the {@link OperatingMode} labels (the default), a VAV box has its own. The methods that take an
 * {@link OperatingMode} are for fan coil units.
 *
 * @param labels the mode label of each code, in code order (written to modes.csv)
 * @param codes one code per sample
 * @param counts samples per mode, indexed by code
 * @param fanInferred true when the unit had no fan signal and fan-on was inferred from open valves
 */
public record ModeSplit(List<String> labels, byte[] codes, int[] counts, boolean fanInferred) {

    /** The labels of {@link OperatingMode}, in code order. */
    public static final List<String> FAN_COIL_LABELS = Arrays.stream(OperatingMode.values())
            .map(OperatingMode::label).toList();

    public ModeSplit {
        labels = List.copyOf(labels);
        if (counts.length != labels.size()) {
            throw new IllegalArgumentException(counts.length + " counts for " + labels.size() + " modes");
        }
    }

    /** A fan coil unit's split ({@link OperatingMode} codes). */
    public ModeSplit(byte[] codes, int[] counts, boolean fanInferred) {
        this(FAN_COIL_LABELS, codes, counts, fanInferred);
    }

    /** A split from codes alone: counts are taken from them. */
    public static ModeSplit of(List<String> labels, byte[] codes, boolean fanInferred) {
        int[] counts = new int[labels.size()];
        for (byte c : codes) {
            counts[c]++;
        }
        return new ModeSplit(labels, codes, counts, fanInferred);
    }

    public OperatingMode at(int sample) {
        return OperatingMode.ofCode(codes[sample]);
    }

    /** The label of sample {@code i}'s mode. */
    public String labelAt(int sample) {
        return labels.get(codes[sample]);
    }

    /** The code of a label, or -1. */
    public int codeOf(String label) {
        return labels.indexOf(label);
    }

    public int count(OperatingMode mode) {
        return counts[mode.code()];
    }

    /** Samples in the mode with this label (0 for a label the split does not have). */
    public int count(String label) {
        int c = codeOf(label);
        return c < 0 ? 0 : counts[c];
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
        return mask(mode.code());
    }

    /** Per sample: whether it is in the mode with this label (all false for a label the split does not have). */
    public boolean[] mask(String label) {
        return mask(codeOf(label));
    }

    private boolean[] mask(int code) {
        boolean[] mask = new boolean[codes.length];
        for (int i = 0; i < codes.length; i++) {
            mask[i] = codes[i] == code;
        }
        return mask;
    }

    /** A copy of {@code values} with NaN wherever the sample is not in {@code mode}. */
    public double[] only(OperatingMode mode, double[] values) {
        return only(mask(mode), values);
    }

    /** A copy of {@code values} with NaN wherever {@code mask} is false. */
    public static double[] only(boolean[] mask, double[] values) {
        if (values.length != mask.length) {
            throw new IllegalArgumentException("series length " + values.length + " != " + mask.length);
        }
        double[] out = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            out[i] = mask[i] ? values[i] : Double.NaN;
        }
        return out;
    }
}
