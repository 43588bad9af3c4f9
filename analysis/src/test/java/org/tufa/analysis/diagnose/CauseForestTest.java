package org.tufa.analysis.diagnose;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/**
 * The random forest against scikit-learn 1.2.1's RandomForestClassifier (same trees, features per split, leaf size)
 * on two open datasets, Fisher's iris (Fisher 1936) and the wine recognition data (Forina et al.), both from the UCI
 * Machine Learning Repository as scikit-learn bundles them: the same stratified 10 folds (make_forest_fixtures.py),
 * mean held-out accuracy within 0.04 of scikit-learn's. Two forests grow different random trees, so their
 * accuracies agree only roughly; 0.04 is 6 of iris's 150 samples.
 */
class CauseForestTest {

    record Data(double[][] x, int[] y, int[] fold) {
    }

    static Data data(String name) throws IOException {
        List<double[]> x = new ArrayList<>();
        List<Integer> y = new ArrayList<>();
        List<Integer> fold = new ArrayList<>();
        try (BufferedReader r = reader("forest_" + name + ".csv")) {
            r.readLine();
            for (String line; (line = r.readLine()) != null; ) {
                String[] c = line.split(",");
                double[] row = new double[c.length - 2];
                for (int j = 0; j < row.length; j++) {
                    row[j] = Double.parseDouble(c[j]);
                }
                x.add(row);
                y.add(Integer.parseInt(c[c.length - 2]));
                fold.add(Integer.parseInt(c[c.length - 1]));
            }
        }
        return new Data(x.toArray(double[][]::new), y.stream().mapToInt(Integer::intValue).toArray(),
                fold.stream().mapToInt(Integer::intValue).toArray());
    }

    static BufferedReader reader(String file) {
        return new BufferedReader(new InputStreamReader(CauseForestTest.class.getResourceAsStream(file),
                StandardCharsets.UTF_8));
    }

    static double sklearnMean(String name) throws IOException {
        double sum = 0;
        int n = 0;
        try (BufferedReader r = reader("forest_" + name + "_sklearn.csv")) {
            r.readLine();
            for (String line; (line = r.readLine()) != null; ) {
                sum += Double.parseDouble(line.split(",")[1]);
                n++;
            }
        }
        return sum / n;
    }

    @ParameterizedTest
    @ValueSource(strings = {"iris", "wine"})
    void heldOutAccuracyAsScikitLearns(String name) throws IOException {
        Data d = data(name);
        int classes = IntStream.of(d.y()).max().orElseThrow() + 1;
        List<String> classNames = IntStream.range(0, classes).mapToObj(c -> "c" + c).toList();
        List<String> features = IntStream.range(0, d.x()[0].length).mapToObj(j -> "x" + j).toList();
        double sum = 0;
        for (int k = 0; k < 10; k++) {
            int fold = k;
            int[] train = IntStream.range(0, d.y().length).filter(i -> d.fold()[i] != fold).toArray();
            int[] test = IntStream.range(0, d.y().length).filter(i -> d.fold()[i] == fold).toArray();
            CauseForest f = CauseForest.fit(IntStream.of(train).mapToObj(i -> d.x()[i]).toArray(double[][]::new),
                    IntStream.of(train).map(i -> d.y()[i]).toArray(), classNames, features,
                    new CauseForest.Options(100, 5, 1));
            double[][] p = f.probabilities(IntStream.of(test).mapToObj(i -> d.x()[i]).toArray(double[][]::new));
            int right = 0;
            for (int t = 0; t < test.length; t++) {
                int best = 0;
                for (int c = 1; c < classes; c++) {
                    best = p[t][c] > p[t][best] ? c : best;
                }
                right += best == d.y()[test[t]] ? 1 : 0;
                assertEquals(1.0, java.util.Arrays.stream(p[t]).sum(), 1e-9, "probabilities sum to one");
            }
            sum += (double) right / test.length;
        }
        double ours = sum / 10;
        double theirs = sklearnMean(name);
        assertEquals(theirs, ours, 0.04, name + ": ours " + ours + ", scikit-learn " + theirs);
    }

    @Test
    void sameSamplesSameForest() throws IOException {
        Data d = data("iris");
        List<String> classes = List.of("a", "b", "c");
        List<String> features = List.of("x0", "x1", "x2", "x3");
        CauseForest a = CauseForest.fit(d.x(), d.y(), classes, features, CauseForest.Options.DEFAULT);
        CauseForest b = CauseForest.fit(d.x(), d.y(), classes, features, CauseForest.Options.DEFAULT);
        double[][] pa = a.probabilities(d.x());
        double[][] pb = b.probabilities(d.x());
        for (int i = 0; i < pa.length; i++) {
            assertArrayEquals(pa[i], pb[i], 0.0, "row " + i);
        }
        assertTrue(pa[0][0] > 0.9, "a setosa is a setosa");
    }
}
