package org.tufa.analysis.kinds.vav;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.Profile;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.findings.DirectionCheck;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.kinds.HealthFeature;
import org.tufa.analysis.kinds.Masks;
import org.tufa.analysis.kinds.RuleChannel;
import org.tufa.analysis.kinds.UnitKind;
import org.tufa.analysis.load.SensibleLoad;
import org.tufa.analysis.modes.ModeSplit;

/**
 * VAV boxes (profiles of {@code tufa:unitKind "vav"}: cooling-only, hot-water or electric reheat, fan-powered):
 * modes from the airflow, its setpoint and the reheat ({@link VavModes}); cooling, deadband and reheat clustered on
 * the discharge against the AHU's supply air, airflow and zone on features that need no discharge sensor
 * ({@link VavFeatures}); four rules ({@link VavRules}); the load from the airflow actually measured.
 */
public final class VavKind implements UnitKind {

    /** The one instance: the kind is stateless. */
    public static final VavKind INSTANCE = new VavKind();

    /** Roles the VAV analysis reads, in the order their series are prepared. */
    public static final List<String> ROLES = List.of(
            UnitSignals.ZONE_AIR_TEMPERATURE, UnitSignals.DISCHARGE_AIR_TEMPERATURE, UnitSignals.AIRFLOW,
            UnitSignals.AIRFLOW_SETPOINT, UnitSignals.DAMPER_POSITION, UnitSignals.DAMPER_COMMAND,
            UnitSignals.REHEAT_VALVE_COMMAND, UnitSignals.ELECTRIC_REHEAT_COMMAND, UnitSignals.FAN_STATUS,
            UnitSignals.ZONE_TEMPERATURE_SETPOINT, UnitSignals.ZONE_COOLING_TEMPERATURE_SETPOINT,
            UnitSignals.ZONE_HEATING_TEMPERATURE_SETPOINT, UnitSignals.OCCUPANCY,
            UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE, UnitSignals.AHU_SUPPLY_STATIC_PRESSURE,
            UnitSignals.HOT_WATER_SUPPLY_TEMPERATURE, UnitSignals.OUTDOOR_AIR_TEMPERATURE);

    /**
     * Gate of the airflow tracking error: 10 % of the setpoint, about a flow sensor's accuracy over its range
     * (common practice, no source; Guideline 36's low-flow alarms, from memory, sit at 70 % and 50 % of setpoint).
     */
    static final double AIRFLOW_ERROR_GATE = 10.0;
    /**
     * Gate of the damper residual: 5 % of stroke, a few times an actuator's resolution and hysteresis (common
     * practice, no source).
     */
    static final double DAMPER_GATE = 5.0;
    /** Smallest day-to-day spreads: 0.1 K logging resolution (as for fan coil units); half a percent. */
    static final double TEMPERATURE_FLOOR = 0.15;
    static final double PERCENT_FLOOR = 0.5;
    /** How long a reheat coil takes to cool down after its valve shuts (as for fan coil coils; common practice). */
    static final Duration REHEAT_RECOVERY = Duration.ofMinutes(30);

    private VavKind() {
    }

    @Override
    public String name() {
        return Profile.VAV;
    }

    @Override
    public List<String> roles() {
        return ROLES;
    }

    @Override
    public String unanalysable(UnitSignals s) {
        return s.has(UnitSignals.AIRFLOW) ? null : "no trend data for the airflow";
    }

    @Override
    public List<String> notes(Map<String, PointRef> points, boolean airflowFromModel, AnalysisSettings settings) {
        List<String> notes = new ArrayList<>();
        if (points.containsKey(UnitSignals.DISCHARGE_AIR_TEMPERATURE)
                && !points.containsKey(UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE)) {
            notes.add("ahu_supply_air_temperature: not found in the model (the box's air handler and its supply"
                    + " air temperature, brick:feeds); cooling and deadband judge the discharge against the box's"
                    + " own usual level instead (discharge_level), which the AHU's supply reset blurs, and reheat"
                    + " judges its rise over the zone");
        }
        if (!points.containsKey(UnitSignals.AIRFLOW_SETPOINT)) {
            notes.add("airflow_setpoint: not found in the model; modes are read from the measured airflow and the"
                    + " airflow tracking and damper rules cannot be judged");
        }
        return notes;
    }

    @Override
    public List<String> modeLabels() {
        return VavModes.LABELS;
    }

    @Override
    public ModeSplit modes(UnitSignals s, AnalysisSettings settings) {
        return VavModes.classify(s, VavModes.levels(s));
    }

    /**
     * The box's air-side sensible load, kW: Q = rho cp V (T_zone - T_discharge) with V the airflow measured
     * ({@link SensibleLoad}, ASHRAE Handbook Fundamentals); NaN without a discharge or zone sensor.
     */
    @Override
    public double[] load(UnitSignals s) {
        double[] out = new double[s.size()];
        double[] airflow = s.airflow();
        double[] zone = s.zoneAirTemperature();
        double[] discharge = s.dischargeAirTemperature();
        for (int i = 0; i < out.length; i++) {
            out[i] = SensibleLoad.kilowatts(airflow[i], zone[i], discharge[i]);
        }
        return out;
    }

