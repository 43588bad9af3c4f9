package org.tufa.analysis.fleet;

import java.nio.file.Path;
import java.time.ZoneId;
import org.tufa.analysis.cluster.OpticsResult;
import org.tufa.analysis.cluster.PcaResult;
import org.tufa.analysis.features.FeatureMatrix;
import org.tufa.analysis.modes.OperatingMode;
import org.tufa.common.OutputFiles;

/**
 * Writes one unit's files under {@code DIR/units/<folder>/}: {@code modes.csv} (every sample's mode and band
 * state), {@code summary.json} (notes, clusters, shifts, PCA loadings, findings; written once
 * the fleet stage has decided), and per clustered mode
 * {@code features.csv}, {@code scores.csv} and {@code reachability.csv}. Numbers in the per-mode files are
 * written with full double precision (a form that parses back to the same double), so the clustering can be re-run elsewhere
 * and reproduces the ordering exactly.
 */
public final class UnitFiles implements UnitSink {

    private final Path unitsDir;
    private final ZoneId zone;
    /** Formatted time of every grid sample, made once per run: every unit shares the grid. */
    private volatile GridTimes gridTimes;

    private record GridTimes(java.time.Instant start, java.time.Duration interval, String[] text) {
    }

    public UnitFiles(Path outDir, ZoneId zone) {
        this.unitsDir = outDir.resolve("units");
        this.zone = zone;
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
        String[] times = times(r);
        OutputFiles.writeText(dir.resolve("modes.csv"), w -> {
            w.write("timestamp,mode,in_band\n");
            byte[] codes = r.modes().codes();
            for (int i = 0; i < codes.length; i++) {
                w.write(times[i]);
                w.write(',');
                w.write(OperatingMode.ofCode(codes[i]).label());
                w.write(',');
                byte b = r.bandState()[i];
                w.write(b == UnitAnalysis.Result.IN_BAND ? "true" : b == UnitAnalysis.Result.OUT_OF_BAND ? "false" : "");
                w.write('\n');
            }
        });
        for (ModeResult m : r.modeResults()) {
            if (m.analyzed()) {
                writeMode(dir.resolve(m.mode()), m, times);
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
                        text[i] = Csv.time(start.plusNanos(step * i), zone);
                    }
                    g = new GridTimes(r.gridStart(), r.interval(), text);
                    gridTimes = g;
                }
            }
        }
        return g.text();
    }

    private void writeMode(Path dir, ModeResult m, String[] times) {
        OutputFiles.ensureFolder(dir);
        FeatureMatrix f = m.features();
        OutputFiles.writeText(dir.resolve("features.csv"), w -> {
            w.write("timestamp," + String.join(",", f.names()) + "\n");
            for (int i = 0; i < f.size(); i++) {
                w.write(times[f.sampleIndex()[i]]);
                for (double v : f.rows()[i]) {
                    w.write(',');
                    w.write(Csv.number(v));
                }
                w.write('\n');
            }
        });
        PcaResult pca = m.pca();
        OutputFiles.writeText(dir.resolve("scores.csv"), w -> {
            w.write("timestamp");
            for (int k = 1; k <= pca.componentCount(); k++) {
                w.write(",pc" + k);
            }
            w.write('\n');
            double[][] scores = pca.scores();
            for (int i = 0; i < scores.length; i++) {
                w.write(times[f.sampleIndex()[i]]);
                for (double v : scores[i]) {
                    w.write(',');
                    w.write(Csv.number(v));
                }
                w.write('\n');
            }
        });
        OpticsResult o = m.optics();
        int[] order = o.ordering();
        OutputFiles.writeText(dir.resolve("reachability.csv"), w -> {
            w.write("order,timestamp,reachability,core_distance,cluster\n");
            for (int k = 0; k < order.length; k++) {
                int i = order[k];
                w.write(k + "," + times[f.sampleIndex()[i]] + "," + Csv.number(o.reachabilityOf(i))
                        + "," + Csv.number(o.coreDistanceOf(i)) + "," + m.labels()[i] + "\n");
            }
        });
    }
}
