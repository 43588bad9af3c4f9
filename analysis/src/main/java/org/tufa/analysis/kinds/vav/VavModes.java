package org.tufa.analysis.kinds.vav;

import java.util.List;
import org.tufa.analysis.band.Quantiles;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.modes.ModeSplit;

/**
 * The operating mode of every sample of a VAV box, from its airflow, airflow setpoint and reheat command, as a
 * box is sequenced (ASHRAE Guideline 36, from memory; simplified): off (no airflow asked for); reheat (reheat
 * commanded open); cooling (the flow setpoint raised above the box's minimum by the cooling loop); deadband (at
 * the minimum, reheat shut). A box without a flow setpoint is read by its measured airflow instead; a sample
 * without an airflow reading is no_data.
 *
 * <p>The box's levels come from its own data ({@link Levels}): the setpoints and limits that configure a box
 * are rarely in its model.
 */
public final class VavModes {

    public static final String OFF = "off";
    public static final String COOLING = "cooling";
    public static final String DEADBAND = "deadband";
    public static final String REHEAT = "reheat";
    public static final String NO_DATA = "no_data";

    /** The mode labels in code order (modes.csv). */
    public static final List<String> LABELS = List.of(OFF, COOLING, DEADBAND, REHEAT, NO_DATA);

    /**
     * A box's airflow levels, m3/s.
     *
     * @param reference the box's largest usual airflow: the 95th percentile of its measured airflow while it
     *                  delivers air, standing in for its cooling maximum
     * @param minimum   its minimum airflow: the 5th percentile of the flow setpoint (else of the measured airflow)
     *                  while on, the level deadband and reheat hold it at
     */
    public record Levels(double reference, double minimum) {

        /** Whether a flow setpoint or reading asks for air: above {@link #ON_SHARE} of the reference. */
        boolean on(double flow) {
            return flow > ON_SHARE * reference;
        }

        /** Whether a flow setpoint or reading is above the minimum by {@link #ABOVE_MINIMUM_SHARE} of the range. */
        boolean aboveMinimum(double flow) {
            return flow > minimum + ABOVE_MINIMUM_SHARE * (reference - minimum);
        }
    }

    /** Share of the reference airflow below which a box is off (common practice, no source). */
    static final double ON_SHARE = 0.05;
    /** Share of the minimum-to-maximum range that makes a flow cooling rather than deadband (common practice, no source). */
    static final double ABOVE_MINIMUM_SHARE = 0.05;
    /** Reheat command above which the box is in reheat, percent (the fan coil valve-open threshold). */
    static final double REHEAT_OPEN_PERCENT = 5.0;

    private VavModes() {
    }

    /** The box's airflow levels from its measured airflow and, when it has one, its flow setpoint. */
    public static Levels levels(UnitSignals s) {
        double[] airflow = s.airflow();
        double[] delivering = new double[airflow.length];
        for (int i = 0; i < airflow.length; i++) {
            delivering[i] = airflow[i] > 0 ? airflow[i] : Double.NaN;
        }
        double reference = Quantiles.linear(delivering, 0.95)[0];
        double[] flow = s.has(UnitSignals.AIRFLOW_SETPOINT) ? s.airflowSetpoint() : airflow;
        double[] on = new double[flow.length];
        for (int i = 0; i < flow.length; i++) {
            on[i] = flow[i] > ON_SHARE * reference ? flow[i] : Double.NaN;
        }
        double minimum = Quantiles.linear(on, 0.05)[0];
        return new Levels(reference, Double.isNaN(minimum) ? 0 : minimum);
    }

    /** The mode of every sample. */
    public static ModeSplit classify(UnitSignals s, Levels levels) {
        double[] airflow = s.airflow();
        boolean hasSetpoint = s.has(UnitSignals.AIRFLOW_SETPOINT);
        double[] flow = hasSetpoint ? s.airflowSetpoint() : airflow;
        double[] reheat = VavPoints.hasReheat(s) ? VavPoints.reheat(s) : null;
        byte[] codes = new byte[airflow.length];
        for (int i = 0; i < codes.length; i++) {
            String mode;
            if (Double.isNaN(airflow[i]) || Double.isNaN(flow[i]) || Double.isNaN(levels.reference())) {
                mode = NO_DATA;
            } else if (!levels.on(flow[i])) {
                mode = OFF;
            } else if (reheat != null && reheat[i] > REHEAT_OPEN_PERCENT) {
                mode = REHEAT;
            } else if (levels.aboveMinimum(flow[i])) {
                mode = COOLING;
            } else {
                mode = DEADBAND;
            }
            codes[i] = (byte) LABELS.indexOf(mode);
        }
        return ModeSplit.of(LABELS, codes, false);
    }

    /**
     * Samples in occupied hours: the occupancy point at or above one half where the box has one, else every
     * sample the box is on (a box sequenced to its schedule delivers air when occupied).
     */
    public static boolean[] occupied(UnitSignals s, ModeSplit modes) {
        boolean[] out = new boolean[s.size()];
        boolean hasOccupancy = s.has(UnitSignals.OCCUPANCY);
        double[] occ = s.occupancy();
        for (int i = 0; i < out.length; i++) {
            String m = modes.labelAt(i);
            boolean on = !m.equals(OFF) && !m.equals(NO_DATA);
            out[i] = hasOccupancy ? occ[i] >= 0.5 && !m.equals(NO_DATA) : on;
        }
        return out;
    }
}
