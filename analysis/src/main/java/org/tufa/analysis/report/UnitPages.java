package org.tufa.analysis.report;

import org.tufa.common.OutputFiles;
import java.awt.Color;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.tufa.analysis.features.UnitSignals;
import org.tufa.analysis.findings.ClusterSummary;
import org.tufa.analysis.findings.DirectionCheck;
import org.tufa.analysis.findings.Finding;
import java.util.concurrent.ConcurrentHashMap;
import org.tufa.analysis.decision.FleetDecision;
import org.tufa.analysis.fleet.ModeResult;
import org.tufa.analysis.fleet.ModeSummary;
import org.tufa.analysis.fleet.UnitSummary;
import org.tufa.analysis.fleet.UnitAnalysis;
import org.tufa.analysis.fleet.UnitOutcome;
import org.tufa.analysis.fleet.UnitSink;

/**
 * Writes one report page per unit, {@code DIR/report/units/<folder>/index.html}, with its charts beside it (a
 * {@link UnitSink}, called from the worker threads): the charts while the unit's detailed result is in memory,
 * the page once its findings are decided. Writes nothing
 * outside the unit's own folder, so units render in parallel.
 */
public final class UnitPages implements UnitSink {

    /** Chart sizes in pixels: small enough for 150 units to stay well under 30 MB. */
    static final int STRIP_WIDTH = 900;
    static final int STRIP_HEIGHT = 520;
    static final int REACH_WIDTH = 720;
    static final int REACH_HEIGHT = 300;
    /** Most columns of a reachability plot: two per pixel of its width (display only; every sample is clustered). */
    static final int REACH_COLUMNS = 2 * REACH_WIDTH;
    static final int BIPLOT_SIZE = 600;
    /** Most points a biplot shows (display only; every sample is clustered). */
    static final int BIPLOT_POINTS = 2000;
    /** Most points per strip line (display only). */
    static final int STRIP_POINTS = 2500;

    private final Path unitsDir;
    private final ZoneId zone;
    /** Per unit folder: the charts drawn in phase 1, by mode, until the page is written. */
    private final Map<String, Map<String, ModeCharts.Drawn>> drawn = new ConcurrentHashMap<>();

    /** @param outDir the run's output directory; pages go below {@code outDir/report/units} */
    public UnitPages(Path outDir, ZoneId zone) {
        Charts.init();
        this.unitsDir = FleetPage.reportDir(outDir).resolve("units");
        this.zone = zone;
    }

    private Path folder(UnitOutcome o) {
        Path dir = unitsDir.resolve(o.folder());
        if (!dir.normalize().startsWith(unitsDir.normalize())) {
            throw new IllegalStateException("unit folder escapes the report folder: " + o.folder());
        }
        return dir;
    }

    /**
     * Phase 1: the charts that need the detailed result (reachability plots, biplots) and the signal strips
     * without findings (redrawn with them in phase 2 for units that have findings).
     */
    @Override
    public void analysed(UnitOutcome o, UnitSignals signals) {
        UnitAnalysis.Result r = o.result();
        if (r == null) {
            return;
        }
        Path dir = folder(o);
        OutputFiles.ensureFolder(dir);
        String name = o.displayName();
        Map<String, ModeCharts.Drawn> charts = new java.util.TreeMap<>();
        for (ModeResult m : r.modeResults()) {
            if (m.analyzed()) {
                charts.put(m.mode(), ModeCharts.draw(m, name, dir));
            }
        }
        drawn.put(o.folder(), charts);
        if (signals != null) {
            Charts.writePng(strips(name, signals, r.loadKw(), r.interval(), List.of()), STRIP_WIDTH, STRIP_HEIGHT,
                    dir.resolve("strips.png"));
        }
    }

