package org.tufa.analysis.simulate;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.function.IntPredicate;
import org.junit.jupiter.api.Test;

/**
 * Each injected fault leaves the signature its physics implies (field notes section 2, signature table, derived
 * from energy balances as in Schein et al., Energy and Buildings 38(12), 2006), and nothing outside its episode:
 * every check compares the faulty run with the same unit run healthy (same seed, same noise).
 */
class FaultSignatureTest {
    private static final Season JULY = new Season(LocalDate.of(2031, 7, 1), LocalDate.of(2031, 7, 28),
            Season.DEMO_ZONE);
    private static final Season SEPTEMBER = new Season(LocalDate.of(2031, 9, 8), LocalDate.of(2031, 10, 5),
            Season.DEMO_ZONE);
    private static final long SEED = 11;

    private record Pair(UnitTrace healthy, UnitTrace faulty, SimulationResult result, FaultEpisode episode) {
        boolean inside(int s) {
            return episode.activeAt(result.timestamps().get(s));
        }

        boolean before(int s) {
            return result.timestamps().get(s).isBefore(episode.start());
        }

        /** After the episode plus two days for the zone to settle back. */
        boolean wellAfter(int s) {
            return !result.timestamps().get(s).isBefore(episode.end().plusSeconds(2 * 86_400));
        }

        int n() {
            return result.timestamps().size();
        }
    }

    private static Pair run(Season season, FaultType type, double severity) {
        List<UnitSeriesTargets> units = SimulationBenchmark.fleet(1, "");
        String iri = units.get(0).unitIri();
        Instant start = season.firstDay().plusDays(7).atStartOfDay(season.zone()).toInstant();
        Instant end = season.firstDay().plusDays(17).atStartOfDay(season.zone()).toInstant();
        FaultEpisode episode = new FaultEpisode(iri, type, start, end, severity);
        SimulationResult healthy = Simulator.run(new SimulationPlan(units, SimulationBenchmark.buildingTargets(""),
                season, SEED, List.of()));
        SimulationResult faulty = Simulator.run(new SimulationPlan(units, SimulationBenchmark.buildingTargets(""),
                season, SEED, List.of(episode)));
        return new Pair(healthy.units().get(0), faulty.units().get(0), faulty, episode);
    }

    /** Before the episode the faulty unit's logs are identical to the healthy run; well after, close to it. */
    private static void assertUntouchedOutsideEpisode(Pair p) {
        for (String role : SimulationRoles.UNIT_ROLES) {
            float[] h = p.healthy().series(role);
            float[] f = p.faulty().series(role);
            double maxAfter = 0;
            for (int s = 0; s < p.n(); s++) {
                if (p.before(s)) {
                    assertEquals(h[s], f[s], 0.0, role + " differs before the episode at sample " + s);
                } else if (p.wellAfter(s)) {
                    maxAfter = Math.max(maxAfter, Math.abs(h[s] - f[s]));
                }
            }
            double tolerance = SimulationRoles.quantityOf(role) == SimulationRoles.Quantity.COMMAND ? 5.0 : 0.3;
            assertTrue(maxAfter <= tolerance, role + " still differs after the episode by " + maxAfter);
        }
    }

    private static double mean(float[] x, int n, IntPredicate keep) {
        double sum = 0;
        int count = 0;
        for (int s = 0; s < n; s++) {
            if (keep.test(s)) {
                sum += x[s];
                count++;
            }
        }
        assertTrue(count > 10, "too few samples: " + count);
        return sum / count;
    }

    private static double correlation(float[] x, float[] y, int n, IntPredicate keep) {
        double sx = 0, sy = 0, sxx = 0, syy = 0, sxy = 0;
        int k = 0;
        for (int s = 0; s < n; s++) {
            if (keep.test(s)) {
                sx += x[s];
                sy += y[s];
                sxx += x[s] * x[s];
                syy += y[s] * y[s];
                sxy += x[s] * y[s];
                k++;
            }
        }
        return (k * sxy - sx * sy) / Math.sqrt((k * sxx - sx * sx) * (k * syy - sy * sy));
    }

