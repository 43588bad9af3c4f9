package org.tufa.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.fleet.FleetPlan;
import org.tufa.analysis.fleet.UnitInputs;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.trends.SeriesKind;

/** How the plan is cut into Spark partitions (common practice, no source: contiguous, balanced, none empty). */
class SplitTest {

    private static FleetPlan plan(String pattern) {
        List<FleetPlan.Unit> units = new ArrayList<>();
        Map<String, SeriesKind> wanted = new java.util.TreeMap<>();
        for (int i = 0; i < pattern.length(); i++) {
            String id = "u" + (char) ('a' + i);
            PointRef zat = new PointRef(id + "#zat", "zat", id + "-zat", null, "Zone_Air_Temperature_Sensor");
            UnitInputs in = new UnitInputs(id, id, "fan_coil", Map.of("zone_air_temperature", zat), FanSignal.NONE, 0.1, false);
            boolean analysed = pattern.charAt(i) == 'A';
            units.add(new FleetPlan.Unit(in, id, analysed ? null : "skipped"));
            if (analysed) {
                wanted.put(id + "-zat", SeriesKind.ANALOG);
            }
        }
        return new FleetPlan(units, wanted, Map.of());
    }

    private static String cut(String pattern, int count) {
        StringBuilder b = new StringBuilder();
        for (FleetPlan p : SparkUnitEngine.split(plan(pattern), count)) {
            assertFalse(p.units().isEmpty(), "no empty part");
            if (b.length() > 0) {
                b.append('|');
            }
            p.units().forEach(u -> b.append(u.analysed() ? 'A' : 's'));
            // Each part reads only the series of its own analysed units.
            assertEquals(p.units().stream().filter(FleetPlan.Unit::analysed).count(), p.wanted().size());
        }
        return b.toString();
    }

    @Test
    void unitsStayInOrderWithAboutEqualAnalysedUnitsPerPart() {
        assertEquals("AA|AA|AA", cut("AAAAAA", 3));
        assertEquals("AsA|sAA|Ass", cut("AsAsAAAss", 3));
        assertEquals("AAA|AA", cut("AAAAA", 2));
        assertEquals("A|A", cut("AA", 5), "never more parts than analysed units");
        assertEquals("sss", cut("sss", 4), "a fleet without analysed units is one part");
        assertEquals("AAAA", cut("AAAA", 1));
    }
}