    /** Phase 2: the page, with the decided findings (and the strips redrawn with them shaded). */
    @Override
    public void decided(UnitOutcome o, UnitSignals signals, double[] loadKw) {
        Path dir = folder(o);
        OutputFiles.ensureFolder(dir);
        if (signals != null && o.summary() != null) {
            Charts.writePng(strips(o.displayName(), signals, loadKw, o.summary().interval(), o.findings()),
                    STRIP_WIDTH, STRIP_HEIGHT, dir.resolve("strips.png"));
        }
        Map<String, ModeCharts.Drawn> charts = drawn.remove(o.folder());
        OutputFiles.writeString(dir.resolve("index.html"), page(o, charts == null ? Map.of() : charts, dir));
    }

    @Override
    public java.io.Serializable carry(String folder) {
        Map<String, ModeCharts.Drawn> charts = drawn.remove(folder);
        return charts == null ? null : new java.util.TreeMap<>(charts);
    }

    @Override
    @SuppressWarnings("unchecked")
    public void restore(String folder, java.io.Serializable kept) {
        if (kept != null) {
            drawn.put(folder, (Map<String, ModeCharts.Drawn>) kept);
        }
    }

    private String page(UnitOutcome o, Map<String, ModeCharts.Drawn> charts, Path dir) {
        String name = o.displayName();
        StringBuilder b = new StringBuilder(16_384);
        Html.open(b, name + " - tufa unit report", "Unit " + name);
        b.append("<p><a href=\"../../index.html\">&larr; Fleet report</a></p>\n");
        b.append("<p>Unit: <code>").append(Html.esc(o.unit())).append("</code>. Status: <strong")
                .append(o.status().equals(UnitOutcome.FAILED) ? " class=\"failed\"" : "").append('>')
                .append(Html.esc(o.status())).append("</strong>");
        if (!o.reason().isEmpty()) {
            b.append(" &mdash; ").append(Html.esc(o.reason()));
        }
        b.append(".</p>\n");
        UnitSummary r = o.summary();
        if (r != null) {
            b.append("<p>Fault hours ").append(Html.fixed(o.faultHours(), 1)).append(" h, estimated sensible "
                    + "energy moved during findings ").append(Html.fixed(o.faultEnergyKwh(), 0)).append(" kWh, ")
                    .append(o.findings().size()).append(" finding(s)");
            if (o.belowConfidence() > 0) {
                b.append(" (and ").append(o.belowConfidence()).append(" candidate(s) below the run's minimum "
                        + "confidence, not listed)");
            }
            b.append(".</p>\n");
        }
        b.append("<h2>Notes</h2>\n");
        if (o.notes().isEmpty()) {
            b.append("<p>No data-quality notes.</p>\n");
        } else {
            b.append("<ul>\n");
            o.notes().forEach(n -> b.append("<li>").append(Html.esc(n)).append("</li>\n"));
            b.append("</ul>\n");
        }
        if (r == null) {
            Html.close(b);
            return b.toString();
        }
        modeCounts(b, r);
        if (Files.exists(dir.resolve("strips.png"))) {
            int factor = stripFactor(r.interval(), r.samples());
            b.append("<h2>Signals over the period</h2>\n<figure><img src=\"strips.png\" width=\"").append(STRIP_WIDTH)
                    .append("\" height=\"").append(STRIP_HEIGHT).append("\" alt=\"Time series of ")
                    .append(Html.esc(name)).append(": temperatures, commands, airflow or fan, and load, with "
                            + "findings shaded\">\n<figcaption>Means over blocks of ")
                    .append(describe(r.interval().multipliedBy(factor)))
                    .append(" (display only; the analysis uses every sample), plotted at each block's start. "
                            + "Shaded: findings (numbered F1, F2, ... as in the findings table below when there are "
                            + "at most eight; vermillion = fault cluster, yellow = differs from its peers, "
                            + "reddish purple = a rule's finding). Fan (fan coil units): share of the time running, in %. "
                            + "Load: sensible load estimated from airflow (measured on VAV boxes, nominal on fan coil "
                            + "units) and the zone-to-discharge temperature difference.</figcaption></figure>\n");
        }
        findings(b, o);
        for (ModeSummary m : r.modes()) {
            mode(b, m, charts.get(m.mode()));
        }
        Html.close(b);
        return b.toString();
    }

