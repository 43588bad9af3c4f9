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

    /** The detection for units of a profile's {@code tufa:unitKind}, or empty when this version has none. */
    public static Optional<UnitKind> of(String unitKind) {
        return ALL.stream().filter(k -> k.name().equals(unitKind)).findFirst();
    }
}
