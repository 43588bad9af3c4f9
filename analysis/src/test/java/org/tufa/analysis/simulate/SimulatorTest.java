package org.tufa.analysis.simulate;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;

class SimulatorTest {
    private static final String UNIT = "http://qudt.org/vocab/unit/";

    @Test
    void healthySummerUnitsHoldTheDeadBandAndMostlyCool() {
        // Common practice, no source: a healthy unit keeps the zone within the dead band +/- 1 K in occupied
        // hours almost all the time, and in a Toronto summer cooling dominates the running hours.
        List<UnitSeriesTargets> units = SimulationBenchmark.fleet(12, "");
        SimulationResult r = Simulator.run(new SimulationPlan(units, SimulationBenchmark.buildingTargets(""),
                Season.summer(2031), 3, List.of()));
        for (UnitTrace u : r.units()) {
            TraceSummary s = TraceSummary.of(u, r);
            assertTrue(s.occupiedInBandShare() > 0.93, s.line());
            assertTrue(s.coolingShare() > 0.2 && s.coolingShare() > 5 * s.heatingShare(), s.line());
            assertTrue(s.offShare() > 0.3, "unoccupied hours mostly off: " + s.line());
            assertTrue(s.simultaneousShare() < 0.001, s.line());
        }
    }

    @Test
    void healthyWinterUnitsHeat() {
        Season january = new Season(LocalDate.of(2031, 1, 6), LocalDate.of(2031, 1, 26), Season.DEMO_ZONE);
        SimulationResult r = Simulator.run(new SimulationPlan(SimulationBenchmark.fleet(6, ""),
                SimulationBenchmark.buildingTargets(""), january, 3, List.of()));
        for (UnitTrace u : r.units()) {
            TraceSummary s = TraceSummary.of(u, r);
            assertTrue(s.occupiedInBandShare() > 0.9, s.line());
            // Internal and solar gains keep some occupied hours in the dead band (ventilation) or even cooling.
            assertTrue(s.heatingShare() > 0.1 && s.heatingShare() > s.coolingShare(), s.line());
        }
        // Hot water reset: colder outdoors, hotter supply (60 C at -15 C, 45 C at 15 C).
        for (int s = 0; s < r.timestamps().size(); s++) {
            assertTrue(r.hotWaterSupplyC()[s] > 45 && r.hotWaterSupplyC()[s] < 62);
        }
    }

    @Test
    void airSideSensibleLoadMatchesCoilCapacityAtFullValve() {
        // A valve stuck fully open gives long stretches at full capacity. Air side: rho * cp * V * (zone - DAT)
        // with rho = 1.2 kg/m3, cp = 1.006 kJ/(kg K) (ASHRAE Handbook Fundamentals), fan heat removed, must match
        // the coil's modelled capacity at that zone and water temperature within 6 % (sensor noise and lags).
        List<UnitSeriesTargets> units = SimulationBenchmark.fleet(4, "");
        Season july = new Season(LocalDate.of(2031, 7, 1), LocalDate.of(2031, 7, 20), Season.DEMO_ZONE);
        Instant start = july.start().plusSeconds(3 * 86_400);
        List<FaultEpisode> stuckOpen = units.stream().map(u -> new FaultEpisode(u.unitIri(),
                FaultType.STUCK_COOLING_VALVE, start, july.end(), 1.0)).toList();
        SimulationResult r = Simulator.run(new SimulationPlan(units, SimulationBenchmark.buildingTargets(""), july,
                5, stuckOpen));
        int checked = 0;
        for (UnitTrace u : r.units()) {
            UnitParameters p = u.parameters();
          for (int s = 4; s < r.timestamps().size(); s++) {
            boolean steady = true;
            for (int k = s - 4; k <= s; k++) {
                steady &= u.coolingValveOpening()[k] == 1f && u.airflowLps()[k] == (float) p.nominalAirflowLps()
                        && u.heatingCommandPct()[k] == 0f;
            }
            if (!steady) {
                continue;
            }
            double airSideW = 1.2 * 1.006 * p.nominalAirflowLps()
                    * (u.zoneC()[s] - (u.dischargeC()[s] - FanCoilSimulation.FAN_HEAT_K));
            double capacityW = p.fullCoolingCapacityW(u.zoneC()[s], r.chilledWaterSupplyC()[s]);
            assertEquals(capacityW, airSideW, 0.06 * capacityW, "sample " + s);
            assertEquals(u.coolingCoilW()[s], capacityW, 0.06 * capacityW, "sample " + s);
            checked++;
          }
        }
        assertTrue(checked > 40, "steady full-valve samples: " + checked);
    }

