package org.tufa.analysis.modes;

/**
 * Operating mode of a terminal unit in one sample. The byte code is the ordinal; {@link #label()} is the stable
 * name used in output files.
 */
public enum OperatingMode {
    OFF("off"),
    VENTILATION("ventilation"),
    COOLING("cooling"),
    HEATING("heating"),
    /** Fan on with both valves open: a finding of its own (two loops fighting), never clustered. */
    SIMULTANEOUS("simultaneous"),
    /** The first samples after a mode change, dropped so that only steady operation is analysed. */
    TRANSITION("transition"),
    NO_DATA("no_data");

    private static final OperatingMode[] BY_CODE = values();

    private final String label;

    OperatingMode(String label) {
        this.label = label;
    }

    public String label() {
        return label;
    }

    public byte code() {
        return (byte) ordinal();
    }

    public static OperatingMode ofCode(byte code) {
        return BY_CODE[code];
    }
}
