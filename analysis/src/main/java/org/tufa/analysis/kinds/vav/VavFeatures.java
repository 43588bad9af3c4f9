package org.tufa.analysis.kinds.vav;

import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.RollingMedian;
import org.tufa.analysis.features.UnitSignals;

/**
 * The feature rows of a VAV box in one of its clustered modes: physically informed health features that make a
 * fault stand out from a change of load, each smoothed by a running median over the mode's consecutive samples
 * ({@link RollingMedian}), beside role values that describe the operating point.
 * <ul>
 *   <li>cooling and deadband, reheat shut: {@code supply_offset}, the discharge minus the AHU's supply air
 *       temperature (K). With the reheat shut the box only carries the air (a duct gain of a fraction of a kelvin);
 *       a rise is heat the coil passes while shut, a fall or rise a biased sensor. A box whose model does not link
 *       it to its AHU's supply temperature gets {@code discharge_level} instead: the discharge against its own
 *       median in the mode.</li>
 *   <li>reheat: {@code reheat_residual}, the discharge rise over the AHU's supply against the box's own rise at
 *       that valve command ({@link BinnedCurve}; K), over the zone where the AHU's supply is not known. The rise is Q / (rho cp V): the air-side sensible heat of
 *       ASHRAE Handbook Fundamentals.</li>
 *   <li>airflow (no discharge sensor needed): {@code airflow_error}, the measured airflow minus its setpoint in
 *       percent of the setpoint (of the box's minimum at least); {@code damper_residual}, the damper opening minus the box's own
 *       opening at that airflow ({@link BinnedCurve}; %). A drifting flow sensor leaves the flow loop satisfied but
 *       moves the damper away from its usual opening; too little supply pressure opens it wider.</li>
 *   <li>zone: {@code zone_error}, how far the zone lies outside its band from the heating to the cooling setpoint
 *       (K; negative inside).</li>
 * </ul>
 * A sample enters only when every feature of the mode has a value.
 */
public final class VavFeatures {

    /** Clustered modes: the profile's mode names (tufa.ttl). */
    public static final String AIRFLOW = "airflow";
    public static final String ZONE = "zone";
    public static final List<String> CLUSTERED_MODES = List.of(VavModes.COOLING, VavModes.DEADBAND,
            VavModes.REHEAT, AIRFLOW, ZONE);

    /** The health feature of cooling and deadband with the AHU's supply temperature, and without it. */
    public static final String SUPPLY_OFFSET = "supply_offset";
    public static final String DISCHARGE_LEVEL = "discharge_level";

    /** Half window of the running median: 8 samples each side, 2 hours at 15 minutes (common practice, no source). */
    public static final int SMOOTHING_HALF_WINDOW = 8;
    /** Bins of the damper curve: 5 % of the reference airflow; of the reheat curve: 10 % of command. */
    static final double AIRFLOW_BIN_PERCENT = 5.0;
    static final double REHEAT_BIN_PERCENT = 10.0;
    /** Fewest samples a bin of a curve needs (a day's worth of one hour; common practice, no source). */
    static final int MIN_BIN_SAMPLES = 8;

    private VavFeatures() {
    }

    /** Why the box cannot be analysed in the mode (the roles it lacks), or null. */
    public static String missingFor(String mode, UnitSignals s) {
        List<String> missing = new ArrayList<>();
        if (!s.has(UnitSignals.AIRFLOW)) {
            missing.add(UnitSignals.AIRFLOW);
        }
        switch (mode) {
            case VavModes.COOLING, VavModes.DEADBAND -> need(s, missing, UnitSignals.DISCHARGE_AIR_TEMPERATURE);
            case VavModes.REHEAT -> {
                need(s, missing, UnitSignals.DISCHARGE_AIR_TEMPERATURE);
                if (!s.has(UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE) && !s.has(UnitSignals.ZONE_AIR_TEMPERATURE)) {
                    missing.add("ahu_supply_air_temperature or zone_air_temperature");
                }
                if (!VavPoints.hasReheat(s)) {
                    missing.add("reheat_command");
                }
            }
            case AIRFLOW -> {
                need(s, missing, UnitSignals.AIRFLOW_SETPOINT);
                if (!VavPoints.hasDamper(s)) {
                    missing.add("damper");
                }
            }
            case ZONE -> {
                need(s, missing, UnitSignals.ZONE_AIR_TEMPERATURE);
                if (!VavPoints.hasZoneSetpoint(s)) {
                    missing.add("zone setpoint");
                }
            }
            default -> throw new IllegalArgumentException("no VAV features for mode " + mode);
        }
        return missing.isEmpty() ? null : "missing " + String.join(", ", missing);
    }