    private static void modeCounts(StringBuilder b, UnitSummary r) {
        b.append("<h2>Samples per operating mode</h2>\n<table>\n<thead><tr>");
        int[] counts = r.modeCounts();
        for (String label : r.modeLabels()) {
            b.append("<th class=\"num\">").append(Html.esc(label)).append("</th>");
        }
        b.append("</tr></thead>\n<tbody><tr>");
        for (int code = 0; code < counts.length; code++) {
            b.append("<td class=\"num\">").append(counts[code]).append("</td>");
        }
        b.append("</tr></tbody>\n</table>\n");
        if (r.fanInferred()) {
            b.append("<p class=\"small\">No fan signal: the fan was taken as running whenever a valve was open."
                    + "</p>\n");
        }
    }

    private void findings(StringBuilder b, UnitOutcome o) {
        b.append("<h2>Findings</h2>\n");
        if (o.findings().isEmpty()) {
            b.append("<p>No findings.</p>\n");
            return;
        }
        b.append("<table>\n<thead><tr><th>#</th><th class=\"num\">confidence</th><th>mode</th><th>kind</th>"
                + "<th>cluster</th><th>start</th><th>end</th><th class=\"num\">hours</th>"
                + "<th class=\"num\">energy (kWh)</th><th>evidence</th><th>shift from normal</th>"
                + "<th>candidate causes (verify on site)</th><th>id</th><th>review</th></tr></thead>\n<tbody>\n");
        int k = 1;
        for (Finding f : o.findings()) {
            b.append("<tr><td>F").append(k++).append("</td><td class=\"num\">").append(Html.fixed(f.confidence(), 3))
                    .append("</td><td>").append(Html.esc(f.mode())).append("</td><td>")
                    .append(Html.esc(f.kind())).append("</td><td>")
                    .append(f.cluster() < 0 ? "" : "C" + f.cluster()).append("</td><td class=\"t\">")
                    .append(Times.local(f.start(), zone)).append("</td><td class=\"t\">")
                    .append(Times.local(f.end(), zone))
                    .append("</td><td class=\"num\">").append(Html.fixed(f.hours(), 1))
                    .append("</td><td class=\"num\">").append(Html.fixed(f.energyKwh(), 1)).append("</td><td>")
                    .append(Html.esc(f.evidence())).append("</td><td>")
                    .append(Html.shifts(f.shifts())).append("</td><td>");
            list(b, f.causes());
            b.append("</td><td><code>").append(o.mark(f).findingId()).append("</code></td><td>")
                    .append(ReviewControls.status(o.mark(f), zone)).append("</td></tr>\n");
        }
        b.append("</tbody>\n</table>\n<p class=\"small\">Verdicts on these findings are given on the "
                + "<a href=\"../../index.html\">fleet page</a>, beside each finding.</p>\n");
    }

    private static void list(StringBuilder b, List<String> items) {
        if (items.isEmpty()) {
            return;
        }
        b.append("<ul>");
        items.forEach(c -> b.append("<li>").append(Html.esc(c)).append("</li>"));
        b.append("</ul>");
    }

