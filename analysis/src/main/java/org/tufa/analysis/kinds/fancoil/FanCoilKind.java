package org.tufa.analysis.kinds.fancoil;

import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.tufa.analysis.band.Quantiles;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.coverage.Profile;
import org.tufa.analysis.coverage.UnitCoverage;
import org.tufa.analysis.episodes.DayIndex;
import org.tufa.analysis.episodes.UsualHours;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.features.RollingMedian;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.features.ValveActivity;
import org.tufa.analysis.findings.BalanceRules;
import org.tufa.analysis.findings.DirectionCheck;
import org.tufa.analysis.findings.ModeHunting;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.kinds.HealthFeature;
import org.tufa.analysis.kinds.Masks;
import org.tufa.analysis.kinds.RuleChannel;
import org.tufa.analysis.kinds.UnitKind;
import org.tufa.analysis.load.SensibleLoad;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.modes.ModeSplit;
import org.tufa.analysis.modes.ModeThresholds;
import org.tufa.analysis.modes.OperatingMode;
import org.tufa.analysis.modes.OperatingModes;

/**
 * Fan coil units (profiles of {@code tufa:unitKind "fan_coil"}): modes from the fan and the two valve commands
 * ({@link OperatingModes}, after APAR), cooling, heating and ventilation clustered on the coil residual, valve
 * activity, zone error and the fan-only discharge offset ({@link FanCoilFeatures}), ventilation on its steady
 * samples only ({@link #steadyVentilation}), and three kinds of rule: simultaneous heating and cooling, hunting
 * ({@link ModeHunting}) and the mode energy-balance rules ({@link BalanceRules}).
 */
public final class FanCoilKind implements UnitKind {

    /** The one instance: the kind is stateless. */
    public static final FanCoilKind INSTANCE = new FanCoilKind();

    /** Roles the fan coil analysis reads, in the order their series are prepared. */
    public static final List<String> ROLES = List.of(
            UnitSignals.ZONE_AIR_TEMPERATURE, UnitSignals.DISCHARGE_AIR_TEMPERATURE, UnitSignals.COOLING_VALVE_COMMAND,
            UnitSignals.HEATING_VALVE_COMMAND, UnitSignals.FAN_STATUS, UnitSignals.FAN_SPEED,
            UnitSignals.ZONE_TEMPERATURE_SETPOINT, UnitSignals.CHILLED_WATER_SUPPLY_TEMPERATURE, UnitSignals.HOT_WATER_SUPPLY_TEMPERATURE,
            UnitSignals.OUTDOOR_AIR_TEMPERATURE);

    private FanCoilKind() {
    }

    @Override
    public String name() {
        return Profile.FAN_COIL;
    }

    /** None: fan coil units were the first kind, and their channel keys stay as they were. */
    @Override
    public String channelPrefix() {
        return "";
    }

    @Override
    public List<String> roles() {
        return ROLES;
    }

    @Override
    public Map<String, PointRef> points(UnitCoverage coverage) {
        Map<String, PointRef> points = new LinkedHashMap<>(UnitKind.super.points(coverage));
        if (!points.containsKey(UnitSignals.ZONE_TEMPERATURE_SETPOINT)) {
            // A unit modelled with the cooling/heating pair: the zone error is judged in cooling only, against the
            // cooling setpoint, so that one stands in for the single setpoint.
            coverage.point(UnitSignals.ZONE_COOLING_TEMPERATURE_SETPOINT)
                    .ifPresent(p -> points.put(UnitSignals.ZONE_TEMPERATURE_SETPOINT, p));
        }
        return points;
    }

    @Override
    public String unanalysable(UnitSignals s) {
        return s.has(UnitSignals.ZONE_AIR_TEMPERATURE) && s.has(UnitSignals.DISCHARGE_AIR_TEMPERATURE) ? null
                : "no trend data for the zone or discharge air temperature";
    }

