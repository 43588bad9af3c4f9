package org.tufa.analysis.simulate;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The VAV box simulator against outside references: the air-side sensible heat Q = rho cp V dT (ASHRAE Handbook
 * Fundamentals), the reheat coil's effectiveness-NTU relation (Incropera and DeWitt, eq. 11.29b), the minimum
 * airflow and reheat sequence as ASHRAE Guideline 36 describes it (from memory: minimum in deadband, the cooling
 * loop between minimum and cooling maximum, reheat at minimum airflow in the first half of the heating loop with the
 * discharge at most 11 K above the heating setpoint, airflow up to the heating maximum in the second half), and the
 * injected faults' signatures. Plus the promise that adding boxes leaves the fan coil units' trends unchanged.
 */
class VavSimulationTest {
    private static final Season SPRING = new Season(LocalDate.of(2031, 4, 1), LocalDate.of(2031, 5, 5),
            Season.DEMO_ZONE);
    private static final Season JULY = new Season(LocalDate.of(2031, 7, 1), LocalDate.of(2031, 7, 28),
            Season.DEMO_ZONE);
    private static SimulationResult spring;

    @BeforeAll
    static void simulateSpring() {
        spring = Simulator.run(new SimulationPlan(List.of(), boxes(6, 3), SimulationBenchmark.buildingTargets(""),
                SPRING, 11, List.of()));
    }