    @Test
    void dischargeNeverBelowChilledWaterSupply() {
        // Physics (field notes section 4): a coil cannot cool air below its entering water temperature. Checked on
        // the noise-free discharge against the building's chilled-water supply (logged with 0.1 K noise).
        SimulationResult r = Simulator.run(DemoSimulation.plan(SimulationBenchmark.fleet(20, ""),
                SimulationBenchmark.buildingTargets(""), Season.summer(2031), 8));
        for (UnitTrace u : r.units()) {
            for (int s = 0; s < r.timestamps().size(); s++) {
                assertTrue(u.dischargeTrueC()[s] > r.chilledWaterSupplyC()[s] - 0.5,
                        u.unitIri() + " sample " + s + ": " + u.dischargeTrueC()[s]);
            }
        }
    }

    @Test
    void sameSeedSameBytesOtherSeedOtherBytes(@TempDir Path dir) throws Exception {
        Season short3Weeks = new Season(LocalDate.of(2031, 6, 1), LocalDate.of(2031, 6, 21), Season.DEMO_ZONE);
        List<UnitSeriesTargets> units = SimulationBenchmark.fleet(6, "");
        Map<String, SeriesTarget> building = SimulationBenchmark.buildingTargets("");
        for (DemoTrends.Layout layout : DemoTrends.Layout.values()) {
            DemoTrends.write(dir.resolve("a" + layout), Simulator.run(DemoSimulation.plan(units, building,
                    short3Weeks, 42)), layout);
            DemoTrends.write(dir.resolve("b" + layout), Simulator.run(DemoSimulation.plan(units, building,
                    short3Weeks, 42)), layout);
            DemoTrends.write(dir.resolve("c" + layout), Simulator.run(DemoSimulation.plan(units, building,
                    short3Weeks, 43)), layout);
            for (String file : List.of(DemoTrends.TRENDS_FILE, DemoTrends.TRUTH_FILE)) {
                byte[] a = Files.readAllBytes(dir.resolve("a" + layout).resolve(file));
                byte[] b = Files.readAllBytes(dir.resolve("b" + layout).resolve(file));
                byte[] c = Files.readAllBytes(dir.resolve("c" + layout).resolve(file));
                assertArrayEquals(a, b, layout + " " + file);
                assertFalse(java.util.Arrays.equals(a, c), layout + " " + file + " same for another seed");
            }
        }
        List<String> wide = Files.readAllLines(dir.resolve("aWIDE").resolve(DemoTrends.TRENDS_FILE));
        assertEquals(1 + 21 * 96, wide.size());
        assertTrue(wide.get(1).startsWith("2031-06-01T00:00:00-04:00,"), wide.get(1));
        assertEquals(1 + 3 + 6 * 7, wide.get(0).split(",").length);
        List<String> longRows = Files.readAllLines(dir.resolve("aLONG").resolve(DemoTrends.TRENDS_FILE));
        assertEquals("timestamp,point,value", longRows.get(0));
        assertEquals(1 + 21 * 96 * (3 + 6 * 7), longRows.size());
        List<String> truth = Files.readAllLines(dir.resolve("aLONG").resolve(DemoTrends.TRUTH_FILE));
        assertEquals("unit,fault,start,end,severity", truth.get(0));
        assertEquals(7, truth.size()); // six units: one of each fault type
    }

