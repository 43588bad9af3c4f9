package org.tufa.analysis.cluster;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Reads the CSV fixtures written by make_fixtures.py (scikit-learn 1.2.1) beside this package's test resources.
 */
final class Fixtures {

    private Fixtures() {}

    /** A CSV table: header and rows of strings. */
    record Table(List<String> header, List<String[]> rows) {
        int column(String name) {
            int c = header.indexOf(name);
            if (c < 0) {
                throw new IllegalArgumentException("no column " + name + " in " + header);
            }
            return c;
        }

        double[] doubles(String name) {
            int c = column(name);
            return rows.stream().mapToDouble(r -> Double.parseDouble(r[c])).toArray();
        }

        int[] ints(String name) {
            int c = column(name);
            return rows.stream().mapToInt(r -> Integer.parseInt(r[c])).toArray();
        }

        /** The columns named {@code prefix} followed by digits (x0, x1, ...), as rows. */
        double[][] matrix(String prefix) {
            int[] cols = java.util.stream.IntStream.range(0, header.size())
                    .filter(c -> header.get(c).matches(java.util.regex.Pattern.quote(prefix) + "\\d+")).toArray();
            double[][] m = new double[rows.size()][cols.length];
            for (int i = 0; i < rows.size(); i++) {
                for (int j = 0; j < cols.length; j++) {
                    m[i][j] = Double.parseDouble(rows.get(i)[cols[j]]);
                }
            }
            return m;
        }

        int size() {
            return rows.size();
        }
    }

    static Table read(String name) {
        try (InputStream in = Fixtures.class.getResourceAsStream(name)) {
            if (in == null) {
                throw new IllegalStateException("missing fixture " + name);
            }
            BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            List<String> header = Arrays.asList(reader.readLine().split(","));
            List<String[]> rows = new ArrayList<>();
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                if (!line.isBlank()) {
                    rows.add(line.split(","));
                }
            }
            return new Table(header, rows);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** One OPTICS fixture: data, scikit-learn's results and parameters. */
    record OpticsCase(String name, double[][] x, Table samples, Table clusters, int minPts, double eps, double xi,
            int minClusterSize) {

        static OpticsCase load(String name) {
            Table samples = read("optics_" + name + ".csv");
            Table params = read("optics_" + name + "_params.csv");
            return new OpticsCase(name, samples.matrix("x"), samples, read("optics_" + name + "_clusters.csv"),
                    params.ints("min_samples")[0], params.doubles("eps")[0], params.doubles("xi")[0],
                    params.ints("min_cluster_size")[0]);
        }

        int[] ordering() {
            int[] position = samples.ints("position");
            int[] ordering = new int[position.length];
            for (int i = 0; i < position.length; i++) {
                ordering[position[i]] = i;
            }
            return ordering;
        }
    }
}
