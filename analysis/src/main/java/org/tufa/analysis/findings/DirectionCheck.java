package org.tufa.analysis.findings;

/**
 * The expected direction of change inside a mode: in cooling the discharge temperature falls as the cooling valve
 * opens, in heating it rises as the heating valve opens (coil energy balance; the APAR rules of Schein et al.,
 * Energy and Buildings 38(12), 2006, state the same expectations for air handlers). A cluster in which the
 * discharge temperature does not follow the valve points at a valve that does not move (stuck valve or actuator)
 * or a coil without water.
 */
public final class DirectionCheck {

    /** The outcome for one cluster. */
    public enum Outcome {
        /** Discharge follows the valve in the expected direction. */
        AS_EXPECTED,
        /** Discharge does not follow the valve, or moves the wrong way. */
        FAILS,
        /** The valve barely moved inside the cluster; nothing can be said. */
        INCONCLUSIVE
    }

    /** A valve must span at least this many percent inside a cluster for the check to speak (common practice, no source). */
    public static final double MIN_VALVE_SPAN = 20.0;
    /** Weakest correlation still counted as following the valve (common practice, no source). */
    public static final double MIN_CORRELATION = 0.3;

    private DirectionCheck() {
    }

    /**
     * @param valve      valve command of the active coil (percent), one value per cluster sample
     * @param discharge  discharge temperature, one value per cluster sample
     * @param cooling    true in cooling mode (expected correlation negative), false in heating (positive)
     */
    public static Outcome check(double[] valve, double[] discharge, boolean cooling) {
        if (valve.length < 3) {
            return Outcome.INCONCLUSIVE;
        }
        double span = percentile(valve, 0.9) - percentile(valve, 0.1);
        if (span < MIN_VALVE_SPAN) {
            return Outcome.INCONCLUSIVE;
        }
        double r = pearson(valve, discharge);
        double expectedSign = cooling ? -1 : 1;
        return r * expectedSign >= MIN_CORRELATION ? Outcome.AS_EXPECTED : Outcome.FAILS;
    }

    /**
     * The check on some rows of a feature matrix.
     *
     * @param rows      per row: in the group checked
     * @param command   the column of the command (percent)
     * @param discharge the column of the discharge temperature
     */
    public static Outcome check(org.tufa.analysis.features.FeatureMatrix f, boolean[] rows, String command,
                                String discharge, boolean cooling) {
        int c = f.indexOf(command);
        int d = f.indexOf(discharge);
        int size = 0;
        for (boolean r : rows) {
            size += r ? 1 : 0;
        }
        double[] v = new double[size];
        double[] t = new double[size];
        int k = 0;
        for (int i = 0; i < rows.length; i++) {
            if (rows[i]) {
                v[k] = f.rows()[i][c];
                t[k++] = f.rows()[i][d];
            }
        }
        return check(v, t, cooling);
    }

    /** Pearson's product-moment correlation; 0 when either series is constant. */
    static double pearson(double[] x, double[] y) {
        int n = x.length;
        double mx = 0;
        double my = 0;
        for (int i = 0; i < n; i++) {
            mx += x[i];
            my += y[i];
        }
        mx /= n;
        my /= n;
        double sxy = 0;
        double sxx = 0;
        double syy = 0;
        for (int i = 0; i < n; i++) {
            double dx = x[i] - mx;
            double dy = y[i] - my;
            sxy += dx * dy;
            sxx += dx * dx;
            syy += dy * dy;
        }
        return sxx == 0 || syy == 0 ? 0 : sxy / Math.sqrt(sxx * syy);
    }

    private static double percentile(double[] v, double p) {
        double[] s = v.clone();
        java.util.Arrays.sort(s);
        double h = (s.length - 1) * p;
        int lo = (int) Math.floor(h);
        int hi = Math.min(lo + 1, s.length - 1);
        return s[lo] + (h - lo) * (s[hi] - s[lo]);
    }
}