    @Override
    public List<String> notes(Map<String, PointRef> points, boolean airflowFromModel, AnalysisSettings settings) {
        List<String> notes = new ArrayList<>();
        for (String valve : List.of(UnitSignals.COOLING_VALVE_COMMAND, UnitSignals.HEATING_VALVE_COMMAND)) {
            if (!points.containsKey(valve)) {
                notes.add(valve + ": not found in the model; operating modes treat that valve as shut, and fan-only (ventilation) samples cannot be told from it, so they are left out");
            }
        }
        if (!airflowFromModel) {
            notes.add(String.format(Locale.ROOT, "no nominal airflow in the model; energy uses the"
                    + " default %.3f m3/s (add tufa:nominalAirflow to the unit)", settings.defaultAirflow()));
        }
        return notes;
    }

    @Override
    public List<String> modeLabels() {
        return ModeSplit.FAN_COIL_LABELS;
    }

    @Override
    public ModeSplit modes(UnitSignals s, AnalysisSettings settings) {
        return classify(s, settings.modeThresholds());
    }

    /** The unit's air-side sensible load per sample, kW ({@link SensibleLoad}). */
    @Override
    public double[] load(UnitSignals s) {
        double[] fan = s.fanFraction();
        if (s.fanSignal() == FanSignal.NONE || !UnitSignals.present(s.fanFraction())) {
            // Without a fan signal the fan counts as running whenever the unit is in a coil mode (inferred).
            fan = new double[s.size()];
            Arrays.fill(fan, 1.0);
        }
        return SensibleLoad.kilowatts(s.nominalAirflow(), fan, s.zoneAirTemperature(), s.dischargeAirTemperature());
    }

    @Override
    public List<String> clusteredModes() {
        return FanCoilFeatures.CLUSTERED_MODES;
    }

    @Override
    public String missingFor(String mode, UnitSignals s) {
        return FanCoilFeatures.missingFor(mode, s);
    }

    @Override
    public boolean[] modeSamples(String mode, ModeSplit modes, UnitSignals s) {
        return modes.mask(operatingMode(mode));
    }

    /**
     * Steady ventilation in ventilation; in heating and cooling the samples whose supply water can drive the coil
     * ({@link #waterCanDrive}).
     */
    @Override
    public boolean[] clusteredSamples(String mode, ModeSplit modes, UnitSignals s) {
        OperatingMode m = operatingMode(mode);
        return switch (m) {
            case VENTILATION -> steadyVentilation(modes, s);
            case COOLING, HEATING -> waterCanDrive(modes.mask(m), s, m == OperatingMode.COOLING);
            default -> modes.mask(m);
        };
    }

    /**
     * Share of the mode's usual drive (the entering difference between supply water and zone that the plant gives
     * at its 90th percentile over the mode's samples) below which a coil sample is not clustered (common practice,
     * no source). The coil residual compares the air's temperature change with the coil's effectiveness times
     * this entering difference (ASHRAE Handbook Fundamentals). A plant off for the season lets its loop drift
     * toward room temperature (hot water at 24 degC in July, chilled water at 16 degC behind a chiller lockout),
     * and its pump is usually off too, so a unit that still opens its valve moves almost nothing: its residual
     * says the plant is off, not that the unit is faulty. Those samples are left to the energy-balance rules,
     * which judge a coil that moves no heat whatever the reason. Relative to the unit's own plant rather than a
     * fixed kelvin figure, because plants run at very different temperatures (a hot-water reset, a warm
     * chilled-water loop for chilled beams).
     */
    static final double MIN_DRIVE_SHARE = 0.5;

    /** The mode's samples, less those whose supply water lies too close to the zone to drive the coil. */
    static boolean[] waterCanDrive(boolean[] inMode, UnitSignals s, boolean cooling) {
        double[] water = cooling ? s.chilledWaterSupplyTemperature() : s.hotWaterSupplyTemperature();
        if (!UnitSignals.present(water)) {
            return inMode;
        }
        double[] zone = s.zoneAirTemperature();
        double[] drive = new double[inMode.length];
        for (int i = 0; i < drive.length; i++) {
            drive[i] = !inMode[i] ? Double.NaN : cooling ? zone[i] - water[i] : water[i] - zone[i];
        }
        double[] sorted = Quantiles.finiteSorted(drive);
        if (sorted.length == 0) {
            return inMode;
        }
        double least = MIN_DRIVE_SHARE * Quantiles.linearOfSorted(sorted, 0.9);
        boolean[] out = inMode.clone();
        for (int i = 0; i < out.length; i++) {
            if (out[i] && drive[i] < least) {
                out[i] = false;
            }
        }
        return out;
    }

