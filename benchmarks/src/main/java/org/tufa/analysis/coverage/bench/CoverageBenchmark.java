package org.tufa.analysis.coverage.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;
import java.util.Set;
import org.apache.jena.rdf.model.Model;
import org.tufa.analysis.coverage.Coverage;
import org.tufa.analysis.coverage.FleetCoverage;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.Profile;
import org.tufa.analysis.coverage.Vocabulary;

/**
 * Times coverage on a generated fleet: N fan coil units with 12 points each (seeded, so every run sees the same
 * model). Load (parse the Turtle file) and assess (all SPARQL lookups and the per-unit decision) are timed apart.
 *
 * <pre>
 * mvn -q -B -o -pl analysis -am package -DskipTests
 * java -cp benchmarks/target/tufa-benchmarks.jar org.tufa.analysis.coverage.bench.CoverageBenchmark [units] [seed] [runs] [keep.ttl]
 * </pre>
 */
public final class CoverageBenchmark {
    private CoverageBenchmark() {
    }

    public static void main(String[] args) throws IOException {
        int units = args.length > 0 ? Integer.parseInt(args[0]) : 2000;
        long seed = args.length > 1 ? Long.parseLong(args[1]) : 20260101L;
        int runs = args.length > 2 ? Integer.parseInt(args[2]) : 5;
        Path keep = args.length > 3 ? Path.of(args[3]) : null;
        Path file = keep != null ? keep : Files.createTempFile("tufa-fleet-", ".ttl");
        try {
            writeFleet(file, units, seed);
            // CPU time of this thread beside wall time: the benchmark machine may be shared.
            java.lang.management.ThreadMXBean threads = java.lang.management.ManagementFactory.getThreadMXBean();
            long t0 = System.nanoTime();
            Vocabulary vocabulary = Vocabulary.standard();
            long t1 = System.nanoTime();
            Model model = ModelLoader.load(file);
            long t2 = System.nanoTime();
            System.out.printf(Locale.ROOT, "load average before assess: %.2f on %d processors%n",
                    java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage(),
                    Runtime.getRuntime().availableProcessors());
            System.out.printf(Locale.ROOT, "fleet: %d units, %d triples, %,d bytes of Turtle%n", units, model.size(),
                    Files.size(file));
            System.out.printf(Locale.ROOT, "vocabulary load: %.0f ms%n", (t1 - t0) / 1e6);
            System.out.printf(Locale.ROOT, "model load:      %.0f ms%n", (t2 - t1) / 1e6);
            Profile profile = vocabulary.profiles().profile("fcu-modes");
            FleetCoverage last = null;
            for (int i = 1; i <= runs; i++) {
                long a = System.nanoTime();
                long ca = threads.getCurrentThreadCpuTime();
                last = Coverage.assess(model, vocabulary, profile, Set.of());
                long cb = threads.getCurrentThreadCpuTime();
                long b = System.nanoTime();
                System.out.printf(Locale.ROOT, "assess run %d:    %.0f ms wall, %.0f ms CPU%n", i, (b - a) / 1e6,
                        (cb - ca) / 1e6);
            }
            System.out.printf(Locale.ROOT, "units found %d, analysable %d (cooling %d, heating %d)%n",
                    last.units().size(), last.analyzableCount(), last.modeCount("cooling"), last.modeCount("heating"));
        } finally {
            if (keep == null) {
                Files.deleteIfExists(file);
            }
        }
    }