    private static void need(UnitSignals s, List<String> missing, String role) {
        if (!s.has(role)) {
            missing.add(role);
        }
    }

    /**
     * Feature rows of the given samples (grid indices, ascending) in the mode.
     *
     * @param levels the box's reference and minimum airflow ({@link VavModes.Levels})
     */
    public static FeatureMatrix build(String mode, UnitSignals s, int[] samples, VavModes.Levels levels) {
        double reference = levels.reference();
        String why = missingFor(mode, s);
        if (why != null) {
            throw new IllegalArgumentException(why);
        }
        Columns c = new Columns(samples);
        double[] airflowShare = c.take(s.airflow(), 100 / reference);
        switch (mode) {
            case VavModes.COOLING, VavModes.DEADBAND -> {
                double[] discharge = c.take(s.dischargeAirTemperature(), 1);
                if (s.has(UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE)) {
                    double[] supply = c.take(s.ahuSupplyAirTemperature(), 1);
                    c.health(SUPPLY_OFFSET, "K", RollingMedian.of(minus(discharge, supply), SMOOTHING_HALF_WINDOW));
                    c.role("discharge_air_temperature", "degC", discharge);
                    c.role("ahu_supply_air_temperature", "degC", supply);
                } else {
                    // Without the AHU's supply temperature: the discharge against the box's own median in the
                    // mode. Weaker (the AHU's reset moves it by a kelvin or two), but a leak still stands out.
                    double median = org.tufa.analysis.band.Quantiles.median(discharge);
                    double[] level = new double[discharge.length];
                    for (int k = 0; k < level.length; k++) {
                        level[k] = discharge[k] - median;
                    }
                    c.health(DISCHARGE_LEVEL, "K", RollingMedian.of(level, SMOOTHING_HALF_WINDOW));
                    c.role("discharge_air_temperature", "degC", discharge);
                }
                c.role("airflow_share", "%", airflowShare);
            }
            case VavModes.REHEAT -> {
                double[] discharge = c.take(s.dischargeAirTemperature(), 1);
                // The rise over the air the coil receives: the AHU's supply, else the zone (the air a box without
                // an AHU point is compared with; its own curve absorbs the difference).
                double[] supply = c.take(s.has(UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE) ? s.ahuSupplyAirTemperature()
                        : s.zoneAirTemperature(), 1);
                double[] command = c.take(VavPoints.reheat(s), 1);
                double[] rise = minus(discharge, supply);
                BinnedCurve curve = BinnedCurve.fit(command, rise, c.days(s), 0, 100, REHEAT_BIN_PERCENT,
                        MIN_BIN_SAMPLES);
                double[] residual = new double[rise.length];
                for (int k = 0; k < rise.length; k++) {
                    residual[k] = rise[k] - curve.at(command[k]);
                }
                c.health("reheat_residual", "K", RollingMedian.of(residual, SMOOTHING_HALF_WINDOW));
                c.role("reheat_command", "%", command);
                c.role("discharge_air_temperature", "degC", discharge);
                c.role(s.has(UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE) ? "ahu_supply_air_temperature"
                        : "zone_air_temperature", "degC", supply);
                c.role("airflow_share", "%", airflowShare);
            }
            case AIRFLOW -> {
                double[] setpointShare = c.take(s.airflowSetpoint(), 100 / reference);
                double[] damper = c.take(VavPoints.damper(s), 1);
                BinnedCurve curve = BinnedCurve.fit(airflowShare, damper, c.days(s), 0, 150, AIRFLOW_BIN_PERCENT,
                        MIN_BIN_SAMPLES);
                double[] residual = new double[damper.length];
                for (int k = 0; k < damper.length; k++) {
                    residual[k] = damper[k] - curve.at(airflowShare[k]);
                }
                // The tracking error relative to the setpoint, as flow alarms are set (a share of the setpoint),
                // with the minimum as the smallest divisor so a setpoint near zero cannot blow it up.
                double floor = 100 * levels.minimum() / reference;
                double[] error = new double[airflowShare.length];
                for (int k = 0; k < error.length; k++) {
                    error[k] = 100 * (airflowShare[k] - setpointShare[k]) / Math.max(setpointShare[k], floor);
                }
                c.health("airflow_error", "%", RollingMedian.of(error, SMOOTHING_HALF_WINDOW));
                c.health("damper_residual", "%", RollingMedian.of(residual, SMOOTHING_HALF_WINDOW));
                c.role("airflow_share", "%", airflowShare);
                c.role("airflow_setpoint_share", "%", setpointShare);
                c.role("damper", "%", damper);
            }
            case ZONE -> {
                double[] zone = c.take(s.zoneAirTemperature(), 1);
                double[] cooling = c.take(VavPoints.coolingSetpoint(s), 1);
                double[] heating = c.take(VavPoints.heatingSetpoint(s), 1);
                double[] error = new double[zone.length];
                for (int k = 0; k < zone.length; k++) {
                    error[k] = zoneError(zone[k], cooling[k], heating[k]);
                }
                c.health("zone_error", "K", RollingMedian.of(error, SMOOTHING_HALF_WINDOW));
                c.role("zone_air_temperature", "degC", zone);
                c.role("airflow_share", "%", airflowShare);
            }
            default -> throw new IllegalArgumentException("no VAV features for mode " + mode);
        }
        return c.matrix();
    }