    /** In heating and cooling; not in ventilation, where the coil load is zero by definition. */
    @Override
    public boolean bandApplies(String mode) {
        return operatingMode(mode) != OperatingMode.VENTILATION;
    }

    @Override
    public FeatureMatrix features(String mode, UnitSignals s, int[] samples, ModeSplit modes) {
        return FanCoilFeatures.build(mode, s, samples, modes.mask(operatingMode(mode)));
    }

    @Override
    public FeatureMatrix featuresOutsideBand(String mode, UnitSignals s, int[] samples, boolean[] inBand,
                                             ModeSplit modes) {
        FeatureMatrix all = FanCoilFeatures.build(mode, s, samples, inBand, modes.mask(operatingMode(mode)));
        boolean[] outside = new boolean[s.size()];
        for (int k = 0; k < samples.length; k++) {
            outside[samples[k]] = !inBand[k];
        }
        return all.onlySamples(outside);
    }

    /**
     * The coil residual on the side of more heat moved than the coil curve allows at that valve opening. The
     * samples judged lie above the band in heat moved (see {@code UnitAnalysis}); a valve that opened for a
     * larger load explains their heat, and a residual past the gate beyond that says the air side changed: a
     * trickle of air leaving the coil near the water temperature (a failed fan or belt with the status still on).
     * Not the other side: at the band's edge the curve is extrapolated past the openings it was learnt at, so a
     * coil doing less than the extrapolation there is the curve's error, not the unit's; and not the zone error,
     * which any load above the coil's capacity raises.
     */
    @Override
    public int[] sidesOutsideBand(String feature) {
        return feature.equals("coil_residual") ? new int[] {1} : new int[0];
    }

    private static OperatingMode operatingMode(String mode) {
        return OperatingMode.valueOf(mode.toUpperCase(Locale.ROOT));
    }

    /**
     * The health features: the coil residual and the fan-only discharge offset on both sides against the 1.1 K gate;
     * valve activity (gate 2 %/sample, and half the unit's own normal activity) and zone error (gate 2 K) on their
     * rising side only, since a calmer valve or a cooler zone is no fault. The coil residual and valve activity are
     * the unit's own (against its own coil curve, after its own control style), so they are not compared with
     * peers.
     */
    @Override
    public List<String> healthFeatures() {
        return List.of("coil_residual", "valve_activity", "zone_error", "discharge_offset");
    }

    @Override
    public HealthFeature health(String feature, AnalysisSettings settings) {
        return switch (feature) {
            case "valve_activity" -> new HealthFeature(feature, HealthFeature.RISE_ONLY, settings.activityGate(),
                    ACTIVITY_FLOOR, 0.5, false);
            case "zone_error" -> new HealthFeature(feature, HealthFeature.RISE_ONLY, settings.zoneErrorGate(),
                    TEMPERATURE_FLOOR, 0, true);
            case "coil_residual" -> new HealthFeature(feature, HealthFeature.BOTH_SIDES, settings.residualGate(),
                    TEMPERATURE_FLOOR, 0, false);
            default -> new HealthFeature(feature, HealthFeature.BOTH_SIDES, settings.residualGate(),
                    TEMPERATURE_FLOOR, 0, true);
        };
    }

    /**
     * Smallest day-to-day spread of a health feature: about the resolution a BAS logs it with (0.1 K for
     * temperatures, logged at 0.1 degC or 0.1 degF; half a percent per sample for valve activity), so that a very
     * steady unit does not turn a rounding step into a large deviation (common practice, no source).
     */
    static final double TEMPERATURE_FLOOR = 0.15;
    static final double ACTIVITY_FLOOR = 0.5;

    /** In cooling and heating: the discharge must follow the active coil's valve. */
    @Override
    public DirectionCheck.Outcome direction(String mode, FeatureMatrix f, boolean[] rows) {
        if (mode.equals("ventilation")) {
            return null;
        }
        boolean cooling = mode.equals("cooling");
        return DirectionCheck.check(f, rows, cooling ? "cooling_valve_command" : "heating_valve_command",
                "discharge_air_temperature", cooling);
    }

