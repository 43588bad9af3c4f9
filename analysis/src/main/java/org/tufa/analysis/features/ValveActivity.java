package org.tufa.analysis.features;

/**
 * Valve activity: the mean absolute change of a command between consecutive samples over a centred window, in
 * percent per sample. A control loop that hunts moves its valve back and forth all the time, so its activity is
 * several times that of a settled loop (hunting as "many command reversals per hour": House, Vaezi-Nejad and
 * Whitcomb, ASHRAE Transactions 107(1), 2001). Per-sample values cannot show an oscillation; this window can.
 */
public final class ValveActivity {

    private ValveActivity() {
    }

    /**
     * @param command    a command series on a regular grid, NaN where missing
     * @param halfWindow samples on each side of the centre (4 at 15 minutes = a 2-hour window)
     * @return activity per sample, NaN where the window holds fewer than {@code halfWindow} valid steps
     */
    public static double[] of(double[] command, int halfWindow) {
        int n = command.length;
        double[] step = new double[n];
        step[0] = Double.NaN;
        for (int i = 1; i < n; i++) {
            step[i] = Math.abs(command[i] - command[i - 1]);
        }
        // Prefix sums of valid steps and their count make each window O(1).
        double[] sum = new double[n + 1];
        int[] count = new int[n + 1];
        for (int i = 0; i < n; i++) {
            boolean ok = !Double.isNaN(step[i]);
            sum[i + 1] = sum[i] + (ok ? step[i] : 0);
            count[i + 1] = count[i] + (ok ? 1 : 0);
        }
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            int lo = Math.max(1, i - halfWindow + 1);
            int hi = Math.min(n - 1, i + halfWindow);
            int c = hi >= lo ? count[hi + 1] - count[lo] : 0;
            out[i] = c >= halfWindow ? (sum[hi + 1] - sum[lo]) / c : Double.NaN;
        }
        return out;
    }

    /** Share of a valve's open samples that must be fully open for it to count as two-position. */
    public static final double TWO_POSITION_SHARE = 0.97;
    /** Fewest open samples needed to tell a two-position valve from a modulating one. */
    public static final int MIN_OPEN_SAMPLES = 20;

    /**
     * True for a two-position (on/off) valve: whenever it is open (above 1 %), it is fully open (at least 99 %) in
     * at least {@link #TWO_POSITION_SHARE} of the samples, as a thermostat's relay drives it; a modulating valve
     * spends much of its open time part-way (common practice, no source). False when the valve was open in fewer
     * than {@link #MIN_OPEN_SAMPLES} samples: then it cannot be told.
     *
     * @param command commands in percent, NaN where missing
     */
    public static boolean twoPosition(double[] command) {
        int open = 0;
        int full = 0;
        for (double c : command) {
            if (c > 1) {
                open++;
                full += c >= 99 ? 1 : 0;
            }
        }
        return open >= MIN_OPEN_SAMPLES && full >= TWO_POSITION_SHARE * open;
    }
}
