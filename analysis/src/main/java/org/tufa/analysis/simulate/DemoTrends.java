package org.tufa.analysis.simulate;

import org.tufa.common.OutputFiles;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Writes a {@link SimulationResult}: the trends in the long layout ({@code timestamp,point,value}, one block per
 * series in column order, each in time order) or the wide layout ({@code timestamp,<series id>,...}, one row per
 * sample), and the ground truth {@code truth.csv} ({@code unit,fault,start,end,severity}). Timestamps are ISO 8601
 * with the local offset of the season's zone, e.g. {@code 2031-06-01T00:15:00-04:00}. Series order: building roles
 * in {@link SimulationRoles#BUILDING_ROLES} order, then fan coil units in plan order, each in
 * {@link SimulationRoles#UNIT_ROLES} order, then the air handler's roles ({@link SimulationRoles#AHU_ROLES}), then
 * VAV boxes in plan order, each in {@link SimulationRoles#VAV_ROLES} order; roles without a target are skipped.
 */
public final class DemoTrends {
    public static final String TRENDS_FILE = "trends.csv";
    public static final String TRUTH_FILE = "truth.csv";
    private static final DateTimeFormatter TIMESTAMP =
            DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ssxxx", Locale.ROOT);
    private static final int BUFFER = 1 << 20;

    /** Trend file layouts. */
    public enum Layout { LONG, WIDE }

    private DemoTrends() {
    }

    /** One written series: id, its SI samples and its converter. */
    private record Column(String seriesId, float[] values, ValueWriter writer) {
    }

    /** Writes {@code dir/trends.csv} in the given layout and {@code dir/truth.csv}; returns both paths. */
    public static List<Path> write(Path dir, SimulationResult result, Layout layout) {
        try {
            Files.createDirectories(dir);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        Path trends = dir.resolve(TRENDS_FILE);
        Path truth = dir.resolve(TRUTH_FILE);
        if (layout == Layout.LONG) {
            writeLong(trends, result);
        } else {
            writeWide(trends, result);
        }
        writeTruth(truth, result);
        return List.of(trends, truth);
    }

    /** Long layout: {@code timestamp,point,value}. */
    public static void writeLong(Path file, SimulationResult result) {
        List<Column> columns = columns(result);
        String[] stamps = timestamps(result);
        OutputFiles.writeText(file, w -> {
            w.write("timestamp,point,value\n");
            StringBuilder line = new StringBuilder(BUFFER);
            for (Column c : columns) {
                String id = csvField(c.seriesId());
                for (int s = 0; s < stamps.length; s++) {
                    line.append(stamps[s]).append(',').append(id).append(',');
                    c.writer().append(line, c.values()[s]);
                    line.append('\n');
                    if (line.length() > BUFFER - 256) {
                        w.append(line);
                        line.setLength(0);
                    }
                }
            }
            w.append(line);
        });
    }

    /** Wide layout: {@code timestamp,<series id>,...}. */
    public static void writeWide(Path file, SimulationResult result) {
        List<Column> columns = columns(result);
        String[] stamps = timestamps(result);
        OutputFiles.writeText(file, w -> {
            StringBuilder line = new StringBuilder(BUFFER);
            line.append("timestamp");
            for (Column c : columns) {
                line.append(',').append(csvField(c.seriesId()));
            }
            line.append('\n');
            for (int s = 0; s < stamps.length; s++) {
                line.append(stamps[s]);
                for (Column c : columns) {
                    line.append(',');
                    c.writer().append(line, c.values()[s]);
                }
                line.append('\n');
                if (line.length() > BUFFER / 2) {
                    w.append(line);
                    line.setLength(0);
                }
            }
            w.append(line);
        });
    }

    /** Ground truth: {@code unit,fault,start,end,severity}, one row per episode, sorted by unit then start. */
    public static void writeTruth(Path file, SimulationResult result) {
        ZoneId zone = result.plan().season().zone();
        List<FaultEpisode> faults = new ArrayList<>(result.plan().faults());
        faults.sort(java.util.Comparator.comparing(FaultEpisode::unitIri).thenComparing(FaultEpisode::start));
        StringBuilder out = new StringBuilder("unit,fault,start,end,severity\n");
        for (FaultEpisode f : faults) {
            out.append(csvField(f.unitIri())).append(',').append(f.fault().id()).append(',')
                    .append(TIMESTAMP.format(f.start().atZone(zone))).append(',')
                    .append(TIMESTAMP.format(f.end().atZone(zone))).append(',');
            ValueWriter.appendFixed(out, f.severity(), 3);
            out.append('\n');
        }
        OutputFiles.writeString(file, out);
    }

    /** The ISO 8601 timestamp, with offset, of each sample. */
    public static String[] timestamps(SimulationResult result) {
        ZoneId zone = result.plan().season().zone();
        return result.timestamps().stream().map(t -> TIMESTAMP.format(t.atZone(zone))).toArray(String[]::new);
    }

    private static List<Column> columns(SimulationResult result) {
        List<Column> columns = new ArrayList<>();
        for (String role : SimulationRoles.BUILDING_ROLES) {
            SeriesTarget t = result.plan().buildingTargets().get(role);
            if (t != null) {
                columns.add(new Column(t.seriesId(), result.buildingSeries(role), ValueWriter.forTarget(role, t)));
            }
        }
        for (int i = 0; i < result.units().size(); i++) {
            UnitSeriesTargets targets = result.plan().units().get(i);
            UnitTrace trace = result.units().get(i);
            for (String role : SimulationRoles.UNIT_ROLES) {
                SeriesTarget t = targets.targets().get(role);
                if (t != null) {
                    columns.add(new Column(t.seriesId(), trace.series(role), ValueWriter.forTarget(role, t)));
                }
            }
        }
        if (!result.vavUnits().isEmpty()) {
            for (String role : SimulationRoles.AHU_ROLES) {
                SeriesTarget t = result.plan().buildingTargets().get(role);
                if (t != null) {
                    columns.add(new Column(t.seriesId(), result.buildingSeries(role), ValueWriter.forTarget(role, t)));
                }
            }
        }
        for (int i = 0; i < result.vavUnits().size(); i++) {
            VavSeriesTargets targets = result.plan().vavUnits().get(i);
            VavTrace trace = result.vavUnits().get(i);
            for (String role : SimulationRoles.VAV_ROLES) {
                SeriesTarget t = targets.targets().get(role);
                if (t != null) {
                    columns.add(new Column(t.seriesId(), trace.series(role), ValueWriter.forTarget(role, t)));
                }
            }
        }
        return columns;
    }

    /** RFC 4180 quoting where needed. */
    static String csvField(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