    @Test
    void lowChilledWaterFlowNeedsMoreValveForLessCooling() {
        Pair p = run(JULY, FaultType.LOW_CHW_FLOW, 0.8);
        UnitTrace f = p.faulty();
        UnitTrace h = p.healthy();
        IntPredicate occupiedInside = s -> p.inside(s) && f.occupancy()[s] > 0.5;
        // The loop opens the valve further for the same load...
        double extraCommand = mean(f.coolingCommandPct(), p.n(), occupiedInside)
                - mean(h.coolingCommandPct(), p.n(), occupiedInside);
        assertTrue(extraCommand > 15, "extra cooling command " + extraCommand);
        // ...and at the same command (50-100 %) the discharge air is warmer than the healthy unit's anywhere.
        IntPredicate highFault = s -> occupiedInside.test(s) && f.coolingCommandPct()[s] >= 50;
        IntPredicate highHealthy = s -> h.occupancy()[s] > 0.5 && h.coolingCommandPct()[s] >= 50;
        double faultyDt = mean(f.zoneC(), p.n(), highFault) - mean(f.dischargeC(), p.n(), highFault);
        double healthyDt = mean(h.zoneC(), p.n(), highHealthy) - mean(h.dischargeC(), p.n(), highHealthy);
        assertTrue(faultyDt < healthyDt - 1.0, "coil dT at >= 50 % command: faulty " + faultyDt + ", healthy "
                + healthyDt);
        assertUntouchedOutsideEpisode(p);
    }

    @Test
    void dischargeSensorBiasShiftsOnlyTheDischargeReading() {
        Pair p = run(JULY, FaultType.DISCHARGE_SENSOR_BIAS, 0.5);
        double expected = 1 + 3 * 0.5; // K, either sign
        for (int s = 0; s < p.n(); s++) {
            double d = p.faulty().dischargeC()[s] - p.healthy().dischargeC()[s];
            assertEquals(p.inside(s) ? expected : 0.0, Math.abs(d), 1e-4, "at sample " + s);
            assertEquals(p.healthy().coolingCommandPct()[s], p.faulty().coolingCommandPct()[s], 0.0);
            assertEquals(p.healthy().zoneC()[s], p.faulty().zoneC()[s], 0.0);
        }
    }

    @Test
    void stuckCoolingValveDecouplesDischargeFromCommand() {
        Pair p = run(JULY, FaultType.STUCK_COOLING_VALVE, 0.3);
        UnitTrace f = p.faulty();
        // Occupied hours only: one zone setpoint, so the command, not the zone temperature, sets the discharge.
        IntPredicate coolingInside = s -> p.inside(s) && f.occupancy()[s] > 0.5 && f.coolingCommandPct()[s] > 5;
        IntPredicate coolingBefore = s -> p.before(s) && f.occupancy()[s] > 0.5 && f.coolingCommandPct()[s] > 5;
        double before = correlation(f.dischargeC(), f.coolingCommandPct(), p.n(), coolingBefore);
        double inside = correlation(f.dischargeC(), f.coolingCommandPct(), p.n(), coolingInside);
        assertTrue(before < -0.3, "healthy DAT-command correlation " + before + ", stuck " + inside);
        assertTrue(Math.abs(inside) < 0.25, "stuck valve DAT-command correlation " + inside + ", healthy " + before);
        for (int s = 0; s < p.n(); s++) {
            if (p.inside(s)) {
                assertEquals(0.3, f.coolingValveOpening()[s], 1e-6);
            }
        }
        assertUntouchedOutsideEpisode(p);
    }