    /**
     * Both valves open together and the energy-balance rules are faults by physics whatever the unit's own days
     * say; how often a unit changes mode depends on its control, so hunting is judged against its own days.
     */
    @Override
    public List<RuleChannel> rules(UnitSignals s, ModeSplit modes, AnalysisSettings settings) {
        List<RuleChannel> out = new ArrayList<>();
        boolean[] running = running(modes);
        out.add(new RuleChannel("any", "simultaneous_heating_cooling", running,
                modes.mask(OperatingMode.SIMULTANEOUS), RuleChannel.DEFAULT_MIN_SHARE, 0, true));
        out.add(new RuleChannel("any", "mode_hunting", running, hunting(s, settings),
                RuleChannel.DEFAULT_MIN_SHARE, Double.NaN, false));
        out.addAll(balanceRules(modes, s, settings));
        out.add(outsideUsualHours(s, modes, running, settings));
        return out;
    }

    /**
     * Running in the hours the unit usually does not run ({@link UsualHours}): the share of the day's usually-off
     * samples with the fan running, against the unit's own days (night cycling is some units' normal; judged
     * against them, short runs that follow the weather on every unit at once become fleet-wide findings). The
     * hours are the unit's own, so the share is not compared with peers.
     */
    private static RuleChannel outsideUsualHours(UnitSignals s, ModeSplit modes, boolean[] running,
                                                 AnalysisSettings settings) {
        int[] day = DayIndex.of(s.gridStart(), s.interval(), s.size(), settings.dayZone());
        int[] hour = DayIndex.hourOf(s.gridStart(), s.interval(), s.size(), settings.dayZone());
        boolean[] hasData = new boolean[running.length];
        for (int i = 0; i < hasData.length; i++) {
            hasData[i] = modes.at(i) != OperatingMode.NO_DATA;
        }
        UsualHours usual = UsualHours.fit(day, hour, hasData, running);
        return new RuleChannel("any", "running_outside_usual_hours", usual.eligible(day, hour, hasData), running,
                RuleChannel.DEFAULT_MIN_SHARE, Double.NaN, false);
    }

    /** How long a coil takes to reach the zone's temperature after its valve shuts (common practice, no source). */
    static final Duration COIL_RECOVERY = Duration.ofMinutes(30);

    /**
     * Fan-only samples with both valves commanded shut ({@link #shut}) and at least {@link #COIL_RECOVERY} after the
     * last sample of a coil mode (cooling, heating,
     * simultaneous, or the transition that follows them): before that the water left in the coil and a slow
     * actuator still cool or warm the air, which is normal and no leaking valve (the field practice of dropping
     * the first 15-30 minutes after a mode change; APAR evaluates its rules only in steady state, Schein et al.
     * 2006).
     */
    public static boolean[] steadyVentilation(ModeSplit modes, UnitSignals s) {
        Duration interval = s.interval();
        int n = modes.codes().length;
        int recovery = (int) Math.max(1, Math.ceil(COIL_RECOVERY.toMillis() / (double) interval.toMillis()));
        boolean[] out = new boolean[n];
        int sinceCoil = Integer.MAX_VALUE / 2;
        double[] cooling = s.coolingValveCommand();
        double[] heating = s.heatingValveCommand();
        for (int i = 0; i < n; i++) {
            OperatingMode m = modes.at(i);
            boolean coil = m == OperatingMode.COOLING || m == OperatingMode.HEATING
                    || m == OperatingMode.SIMULTANEOUS;
            if (coil) {
                sinceCoil = 0;
            } else if (m == OperatingMode.VENTILATION || m == OperatingMode.TRANSITION) {
                sinceCoil++;
            } else {
                sinceCoil = Integer.MAX_VALUE / 2; // fan off: the coil has time to settle
            }
            out[i] = m == OperatingMode.VENTILATION && sinceCoil > recovery
                    && shut(cooling[i]) && shut(heating[i]);
        }
        // Steady state: the discharge temperature holds still from one sample to the next. A polled trend log sees
        // the command only at the log instant; a two-position valve that cycles between instants shows as a
        // discharge jumping by kelvins with the logged command at zero.
        double[] d = s.dischargeAirTemperature();
        boolean[] steady = out.clone();
        for (int i = 0; i < n; i++) {
            if (out[i]) {
                boolean before = i > 0 && Math.abs(d[i] - d[i - 1]) <= STEADY_STEP_K;
                boolean after = i + 1 < n && Math.abs(d[i + 1] - d[i]) <= STEADY_STEP_K;
                steady[i] = before && after;
            }
        }
        return steady;
    }

