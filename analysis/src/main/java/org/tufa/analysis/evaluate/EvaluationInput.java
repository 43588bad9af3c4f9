package org.tufa.analysis.evaluate;

import java.util.List;
import java.util.Map;

/**
 * Everything evaluation reads: the fleet (in file order), findings per unit, samples per analysed unit and the
 * ground truth. Maps are sorted (TreeMap) so nothing depends on hash order.
 *
 * @param repeatedEpisodes truth rows that repeat an earlier row (same unit, fault, start and end): counted once
 */
public record EvaluationInput(
        List<FleetUnit> fleet,
        Map<String, List<FlaggedInterval>> findingsByUnit,
        Map<String, UnitSamples> samplesByUnit,
        List<TruthEpisode> truth,
        int repeatedEpisodes) {

    public EvaluationInput(List<FleetUnit> fleet, Map<String, List<FlaggedInterval>> findingsByUnit,
            Map<String, UnitSamples> samplesByUnit, List<TruthEpisode> truth) {
        this(fleet, findingsByUnit, samplesByUnit, truth, 0);
    }
}
