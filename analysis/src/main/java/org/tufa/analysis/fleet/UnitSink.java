package org.tufa.analysis.fleet;

import org.tufa.analysis.features.UnitSignals;

/**
 * Receives each unit twice, from worker threads: once as soon as its analysis is done, while its signals and
 * detailed result are in memory (the per-sample files and the charts are written then, so the fleet's data never
 * has to be held at once), and once after the fleet stage has decided its findings (the files and pages that show
 * them). Implementations write only below their own per-unit folder, so calls for different units may run in
 * parallel.
 */
public interface UnitSink {

    /**
     * Phase 1: the unit's outcome with its detailed result and candidate findings.
     *
     * @param signals the unit's prepared signals, or null when the unit was not analysed
     */
    void analysed(UnitOutcome outcome, UnitSignals signals);

    /**
     * Phase 2: the unit's outcome with its decided findings and without the detailed result.
     *
     * @param signals the unit's signals again when it has findings to show (null otherwise)
     * @param loadKw  its sensible load per sample, with {@code signals}
     */
    void decided(UnitOutcome outcome, UnitSignals signals, double[] loadKw);

    /**
     * What this sink keeps of a unit from phase 1 for phase 2 (the charts it drew, say), taken out of it, so that
     * another instance of the sink can write phase 2 ({@link #restore}): for an engine that runs the two phases in
     * different processes (the Spark job). Null when the sink keeps nothing.
     */
    default java.io.Serializable carry(String folder) {
        return null;
    }

    /** Takes back what {@link #carry} gave for a unit, before its phase 2. */
    default void restore(String folder, java.io.Serializable kept) {
    }
}
