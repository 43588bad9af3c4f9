package org.tufa.analysis.band;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class LoadBandTest {

    private static final double N = Double.NaN;

    @Test
    void notesSection6TukeyFencesOnOneToNineAndHundred() {
        // {1..9, 100}, linear interpolation (NumPy default / Hyndman & Fan type 7): Q1 3.25, Q3 7.75,
        // fences -3.5 and 14.5 (field notes section 6, "calc"; Tukey 1977 for the 1.5 IQR fences).
        double[] x = {1, 2, 3, 4, 5, 6, 7, 8, 9, 100};
        LoadBand tukey = LoadBand.fit(x, BandKind.TUKEY, RunOptions.defaults());
        assertEquals(3.25, tukey.q1(), 1e-12);
        assertEquals(7.75, tukey.q3(), 1e-12);
        assertEquals(-3.5, tukey.low(), 1e-12);
        assertEquals(14.5, tukey.high(), 1e-12);
        assertEquals(9, tukey.inBandCount());
        assertEquals(1, tukey.outOfBandCount());
        assertFalse(tukey.inBand()[9]);
        LoadBand iqr = LoadBand.fit(x, BandKind.IQR, RunOptions.defaults());
        // [3.25, 7.75] keeps 4, 5, 6, 7.
        assertEquals(4, iqr.inBandCount());
        assertEquals(6, iqr.outOfBandCount());
        LoadBand none = LoadBand.fit(x, BandKind.NONE, RunOptions.defaults());
        assertEquals(10, none.inBandCount());
        assertTrue(none.runs().isEmpty());
    }

    @Test
    void agreesWithNumpyOnASeededRandomSample() throws IOException {
        // Fixture from numpy.quantile(method="linear"), NumPy 1.24.2 (Debian); script make_quantile_fixture.py.
        double[] x = read("quantile-sample.csv").lines().mapToDouble(Double::parseDouble).toArray();
        Map<String, String> expected = new HashMap<>();
        read("quantile-expected.csv").lines().forEach(l -> expected.put(l.split(",")[0], l.split(",")[1]));
        assertEquals(Integer.parseInt(expected.get("n")), x.length);
        double[] q = Quantiles.linear(x, 0.1, 0.25, 0.5, 0.75, 0.9);
        String[] names = {"p10", "q1", "median", "q3", "p90"};
        for (int i = 0; i < names.length; i++) {
            assertEquals(Double.parseDouble(expected.get(names[i])), q[i], 1e-12, names[i]);
        }
        LoadBand tukey = LoadBand.fit(x, BandKind.TUKEY, RunOptions.defaults());
        assertEquals(Double.parseDouble(expected.get("tukey_low")), tukey.low(), 1e-12);
        assertEquals(Double.parseDouble(expected.get("tukey_high")), tukey.high(), 1e-12);
        assertEquals(Integer.parseInt(expected.get("tukey_in_band")), tukey.inBandCount());
        assertEquals(Integer.parseInt(expected.get("tukey_above")) + Integer.parseInt(expected.get("tukey_below")),
                tukey.outOfBandCount());
        assertEquals(Integer.parseInt(expected.get("iqr_in_band")),
                LoadBand.fit(x, BandKind.IQR, RunOptions.defaults()).inBandCount());
    }

    @Test
    void sustainedRunsBridgeShortGapsAndIgnoreShortExcursions() {
        // Band [0, 10], runs need 3 outside samples, gaps of 1 bridged (worked by hand):
        // idx 2-3 outside, then two in-band samples -> closed with 2 outside: too short, not reported.
        // idx 6, 7 (below), 9, 11, 13, 14 outside; the single in-band or NaN samples 8, 10, 12 are bridged;
        // 15 and 16 in band close it -> one run [6, 15) with 6 outside, 5 of them above.
        double[] v = {5, 5, 20, 20, 5, 5, 20, -3, 5, 20, 5, 20, N, 20, 20, 5, 5, 5};
        List<OutOfBandRun> runs = LoadBand.runs(v, 0, 10, new RunOptions(3, 1));
        assertEquals(1, runs.size());
        OutOfBandRun run = runs.get(0);
        assertEquals(6, run.start());
        assertEquals(15, run.endExclusive());
        assertEquals(6, run.outsideSamples());
        assertEquals(5, run.aboveSamples());
        assertEquals("both", run.side());
        // Without bridging the longest stretches (2-3, 6-7, 13-14) have 2 outside samples: none is reported.
        assertTrue(LoadBand.runs(v, 0, 10, new RunOptions(3, 0)).isEmpty());
        // Counting with NaN: missing samples are neither in nor out of band.
        LoadBand band = LoadBand.fit(new double[] {1, N, 2, 3}, BandKind.NONE, RunOptions.defaults());
        assertEquals(1, band.missingCount());
        assertArrayEquals(new boolean[] {true, false, true, true}, band.inBand());
    }

    private static String read(String name) throws IOException {
        try (InputStream in = LoadBandTest.class.getResourceAsStream(name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }
}
