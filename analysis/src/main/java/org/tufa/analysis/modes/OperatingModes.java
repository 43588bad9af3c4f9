package org.tufa.analysis.modes;

/**
 * Splits a terminal unit's samples into operating modes from its control signals.
 *
 * <p>Template: the mode logic of the air-handling-unit performance assessment rules (APAR) of House, Vaezi-Nejad
 * and Whitcomb, "An expert rule set for fault detection in air-handling units", ASHRAE Transactions 107(1), 2001,
 * and Schein, Bushby, Castro and House, "A rule-based fault detection method for air handling units", Energy and
 * Buildings 38(12):1485-1492, 2006: the mode is read from the control signals, simultaneous heating and cooling is
 * a mode of its own, and rules apply only after a mode has persisted. Transferred to fan-coil units as in notes
 * section 4 (thresholds are design choices):
 *
 * <ul>
 *   <li>off: fan off;</li>
 *   <li>ventilation: fan on, both valve commands at most h;</li>
 *   <li>cooling: fan on, cooling above h, heating at most h; heating: the mirror;</li>
 *   <li>simultaneous: fan on, both above h;</li>
 *   <li>no_data: a needed value is NaN.</li>
 * </ul>
 *
 * <p>Fan on: a status on-fraction of at least {@code fanStatusOnFraction} (default 0.5), or a speed fraction above
 * {@code fanSpeedOnFraction} (default 0). Missing valve roles: pass null for a valve the unit does not have (a
 * cooling-only unit has no heating valve); it counts as closed. A NaN in a present valve is no_data, unless the
 * fan is known to be off (valves do not matter then).
 *
 * <p>Units without a fan signal ({@link FanSignal#NONE}): a valve open above h implies the fan runs (units
 * normally interlock the valves with the fan, common practice), so cooling, heating and simultaneous are still
 * found. With both valves closed, off and ventilation cannot be told apart; such samples are no_data rather than a
 * guess, and {@link ModeSplit#fanInferred()} is set so the report can say why.
 *
 * <p>Settling: the first {@code settlingSamples} samples of each new run of a mode, after a run of a different
 * mode (no_data included, since the state before a data gap is unknown), become transition. The first run of the
 * series is not settled: there is no change to settle from.
 */
public final class OperatingModes {

    private OperatingModes() {
    }

    /**
     * Classifies every sample.
     *
     * @param fan fan status on-fraction or speed fraction 0..1 per sample; null with {@link FanSignal#NONE}
     * @param fanSignal which fan signal {@code fan} is
     * @param coolingPercent cooling valve command in percent per sample, or null if the unit has none
     * @param heatingPercent heating valve command in percent per sample, or null if the unit has none
     * @param thresholds thresholds and settling
     */
    public static ModeSplit classify(double[] fan, FanSignal fanSignal, double[] coolingPercent,
            double[] heatingPercent, ModeThresholds thresholds) {
        int n = length(fan, coolingPercent, heatingPercent);
        byte[] raw = new byte[n];
        double h = thresholds.valveOpenPercent();
        for (int i = 0; i < n; i++) {
            double cooling = coolingPercent == null ? 0 : coolingPercent[i];
            double heating = heatingPercent == null ? 0 : heatingPercent[i];
            raw[i] = classifySample(fan == null ? Double.NaN : fan[i], fanSignal, cooling, heating, h, thresholds)
                    .code();
        }
        byte[] codes = settle(raw, thresholds.settlingSamples());
        int[] counts = new int[OperatingMode.values().length];
        for (byte c : codes) {
            counts[c]++;
        }
        return new ModeSplit(codes, counts, fanSignal == FanSignal.NONE);
    }

    static OperatingMode classifySample(double fan, FanSignal fanSignal, double cooling, double heating, double h,
            ModeThresholds thresholds) {
        if (Double.isNaN(cooling) || Double.isNaN(heating)) {
            if (fanSignal != FanSignal.NONE && !Double.isNaN(fan) && !fanOn(fan, fanSignal, thresholds)) {
                return OperatingMode.OFF;
            }
            return OperatingMode.NO_DATA;
        }
        boolean coolingOpen = cooling > h;
        boolean heatingOpen = heating > h;
        if (fanSignal == FanSignal.NONE) {
            if (!coolingOpen && !heatingOpen) {
                return OperatingMode.NO_DATA;
            }
        } else {
            if (Double.isNaN(fan)) {
                return OperatingMode.NO_DATA;
            }
            if (!fanOn(fan, fanSignal, thresholds)) {
                return OperatingMode.OFF;
            }
        }
        if (coolingOpen && heatingOpen) {
            return OperatingMode.SIMULTANEOUS;
        }
        if (coolingOpen) {
            return OperatingMode.COOLING;
        }
        if (heatingOpen) {
            return OperatingMode.HEATING;
        }
        return OperatingMode.VENTILATION;
    }

    private static boolean fanOn(double fan, FanSignal signal, ModeThresholds thresholds) {
        return signal == FanSignal.STATUS ? fan >= thresholds.fanStatusOnFraction()
                : fan > thresholds.fanSpeedOnFraction();
    }

    /** Marks the first {@code settling} samples of each run that follows a different mode as transition. */
    static byte[] settle(byte[] raw, int settling) {
        byte[] codes = raw.clone();
        byte noData = OperatingMode.NO_DATA.code();
        byte transition = OperatingMode.TRANSITION.code();
        int runStart = 0;
        for (int i = 0; i < raw.length; i++) {
            if (i > 0 && raw[i] != raw[i - 1]) {
                runStart = i;
            }
            if (runStart > 0 && raw[i] != noData && i - runStart < settling) {
                codes[i] = transition;
            }
        }
        return codes;
    }

    private static int length(double[] fan, double[] cooling, double[] heating) {
        int n = -1;
        for (double[] a : new double[][] {fan, cooling, heating}) {
            if (a != null) {
                if (n >= 0 && a.length != n) {
                    throw new IllegalArgumentException("fan and valve series differ in length");
                }
                n = a.length;
            }
        }
        if (n < 0) {
            throw new IllegalArgumentException("need a fan signal or at least one valve command");
        }
        return n;
    }
}
