package org.tufa.analysis.features;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The within (fixed day effects) estimate of fan stage offsets ({@link StageContrasts}) against the full
 * dummy-variable regression computed by NumPy's {@code linalg.lstsq} (fixture and script
 * {@code make_stage_contrast_fixture.py} beside it): by the Frisch-Waugh-Lovell theorem the two give the same
 * coefficients, so one ordinary least-squares round must match to rounding.
 */
class StageContrastsTest {

    @Test
    void withinFitMatchesTheDummyVariableRegression() throws IOException {
        List<String> rows = lines("stage-contrast-sample.csv");
        int n = rows.size();
        double[] v = new double[n];
        double[] y = new double[n];
        int[] stage = new int[n];
        int[] day = new int[n];
        for (int i = 0; i < n; i++) {
            String[] f = rows.get(i).split(",");
            v[i] = Double.parseDouble(f[0]);
            y[i] = Double.parseDouble(f[1]);
            stage[i] = Integer.parseInt(f[2]);
            day[i] = Integer.parseInt(f[3]);
        }
        Map<String, Double> expected = new HashMap<>();
        for (String line : lines("stage-contrast-expected.csv")) {
            String[] f = line.split(",");
            if (!f[0].equals("numpy_version")) {
                expected.put(f[0], Double.parseDouble(f[1]));
            }
        }
        double[] ols = StageContrasts.offsets(v, y, stage, day, 3, 3, 1);
        assertEquals(0.0, ols[0], 0.0);
        assertEquals(expected.get("offset1"), ols[1], 1e-9);
        assertEquals(expected.get("offset2"), ols[2], 1e-9);
        // With Huber weights on Gaussian noise the offsets move little from least squares, and stay near the
        // planted -0.05 and -0.11.
        double[] huber = StageContrasts.offsets(v, y, stage, day, 3, 3);
        assertEquals(-0.05, huber[1], 0.01);
        assertEquals(-0.11, huber[2], 0.01);
    }

    /** A stage that never runs on a day beside another stage has no within-day contrast: offset 0. */
    @Test
    void aStageAloneOnItsDaysKeepsOffsetZero() {
        int n = 400;
        double[] v = new double[n];
        double[] y = new double[n];
        int[] stage = new int[n];
        int[] day = new int[n];
        for (int i = 0; i < n; i++) {
            day[i] = i / 40;
            stage[i] = day[i] < 8 ? i % 2 : 2; // stage 2 only on days 8 and 9, alone
            v[i] = (i * 37 % 100) / 100.0;
            y[i] = 0.5 * v[i] + (stage[i] == 1 ? -0.05 : stage[i] == 2 ? -0.3 : 0);
        }
        double[] o = StageContrasts.offsets(v, y, stage, day, 3, 3);
        assertEquals(-0.05, o[1], 1e-9);
        assertEquals(0.0, o[2], 0.0);
    }

    private static List<String> lines(String name) throws IOException {
        try (InputStream in = StageContrastsTest.class.getResourceAsStream(name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8).lines().filter(l -> !l.isBlank()).toList();
        }
    }
}
