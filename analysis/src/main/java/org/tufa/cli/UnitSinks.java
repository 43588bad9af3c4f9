package org.tufa.cli;

import java.io.Serializable;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.fleet.UnitFiles;
import org.tufa.analysis.fleet.UnitSink;
import org.tufa.analysis.report.UnitPages;
import org.tufa.analysis.tables.SampleFormat;

/**
 * What {@code analyze} writes for each unit, as a recipe any process can follow: the per-unit files under
 * {@code out/units/} and, unless the report is skipped, the unit pages and charts. Serializable (a path is kept as
 * its text), so the Spark job's executors write the same files as the driver would.
 *
 * @param out    the output folder, absolute
 * @param zone   zone of the times in the files
 * @param format per-sample table format
 * @param pages  whether unit pages and charts are drawn
 */
public record UnitSinks(String out, ZoneId zone, SampleFormat format, boolean pages) implements Serializable {

    /** The sinks, in the order the local engine calls them. */
    public List<UnitSink> create() {
        List<UnitSink> sinks = new ArrayList<>();
        sinks.add(new UnitFiles(Path.of(out), zone, format));
        if (pages) {
            sinks.add(new UnitPages(Path.of(out), zone)); // charts and unit pages render in the worker threads
        }
        return sinks;
    }
}