    /**
     * A valve commanded fully shut: at most half a percent, i.e. zero as a BAS logs commands (to 1 % or 0.01).
     * A command below the open threshold of the modes (5 %) still passes water on most valves (a 2 % command on
     * an equal-percentage valve cools the air by kelvins), so fan-only analysis takes only samples whose valves are
     * commanded shut (common practice, no source). A missing command is a missing valve.
     */
    static boolean shut(double command) {
        return Double.isNaN(command) || command <= SHUT_PERCENT;
    }

    /**
     * Largest change of the discharge temperature between consecutive samples in steady fan-only operation: the
     * 1.1 K sensor tolerance (common practice, no source; APAR's steady-state filter, Schein et al. 2006).
     */
    static final double STEADY_STEP_K = 1.1;

    /** Largest command that counts as fully shut, percent. */
    static final double SHUT_PERCENT = 0.5;

    /**
     * Samples in a stretch with at least 3 changes between running modes (cooling, heating, ventilation,
     * simultaneous) within a 2-hour window (8 samples at 15 minutes) while a valve swings by at least
     * {@link #HUNTING_ACTIVITY} percent per sample on average: the unit hunts. Changes are counted on the modes
     * before settling, and a fan starting or stopping (to or from off) is not a change, so unoccupied fan cycling
     * never counts; the swing condition keeps a valve that settles near the open threshold (flipping between
     * fan-only and cooling at low load) from counting, and only a modulating valve's swing counts
     * ({@link ValveActivity#twoPosition}): a two-position valve cycling on its thermostat is not hunting (common
     * practice, no source).
     */
    private static boolean[] hunting(UnitSignals s, AnalysisSettings settings) {
        ModeSplit raw = classify(s, settings.modeThresholds().withSettlingSamples(0));
        byte[] codes = raw.codes();
        boolean[] changed = new boolean[codes.length];
        for (int i = 1; i < codes.length; i++) {
            OperatingMode m = OperatingMode.ofCode(codes[i]);
            OperatingMode previous = OperatingMode.ofCode(codes[i - 1]);
            changed[i] = m != previous && running(m) && running(previous);
        }
        boolean[] flags = ModeHunting.flags(changed, 4, 3);
        double[] cooling = ValveActivity.of(s.coolingValveCommand(), FanCoilFeatures.ACTIVITY_HALF_WINDOW);
        double[] heating = ValveActivity.of(s.heatingValveCommand(), FanCoilFeatures.ACTIVITY_HALF_WINDOW);
        // Only a modulating valve can hunt: a two-position valve cycles on its thermostat by design.
        boolean coolingModulates = !ValveActivity.twoPosition(s.coolingValveCommand());
        boolean heatingModulates = !ValveActivity.twoPosition(s.heatingValveCommand());
        for (int i = 0; i < flags.length; i++) {
            double swing = Math.max(coolingModulates && !Double.isNaN(cooling[i]) ? cooling[i] : 0,
                    heatingModulates && !Double.isNaN(heating[i]) ? heating[i] : 0);
            flags[i] &= swing >= HUNTING_ACTIVITY;
        }
        return flags;
    }

    /** Valve swing (mean absolute change per sample, percent) that makes mode changes hunting. */
    static final double HUNTING_ACTIVITY = 10.0;

