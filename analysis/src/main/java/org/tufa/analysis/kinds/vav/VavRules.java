package org.tufa.analysis.kinds.vav;

import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.features.RollingMedian;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.fleet.AnalysisSettings;
import org.tufa.analysis.kinds.RuleChannel;
import org.tufa.analysis.modes.ModeSplit;

/**
 * The rules of a VAV box, each a share of the day's eligible samples (judged by the per-unit detection as every
 * kind's rules are). Each sample's quantity is first smoothed by a short running median ({@link RollingMedian},
 * 2 samples each side) so that a spike or a loop's transient cannot fail a rule.
 * <ul>
 *   <li>{@code damper_open_flow_short}: the damper at least {@value #DAMPER_OPEN_PERCENT} % open and the airflow
 *       short of its setpoint by more than {@value #SHORT_SHARE} of it: the box can deliver no more, so the flow
 *       setpoint cannot be met (too little supply pressure, a blocked inlet, a setpoint above what the box can
 *       pass). By physics a healthy box never does this for long (it is sized to reach its maximum part open).</li>
 *   <li>{@code reheat_without_rise}: the reheat commanded at least {@value #REHEAT_WELL_OPEN_PERCENT} % open with
 *       air flowing, and the discharge less than {@value #MIN_REHEAT_RISE_K} K above the AHU's supply air: no heat
 *       from the coil (valve or actuator stuck shut, no hot water, a tripped heater). Q = rho cp V dT: at a half-open
 *       valve a reheat coil sized for the heating maximum raises the air by well over 3 K (ASHRAE Handbook
 *       Fundamentals for Q; the margin is common practice, no source).</li>
 *   <li>{@code airflow_below_minimum}: occupied, and the airflow below {@value #BELOW_MINIMUM_SHARE} of the box's
 *       minimum: the zone gets less than its ventilation minimum (ASHRAE Guideline 36 holds the minimum whenever
 *       the zone is occupied; from memory).</li>
 *   <li>{@code zone_not_held}: occupied, past the morning recovery, and the zone more than the zone-error gate
 *       outside its band from heating to cooling setpoint. Judged against the box's own days: how often a zone
 *       drifts depends on its loads.</li>
 * </ul>
 */
public final class VavRules {

    static final double DAMPER_OPEN_PERCENT = 95.0;
    static final double SHORT_SHARE = 0.1;
    static final double REHEAT_WELL_OPEN_PERCENT = 50.0;
    static final double MIN_REHEAT_RISE_K = 3.0;
    static final double BELOW_MINIMUM_SHARE = 0.8;
    /** Samples after the first occupied sample of a day before the zone counts as recovered: 2 hours at 15 min. */
    static final int RECOVERY_SAMPLES = 8;
    private static final int HALF_WINDOW = 2;

    private VavRules() {
    }

    /** The box's rule channels. */
    public static List<RuleChannel> of(UnitSignals s, ModeSplit modes, VavModes.Levels levels,
                                       AnalysisSettings settings) {
        List<RuleChannel> out = new ArrayList<>();
        boolean[] on = on(modes);
        boolean[] occupied = VavModes.occupied(s, modes);
        int n = s.size();
        double[] airflow = RollingMedian.of(s.airflow(), HALF_WINDOW);
        if (s.has(UnitSignals.AIRFLOW_SETPOINT) && VavPoints.hasDamper(s)) {
            double[] setpoint = s.airflowSetpoint();
            double[] damper = RollingMedian.of(VavPoints.damper(s), HALF_WINDOW);
            boolean[] eligible = new boolean[n];
            boolean[] flagged = new boolean[n];
            for (int i = 0; i < n; i++) {
                eligible[i] = on[i] && finite(airflow[i], setpoint[i], damper[i]);
                flagged[i] = eligible[i] && damper[i] >= DAMPER_OPEN_PERCENT
                        && airflow[i] < (1 - SHORT_SHARE) * setpoint[i];
            }
            out.add(new RuleChannel("any", "damper_open_flow_short", eligible, flagged,
                    RuleChannel.DEFAULT_MIN_SHARE, 0, true));
        }
        if (VavPoints.hasReheat(s) && s.has(UnitSignals.DISCHARGE_AIR_TEMPERATURE)
                && s.has(UnitSignals.AHU_SUPPLY_AIR_TEMPERATURE)) {
            double[] reheat = VavPoints.reheat(s);
            double[] rise = new double[n];
            for (int i = 0; i < n; i++) {
                rise[i] = s.dischargeAirTemperature()[i] - s.ahuSupplyAirTemperature()[i];
            }
            rise = RollingMedian.of(rise, HALF_WINDOW);
            boolean[] eligible = new boolean[n];
            boolean[] flagged = new boolean[n];
            for (int i = 0; i < n; i++) {
                eligible[i] = on[i] && reheat[i] >= REHEAT_WELL_OPEN_PERCENT && levels.on(airflow[i])
                        && finite(rise[i]);
                flagged[i] = eligible[i] && rise[i] < MIN_REHEAT_RISE_K;
            }
            out.add(new RuleChannel(VavModes.REHEAT, "reheat_without_rise", eligible, flagged, 0.5, 0, true));
        }
        if (levels.minimum() > 0) {
            boolean[] eligible = new boolean[n];
            boolean[] flagged = new boolean[n];
            for (int i = 0; i < n; i++) {
                eligible[i] = occupied[i] && finite(airflow[i]);
                flagged[i] = eligible[i] && airflow[i] < BELOW_MINIMUM_SHARE * levels.minimum();
            }
            out.add(new RuleChannel("any", "airflow_below_minimum", eligible, flagged,
                    RuleChannel.DEFAULT_MIN_SHARE, 0, true));
        }
        if (s.has(UnitSignals.ZONE_AIR_TEMPERATURE) && VavPoints.hasZoneSetpoint(s)) {
            double[] zone = RollingMedian.of(s.zoneAirTemperature(), HALF_WINDOW);
            double[] cooling = VavPoints.coolingSetpoint(s);
            double[] heating = VavPoints.heatingSetpoint(s);
            boolean[] recovered = recovered(occupied);
            boolean[] eligible = new boolean[n];
            boolean[] flagged = new boolean[n];
            for (int i = 0; i < n; i++) {
                double error = VavFeatures.zoneError(zone[i], cooling[i], heating[i]);
                eligible[i] = recovered[i] && on[i] && finite(error);
                flagged[i] = eligible[i] && error > settings.zoneErrorGate();
            }
            out.add(new RuleChannel("any", "zone_not_held", eligible, flagged, RuleChannel.DEFAULT_MIN_SHARE,
                    Double.NaN, true));
        }
        return out;
    }

    /** Samples where the box delivers air (not off, not without data). */
    static boolean[] on(ModeSplit modes) {
        boolean[] out = new boolean[modes.codes().length];
        for (int i = 0; i < out.length; i++) {
            String m = modes.labelAt(i);
            out[i] = !m.equals(VavModes.OFF) && !m.equals(VavModes.NO_DATA);
        }
        return out;
    }

    /** Occupied samples at least {@link #RECOVERY_SAMPLES} after the start of their occupied stretch. */
    static boolean[] recovered(boolean[] occupied) {
        boolean[] out = new boolean[occupied.length];
        int run = 0;
        for (int i = 0; i < occupied.length; i++) {
            run = occupied[i] ? run + 1 : 0;
            out[i] = run > RECOVERY_SAMPLES;
        }
        return out;
    }

    private static boolean finite(double... v) {
        for (double x : v) {
            if (!Double.isFinite(x)) {
                return false;
            }
        }
        return true;
    }
}
