package org.tufa.analysis.kinds.fancoil;

import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.features.CoilResponse;
import org.tufa.analysis.features.FanStages;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.RobustLine;
import org.tufa.analysis.features.RollingMedian;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.features.ValveActivity;

/**
 * Builds the feature rows of one fan coil unit in one operating mode: physically informed health features that make a
 * fault stand out from a change of load — the coil residual ({@link CoilResponse}), the discharge offset in
 * ventilation, the valve activity ({@link ValveActivity}), residuals and offsets smoothed by a short running
 * median ({@link RollingMedian}) — and the unit's role values in that mode with the upstream supply-water and
 * outdoor temperatures where present.
 *
 * <p>Only the health features are clustered: in the space of raw role values a change of load (valve, zone and
 * discharge temperatures moving together) separates samples as much as a fault does, which is why PCA + OPTICS
 * on raw values flags few fault hours. The role values stay in the matrix (and in features.csv) to describe
 * each cluster's shift from normal in engineering units.
 *
 * <p>A sample enters only when every feature of the mode has a value; the others are counted by the caller.
 */
public final class FanCoilFeatures {

    /** Half window of the valve activity: 4 samples each side, 2 hours at 15 minutes (common practice, no source). */
    public static final int ACTIVITY_HALF_WINDOW = 4;
    /**
     * Half window of the running median on residuals, offsets and zone errors, counted in samples of the same
     * mode (not grid samples, so nights and other modes do not thin it): 12 each side, about six hours of
     * operation (common practice, no source). Faults worth a finding last days (a failed fan, a biased sensor, a
     * fouled coil), while a single-sample spike or a transient after start-up lasts minutes; the window keeps the
     * first and removes the second, so clusters form around persistent states.
     */
    public static final int SMOOTHING_HALF_WINDOW = 12;

    private FanCoilFeatures() {
    }

    /** Modes this class builds features for. */
    public static final List<String> CLUSTERED_MODES = List.of("cooling", "heating", "ventilation");

    /**
     * Returns why the unit cannot be analysed in the mode (a missing role), or null when it can.
     */
    public static String missingFor(String mode, UnitSignals s) {
        List<String> missing = new ArrayList<>();
        if (!UnitSignals.present(s.zoneAirTemperature())) {
            missing.add("zone_air_temperature");
        }
        if (!UnitSignals.present(s.dischargeAirTemperature())) {
            missing.add("discharge_air_temperature");
        }
        if (mode.equals("cooling") && !UnitSignals.present(s.coolingValveCommand())) {
            missing.add("cooling_valve_command");
        }
        if (mode.equals("heating") && !UnitSignals.present(s.heatingValveCommand())) {
            missing.add("heating_valve_command");
        }
        return missing.isEmpty() ? null : "missing " + String.join(", ", missing);
    }

    /**
     * Feature rows of the given samples (grid indices, ascending) in the given mode.
     *
     * @throws IllegalArgumentException for a mode that is not clustered or a unit that lacks its roles
     */
    public static FeatureMatrix build(String mode, UnitSignals s, int[] samples) {
        boolean[] running = new boolean[s.size()];
        java.util.Arrays.fill(running, true);
        return build(mode, s, samples, running);
    }

    /**
     * @param running per grid sample: in the mode itself. The valve activity counts only moves between consecutive
     *                samples of the mode, so it measures how a loop holds while it runs: a valve that opens as the
     *                fan starts and shuts as it stops (unoccupied cycling) is not unstable, and a loop that leaves
     *                the mode each time it swings is the hunting rule's to judge.
     */
    public static FeatureMatrix build(String mode, UnitSignals s, int[] samples, boolean[] running) {
        return build(mode, s, samples, null, running);
    }

    /**
     * Feature rows of {@code samples} whose coil curve (and outdoor-temperature line) is learnt from a part of them
     * only: the samples inside the load band, so that the samples outside it are judged against the unit's usual
     * operation instead of shaping it. The running medians run over all the samples, in time order.
     *
     * @param learnFrom per entry of {@code samples}: whether the models learn from it (null: all of them)
     */
    public static FeatureMatrix build(String mode, UnitSignals s, int[] samples, boolean[] learnFrom,
                                      boolean[] running) {
        String why = missingFor(mode, s);
        if (why != null) {
            throw new IllegalArgumentException(why);
        }
        if (learnFrom != null && learnFrom.length != samples.length) {
            throw new IllegalArgumentException(samples.length + " samples, " + learnFrom.length + " learning flags");
        }
        return switch (mode) {
            case "cooling" -> coil(s, samples, learnFrom, true, running);
            case "heating" -> coil(s, samples, learnFrom, false, running);
            case "ventilation" -> ventilation(s, samples);
            default -> throw new IllegalArgumentException("no features for mode " + mode);
        };
    }