    /**
     * The mode energy-balance rules ({@link BalanceRules}) on the discharge and zone temperatures, each sample
     * smoothed by the same running median as the features so a spike cannot fail a rule. Tolerance: twice the
     * residual gate (two sensors, each within about 1.1 K) in ventilation, once in heating and cooling, where the
     * coil drives the difference well past it.
     */
    private static List<RuleChannel> balanceRules(ModeSplit modes, UnitSignals s, AnalysisSettings settings) {
        if (!UnitSignals.present(s.dischargeAirTemperature()) || !UnitSignals.present(s.zoneAirTemperature())) {
            return List.of();
        }
        List<RuleChannel> out = new ArrayList<>();
        double eps = settings.residualGate();
        record Rule(OperatingMode mode, String kind, double tolerance) {
        }
        for (Rule rule : List.of(new Rule(OperatingMode.HEATING, "heating_without_heat", eps),
                new Rule(OperatingMode.COOLING, "cooling_without_cooling", eps),
                new Rule(OperatingMode.VENTILATION, "ventilation_offset", 2 * eps))) {
            boolean[] in = rule.mode() == OperatingMode.VENTILATION ? steadyVentilation(modes, s)
                    : modes.mask(rule.mode());
            int[] idx = Masks.indices(in);
            double[] difference = new double[idx.length];
            for (int k = 0; k < idx.length; k++) {
                difference[k] = s.dischargeAirTemperature()[idx[k]] - s.zoneAirTemperature()[idx[k]];
            }
            double[] smooth = RollingMedian.of(difference, 2);
            boolean[] eligible = new boolean[in.length];
            boolean[] failed = new boolean[in.length];
            for (int k = 0; k < idx.length; k++) {
                double d = smooth[k];
                if (Double.isNaN(d)) {
                    continue;
                }
                eligible[idx[k]] = true;
                failed[idx[k]] = switch (rule.mode()) {
                    case HEATING -> BalanceRules.heatingWithoutHeat(0, d, rule.tolerance());
                    case COOLING -> BalanceRules.coolingWithoutCooling(0, d, rule.tolerance());
                    default -> BalanceRules.ventilationOffset(0, d, rule.tolerance());
                };
            }
            out.add(new RuleChannel(rule.mode().label(), rule.kind(), eligible, failed, 0.5, 0, true));
        }
        return out;
    }

    /**
     * Modes per sample. A valve the unit has no command for counts as shut, so the other coil's modes are still
     * found (the fleet runner notes it); but "both valves shut" cannot be known then, so what would be ventilation
     * becomes no_data: a real cooling valve, open and unseen, must not pass for fan-only operation.
     */
    static ModeSplit classify(UnitSignals s, ModeThresholds thresholds) {
        FanSignal fanSignal = s.fanSignal();
        boolean fan = fanSignal != FanSignal.NONE && UnitSignals.present(s.fanFraction());
        boolean cooling = UnitSignals.present(s.coolingValveCommand());
        boolean heating = UnitSignals.present(s.heatingValveCommand());
        ModeSplit split = OperatingModes.classify(fan ? s.fanFraction() : null, fan ? fanSignal : FanSignal.NONE,
                cooling ? s.coolingValveCommand() : null, heating ? s.heatingValveCommand() : null, thresholds);
        if (cooling && heating) {
            return split;
        }
        byte[] codes = split.codes().clone();
        int[] counts = split.counts().clone();
        for (int i = 0; i < codes.length; i++) {
            if (codes[i] == OperatingMode.VENTILATION.code()) {
                codes[i] = OperatingMode.NO_DATA.code();
                counts[OperatingMode.VENTILATION.code()]--;
                counts[OperatingMode.NO_DATA.code()]++;
            }
        }
        return new ModeSplit(codes, counts, split.fanInferred());
    }

    private static boolean running(OperatingMode m) {
        return m == OperatingMode.COOLING || m == OperatingMode.HEATING || m == OperatingMode.VENTILATION
                || m == OperatingMode.SIMULTANEOUS;
    }

    /** Samples with the fan running: a running mode, or the transition sample after a change of mode. */
    private static boolean[] running(ModeSplit modes) {
        boolean[] out = new boolean[modes.codes().length];
        for (int i = 0; i < out.length; i++) {
            out[i] = running(modes.at(i)) || modes.at(i) == OperatingMode.TRANSITION;
        }
        return out;
    }
}
