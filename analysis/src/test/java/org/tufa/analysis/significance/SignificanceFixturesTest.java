package org.tufa.analysis.significance;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.decision.FleetDecisionProbe;

/**
 * The statistics of the fleet stage against outside references: Benjamini and Hochberg's own worked example
 * (JRSS B 57(1), 1995, section 4: 15 p-values, 4 rejections at q = 0.05) and statsmodels' {@code multipletests};
 * Fisher's method against SciPy's {@code combine_pvalues}; the Gumbel law against SciPy's {@code gumbel_r}; the
 * Poisson tail against SciPy's {@code poisson.sf}. Fixtures made by {@code make_fixtures.py} beside them (Debian's
 * statsmodels 0.13.5, SciPy 1.10.1, NumPy 1.24.2).
 */
class SignificanceFixturesTest {

    static List<String[]> rows(String name) throws IOException {
        try (InputStream in = SignificanceFixturesTest.class.getResourceAsStream(name)) {
            List<String[]> out = new ArrayList<>();
            boolean header = true;
            for (String line : new String(in.readAllBytes(), StandardCharsets.UTF_8).split("\n")) {
                if (line.startsWith("#") || line.isBlank()) {
                    continue;
                }
                if (header) {
                    header = false;
                    continue;
                }
                out.add(line.split(","));
            }
            return out;
        }
    }

    @Test
    void benjaminiHochbergRejectsFourOfThePapersFifteenAndMatchesStatsmodels() throws IOException {
        for (String set : List.of("paper", "random")) {
            List<String[]> r = rows("bh.csv").stream().filter(x -> x[0].equals(set)).toList();
            double alpha = Double.parseDouble(r.get(0)[1]);
            double[] p = r.stream().mapToDouble(x -> Double.parseDouble(x[2])).toArray();
            double[] expected = r.stream().mapToDouble(x -> Double.parseDouble(x[3])).toArray();
            boolean[] reject = BenjaminiHochberg.reject(p, alpha);
            assertArrayEquals(expected, BenjaminiHochberg.adjust(p), 1e-12, set);
            for (int i = 0; i < p.length; i++) {
                assertEquals(Boolean.parseBoolean(r.get(i)[4]), reject[i], set + " test " + i);
            }
            if (set.equals("paper")) {
                int rejected = 0;
                for (boolean b : reject) {
                    rejected += b ? 1 : 0;
                }
                assertEquals(4, rejected, "Benjamini and Hochberg 1995, section 4");
            }
        }
    }

    @Test
    void adjustedValuesKeepTheInputOrderAndTies() {
        // Worked by hand: m = 4, sorted p 0.01, 0.02, 0.02, 0.5 -> 0.04, min(0.04, 0.0267) ... step-up minimum.
        double[] q = BenjaminiHochberg.adjust(new double[] {0.5, 0.02, 0.01, 0.02});
        assertArrayEquals(new double[] {0.5, 0.02 * 4 / 3, 0.02 * 4 / 3, 0.02 * 4 / 3}, q, 1e-15);
    }

    @Test
    void fisherMatchesScipy() throws IOException {
        for (String[] r : rows("fisher.csv")) {
            double[] p = Arrays.stream(r[0].split(" ")).mapToDouble(Double::parseDouble).toArray();
            assertEquals(Double.parseDouble(r[1]), FisherCombination.combine(p), 1e-12 * Math.max(1e-3,
                    Double.parseDouble(r[1])), r[0]);
        }
    }

    @Test
    void gumbelSurvivalMatchesScipyAndTheQuantileFitRecoversTheLaw() throws IOException {
        for (String[] r : rows("gumbel.csv")) {
            GumbelNull g = new GumbelNull(Double.parseDouble(r[0]), Double.parseDouble(r[1]), 0, true);
            double expected = Double.parseDouble(r[3]);
            assertEquals(expected, g.survival(Double.parseDouble(r[2])), 1e-12 * Math.max(1, expected)
                    + 1e-15 * expected, String.join(",", r));
        }
        double[] sample;
        try (InputStream in = getClass().getResourceAsStream("gumbel_sample.txt")) {
            sample = new String(in.readAllBytes(), StandardCharsets.UTF_8).lines().filter(l -> !l.startsWith("#"))
                    .mapToDouble(Double::parseDouble).toArray();
        }
        // 5,000 draws of Gumbel(4.0, 0.8) by SciPy: the median/IQR match gives back about those (sampling error of
        // the quartiles at n = 5000 is a few hundredths); the theoretical floor (1,000 windows) lies below them.
        GumbelNull fit = GumbelNull.fit(sample, 1000);
        assertTrue(fit.fitted());
        assertEquals(4.0, fit.location(), 0.06);
        assertEquals(0.8, fit.scale(), 0.06);
    }

    @Test
    void tooFewMaximaFallBackToTheWidenedTheoreticalNull() {
        GumbelNull g = GumbelNull.fit(new double[] {1, 2, 3}, 1000);
        assertTrue(!g.fitted());
        // Maximum of 1,000 independent standard normal values: a_n = sqrt(2 ln n) - (ln ln n + ln 4 pi) / (2 sqrt(2 ln n)),
        // b_n = 1 / sqrt(2 ln n) (Leadbetter, Lindgren and Rootzen 1983, theorem 1.5.3); by hand, ln 1000 = 6.9078:
        // sqrt(13.8155) = 3.7169, (ln 6.9078 + ln 4 pi) / 7.4338 = (1.9327 + 2.5310) / 7.4338 = 0.6005, so 3.1164 and 0.2690.
        assertEquals(3.1164, g.location(), 1e-3);
        assertEquals(2 * 0.2690, g.scale(), 1e-3);
    }

    @Test
    void poissonTailMatchesScipy() throws IOException {
        for (String[] r : rows("poisson.csv")) {
            double expected = Double.parseDouble(r[2]);
            assertEquals(expected, FleetDecisionProbe.poissonUpperTail(Double.parseDouble(r[0]),
                    Integer.parseInt(r[1])), 1e-12 + 1e-9 * expected, String.join(",", r));
        }
    }

    @Test
    void scanStatisticWorkedByHand() {
        // z = 1, 4, 4, 0: windows {4,4} give 8 / sqrt 2 = 5.657, larger than 4 alone or {1,4,4} = 9 / sqrt 3 = 5.196.
        assertEquals(8 / Math.sqrt(2), ScanStatistic.max(new double[] {1, 4, 4, 0}, 14), 1e-12);
        // Clipped at 6: one wild day of 70 spreads counts 6.
        assertEquals(6.0, ScanStatistic.max(new double[] {70}, 14), 1e-12);
        // Window length limit 1: the best single day.
        assertEquals(4.0, ScanStatistic.max(new double[] {1, 4, 4, 0}, 1), 1e-12);
    }
}
