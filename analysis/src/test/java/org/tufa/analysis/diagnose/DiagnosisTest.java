package org.tufa.analysis.diagnose;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The diagnosis on an invented fleet where the answer is known by construction: every unit has its own normal level
 * (so raw values would not carry from unit to unit), cause "a" raises feature f1 by 3 above the unit's normal, cause
 * "b" lowers f2 by 3. Leaving each unit out, its confirmed periods are named right; a cause confirmed on one unit
 * only cannot be learnt without it, and the check says so rather than hide it.
 */
class DiagnosisTest {

    static final Instant T0 = Instant.parse("2031-07-01T00:00:00Z");

    /** 300 hourly samples: normal, then 50 of the unit's fault (if any) from hour 100. */
    static Samples.Part unit(String name, double level, String cause, Random r) {
        int n = 300;
        Instant[] t = new Instant[n];
        double[][] v = new double[n][3];
        String[] label = new String[n];
        String[] causes = new String[n];
        String[] source = new String[n];
        double[] confidence = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = T0.plusSeconds(3600L * i);
            boolean fault = cause != null && i >= 100 && i < 150;
            v[i][0] = level + r.nextGaussian() * 0.3 + (fault && cause.equals("a") ? 3 : 0);
            v[i][1] = 2 * level + r.nextGaussian() * 0.3 - (fault && cause.equals("b") ? 3 : 0);
            v[i][2] = r.nextGaussian();
            label[i] = fault ? "fault" : "normal";
            causes[i] = fault ? cause : "";
            source[i] = fault ? "review" : "detection";
            confidence[i] = 1;
        }
        return new Samples.Part(name, "cooling", List.of("f1", "f2", "f3"), t, v, label, causes, source, confidence);
    }

    static LabelledData.Reviewed confirmed(String unit, String cause) {
        return new LabelledData.Reviewed(1, unit, "cooling", "fault_cluster", T0.plusSeconds(3600L * 100),
                T0.plusSeconds(3600L * 150), unit + "-id", "confirmed", cause);
    }

    @Test
    void eachUnitsFaultIsNamedByForestsThatNeverSawIt() {
        Random r = new Random(7);
        List<Samples.Part> parts = new ArrayList<>();
        List<LabelledData.Reviewed> verdicts = new ArrayList<>();
        String[] causes = {"a", "b", "a", "b", "a", "b", null, "c"};
        for (int u = 0; u < causes.length; u++) {
            parts.add(unit("u" + u, 10 * u, causes[u], r));
            if (causes[u] != null) {
                verdicts.add(confirmed("u" + u, causes[u]));
            }
        }
        List<Diagnosis.HeldOut> held = Diagnosis.leaveOneUnitOut(parts, verdicts, Diagnosis.Settings.DEFAULT);
        assertEquals(7, held.size());
        for (Diagnosis.HeldOut h : held) {
            if (h.verdict().cause().equals("c")) {
                assertEquals(false, h.correct(), "c is confirmed on u7 only: no other unit teaches it");
            } else {
                assertTrue(h.correct(), h.verdict().unit() + ": " + h.diagnosed());
                assertTrue(h.diagnosed().probability() > 0.8, h.diagnosed().toString());
            }
        }
        Diagnosis.Model all = Diagnosis.train(parts, verdicts, Diagnosis.Settings.DEFAULT);
        assertEquals(List.of("normal", "a", "b", "c"), all.classes());
        Diagnosis.Diagnosed quiet = Diagnosis.diagnose(all, List.of(parts.get(6)), "cooling", "fault_cluster", T0,
                T0.plusSeconds(3600L * 50));
        assertTrue(quiet.normalShare() > 0.8, "a healthy period looks normal: " + quiet);
    }

    @Test
    void aFindingWithoutReadableSamplesIsDiagnosedByItsKindAndSaysSo() {
        Random r = new Random(11);
        List<Samples.Part> parts = List.of(unit("u0", 0, "a", r), unit("u1", 5, "b", r), unit("u2", 9, null, r));
        List<LabelledData.Reviewed> verdicts = new ArrayList<>(List.of(confirmed("u0", "a"), confirmed("u1", "b")));
        for (String u : List.of("u0", "u1")) {
            verdicts.add(new LabelledData.Reviewed(2, u, "any", "mode_hunting", T0.plusSeconds(3600L * 400),
                    T0.plusSeconds(3600L * 420), u + "-hunt", "confirmed", "oscillation"));
        }
        Diagnosis.Model m = Diagnosis.train(parts, verdicts, Diagnosis.Settings.DEFAULT);
        // Hours 400-420 lie after every sample: nothing for the forest to read.
        Diagnosis.Diagnosed d = Diagnosis.diagnose(m, List.of(parts.get(2)), "any", "mode_hunting",
                T0.plusSeconds(3600L * 400), T0.plusSeconds(3600L * 420));
        assertEquals("oscillation", d.cause());
        assertEquals(0, d.samples());
        // Add-one smoothing over the causes a, b, oscillation: (2 + 1) / (2 + 3).
        assertEquals(0.6, d.probability(), 1e-12);
        assertTrue(d.why().contains("kind only"), d.why());
        Diagnosis.Diagnosed unknown = Diagnosis.diagnose(m, List.of(parts.get(2)), "any", "never_seen",
                T0.plusSeconds(3600L * 400), T0.plusSeconds(3600L * 420));
        assertEquals("", unknown.cause(), "no samples and an unknown kind: no cause, and why");
        assertTrue(unknown.why().contains("no confirmed finding of kind never_seen"), unknown.why());
    }
}