    @Test
    void fahrenheitTargetsGetFahrenheit(@TempDir Path dir) throws Exception {
        // NIST SP 811 appendix B: F = C * 9/5 + 32, so 20 C = 68 F exactly.
        StringBuilder sb = new StringBuilder();
        ValueWriter.forTarget(SimulationRoles.ZONE_AIR_TEMPERATURE, new SeriesTarget("t", UNIT + "DEG_F"))
                .append(sb, 20.0);
        assertEquals("68", sb.toString());
        sb.setLength(0);
        ValueWriter.forTarget(SimulationRoles.COOLING_VALVE_COMMAND, new SeriesTarget("v", UNIT + "UNITLESS"))
                .append(sb, 37.5);
        assertEquals("0.375", sb.toString());

        // End to end: the same unit written with Celsius and with Fahrenheit targets.
        Season days = new Season(LocalDate.of(2031, 6, 1), LocalDate.of(2031, 6, 16), Season.DEMO_ZONE);
        List<UnitSeriesTargets> celsius = SimulationBenchmark.fleet(1, "");
        Map<String, SeriesTarget> fahrenheitTargets = new TreeMap<>();
        celsius.get(0).targets().forEach((role, t) -> fahrenheitTargets.put(role, new SeriesTarget(t.seriesId(),
                SimulationRoles.quantityOf(role) == SimulationRoles.Quantity.TEMPERATURE ? UNIT + "DEG_F"
                        : t.qudtUnitIri())));
        List<UnitSeriesTargets> fahrenheit = List.of(new UnitSeriesTargets(celsius.get(0).unitIri(), "F",
                fahrenheitTargets));
        Map<String, SeriesTarget> building = SimulationBenchmark.buildingTargets("");
        DemoTrends.writeWide(dir.resolve("c.csv"), Simulator.run(new SimulationPlan(celsius, building, days, 1,
                List.of())));
        DemoTrends.writeWide(dir.resolve("f.csv"), Simulator.run(new SimulationPlan(fahrenheit, building, days, 1,
                List.of())));
        List<String> c = Files.readAllLines(dir.resolve("c.csv"));
        List<String> f = Files.readAllLines(dir.resolve("f.csv"));
        String[] header = c.get(0).split(",");
        int zoneColumn = List.of(header).indexOf(celsius.get(0).targets()
                .get(SimulationRoles.ZONE_AIR_TEMPERATURE).seriesId());
        for (int row = 1; row < c.size(); row += 97) {
            double zoneC = Double.parseDouble(c.get(row).split(",")[zoneColumn]);
            double zoneF = Double.parseDouble(f.get(row).split(",")[zoneColumn]);
            assertEquals(zoneC * 9 / 5 + 32, zoneF, 0.002);
        }
    }

    @Test
    void unsupportedUnitsAndUnknownRolesAreRejected() {
        InputException e = assertThrows(InputException.class, () -> ValueWriter.forTarget(
                SimulationRoles.DISCHARGE_AIR_TEMPERATURE, new SeriesTarget("DA-T", UNIT + "PERCENT")));
        assertTrue(e.getMessage().contains("DA-T") && e.getMessage().contains("not a temperature unit"));
        assertThrows(IllegalArgumentException.class, () -> new UnitSeriesTargets("u", "u",
                Map.of("supply_fan_speed", new SeriesTarget("x", ""))));
    }

    @Test
    void fixedPointFormatting() {
        StringBuilder sb = new StringBuilder();
        for (double v : new double[] {0.0, -0.0004, 23.4, -1.25, 12.3456, 100, 7.0005}) {
            ValueWriter.appendFixed(sb, v, 3);
            sb.append(' ');
        }
        assertEquals("0 0 23.4 -1.25 12.346 100 7.001 ", sb.toString());
    }

    @Test
    void faultPlanCoversEveryTypeInsideTheSeason() {
        List<String> iris = SimulationBenchmark.fleet(150, "").stream().map(UnitSeriesTargets::unitIri).toList();
        Season summer = Season.summer(2031);
        List<FaultEpisode> plan = FaultPlanner.plan(iris, summer, 9, FaultPlanner.DEMO_FAULTY_SHARE);
        assertEquals(Math.round(0.17 * 150), plan.size());
        for (FaultType t : FaultType.ofKind(FaultType.Kind.FAN_COIL)) {
            assertTrue(plan.stream().anyMatch(e -> e.fault() == t), t.id());
        }
        for (FaultEpisode e : plan) {
            assertFalse(e.start().isBefore(summer.start().plusSeconds(7 * 86_400)));
            assertFalse(e.end().isAfter(summer.end().minusSeconds(2 * 86_400)));
            long days = (e.end().getEpochSecond() - e.start().getEpochSecond()) / 86_400;
            assertTrue(days >= 5 && days <= 21, "episode days " + days);
            assertTrue(e.severity() >= e.fault().demoSeverityMin() && e.severity() <= e.fault().demoSeverityMax());
        }
        List<String> reversed = new java.util.ArrayList<>(iris);
        java.util.Collections.reverse(reversed);
        assertEquals(plan, FaultPlanner.plan(reversed, summer, 9, FaultPlanner.DEMO_FAULTY_SHARE));
    }
}