    /**
     * Writes a fleet: one building with an outdoor air sensor, chilled and hot water loops (one pair per 100 units)
     * feeding the units, one HVAC zone per unit. Each unit has 12 points: discharge air, zone temperature (on the
     * unit or, for one unit in four, on its zone), setpoint, cooling and heating valve commands (on valve parts, or
     * tagged on the unit for one in five), fan status, fan speed command, occupancy status, filter status, zone
     * humidity, a heating and a cooling setpoint. One unit in ten lacks the discharge air sensor.
     */
    public static void writeFleet(Path file, int units, long seed) {
        Random random = new Random(seed);
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("""
                    @prefix b: <https://fleet.example.org/bench#> .
                    @prefix brick: <https://brickschema.org/schema/Brick#> .
                    @prefix tag: <https://brickschema.org/schema/BrickTag#> .
                    @prefix ref: <https://brickschema.org/schema/Brick/ref#> .
                    @prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
                    b:site a brick:Building ; brick:hasPoint b:oat .
                    b:oat a brick:Outside_Air_Temperature_Sensor .
                    """);
            int loops = Math.max(1, (units + 99) / 100);
            for (int l = 0; l < loops; l++) {
                w.write(String.format(Locale.ROOT, """
                        b:chw%1$d a brick:Chilled_Water_Loop ; brick:hasPoint b:chw%1$d_st .
                        b:chw%1$d_st a brick:Leaving_Chilled_Water_Temperature_Sensor .
                        b:hw%1$d a brick:Hot_Water_Loop ; brick:hasPoint b:hw%1$d_st .
                        b:hw%1$d_st a brick:Leaving_Hot_Water_Temperature_Sensor .
                        """, l));
            }
            for (int u = 0; u < units; u++) {
                String id = String.format(Locale.ROOT, "u%05d", u);
                int loop = u % loops;
                boolean zoneSensor = random.nextInt(4) == 0;
                boolean tagged = random.nextInt(5) == 0;
                boolean noDat = random.nextInt(10) == 0;
                StringBuilder s = new StringBuilder();
                s.append(String.format(Locale.ROOT, "b:%1$s a brick:Fan_Coil_Unit ; rdfs:label \"FCU-%1$s\" ;%n"
                        + "  brick:feeds b:%1$s_zone ; brick:isFedBy b:chw%2$d, b:hw%2$d .%n", id, loop));
                s.append(String.format(Locale.ROOT, "b:%s_zone a brick:HVAC_Zone .%n", id));
                point(s, id, noDat ? "Return_Air_Temperature_Sensor" : "Discharge_Air_Temperature_Sensor", "dat", id);
                point(s, id, "Zone_Air_Temperature_Sensor", "znt", zoneSensor ? id + "_zone" : id);
                point(s, id, "Target_Zone_Air_Temperature_Setpoint", "sp", id);
                if (tagged) {
                    point(s, id, "Valve_Command", "clg", id);
                    s.append(String.format(Locale.ROOT, "b:%s_clg brick:hasTag tag:Chilled .%n", id));
                    point(s, id, "Valve_Command", "htg", id);
                    s.append(String.format(Locale.ROOT, "b:%s_htg brick:hasTag tag:Hot .%n", id));
                } else {
                    s.append(String.format(Locale.ROOT, "b:%1$s brick:hasPart b:%1$s_cv, b:%1$s_hv .%n"
                            + "b:%1$s_cv a brick:Chilled_Water_Valve .%nb:%1$s_hv a brick:Hot_Water_Valve .%n", id));
                    point(s, id, "Valve_Position_Command", "clg", id + "_cv");
                    point(s, id, "Valve_Position_Command", "htg", id + "_hv");
                }
                point(s, id, "Fan_Status", "fan", id);
                point(s, id, "Fan_Speed_Command", "spd", id);
                point(s, id, "Occupancy_Status", "occ", id);
                point(s, id, "Filter_Status", "flt", id);
                point(s, id, "Zone_Air_Humidity_Sensor", "rh", id);
                point(s, id, "Occupied_Heating_Temperature_Setpoint", "hsp", id);
                point(s, id, "Occupied_Cooling_Temperature_Setpoint", "csp", id);
                w.write(s.toString());
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static void point(StringBuilder s, String unit, String cls, String suffix, String host) {
        s.append(String.format(Locale.ROOT, "b:%1$s_%2$s a brick:%3$s ; rdfs:label \"%1$s.%2$s\" ; brick:isPointOf b:%4$s ;%n"
                + "  ref:hasExternalReference [ ref:hasTimeseriesId \"%1$s/%2$s\" ] .%n", unit, suffix, cls, host));
    }
}
