package org.tufa.analysis.evaluate;

import java.util.List;
import java.util.Map;

/**
 * Everything evaluation reads: the fleet (in file order), findings per unit, samples per analysed unit, the
 * ground truth, and the kind of each unit (fan coil, VAV, ... as the coverage file gives it; empty when the
 * analysis folder has no coverage.csv). Maps are sorted (TreeMap) so nothing depends on hash order.
 *
 * @param repeatedEpisodes truth rows that repeat an earlier row (same unit, fault, start and end): counted once
 */
public record EvaluationInput(
        List<FleetUnit> fleet,
        Map<String, List<FlaggedInterval>> findingsByUnit,
        Map<String, UnitSamples> samplesByUnit,
        List<TruthEpisode> truth,
        Map<String, String> unitKinds,
        int repeatedEpisodes) {

    /** Input without unit kinds: one group of faults. */
    public EvaluationInput(List<FleetUnit> fleet, Map<String, List<FlaggedInterval>> findingsByUnit,
            Map<String, UnitSamples> samplesByUnit, List<TruthEpisode> truth) {
        this(fleet, findingsByUnit, samplesByUnit, truth, Map.of(), 0);
    }

    /** Input with unit kinds, no repeated truth rows. */
    public EvaluationInput(List<FleetUnit> fleet, Map<String, List<FlaggedInterval>> findingsByUnit,
            Map<String, UnitSamples> samplesByUnit, List<TruthEpisode> truth, Map<String, String> unitKinds) {
        this(fleet, findingsByUnit, samplesByUnit, truth, unitKinds, 0);
    }
}
