package org.tufa.analysis.fleet.bench;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.simulate.DemoTrends;
import org.tufa.analysis.simulate.SeriesTarget;
import org.tufa.analysis.simulate.SimulationResult;
import org.tufa.analysis.simulate.SimulationRoles;
import org.tufa.analysis.simulate.UnitSeriesTargets;

/**
 * Writes a simulated fleet as a wide CSV the way many BAS trend exports look: same columns and time stamps as
 * {@link DemoTrends#writeWide}, but fixed decimals (temperatures 3, valve commands 2, trailing zeros kept) and
 * binary points as the BACnet BinaryPV words {@code active}/{@code inactive} (BACnetBinaryPV, ASHRAE 135; from memory). Values are
 * written in SI, so the targets must carry SI units (DEG_C, PERCENT, none for binary). The point: a year of 500
 * units comes out at the ~660 MB the fleet benchmark is specified for; the simulator's own writer trims zeros and
 * gives about 430 MB.
 */
final class ExportWriter {

    private static final byte[] ACTIVE = "active".getBytes(StandardCharsets.US_ASCII);
    private static final byte[] INACTIVE = "inactive".getBytes(StandardCharsets.US_ASCII);

    private ExportWriter() {
    }

    /** One column: its samples and decimals (-1 for a binary point). */
    private record Column(String seriesId, float[] values, int decimals) {
    }

    static void writeWide(Path file, SimulationResult result) {
        List<Column> columns = columns(result);
        String[] stamps = DemoTrends.timestamps(result);
        try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(file), 1 << 20)) {
            StringBuilder header = new StringBuilder("timestamp");
            for (Column c : columns) {
                header.append(',').append(c.seriesId());
            }
            out.write(header.append('\n').toString().getBytes(StandardCharsets.UTF_8));
            byte[] line = new byte[64 + columns.size() * 16];
            for (int s = 0; s < stamps.length; s++) {
                byte[] stamp = stamps[s].getBytes(StandardCharsets.US_ASCII);
                System.arraycopy(stamp, 0, line, 0, stamp.length);
                int p = stamp.length;
                for (Column c : columns) {
                    line[p++] = ',';
                    float v = c.values()[s];
                    if (c.decimals() < 0) {
                        byte[] word = v >= 0.5f ? ACTIVE : INACTIVE;
                        System.arraycopy(word, 0, line, p, word.length);
                        p += word.length;
                    } else {
                        p = fixed(line, p, v, c.decimals());
                    }
                }
                line[p++] = '\n';
                out.write(line, 0, p);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + file + ": " + e.getMessage(), e);
        }
    }

    /** Columns in {@link DemoTrends} order: building roles, then each unit's roles that have a target. */
    private static List<Column> columns(SimulationResult result) {
        List<Column> columns = new ArrayList<>();
        for (String role : SimulationRoles.BUILDING_ROLES) {
            SeriesTarget t = result.plan().buildingTargets().get(role);
            if (t != null) {
                columns.add(column(role, t, result.buildingSeries(role)));
            }
        }
        for (int i = 0; i < result.units().size(); i++) {
            UnitSeriesTargets targets = result.plan().units().get(i);
            for (String role : SimulationRoles.UNIT_ROLES) {
                SeriesTarget t = targets.targets().get(role);
                if (t != null) {
                    columns.add(column(role, t, result.units().get(i).series(role)));
                }
            }
        }
        return columns;
    }

    private static Column column(String role, SeriesTarget t, float[] values) {
        String unit = t.qudtUnitIri().substring(Math.max(t.qudtUnitIri().lastIndexOf('/'),
                t.qudtUnitIri().lastIndexOf('#')) + 1);
        SimulationRoles.Quantity q = SimulationRoles.quantityOf(role);
        boolean si = switch (q) {
            case TEMPERATURE -> unit.isEmpty() || unit.equals("DEG_C");
            case COMMAND -> unit.isEmpty() || unit.equals("PERCENT");
            case BINARY -> true;
            case AIRFLOW -> unit.isEmpty() || unit.equals("L-PER-SEC");
            case PRESSURE -> unit.isEmpty() || unit.equals("PA");
        };
        if (!si) {
            throw new IllegalArgumentException("series " + t.seriesId() + ": the export writer writes SI only, not "
                    + t.qudtUnitIri());
        }
        int decimals = switch (q) {
            case TEMPERATURE -> 3;
            case COMMAND -> 2;
            case BINARY -> -1;
            case AIRFLOW, PRESSURE -> 1;
        };
        return new Column(t.seriesId(), values, decimals);
    }

    /** Writes v rounded half away from zero to a fixed number of decimals (|v| well under 1e9). */
    static int fixed(byte[] b, int p, double v, int decimals) {
        long scale = 1;
        for (int i = 0; i < decimals; i++) {
            scale *= 10;
        }
        long scaled = Math.round(Math.abs(v) * scale);
        if (v < 0 && scaled != 0) {
            b[p++] = '-';
        }
        String whole = Long.toString(scaled / scale);
        for (int i = 0; i < whole.length(); i++) {
            b[p++] = (byte) whole.charAt(i);
        }
        if (decimals > 0) {
            b[p++] = '.';
            long fraction = scaled % scale;
            for (long d = scale / 10; d >= 1; d /= 10) {
                b[p++] = (byte) ('0' + (fraction / d) % 10);
            }
        }
        return p;
    }
}