    @Override
    public List<String> clusteredModes() {
        return VavFeatures.CLUSTERED_MODES;
    }

    @Override
    public String missingFor(String mode, UnitSignals s) {
        return VavFeatures.missingFor(mode, s);
    }

    /**
     * Cooling and deadband: their samples with the reheat shut for at least {@link #REHEAT_RECOVERY}; reheat: its
     * samples; airflow: occupied samples with the box on; zone: those past the morning recovery.
     */
    @Override
    public boolean[] modeSamples(String mode, ModeSplit modes, UnitSignals s) {
        return switch (mode) {
            case VavModes.COOLING, VavModes.DEADBAND -> reheatSettled(modes.mask(mode), s);
            case VavModes.REHEAT -> modes.mask(mode);
            case VavFeatures.AIRFLOW -> Masks.and(VavModes.occupied(s, modes), VavRules.on(modes));
            case VavFeatures.ZONE -> Masks.and(VavRules.recovered(VavModes.occupied(s, modes)), VavRules.on(modes));
            default -> throw new IllegalArgumentException("no VAV mode " + mode);
        };
    }

    private static boolean[] reheatSettled(boolean[] in, UnitSignals s) {
        if (!VavPoints.hasReheat(s)) {
            return in;
        }
        double[] reheat = VavPoints.reheat(s);
        int recovery = (int) Math.max(1, Math.ceil(REHEAT_RECOVERY.toMillis() / (double) s.interval().toMillis()));
        boolean[] out = new boolean[in.length];
        int since = Integer.MAX_VALUE / 2;
        for (int i = 0; i < in.length; i++) {
            since = reheat[i] > 0.5 ? 0 : since + 1;
            out[i] = in[i] && since > recovery;
        }
        return out;
    }

    /** In cooling and reheat, where the box's load varies; not in deadband nor the airflow and zone modes. */
    @Override
    public boolean bandApplies(String mode) {
        return mode.equals(VavModes.COOLING) || mode.equals(VavModes.REHEAT);
    }

    @Override
    public FeatureMatrix features(String mode, UnitSignals s, int[] samples, ModeSplit modes) {
        return VavFeatures.build(mode, s, samples, VavModes.levels(s));
    }

    /**
     * The supply offset and reheat residual against the 1.1 K gate on both sides; the airflow error (10 %) on both
     * sides, the damper residual (5 %) on both; the zone error (gate 2 K) on its rising side only. The reheat and
     * damper residuals are against the box's own curves, so they are not compared with peers.
     */
    @Override
    public List<String> healthFeatures() {
        return List.of(VavFeatures.SUPPLY_OFFSET, VavFeatures.DISCHARGE_LEVEL, "reheat_residual", "airflow_error",
                "damper_residual", "zone_error");
    }

    @Override
    public HealthFeature health(String feature, AnalysisSettings settings) {
        return switch (feature) {
            case "airflow_error" -> new HealthFeature(feature, HealthFeature.BOTH_SIDES, AIRFLOW_ERROR_GATE,
                    PERCENT_FLOOR, 0, true);
            case "damper_residual" -> new HealthFeature(feature, HealthFeature.BOTH_SIDES, DAMPER_GATE,
                    PERCENT_FLOOR, 0, false);
            case "zone_error" -> new HealthFeature(feature, HealthFeature.RISE_ONLY, settings.zoneErrorGate(),
                    TEMPERATURE_FLOOR, 0, true);
            case "reheat_residual" -> new HealthFeature(feature, HealthFeature.BOTH_SIDES, settings.residualGate(),
                    TEMPERATURE_FLOOR, 0, false);
            case VavFeatures.DISCHARGE_LEVEL -> new HealthFeature(feature, HealthFeature.BOTH_SIDES,
                    settings.residualGate(), TEMPERATURE_FLOOR, 0, false);
            default -> new HealthFeature(feature, HealthFeature.BOTH_SIDES, settings.residualGate(),
                    TEMPERATURE_FLOOR, 0, true);
        };
    }

    /** In reheat: the discharge must rise with the reheat command. */
    @Override
    public DirectionCheck.Outcome direction(String mode, FeatureMatrix f, boolean[] rows) {
        if (!mode.equals(VavModes.REHEAT)) {
            return null;
        }
        return DirectionCheck.check(f, rows, "reheat_command", "discharge_air_temperature", false);
    }

    @Override
    public List<RuleChannel> rules(UnitSignals s, ModeSplit modes, AnalysisSettings settings) {
        return VavRules.of(s, modes, VavModes.levels(s), settings);
    }
}
