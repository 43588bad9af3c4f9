package org.tufa.analysis.trends.bench;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import org.tufa.analysis.trends.IngestReport;
import org.tufa.analysis.trends.ResampledSeries;
import org.tufa.analysis.trends.SeriesKind;
import org.tufa.analysis.trends.TimeOptions;
import org.tufa.analysis.trends.TrendStore;

/**
 * Speed and memory benchmark of {@link TrendStore}: generates a seeded wide CSV of a fictional fleet (units x 6
 * series + 2 shared plant series, naive local stamps every 15 min in America/Toronto), ingests it, loads every
 * series, checks a few cells against the generator and prints MB/s and peak heap.
 *
 * <pre>
 * java -Xmx1500m -cp benchmarks/target/tufa-benchmarks.jar org.tufa.analysis.trends.bench.IngestBenchmark \
 *     [--units 500] [--rows 35040] [--dir bench-out] [--spill-dir DIR] [--threads 2] [--keep]
 * </pre>
 *
 * Defaults give 3,002 series x 35,040 rows (a year), about 690 MB. {@code --units 50 --rows 8000} is a quick run.
 * The generated file is reused when it already exists with the same size arguments.
 */
public final class IngestBenchmark {

    private static final String[] ROLES = {"ZNT", "DAT", "CLG-VLV", "HTG-VLV", "FAN-STS", "FAN-SPD"};
    private static final ZoneId ZONE = ZoneId.of("America/Toronto");
    private static final long SEED = 20310701L;
    private static final byte[] ACTIVE = "active".getBytes(StandardCharsets.US_ASCII);
    private static final byte[] INACTIVE = "inactive".getBytes(StandardCharsets.US_ASCII);

