package org.tufa.analysis.simulate;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Set;

/**
 * Chooses, deterministically from a seed, which units get a fault and when: a share of the units (at least one
 * per fault type when there are enough units), fault types dealt round-robin over a seeded shuffle so every type
 * appears, one episode per faulty unit lasting 5 to 21 days, starting at a whole hour spread over the season.
 * Every episode starts at least 7 days into the season, so each faulty unit has a healthy stretch first, and
 * ends at least 2 days before the season ends. The rest of the units stay healthy all season.
 */
public final class FaultPlanner {
    /** Share of units given a fault in the demo. */
    public static final double DEMO_FAULTY_SHARE = 0.17;

    private FaultPlanner() {
    }

    /**
     * Plans the episodes.
     *
     * @param unitIris all units (any order: they are sorted first, so the caller's order does not matter)
     * @param season the simulated period (at least 15 days)
     * @param seed run seed
     * @param faultyShare share of units to give a fault, in [0, 1]
     * @return the episodes, sorted by unit IRI
     */
    public static List<FaultEpisode> plan(List<String> unitIris, Season season, long seed, double faultyShare) {
        return plan(unitIris, new java.util.HashSet<>(unitIris), FaultType.Kind.FAN_COIL, season, seed, faultyShare);
    }

    /**
     * Plans the episodes of one kind of unit. Each kind draws from its own stream (the fan coil plan is the one
     * {@link #plan(List, Season, long, double)} always made), so adding boxes of another kind leaves it unchanged.
     *
     * @param unitIris all units of the kind (any order: they are sorted first)
     * @param reheatUnits the units that have a reheat coil (only they get reheat faults)
     * @param kind the kind of unit: its fault types are dealt round-robin
     */
    public static List<FaultEpisode> plan(List<String> unitIris, Set<String> reheatUnits, FaultType.Kind kind,
            Season season, long seed, double faultyShare) {
        if (!(faultyShare >= 0 && faultyShare <= 1)) {
            throw new IllegalArgumentException("faulty share must be in [0, 1]");
        }
        long days = season.lastDay().toEpochDay() - season.firstDay().toEpochDay() + 1;
        if (days < 15) {
            throw new IllegalArgumentException("season too short to plan faults (" + days + " days; need 15)");
        }
        List<String> units = new ArrayList<>(unitIris.stream().distinct().sorted().toList());
        SeededRandom rng = SeededRandom.forStream(seed, kind == FaultType.Kind.FAN_COIL ? "fault-plan"
                : "fault-plan|" + kind.name().toLowerCase(java.util.Locale.ROOT));
        // Fisher-Yates shuffle with our generator, so the choice is fixed by the seed alone.
        for (int i = units.size() - 1; i > 0; i--) {
            int j = rng.nextInt(i + 1);
            String tmp = units.get(i);
            units.set(i, units.get(j));
            units.set(j, tmp);
        }
        List<FaultType> types = FaultType.ofKind(kind);
        int count = (int) Math.round(faultyShare * units.size());
        if (faultyShare > 0) {
            count = Math.max(count, Math.min(units.size(), types.size()));
        }
        List<FaultEpisode> episodes = new ArrayList<>();
        Set<String> taken = new java.util.HashSet<>();
        for (int k = 0; k < count; k++) {
            FaultType type = types.get(k % types.size());
            // The next unit in shuffled order that can have this fault (reheat faults need a reheat coil).
            String unit = null;
            for (String u : units) {
                if (!taken.contains(u) && (!type.needsReheat() || reheatUnits.contains(u))) {
                    unit = u;
                    break;
                }
            }
            if (unit == null) {
                continue;
            }
            taken.add(unit);
            long maxLength = Math.min(21, days - 9);
            long length = 5 + rng.nextInt((int) (maxLength - 5 + 1));
            long latestStartOffset = days - 2 - length;
            long startOffset = 7 + rng.nextInt((int) (latestStartOffset - 7 + 1));
            int startHour = rng.nextInt(24);
            LocalDate startDay = season.firstDay().plusDays(startOffset);
            Instant start = startDay.atTime(startHour, 0).atZone(season.zone()).toInstant();
            Instant end = startDay.plusDays(length).atTime(startHour, 0).atZone(season.zone()).toInstant();
            double severity = rng.uniform(type.demoSeverityMin(), type.demoSeverityMax());
            severity = Math.round(severity * 1000) / 1000.0; // as written to truth.csv, so the file is the truth
            episodes.add(new FaultEpisode(unit, type, start, end, severity));
        }
        episodes.sort(Comparator.comparing(FaultEpisode::unitIri));
        return List.copyOf(episodes);
    }
}