    /**
     * How far a zone lies outside its band from the heating to the cooling setpoint, K: positive above the cooling
     * or below the heating setpoint, negative inside (the distance to the nearer edge). With a single setpoint both
     * edges are that setpoint.
     */
    public static double zoneError(double zone, double coolingSetpoint, double heatingSetpoint) {
        double above = zone - coolingSetpoint;
        double below = heatingSetpoint - zone;
        if (Double.isNaN(above)) {
            return below;
        }
        if (Double.isNaN(below)) {
            return above;
        }
        return Math.max(above, below);
    }

    private static double[] minus(double[] a, double[] b) {
        double[] out = new double[a.length];
        for (int k = 0; k < a.length; k++) {
            out[k] = a[k] - b[k];
        }
        return out;
    }

    /** The columns of one matrix, over the mode's samples, kept where every column has a value. */
    private static final class Columns {
        private final int[] samples;
        private final List<String> names = new ArrayList<>();
        private final List<String> units = new ArrayList<>();
        private final List<Boolean> health = new ArrayList<>();
        private final List<double[]> values = new ArrayList<>();

        Columns(int[] samples) {
            this.samples = samples;
        }

        /** The day of each sample on the grid (24-hour blocks from the grid's start): the curves' groups. */
        int[] days(UnitSignals s) {
            long perDay = Math.max(1, java.time.Duration.ofDays(1).toMillis() / s.interval().toMillis());
            int[] out = new int[samples.length];
            for (int k = 0; k < samples.length; k++) {
                out[k] = (int) (samples[k] / perDay);
            }
            return out;
        }

        double[] take(double[] series, double scale) {
            double[] out = new double[samples.length];
            for (int k = 0; k < samples.length; k++) {
                out[k] = series[samples[k]] * scale;
            }
            return out;
        }

        void health(String name, String unit, double[] v) {
            add(name, unit, true, v);
        }

        void role(String name, String unit, double[] v) {
            add(name, unit, false, v);
        }

        private void add(String name, String unit, boolean isHealth, double[] v) {
            names.add(name);
            units.add(unit);
            health.add(isHealth);
            values.add(v);
        }

        FeatureMatrix matrix() {
            int width = names.size();
            List<double[]> rows = new ArrayList<>();
            List<Integer> index = new ArrayList<>();
            for (int k = 0; k < samples.length; k++) {
                double[] row = new double[width];
                boolean complete = true;
                for (int j = 0; j < width && complete; j++) {
                    row[j] = values.get(j)[k];
                    complete = Double.isFinite(row[j]);
                }
                if (complete) {
                    rows.add(row);
                    index.add(samples[k]);
                }
            }
            boolean[] h = new boolean[width];
            for (int j = 0; j < width; j++) {
                h[j] = health.get(j);
            }
            return new FeatureMatrix(names, units, h, rows.toArray(new double[0][]),
                    index.stream().mapToInt(Integer::intValue).toArray());
        }
    }
}
