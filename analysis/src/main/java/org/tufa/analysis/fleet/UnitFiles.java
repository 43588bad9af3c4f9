package org.tufa.analysis.fleet;

import java.nio.file.Path;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.cluster.OpticsResult;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.tables.SampleColumn;
import org.tufa.analysis.tables.SampleFormat;
import org.tufa.analysis.tables.SampleTable;
import org.tufa.common.OutputFiles;

/**
 * Writes one unit's files under {@code DIR/units/<folder>/}: {@code modes} (every sample's mode and band state),
 * {@code summary.json} (notes, clusters, shifts, PCA loadings, findings; written once the fleet stage has decided),
 * and per clustered mode {@code features}, {@code scores} and {@code reachability}. The per-sample tables are
 * Parquet ({@code .parquet}) or CSV ({@code .csv}), same columns either way ({@link SampleFormat}). Features are
 * written at full double precision, so the clustering can be re-run elsewhere from them (with the scaling and
 * loadings of summary.json) and reproduces the ordering exactly. What is derived from them for plots and reading,
 * the PCA scores and the reachability and core distances, is kept to single precision (7 significant digits,
 * far finer than any sensor): it halves those tables, which were half the per-sample bytes of the 500-unit year.
 */
public final class UnitFiles implements UnitSink {

    private static final List<SampleColumn> MODE_COLUMNS = List.of(SampleColumn.time("timestamp"),
            SampleColumn.text("mode"), SampleColumn.flag("in_band"));
    private static final List<SampleColumn> REACHABILITY_COLUMNS = List.of(SampleColumn.integer("order"),
            SampleColumn.time("timestamp"), SampleColumn.single("reachability"), SampleColumn.single("core_distance"),
            SampleColumn.integer("cluster"));

    private final Path unitsDir;
    private final ZoneId zone;
    private final SampleFormat format;
    /** Formatted time of every grid sample, made once per run: every unit shares the grid. */
    private volatile GridTimes gridTimes;

    private record GridTimes(java.time.Instant start, java.time.Duration interval, String[] text) {
    }

    /** Per-sample tables as CSV, as tufa wrote them before Parquet. */
    public UnitFiles(Path outDir, ZoneId zone) {
        this(outDir, zone, SampleFormat.CSV);
    }

    public UnitFiles(Path outDir, ZoneId zone, SampleFormat format) {
        this.unitsDir = outDir.resolve("units");
        this.zone = zone;
        this.format = format;
    }

    private Path folder(UnitOutcome o) {
        Path dir = unitsDir.resolve(o.folder());
        if (!dir.normalize().startsWith(unitsDir.normalize())) {
            throw new IllegalStateException("unit folder escapes the output folder: " + o.folder());
        }
        return dir;
    }

    /** summary.json, once the unit's findings are decided. */
    @Override
    public void decided(UnitOutcome o, org.tufa.analysis.features.UnitSignals signals, double[] loadKw) {
        Path dir = folder(o);
        OutputFiles.ensureFolder(dir);
        OutputFiles.writeString(dir.resolve("summary.json"), Json.unitSummary(o));
    }

    /** The per-sample files, while the detailed result is in memory. */
    @Override
    public void analysed(UnitOutcome o, org.tufa.analysis.features.UnitSignals signals) {
        Path dir = folder(o);
        OutputFiles.ensureFolder(dir);
        if (o.result() == null) {
            return;
        }
        UnitAnalysis.Result r = o.result();
        SampleTable.removeStale(dir, "modes", format);
        for (ModeResult m : r.modeResults()) {
            for (String table : MODE_TABLES) {
                SampleTable.removeStale(dir.resolve(m.mode()), table, m.analyzed() ? format : null);
            }
        }
        String[] times = times(r);
        long start = r.gridStart().getEpochSecond();
        long step = r.interval().getSeconds();
        SampleTable.write(dir, "modes", format, MODE_COLUMNS, t -> {
            byte[] codes = r.modes().codes();
            for (int i = 0; i < codes.length; i++) {
                t.time(start + i * step, times[i]);
                t.text(r.modes().labelAt(i));
                byte b = r.bandState()[i];
                t.flag(b == UnitAnalysis.Result.IN_BAND ? Boolean.TRUE
                        : b == UnitAnalysis.Result.OUT_OF_BAND ? Boolean.FALSE : null);
                t.endRow();
            }
        });
        for (ModeResult m : r.modeResults()) {
            if (m.analyzed()) {
                writeMode(dir.resolve(m.mode()), m, times, start, step);
            }
        }
    }

    private String[] times(UnitAnalysis.Result r) {
        GridTimes g = gridTimes;
        int n = r.modes().codes().length;
        if (g == null || !g.start().equals(r.gridStart()) || !g.interval().equals(r.interval()) || g.text().length != n) {
            synchronized (this) {
                g = gridTimes;
                if (g == null || !g.start().equals(r.gridStart()) || !g.interval().equals(r.interval())
                        || g.text().length != n) {
                    String[] text = new String[n];
                    java.time.Instant start = r.gridStart();
                    long step = r.interval().toNanos();
                    for (int i = 0; i < n; i++) {
                        // Parquet stores the instant; the text is needed only for CSV.
                        text[i] = format == SampleFormat.CSV ? Csv.time(start.plusNanos(step * i), zone) : "";
                    }
                    g = new GridTimes(r.gridStart(), r.interval(), text);
                    gridTimes = g;
                }
            }
        }
        return g.text();
    }

    /** The per-sample tables of an analysed mode, in its folder. */
    static final List<String> MODE_TABLES = List.of("features", "scores", "reachability");

    private void writeMode(Path dir, ModeResult m, String[] times, long start, long step) {
        OutputFiles.ensureFolder(dir);
        FeatureMatrix f = m.features();
        int[] sample = f.sampleIndex();
        List<SampleColumn> featureColumns = new ArrayList<>();
        featureColumns.add(SampleColumn.time("timestamp"));
        f.names().forEach(n -> featureColumns.add(SampleColumn.real(n)));
        SampleTable.write(dir, "features", format, featureColumns, t -> {
            for (int i = 0; i < f.size(); i++) {
                t.time(start + sample[i] * step, times[sample[i]]);
                for (double v : f.rows()[i]) {
                    t.real(v);
                }
                t.endRow();
            }
        });
        PcaResult pca = m.pca();
        List<SampleColumn> scoreColumns = new ArrayList<>();
        scoreColumns.add(SampleColumn.time("timestamp"));
        for (int k = 1; k <= pca.componentCount(); k++) {
            scoreColumns.add(SampleColumn.single("pc" + k));
        }
        SampleTable.write(dir, "scores", format, scoreColumns, t -> {
            double[][] scores = pca.scores();
            for (int i = 0; i < scores.length; i++) {
                t.time(start + sample[i] * step, times[sample[i]]);
                for (double v : scores[i]) {
                    t.single(v);
                }
                t.endRow();
            }
        });
        OpticsResult o = m.optics();
        int[] order = o.ordering();
        SampleTable.write(dir, "reachability", format, REACHABILITY_COLUMNS, t -> {
            for (int k = 0; k < order.length; k++) {
                int i = order[k];
                t.integer(k);
                t.time(start + sample[i] * step, times[sample[i]]);
                t.single(o.reachabilityOf(i));
                t.single(o.coreDistanceOf(i));
                t.integer(m.labels()[i]);
                t.endRow();
            }
        });
    }
}