    @Test
    void failedFanStillReportsRunningWhileTheZoneDrifts() {
        Pair p = run(JULY, FaultType.FAN_FAILURE, 1.0);
        UnitTrace f = p.faulty();
        IntPredicate occupiedInside = s -> p.inside(s) && f.occupancy()[s] > 0.5;
        assertEquals(1.0, mean(f.fanStatus(), p.n(), occupiedInside), 0.0);
        assertEquals(0.0, mean(f.airflowLps(), p.n(), occupiedInside), 0.0);
        // The discharge sensor reads about the zone (within 2.5 K), not a coil dT of about 11 K...
        double gap = mean(f.zoneC(), p.n(), occupiedInside) - mean(f.dischargeC(), p.n(), occupiedInside);
        assertTrue(gap >= 0 && gap < 2.5, "zone - discharge " + gap);
        // ...while the zone runs well above its cooling setpoint and the cooling command saturates.
        double overshoot = mean(f.zoneC(), p.n(), occupiedInside) - mean(f.setpointC(), p.n(), occupiedInside);
        assertTrue(overshoot > 2.0, "zone above setpoint by " + overshoot);
        assertTrue(mean(f.coolingCommandPct(), p.n(), occupiedInside) > 90);
        assertUntouchedOutsideEpisode(p);
    }

    @Test
    void leakingHeatingValveWarmsTheDischargeWithTheHeatingValveClosed() {
        Pair p = run(SEPTEMBER, FaultType.LEAKING_HEATING_VALVE, 0.6);
        UnitTrace f = p.faulty();
        IntPredicate ventilation = s -> f.fanStatus()[s] > 0.5 && f.heatingCommandPct()[s] == 0
                && f.coolingCommandPct()[s] <= 5;
        IntPredicate ventInside = s -> p.inside(s) && ventilation.test(s);
        IntPredicate ventBefore = s -> p.before(s) && ventilation.test(s);
        double inside = mean(f.dischargeC(), p.n(), ventInside) - mean(f.zoneC(), p.n(), ventInside);
        double before = mean(f.dischargeC(), p.n(), ventBefore) - mean(f.zoneC(), p.n(), ventBefore);
        // Fan heat only (0.3 K, field notes section 3: under 1 F) when healthy; G36's leaking-valve alarm uses 3 K.
        assertEquals(0.3, before, 0.5);
        assertTrue(inside > 3.0, "discharge above zone in ventilation with the heating valve shut: " + inside);
        // Cooling works against the leak (simultaneous heating and cooling in effect).
        IntPredicate occupiedInside = s -> p.inside(s) && f.occupancy()[s] > 0.5;
        assertTrue(mean(f.coolingCommandPct(), p.n(), occupiedInside)
                > mean(p.healthy().coolingCommandPct(), p.n(), occupiedInside) + 5);
        assertUntouchedOutsideEpisode(p);
    }

    @Test
    void oscillatingControlMakesTheCommandsJump() {
        Pair p = run(JULY, FaultType.OSCILLATING_CONTROL, 0.7);
        UnitTrace f = p.faulty();
        double inside = meanJump(f, p, true);
        double healthy = meanJump(p.healthy(), p, true);
        assertTrue(inside > 5 * healthy && inside > 20, "mean command jump " + inside + " vs healthy " + healthy);
        assertUntouchedOutsideEpisode(p);
    }

    /** Mean absolute change of the cooling plus heating command between consecutive occupied samples. */
    private static double meanJump(UnitTrace u, Pair p, boolean insideEpisode) {
        double sum = 0;
        int n = 0;
        for (int s = 1; s < p.n(); s++) {
            if (p.inside(s) == insideEpisode && u.occupancy()[s] > 0.5 && u.occupancy()[s - 1] > 0.5) {
                sum += Math.abs(u.coolingCommandPct()[s] - u.coolingCommandPct()[s - 1])
                        + Math.abs(u.heatingCommandPct()[s] - u.heatingCommandPct()[s - 1]);
                n++;
            }
        }
        return sum / n;
    }

    @Test
    void healthyRunsOfTheSameUnitAreIdenticalWhateverElseIsSimulated() {
        // A unit's trace depends only on (seed, unit IRI, its own faults): adding units does not change it.
        List<UnitSeriesTargets> three = SimulationBenchmark.fleet(3, "");
        SimulationResult alone = Simulator.run(new SimulationPlan(three.subList(0, 1),
                SimulationBenchmark.buildingTargets(""), JULY, SEED, List.of()));
        SimulationResult together = Simulator.run(new SimulationPlan(three, SimulationBenchmark.buildingTargets(""),
                JULY, SEED, List.of()));
        assertArrayEquals(alone.units().get(0).dischargeC(), together.units().get(0).dischargeC());
    }
}
