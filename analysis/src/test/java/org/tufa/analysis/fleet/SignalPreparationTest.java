package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.coverage.PointRef;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.kinds.vav.VavKind;
import org.tufa.analysis.modes.FanSignal;
import org.tufa.analysis.trends.ResampledSeries;
import org.tufa.analysis.trends.SeriesKind;

/** A VAV box's series in canonical units: airflow in m3/s, pressure in Pa, temperatures in C (NIST SP 811). */
class SignalPreparationTest {

    static final Instant START = Instant.parse("2031-06-02T00:00:00Z");
    static final Duration STEP = Duration.ofMinutes(15);
    static final String QUDT = "http://qudt.org/vocab/unit/";

    private static SignalPreparation.Prepared prepare(Map<String, PointRef> points, Map<String, double[]> data) {
        UnitInputs in = new UnitInputs("urn:x:vav-1", "VAV-1", VavKind.INSTANCE.name(), points, FanSignal.NONE, 0.3, false);
        return SignalPreparation.prepare(in, id -> Optional.ofNullable(data.get(id)).map(v -> new ResampledSeries(id,
                SeriesKind.ANALOG, START, STEP, v, v.length, v.length, 0)), START, STEP, 2);
    }

    private static PointRef point(String id, String unit) {
        return new PointRef("urn:x:" + id, id, id, unit == null ? null : QUDT + unit, null);
    }

    @Test
    void airflowAndPressureAreConvertedByTheirUnits() {
        Map<String, PointRef> points = new LinkedHashMap<>();
        points.put(UnitSignals.AIRFLOW, point("af", "FT3-PER-MIN"));
        points.put(UnitSignals.AIRFLOW_SETPOINT, point("afsp", "L-PER-SEC"));
        points.put(UnitSignals.AHU_SUPPLY_STATIC_PRESSURE, point("sp", "IN_H2O"));
        points.put(UnitSignals.DISCHARGE_AIR_TEMPERATURE, point("dat", "DEG_F"));
        SignalPreparation.Prepared p = prepare(points, Map.of("af", new double[] {1000, 500},
                "afsp", new double[] {472, 236}, "sp", new double[] {1.0, 1.5}, "dat", new double[] {55, 95}));
        UnitSignals s = p.signals();
        // 1 ft3/min = 0.000 471 947 4 m3/s, 1 L/s = 0.001 m3/s, 1 inch of water = 249.0889 Pa (NIST SP 811
        // (2008), appendix B.8); 55 F = 12.78 C, 95 F = 35 C.
        assertEquals(0.4719474, s.airflow()[0], 1e-9);
        assertEquals(0.2359737, s.airflow()[1], 1e-9);
        assertEquals(0.472, s.airflowSetpoint()[0], 1e-12);
        assertEquals(373.63335, s.ahuSupplyStaticPressure()[1], 1e-6);
        assertEquals(12.778, s.dischargeAirTemperature()[0], 0.001);
        assertEquals(35.0, s.dischargeAirTemperature()[1], 1e-9);
        assertEquals(List.of(), p.notes());
    }

    @Test
    void anAirflowWithoutAUnitIsReadByItsMagnitudeAndNoted() {
        Map<String, PointRef> points = new LinkedHashMap<>();
        points.put(UnitSignals.AIRFLOW, point("af", null));
        SignalPreparation.Prepared p = prepare(points, Map.of("af", new double[] {180, 220}));
        assertEquals(0.18, p.signals().airflow()[0], 1e-12);
        assertEquals(1, p.notes().size());
        assertTrue(p.notes().get(0).startsWith("airflow: the model gives no airflow unit tufa reads for af; read as"
                + " L/s (median 200)"), p.notes().get(0));
    }
}
