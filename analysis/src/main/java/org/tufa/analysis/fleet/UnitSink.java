package org.tufa.analysis.fleet;

import org.tufa.analysis.features.UnitSignals;

/**
 * Receives each unit as soon as its analysis is done, from a worker thread, while its signals are still in
 * memory: the per-unit files and report pages are written here, so the fleet's data never has to be held at once.
 * Implementations write only below their own per-unit folder, so calls for different units may run in parallel.
 */
@FunctionalInterface
public interface UnitSink {
    /**
     * @param outcome the unit's outcome
     * @param signals the unit's prepared signals, or null when the unit was not analysed
     */
    void accept(UnitOutcome outcome, UnitSignals signals);
}