    private static void mode(StringBuilder b, ModeSummary m, ModeCharts.Drawn drawn) {
        b.append("<h2>Mode: ").append(Html.esc(m.mode())).append("</h2>\n");
        if (!m.analyzed()) {
            b.append("<p>Not clustered: ").append(Html.esc(m.reason())).append(" (").append(m.modeSamples())
                    .append(" samples in this mode).</p>\n");
            return;
        }
        b.append("<p>").append(m.modeSamples()).append(" samples in ").append(Html.esc(m.mode())).append(", ")
                .append(m.samplesClustered()).append(" clustered");
        if (m.band() != null) {
            b.append(" (inside the load band)");
        }
        b.append("; PCA kept ").append(m.pca().components()).append(" component(s) explaining ")
                .append(Html.fixed(100 * m.pca().explainedVariance(), 0)).append(" % of the variance. The normal "
                        + "reference (the largest cluster and the clusters that agree with it) holds ")
                .append(Html.fixed(100 * m.referenceShare(), 0)).append(" % of the clustered samples")
                .append(m.dominantRegime() ? "." : ": no dominant regime, so no cluster findings in this mode.")
                .append("</p>\n");
        clusterTable(b, m);
        if (drawn == null) {
            return;
        }
        b.append("<figure><img src=\"").append(drawn.reachabilityFile()).append("\" width=\"").append(REACH_WIDTH)
                .append("\" height=\"").append(REACH_HEIGHT).append("\" alt=\"Reachability plot, ")
                .append(Html.esc(m.mode())).append("\">\n<figcaption>OPTICS reachability plot (Ankerst, Breunig, "
                        + "Kriegel and Sander, SIGMOD 1999): ")
                .append(drawn.reachabilityColumnWidth() == 1 ? "one bar per clustered sample in processing order"
                        : "clustered samples in processing order, " + drawn.reachabilityColumnWidth()
                        + " per column, each column showing the largest reachability of each cluster in it (display"
                        + " only: the outline of peaks and valleys is exact)")
                .append("; valleys are dense regions. Bars coloured by cluster, noise grey; the brackets under the "
                        + "axis mark each extracted xi cluster's span of the ordering (C0 = normal, the largest). "
                        + "Distances are in standardised PCA-score units (features scaled to unit variance). "
                        + "Undefined reachability (first sample of a region) is drawn at the top.</figcaption>"
                        + "</figure>\n");
        b.append("<figure><img src=\"").append(drawn.biplotFile()).append("\" width=\"").append(BIPLOT_SIZE)
                .append("\" height=\"").append(BIPLOT_SIZE).append("\" alt=\"PCA biplot, ")
                .append(Html.esc(m.mode())).append("\">\n<figcaption>").append(drawn.caption())
                .append("</figcaption></figure>\n");
    }

    private static void clusterTable(StringBuilder b, ModeSummary m) {
        b.append("<table>\n<thead><tr><th>cluster</th><th class=\"num\">samples</th><th>judged</th>"
                + "<th>direction check</th><th>shift from normal</th><th>candidate causes</th></tr></thead>\n"
                + "<tbody>\n");
        for (ClusterSummary c : m.clusters()) {
            String judged = c.label() == 0 ? "normal (largest)" : c.candidateFault() ? "candidate fault"
                    : "normal reference: another regime of normal operation";
            b.append("<tr><td><span class=\"swatch\" style=\"background:")
                    .append(Palette.hex(Palette.cluster(c.label()))).append("\"></span>C").append(c.label())
                    .append("</td><td class=\"num\">").append(c.size()).append("</td><td>").append(judged)
                    .append("</td><td>").append(direction(c.direction())).append("</td><td>")
                    .append(Html.shifts(c.shifts())).append("</td><td>");
            list(b, c.causes());
            b.append("</td></tr>\n");
        }
        int noise = m.noise();
        b.append("<tr><td><span class=\"swatch\" style=\"background:").append(Palette.hex(Palette.NOISE_GREY))
                .append("\"></span>noise</td><td class=\"num\">").append(noise)
                .append("</td><td>ignored</td><td></td><td></td><td></td></tr>\n</tbody>\n</table>\n");
    }

    private static String direction(DirectionCheck.Outcome d) {
        if (d == null) {
            return "not applicable";
        }
        return switch (d) {
            case AS_EXPECTED -> "discharge follows the valve as expected";
            case FAILS -> "discharge does not follow the valve";
            case INCONCLUSIVE -> "inconclusive (valve barely moved)";
        };
    }

    static int stripFactor(Duration interval, int samples) {
        long perHour = Math.max(1, Math.round(3_600_000.0 / Math.max(1, interval.toMillis())));
        long factor = Math.max(perHour, (samples + STRIP_POINTS - 1) / STRIP_POINTS);
        return (int) factor;
    }

    private static String describe(Duration d) {
        long minutes = d.toMinutes();
        if (minutes % 60 == 0) {
            long h = minutes / 60;
            return h == 1 ? "one hour" : h + " hours";
        }
        return minutes + " minutes";
    }