    /** n boxes, the first reheat of them with hot-water reheat, all roles written in SI. */
    static List<VavSeriesTargets> boxes(int n, int reheat) {
        List<VavSeriesTargets> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            String name = String.format(java.util.Locale.ROOT, "VAV-%02d", i + 1);
            Map<String, SeriesTarget> t = new TreeMap<>();
            for (String role : SimulationRoles.VAV_ROLES) {
                t.put(role, new SeriesTarget("ELM." + name + "." + role, SimulationBenchmark.unitFor(role)));
            }
            out.add(new VavSeriesTargets("https://example.org/elm#" + name, name, i < reheat, t));
        }
        return out;
    }

    @Test
    void supplyAirHeatIsRhoCpVdT() {
        // ASHRAE Handbook Fundamentals: 1.08 Btu/(h cfm F) at standard air; 400 cfm and 20 F give 8,640 Btu/h =
        // 2.532 kW. 400 cfm = 188.779 L/s (NIST SP 811: 1 ft3/min = 0.4719474 L/s), 20 F = 11.111 K.
        double w = CoilModel.AIR_DENSITY * 188.779 / 1000.0 * CoilModel.AIR_CP * 20.0 * 5.0 / 9.0;
        assertEquals(8640 * 0.29307107, w, 3.0);
        // The sizing rule: a box's cooling maximum carries its design load at a 10 K supply-to-zone difference
        // with the margin, worked from its own parameters.
        for (VavTrace box : spring.vavUnits()) {
            VavParameters p = box.parameters();
            double loadW = p.internalGainWPerM2() * p.floorAreaM2() + p.windowAreaM2() * p.solarHeatGainCoefficient()
                    * VavParameters.DESIGN_SOLAR_W_PER_M2 + p.envelopeUaWPerK() * (VavParameters.DESIGN_SUMMER_OUTDOOR_C
                    - 24.0);
            double carried = CoilModel.AIR_DENSITY * p.maxAirflowLps() / 1000.0 * CoilModel.AIR_CP
                    * VavParameters.DESIGN_COOLING_DELTA_K;
            assertEquals(VavParameters.DESIGN_MARGIN * loadW, carried, 1e-6 * carried);
            assertTrue(p.minAirflowLps() >= 0.25 * p.maxAirflowLps() - 1e-9
                    && p.minAirflowLps() <= 0.35 * p.maxAirflowLps() + 1e-9);
        }
    }

    @Test
    void reheatCoilMeetsItsDesignEffectiveness() {
        // Incropera and DeWitt eq. 11.29b: with Cr = 1, epsilon = NTU / (1 + NTU); at the heating maximum and the
        // valve fully open the coil moves epsilon * C_air * (T_water - T_air) (worked by hand from the design values).
        VavParameters p = spring.vavUnits().get(0).parameters();
        double cAir = p.heatingAirCapacityRate();
        double ua = CoilModel.conductance(p.reheatUaDesign() / UnitParameters.AIR_SIDE_RESISTANCE_SHARE, 1.0,
                p.reheatUaDesign() / (1 - UnitParameters.AIR_SIDE_RESISTANCE_SHARE), 1.0);
        double q = -CoilModel.heatFromAir(cAir, VavParameters.HW_TO_AIR_CAPACITY_RATIO * cAir, ua, 14.0, 60.0);
        double ntu = p.reheatUaDesign() / cAir;
        assertEquals(ntu / (1 + ntu), q / (cAir * (60.0 - 14.0)), 1e-12);
        assertEquals(p.reheatEffectivenessDesign(), q / (cAir * 46.0), 1e-9);
    }

    @Test
    void guideline36MinimumAndReheatSequence() {
        int reheatSamples = 0;
        for (VavTrace box : spring.vavUnits()) {
            VavParameters p = box.parameters();
            for (int s = 0; s < box.occupancy().length; s++) {
                if (box.occupancy()[s] != 1f) {
                    continue;
                }
                double sp = box.airflowSetpointLps()[s];
                // Occupied: never below the minimum, never above the cooling maximum.
                assertTrue(sp >= p.minAirflowLps() - 1e-3 && sp <= p.maxAirflowLps() + 1e-3, box.unitIri() + " " + s);
                if (box.reheatCommandPct()[s] > 0) {
                    reheatSamples++;
                    assertTrue(p.reheat(), "a cooling-only box never reheats");
                    // Reheat happens between the minimum and the heating maximum, never with cooling airflow.
                    assertTrue(sp <= p.heatingMaxAirflowLps() + 1e-3, box.unitIri() + " sample " + s);
                    // Discharge no more than 11 K above the heating setpoint (1 K for the loop's overshoot).
                    assertTrue(box.dischargeTrueC()[s] <= box.heatingSetpointC()[s]
                            + VavParameters.MAX_DISCHARGE_ABOVE_SETPOINT_K + 1.0, box.unitIri() + " sample " + s);
                }
            }
        }
        assertTrue(reheatSamples > 100, "spring mornings call for reheat: " + reheatSamples);
    }

    @Test
    void healthyBoxesTrackTheirAirflowSetpointAndHoldTheirZone() {
        for (VavTrace box : spring.vavUnits()) {
            double err = 0;
            int n = 0;
            int warm = 0;
            int settled = 0;
            int occupiedRun = 0;
            for (int s = 0; s < box.occupancy().length; s++) {
                occupiedRun = box.occupancy()[s] == 1f ? occupiedRun + 1 : 0;
                if (box.occupancy()[s] == 1f && box.airflowSetpointLps()[s] > 0) {
                    err += Math.abs(box.airflowLps()[s] - box.airflowSetpointLps()[s]);
                    n++;
                    // After the morning pull-down (4 h: an interior zone floats to 29 C over a weekend).
                    if (occupiedRun > 16) {
                        settled++;
                        warm += box.zoneC()[s] > box.coolingSetpointC()[s] + 1.5 ? 1 : 0;
                    }
                }
            }
            double meanErr = err / n;
            // The reading follows the setpoint within the sensor noise (1.5 % of the maximum plus 1 % gain).
            assertTrue(meanErr < 0.04 * box.parameters().maxAirflowLps(), box.unitIri() + " " + meanErr);
            assertTrue(warm < 0.02 * settled, box.unitIri() + ": zone 1.5 K above its cooling setpoint in " + warm
                    + " of " + settled + " occupied samples");
        }
    }

    @Test
    void dischargeNeverPassesTheHotWaterAndSitsNearTheSupplyWithReheatShut() {
        for (VavTrace box : spring.vavUnits()) {
            for (int s = 0; s < box.occupancy().length; s++) {
                // Second law: the reheat coil cannot heat air above its water (Incropera and DeWitt).
                assertTrue(box.dischargeTrueC()[s] <= spring.hotWaterSupplyC()[s] + 1.0, box.unitIri() + " " + s);
                boolean steady = s > 0 && box.reheatW()[s - 1] == 0 && box.airflowTrueLps()[s - 1]
                        > box.parameters().minAirflowLps() * 0.9;
                if (steady && box.occupancy()[s] == 1f && box.reheatCommandPct()[s] == 0 && box.reheatW()[s] == 0
                        && box.airflowTrueLps()[s] > box.parameters().minAirflowLps() * 0.9) {
                    // Reheat shut: discharge = AHU supply + duct gain (the AHU's logged value carries 0.1 K noise).
                    assertEquals(spring.ahuSupplyAirC()[s] + VavSimulation.DUCT_GAIN_K, box.dischargeTrueC()[s], 0.8,
                            box.unitIri() + " sample " + s);
                }
            }
        }
    }

    @Test
    void airHandlerResetsItsSupplyTemperatureWithOutdoorAir() {
        // The reset chosen (from memory of Guideline 36's outdoor-air limits): 12.8 C above 21 C, 14.5 C below 15.5 C,
        // linear between (worked by hand: halfway, 18.25 C outdoors, gives 13.65 C).
        assertEquals(12.8, AirHandlerConditions.supplySetpointC(30), 1e-12);
        assertEquals(14.5, AirHandlerConditions.supplySetpointC(0), 1e-12);
        assertEquals(13.65, AirHandlerConditions.supplySetpointC(18.25), 1e-12);
    }

    @Test
    void addingBoxesLeavesTheFanCoilUnitsAlone() {
        List<UnitSeriesTargets> fcus = SimulationBenchmark.fleet(4, "");
        SimulationPlan alone = DemoSimulation.plan(fcus, SimulationBenchmark.buildingTargets(""), JULY, 5);
        SimulationPlan withWing = DemoSimulation.plan(fcus, boxes(10, 6), SimulationBenchmark.buildingTargets(""),
                JULY, 5);
        assertEquals(alone.faults(), withWing.faults().stream()
                .filter(f -> f.fault().kind() == FaultType.Kind.FAN_COIL).toList(), "the fan coil plan is unchanged");
        assertEquals(6, withWing.faults().stream().filter(f -> f.fault().kind() == FaultType.Kind.VAV).count(),
                "at least one episode of each of the six VAV faults (30 % of 10 boxes would be 3)");
        for (FaultEpisode f : withWing.faults()) {
            if (f.fault().needsReheat()) {
                assertTrue(withWing.vavUnits().stream().anyMatch(b -> b.unitIri().equals(f.unitIri()) && b.reheat()));
            }
        }
        SimulationResult a = Simulator.run(alone);
        SimulationResult b = Simulator.run(withWing);
        for (int i = 0; i < fcus.size(); i++) {
            for (String role : SimulationRoles.UNIT_ROLES) {
                assertArrayEquals(a.units().get(i).series(role), b.units().get(i).series(role), role);
            }
        }
        assertArrayEquals(a.outdoorC(), b.outdoorC());
        assertArrayEquals(a.hotWaterSupplyC(), b.hotWaterSupplyC());
    }

    @Test
    void injectedFaultsLeaveTheirSignature() {
        List<VavSeriesTargets> boxes = boxes(6, 6);
        Instant from = JULY.firstDay().plusDays(10).atStartOfDay(JULY.zone()).toInstant();
        Instant to = JULY.firstDay().plusDays(24).atStartOfDay(JULY.zone()).toInstant();
        FaultType[] types = {FaultType.STUCK_DAMPER, FaultType.AIRFLOW_SENSOR_DRIFT, FaultType.LEAKING_REHEAT_VALVE,
            FaultType.STUCK_REHEAT_VALVE, FaultType.INSUFFICIENT_SUPPLY_AIR, FaultType.UNREACHABLE_AIRFLOW_SETPOINT};
        List<FaultEpisode> faults = new ArrayList<>();
        for (int i = 0; i < types.length; i++) {
            faults.add(new FaultEpisode(boxes.get(i).unitIri(), types[i], from, to, 0.8));
        }
        SimulationResult r = Simulator.run(new SimulationPlan(List.of(), boxes, SimulationBenchmark.buildingTargets(""),
                JULY, 3, faults));
        int n = r.timestamps().size();
        // Stuck damper at 0.1 + 0.8 * 0.8 = 74 %: the position feedback stays while the command moves.
        VavTrace stuck = r.vavUnits().get(0);
        Window in = new Window(r, from.plusSeconds(86_400), to);
        assertEquals(74.0, in.mean(stuck.damperPositionPct(), stuck), 0.5);
        assertTrue(in.spread(stuck.damperCommandPct(), stuck) > 10, "the flow loop keeps commanding");
        // Airflow sensor drift: after two days the reading is (1 +/- (0.15 + 0.35 * 0.8)) = 1 +/- 0.43 times true.
        VavTrace drift = r.vavUnits().get(1);
        Window late = new Window(r, from.plusSeconds(3 * 86_400), to);
        double ratio = late.sum(drift.airflowLps(), drift) / late.sum(drift.airflowTrueLps(), drift);
        assertEquals(0.43, Math.abs(ratio - 1), 0.02, "reading / true = " + ratio);
        // Leaking reheat valve: discharge above the supply with the valve commanded shut, in cooling.
        VavTrace leak = r.vavUnits().get(2);
        Window before = new Window(r, JULY.start().plusSeconds(86_400), from);
        double riseBefore = before.shutDischargeRise(leak);
        double riseDuring = in.shutDischargeRise(leak);
        assertTrue(riseBefore < 0.3 && riseDuring > 1.5, riseBefore + " -> " + riseDuring);
        // Stuck reheat valve at 64 %: heat in the coil all through the episode, whatever the command.
        VavTrace stuckValve = r.vavUnits().get(3);
        assertTrue(in.mean(stuckValve.reheatW(), stuckValve) > 300, "reheat W " + in.mean(stuckValve.reheatW(), stuckValve));
        // Insufficient supply and an unreachable setpoint: damper wide open, airflow short of setpoint.
        for (int i = 4; i < 6; i++) {
            VavTrace box = r.vavUnits().get(i);
            assertTrue(in.shortfallHours(box) > 10, box.unitIri() + " " + in.shortfallHours(box));
            assertEquals(0.0, before.shortfallHours(box), 0.5, box.unitIri());
        }
        assertEquals(n, stuck.zoneC().length);
    }

    /** Occupied samples of a time window. */
    private record Window(SimulationResult r, Instant from, Instant to) {
        boolean in(VavTrace box, int s) {
            Instant t = r.timestamps().get(s);
            return !t.isBefore(from) && t.isBefore(to) && box.occupancy()[s] == 1f;
        }

        double sum(float[] v, VavTrace box) {
            double sum = 0;
            for (int s = 0; s < v.length; s++) {
                if (in(box, s)) {
                    sum += v[s];
                }
            }
            return sum;
        }

        double mean(float[] v, VavTrace box) {
            int n = 0;
            for (int s = 0; s < v.length; s++) {
                n += in(box, s) ? 1 : 0;
            }
            return sum(v, box) / n;
        }

        double spread(float[] v, VavTrace box) {
            double lo = Double.MAX_VALUE;
            double hi = -Double.MAX_VALUE;
            for (int s = 0; s < v.length; s++) {
                if (in(box, s)) {
                    lo = Math.min(lo, v[s]);
                    hi = Math.max(hi, v[s]);
                }
            }
            return hi - lo;
        }

        /** Mean discharge rise over the AHU supply (+ duct gain) in samples with the reheat commanded shut. */
        double shutDischargeRise(VavTrace box) {
            double sum = 0;
            int n = 0;
            for (int s = 0; s < box.zoneC().length; s++) {
                if (in(box, s) && box.reheatCommandPct()[s] == 0) {
                    sum += box.dischargeTrueC()[s] - r.ahuSupplyAirC()[s] - VavSimulation.DUCT_GAIN_K;
                    n++;
                }
            }
            return sum / n;
        }

        /** Hours with the damper commanded fully open and the airflow reading 10 % or more short of setpoint. */
        double shortfallHours(VavTrace box) {
            double h = 0;
            for (int s = 0; s < box.zoneC().length; s++) {
                if (in(box, s) && box.damperCommandPct()[s] >= 99.9
                        && box.airflowLps()[s] < 0.9 * box.airflowSetpointLps()[s]) {
                    h += 0.25;
                }
            }
            return h;
        }
    }

    @Test
    void truthFileHoldsTheBoxesEpisodesInTheSameFormat(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir)
            throws java.io.IOException {
        SimulationPlan plan = DemoSimulation.plan(SimulationBenchmark.fleet(2, ""), boxes(7, 4),
                SimulationBenchmark.buildingTargets(""), JULY, 8);
        SimulationResult r = Simulator.run(plan);
        DemoTrends.write(dir, r, DemoTrends.Layout.WIDE);
        List<String> truth = java.nio.file.Files.readAllLines(dir.resolve(DemoTrends.TRUTH_FILE));
        assertEquals("unit,fault,start,end,severity", truth.get(0));
        assertTrue(truth.stream().anyMatch(l -> l.startsWith("https://example.org/elm#VAV-")), truth.toString());
        String header = java.nio.file.Files.readAllLines(dir.resolve(DemoTrends.TRENDS_FILE)).get(0);
        assertTrue(header.contains(",ELM.VAV-01.airflow,"), header);
        assertFalse(header.contains("ahu_supply_air_temperature"), "no AHU target given, no AHU column");
    }
}