    /** The UTC day of each sample, counted from the epoch: the blocks the coil's stage offsets are learnt in. */
    private static int[] days(UnitSignals s, int[] samples) {
        long start = s.time(0).getEpochSecond();
        long step = s.interval().getSeconds();
        int[] day = new int[samples.length];
        for (int k = 0; k < samples.length; k++) {
            day[k] = (int) Math.floorDiv(start + samples[k] * step, 86_400L);
        }
        return day;
    }

    /** The entries of {@code a} where {@code keep} holds ({@code a} itself when keep is null). */
    private static int[] only(int[] a, boolean[] keep) {
        if (keep == null || a == null) {
            return a;
        }
        int[] out = new int[a.length];
        int m = 0;
        for (int k = 0; k < a.length; k++) {
            if (keep[k]) {
                out[m++] = a[k];
            }
        }
        return java.util.Arrays.copyOf(out, m);
    }

    /** The entries of {@code a} where {@code keep} holds ({@code a} itself when keep is null). */
    private static double[] only(double[] a, boolean[] keep) {
        if (keep == null || a == null) {
            return a;
        }
        double[] out = new double[a.length];
        int m = 0;
        for (int k = 0; k < a.length; k++) {
            if (keep[k]) {
                out[m++] = a[k];
            }
        }
        return java.util.Arrays.copyOf(out, m);
    }

    private static FeatureMatrix coil(UnitSignals s, int[] samples, boolean[] learnFrom, boolean cooling,
                                      boolean[] running) {
        double[] zone = s.zoneAirTemperature();
        double[] discharge = s.dischargeAirTemperature();
        double[] valve = cooling ? s.coolingValveCommand() : s.heatingValveCommand();
        double[] water = cooling ? s.chilledWaterSupplyTemperature() : s.hotWaterSupplyTemperature();
        boolean hasWater = UnitSignals.present(water);
        boolean hasOutdoor = UnitSignals.present(s.outdoorAirTemperature());
        double sign = cooling ? 1 : -1;

        int n = samples.length;
        double[] v = new double[n];
        double[] air = new double[n];
        double[] wat = hasWater ? new double[n] : null;
        for (int k = 0; k < n; k++) {
            int i = samples[k];
            v[k] = valve[i];
            air[k] = sign * (zone[i] - discharge[i]);
            if (hasWater) {
                wat[k] = sign * (zone[i] - water[i]);
            }
        }
        double[] speed = s.fanSpeed();
        double[] speedAt = null;
        if (speed != null) {
            speedAt = new double[n];
            for (int k = 0; k < n; k++) {
                speedAt[k] = speed[samples[k]];
            }
        }
        // A staged fan's lower stages pass less air through the coil, which then changes its temperature more:
        // the curve gets an offset per stage (CoilResponse), or normal operation splits by stage.
        FanStages stages = FanStages.of(speedAt);
        int[] stage = stages.count() == 0 ? null : stages.stageOfSample();
        CoilResponse response = CoilResponse.fit(only(v, learnFrom), only(air, learnFrom), only(wat, learnFrom),
                only(stage, learnFrom), stages.count(), stage == null ? null : only(days(s, samples), learnFrom));
        // A two-position valve toggles by design: its activity says nothing about loop stability, and clustering on
        // it only splits normal operation by how often the thermostat switched.
        boolean modulating = !ValveActivity.twoPosition(valve);
        double[] activity = null;
        if (modulating) {
            double[] whileRunning = valve.clone();
            for (int i = 0; i < whileRunning.length; i++) {
                if (!running[i]) {
                    whileRunning[i] = Double.NaN;
                }
            }
            activity = ValveActivity.of(whileRunning, ACTIVITY_HALF_WINDOW);
        }
        double[] rawResidual = new double[n];
        for (int k = 0; k < n; k++) {
            rawResidual[k] = response.residual(v[k], air[k], hasWater ? wat[k] : Double.NaN,
                    stage == null ? 0 : stage[k]);
        }
        if (!hasWater && hasOutdoor) {
            // Without a supply-water sensor the water temperature is unknown, but plants reset it on the outdoor
            // temperature: what the residual shares with the outdoor temperature is the reset, not the unit.
            double[] outdoor = new double[n];
            for (int k = 0; k < n; k++) {
                outdoor[k] = s.outdoorAirTemperature()[samples[k]];
            }
            rawResidual = RobustLine.fit(only(outdoor, learnFrom), only(rawResidual, learnFrom))
                    .residuals(outdoor, rawResidual);
        }
        double[] residual = RollingMedian.of(rawResidual, SMOOTHING_HALF_WINDOW);
        // Cooling only: the zone held above its setpoint with the coil working is a capacity shortfall (no
        // airflow, no water); the setpoint role is the active (target) setpoint. Heating setpoints are often a
        // different point, so the mirror feature is left out rather than guessed. Tried (the zone below the
        // heating setpoint of the pair, else the single one, counted only with the valve at 90 % or more, since a
        // loop with travel left below the logged setpoint follows a setback the log does not carry): it found a
        // failed fan on a two-position winter unit of the dev set, but the healthy 500-unit year logs one setpoint
        // of 26-28 degC that is the cooling one, and 14 units differed from their peers on it all year (healthy
        // hours flagged 0.05 -> 3.2 %). A single logged setpoint cannot be trusted in heating.
        boolean hasError = cooling && UnitSignals.present(s.zoneSetpoint());
        double[] zoneError = null;
        if (hasError) {
            double[] rawError = new double[n];
            for (int k = 0; k < n; k++) {
                rawError[k] = zone[samples[k]] - s.zoneSetpoint()[samples[k]];
            }
            zoneError = RollingMedian.of(rawError, SMOOTHING_HALF_WINDOW);
        }

        String valveName = cooling ? "cooling_valve_command" : "heating_valve_command";
        String waterName = cooling ? "chilled_water_supply_temperature" : "hot_water_supply_temperature";
        Columns c = new Columns();
        c.add("coil_residual", "K", true);
        if (modulating) {
            c.add("valve_activity", "%", true);
        }
        if (hasError) {
            c.add("zone_error", "K", true);
        }
        c.add("discharge_air_temperature", "degC", false);
        c.add("zone_air_temperature", "degC", false);
        c.add(valveName, "%", false);
        if (hasWater) {
            c.add(waterName, "degC", false);
        }
        if (hasOutdoor) {
            c.add("outdoor_air_temperature", "degC", false);
        }
        List<double[]> rows = new ArrayList<>(n);
        List<Integer> index = new ArrayList<>(n);
        for (int k = 0; k < n; k++) {
            int i = samples[k];
            double[] row = new double[c.size()];
            int j = 0;
            row[j++] = residual[k];
            if (modulating) {
                row[j++] = activity[i];
            }
            if (hasError) {
                row[j++] = zoneError[k];
            }
            row[j++] = discharge[i];
            row[j++] = zone[i];
            row[j++] = valve[i];
            if (hasWater) {
                row[j++] = water[i];
            }
            if (hasOutdoor) {
                row[j++] = s.outdoorAirTemperature()[i];
            }
            if (allFinite(row)) {
                rows.add(row);
                index.add(i);
            }
        }
        return c.matrix(rows, index);
    }