    private org.jfree.chart.JFreeChart strips(String name, UnitSignals s, double[] loadKw, Duration interval,
                                              List<Finding> findings) {
        int factor = stripFactor(interval, s.size());
        int blocks = (s.size() + factor - 1) / factor;
        long[] times = new long[blocks];
        for (int i = 0; i < blocks; i++) {
            times[i] = s.time(i * factor).toEpochMilli();
        }
        List<Charts.Strip> strips = new ArrayList<>();
        List<Charts.Line> temps = new ArrayList<>();
        add(temps, "zone air (degC)", s.zoneAirTemperature(), factor, Palette.BLUE, false);
        add(temps, "discharge air (degC)", s.dischargeAirTemperature(), factor, Palette.VERMILLION, false);
        add(temps, "zone setpoint (degC)", s.zoneSetpoint(), factor, Palette.BLACK, true);
        add(temps, "cooling setpoint (degC)", s.zoneCoolingSetpoint(), factor, Palette.SKY_BLUE, true);
        add(temps, "heating setpoint (degC)", s.zoneHeatingSetpoint(), factor, Palette.ORANGE, true);
        add(temps, "AHU supply air (degC)", s.ahuSupplyAirTemperature(), factor, Palette.BLACK, false);
        strips.add(new Charts.Strip("temperature (degC)", temps));
        List<Charts.Line> commands = new ArrayList<>();
        add(commands, "cooling valve (%)", s.coolingValveCommand(), factor, Palette.SKY_BLUE, false);
        add(commands, "heating valve (%)", s.heatingValveCommand(), factor, Palette.ORANGE, false);
        double[] fan = s.fanFraction().clone();
        for (int i = 0; i < fan.length; i++) {
            fan[i] *= 100;
        }
        add(commands, "fan running (% of time)", fan, factor, Palette.BLUISH_GREEN, true);
        // A VAV box's (absent on fan coil units, whose strips stay as they were).
        add(commands, "damper position (%)", s.damperPosition(), factor, Palette.BLUE, false);
        add(commands, "damper command (%)", s.damperCommand(), factor, Palette.BLUE, true);
        add(commands, "reheat valve (%)", s.reheatValveCommand(), factor, Palette.ORANGE, false);
        add(commands, "electric reheat (%)", s.electricReheatCommand(), factor, Palette.ORANGE, true);
        strips.add(new Charts.Strip("command (%)", commands));
        List<Charts.Line> air = new ArrayList<>();
        add(air, "airflow (L/s)", scaled(s.airflow(), 1000), factor, Palette.BLUISH_GREEN, false);
        add(air, "airflow setpoint (L/s)", scaled(s.airflowSetpoint(), 1000), factor, Palette.BLACK, true);
        strips.add(new Charts.Strip("airflow (L/s)", air));
        List<Charts.Line> load = new ArrayList<>();
        add(load, "sensible load (kW)", loadKw, factor, Palette.REDDISH_PURPLE, false);
        strips.add(new Charts.Strip("load (kW)", load));
        strips.removeIf(st -> st.lines().isEmpty());
        List<Charts.Shade> shades = new ArrayList<>();
        int k = 1;
        for (Finding f : findings) {
            Color c = f.kind().equals("fault_cluster") ? Palette.VERMILLION
                    : f.kind().equals(FleetDecision.PEER_KIND) ? Palette.YELLOW : Palette.REDDISH_PURPLE;
            shades.add(new Charts.Shade(f.start().toEpochMilli(), f.end().toEpochMilli(), c,
                    findings.size() <= 8 ? "F" + k : null));
            k++;
        }
        return Charts.strips(name + ": signals and findings", times, strips, shades, zone);
    }

    private static double[] scaled(double[] values, double factor) {
        double[] out = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            out[i] = values[i] * factor;
        }
        return out;
    }

    private static void add(List<Charts.Line> lines, String name, double[] values, int factor, Color colour,
                            boolean dashed) {
        if (UnitSignals.present(values)) {
            lines.add(new Charts.Line(name, Thinning.blockMeans(values, factor), colour, dashed));
        }
    }
}
