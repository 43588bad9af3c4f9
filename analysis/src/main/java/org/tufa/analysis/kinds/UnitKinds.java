package org.tufa.analysis.kinds;

import java.util.List;
import java.util.Optional;
import org.tufa.analysis.kinds.fancoil.FanCoilKind;
import org.tufa.analysis.kinds.vav.VavKind;

/** The kinds of unit this version detects faults on, by the {@code tufa:unitKind} of their profiles. */
public final class UnitKinds {

    /** Every kind with a detection, in a fixed order. */
    public static final List<UnitKind> ALL = List.of(FanCoilKind.INSTANCE, VavKind.INSTANCE);

    private UnitKinds() {
    }

    /**
     * The engineering gate of a health feature known by its name alone (an analysis folder read back): the gate
     * of the first kind, in {@link #ALL}'s order, that names the feature among its own; a name no kind claims gets
     * the fan coil gates (the residual gate).
     */
    public static double gate(String feature, org.tufa.analysis.fleet.AnalysisSettings settings) {
        for (UnitKind kind : ALL) {
            if (kind.healthFeatures().contains(feature)) {
                return kind.health(feature, settings).gate();
            }
        }
        return FanCoilKind.INSTANCE.health(feature, settings).gate();
    }

    /** The detection for units of a profile's {@code tufa:unitKind}, or empty when this version has none. */
    public static Optional<UnitKind> of(String unitKind) {
        return ALL.stream().filter(k -> k.name().equals(unitKind)).findFirst();
    }
}