    private static FeatureMatrix ventilation(UnitSignals s, int[] samples) {
        boolean hasOutdoor = UnitSignals.present(s.outdoorAirTemperature());
        Columns c = new Columns();
        // Fan only, both valves shut: discharge should equal zone plus fan heat. A persistent offset is a
        // leaking valve or a biased sensor (notes on ventilation mode; G36 leaking-valve logic).
        c.add("discharge_offset", "K", true);
        c.add("discharge_air_temperature", "degC", false);
        c.add("zone_air_temperature", "degC", false);
        if (hasOutdoor) {
            c.add("outdoor_air_temperature", "degC", false);
        }
        double[] rawOffset = new double[samples.length];
        for (int k = 0; k < samples.length; k++) {
            rawOffset[k] = s.dischargeAirTemperature()[samples[k]] - s.zoneAirTemperature()[samples[k]];
        }
        double[] offset = RollingMedian.of(rawOffset, SMOOTHING_HALF_WINDOW);
        List<double[]> rows = new ArrayList<>(samples.length);
        List<Integer> index = new ArrayList<>(samples.length);
        for (int k = 0; k < samples.length; k++) {
            int i = samples[k];
            double[] row = new double[c.size()];
            row[0] = offset[k];
            row[1] = s.dischargeAirTemperature()[i];
            row[2] = s.zoneAirTemperature()[i];
            if (hasOutdoor) {
                row[3] = s.outdoorAirTemperature()[i];
            }
            if (allFinite(row)) {
                rows.add(row);
                index.add(i);
            }
        }
        return c.matrix(rows, index);
    }

    private static boolean allFinite(double[] row) {
        for (double x : row) {
            if (!Double.isFinite(x)) {
                return false;
            }
        }
        return true;
    }

    /** Collects column names, units and health flags in order. */
    private static final class Columns {
        private final List<String> names = new ArrayList<>();
        private final List<String> units = new ArrayList<>();
        private final List<Boolean> health = new ArrayList<>();

        void add(String name, String unit, boolean isHealth) {
            names.add(name);
            units.add(unit);
            health.add(isHealth);
        }

        int size() {
            return names.size();
        }

        FeatureMatrix matrix(List<double[]> rows, List<Integer> index) {
            boolean[] h = new boolean[health.size()];
            for (int j = 0; j < h.length; j++) {
                h[j] = health.get(j);
            }
            return new FeatureMatrix(names, units, h, rows.toArray(new double[0][]),
                    index.stream().mapToInt(Integer::intValue).toArray());
        }
    }
}
