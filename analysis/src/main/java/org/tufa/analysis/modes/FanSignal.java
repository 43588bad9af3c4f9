package org.tufa.analysis.modes;

/** Which fan signal a unit has, as a 0..1 fraction per sample. */
public enum FanSignal {
    /** Binary fan status or command, resampled to an on-fraction. */
    STATUS,
    /** Fan speed (ECM speed or stage) as a fraction of full speed. */
    SPEED,
    /** No fan signal: fan on is inferred from an open valve (see {@link OperatingModes#classify}). */
    NONE
}