    private IngestBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        int units = 500;
        int rows = 35_040;
        int threads = 2;
        Path dir = Path.of("bench-out");
        Path spillDir = null;
        boolean keep = false;
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--units" -> units = Integer.parseInt(args[++i]);
                case "--rows" -> rows = Integer.parseInt(args[++i]);
                case "--threads" -> threads = Integer.parseInt(args[++i]);
                case "--dir" -> dir = Path.of(args[++i]);
                case "--spill-dir" -> spillDir = Path.of(args[++i]);
                case "--keep" -> keep = true;
                default -> throw new IllegalArgumentException("unknown argument " + args[i]);
            }
        }
        Files.createDirectories(dir);
        Path csv = dir.resolve("fleet-" + units + "x" + rows + ".csv");
        List<String> ids = seriesIds(units);
        if (!Files.exists(csv)) {
            long t0 = System.nanoTime();
            generate(csv, ids, rows);
            System.out.printf(Locale.ROOT, "generated %s: %.1f MB in %.1f s%n", csv, Files.size(csv) / 1e6,
                    (System.nanoTime() - t0) / 1e9);
        }
        double megabytes = Files.size(csv) / 1e6;
        Map<String, SeriesKind> wanted = new TreeMap<>();
        for (String id : ids) {
            wanted.put(id, id.endsWith("FAN-STS") ? SeriesKind.BINARY : SeriesKind.ANALOG);
        }
        resetPeaks();
        long cpu0 = ManagementFactory.getThreadMXBean().getCurrentThreadCpuTime();
        long t0 = System.nanoTime();
        try (TrendStore store = TrendStore.ingest(List.of(csv), wanted, TimeOptions.defaults(ZONE),
                spillDir == null ? dir : spillDir)) {
            double ingestSeconds = (System.nanoTime() - t0) / 1e9;
            double ingestCpuSeconds = (ManagementFactory.getThreadMXBean().getCurrentThreadCpuTime() - cpu0) / 1e9;
            IngestReport report = store.report();
            System.out.printf(Locale.ROOT, "ingest: %.1f MB in %.2f s = %.1f MB/s wall (%.2f s CPU = %.1f MB/s per"
                    + " CPU second); rows %d, samples kept %d,"
                    + " problems %d, DST repeated %d+%d, skipped %d, heap peak so far %.0f MB%n",
                    megabytes, ingestSeconds, megabytes / ingestSeconds, ingestCpuSeconds, megabytes / ingestCpuSeconds,
                    report.rows(), report.samplesKept(),
                    report.unparsableValues() + report.unparsableTimestamps() + report.malformedRows(),
                    report.dstRepeatedFirstPass(), report.dstRepeatedSecondPass(), report.dstSkipped(),
                    peakHeapMegabytes());
            System.gc();
            System.out.printf(Locale.ROOT, "heap in use after ingest and a GC: %.0f MB (spill index and report)%n",
                    ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed() / 1048576.0);
            long t1 = System.nanoTime();
            AtomicLong cells = new AtomicLong();
            AtomicLong mismatches = new AtomicLong();
            ExecutorService pool = Executors.newFixedThreadPool(threads);
            List<Future<?>> futures = new ArrayList<>();
            int gridLength = store.gridLength();
            Instant gridStart = store.gridStart();
            final int fleetUnits = units;
            final int rowCount = rows;
            for (int u = 0; u < units + 1; u++) {
                final int unit = u;
                futures.add(pool.submit(() -> {
                    for (int s = 0; s < (unit < fleetUnits ? ROLES.length : 2); s++) {
                        int column = unit < fleetUnits ? unit * ROLES.length + s : fleetUnits * ROLES.length + s;
                        ResampledSeries series = store.series(ids.get(column));
                        cells.addAndGet(series.length());
                        mismatches.addAndGet(check(series, column, fleetUnits, rowCount, gridStart));
                    }
                }));
            }
            for (Future<?> f : futures) {
                f.get();
            }
            pool.shutdown();
            double loadSeconds = (System.nanoTime() - t1) / 1e9;
            System.out.printf(Locale.ROOT, "load all %d series (%d threads): %.2f s, grid %d cells, %d cells in total,"
                    + " %d mismatches against the generator%n", ids.size(), threads, loadSeconds, gridLength,
                    cells.get(), mismatches.get());
            System.out.printf(Locale.ROOT, "total %.2f s; peak heap %.0f MB (max heap %.0f MB)%n",
                    (System.nanoTime() - t0) / 1e9, peakHeapMegabytes(),
                    Runtime.getRuntime().maxMemory() / 1048576.0);
            if (mismatches.get() > 0) {
                throw new IllegalStateException("resampled values differ from the generated ones");
            }
        }
        if (!keep) {
            Files.delete(csv);
        }
    }

    static List<String> seriesIds(int units) {
        List<String> ids = new ArrayList<>();
        for (int u = 0; u < units; u++) {
            for (String role : ROLES) {
                ids.add(String.format(Locale.ROOT, "ELM.F%02d.FCU-%04d.%s", u / 40 + 1, u + 1, role));
            }
        }
        ids.add("ELM.PLANT.OAT");
        ids.add("ELM.PLANT.HWS-T");
        return ids;
    }

    /**
     * The generated value of a column at a row, as written: temperatures and fan speed with 3 decimals, valve
     * commands with 2, fan status as the BACnet words active/inactive (read back as 1/0). Written with fixed decimals,
     * like many BAS exports, which makes the file about 690 MB at full size.
     */
    static double value(int row, int column, int units) {
        long h = mix(SEED ^ ((long) row << 20) ^ column);
        double noise = (h >>> 11) * 0x1.0p-53;
        if (column >= units * ROLES.length) {
            return Math.round((column % 2 == 0 ? -5 + 20 * noise : 70 + 10 * noise) * 1000) / 1000.0;
        }
        return switch (column % ROLES.length) {
            case 0 -> Math.round((20 + 5 * noise) * 1000) / 1000.0;
            case 1 -> Math.round((13 + 25 * noise) * 1000) / 1000.0;
            case 2, 3 -> noise < 0.5 ? 0 : Math.round((noise - 0.5) * 200 * 100) / 100.0;
            case 4 -> noise < 0.3 ? 0 : 1;
            default -> Math.round(noise * 1000) / 1000.0;
        };
    }

    private static int decimalsOf(int column, int units) {
        if (column >= units * ROLES.length) {
            return 3;
        }
        return switch (column % ROLES.length) {
            case 2, 3 -> 2;
            case 4 -> -1;
            default -> 3;
        };
    }

    private static long mix(long z) {
        // SplitMix64 finaliser (Steele, Lea, Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014).
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    private static void generate(Path csv, List<String> ids, int rows) throws IOException {
        int units = (ids.size() - 2) / ROLES.length;
        DateTimeFormatter format = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss", Locale.ROOT);
        Instant start = LocalDateTime.of(2031, 1, 1, 0, 0).atZone(ZONE).toInstant();
        Path tmp = csv.resolveSibling(csv.getFileName() + ".tmp");
        try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(tmp), 1 << 20)) {
            out.write(("timestamp," + String.join(",", ids) + "\n").getBytes(StandardCharsets.UTF_8));
            byte[] line = new byte[ids.size() * 12 + 64];
            for (int r = 0; r < rows; r++) {
                Instant t = start.plus(Duration.ofMinutes(15L * r));
                byte[] stamp = format.format(t.atZone(ZONE).toLocalDateTime()).getBytes(StandardCharsets.US_ASCII);
                System.arraycopy(stamp, 0, line, 0, stamp.length);
                int p = stamp.length;
                for (int c = 0; c < ids.size(); c++) {
                    line[p++] = ',';
                    double v = value(r, c, units);
                    int decimals = decimalsOf(c, units);
                    if (decimals < 0) {
                        byte[] word = v == 1 ? ACTIVE : INACTIVE;
                        System.arraycopy(word, 0, line, p, word.length);
                        p += word.length;
                    } else {
                        p = writeDecimal(line, p, v, decimals);
                    }
                }
                line[p++] = '\n';
                out.write(line, 0, p);
            }
        }
        Files.move(tmp, csv);
    }

    /** Writes v with a fixed number of decimals (|v| < 1e9). */
    private static int writeDecimal(byte[] b, int p, double v, int decimals) {
        long scale = decimals == 3 ? 1000 : 100;
        long scaled = Math.round(v * scale);
        if (scaled < 0) {
            b[p++] = '-';
            scaled = -scaled;
        }
        String whole = Long.toString(scaled / scale);
        for (int i = 0; i < whole.length(); i++) {
            b[p++] = (byte) whole.charAt(i);
        }
        b[p++] = '.';
        long fraction = scaled % scale;
        for (long d = scale / 10; d >= 1; d /= 10) {
            b[p++] = (byte) ('0' + (fraction / d) % 10);
        }
        return p;
    }

    /**
     * Compares resampled cells with the generator. Rows are 15 min apart in real time (the generator steps instants
     * and writes local wall time, so the fall-back hour appears twice), hence row r must land in cell
     * {@code offset + r} with exactly its own value: this also checks the DST reading. Every row is checked for
     * every 50th column, every 97th row for the others.
     */
    private static long check(ResampledSeries series, int column, int units, int rows, Instant gridStart) {
        Instant start = LocalDateTime.of(2031, 1, 1, 0, 0).atZone(ZONE).toInstant();
        int offsetCells = (int) (Duration.between(gridStart, start).toMinutes() / 15);
        int step = column % 50 == 0 ? 1 : 97;
        long mismatches = 0;
        for (int r = 0; r < rows; r += step) {
            if (Double.compare(value(r, column, units), series.values()[offsetCells + r]) != 0) {
                mismatches++;
            }
        }
        return mismatches;
    }

    private static void resetPeaks() {
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            pool.resetPeakUsage();
        }
    }

    /** Sum of the heap pools' peak usage since the last reset (an upper bound of the peak heap in use). */
    private static double peakHeapMegabytes() {
        long peak = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) {
                peak += pool.getPeakUsage().getUsed();
            }
        }
        return peak / 1048576.0;
    }
}
