package org.tufa.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.tufa.analysis.fleet.FleetAnalysis;

/**
 * Where {@code analyze} runs phase 1 of the fleet (each unit's own analysis) when not in this JVM's worker threads:
 * the spark module's job gives one that runs it on a cluster's executors. The fleet decision, phase 3 and every
 * fleet file stay with the command, so both engines write the same files.
 */
public interface UnitEngine {

    /**
     * The phase-1 analyser for one run.
     *
     * @param trendFiles the trend files and folders given (empty when the trends are in a database)
     * @param database   the database the trends are in, or null for trend files
     * @param sinks      what to write for each unit, wherever it is analysed
     * @throws org.tufa.common.InputException when this engine cannot run on these inputs
     */
    FleetAnalysis.UnitAnalyser analyser(List<Path> trendFiles, DatabaseTrends database, UnitSinks sinks);

    /** What run.json records about the engine (its name, its settings). */
    Map<String, Object> parameters();
}
