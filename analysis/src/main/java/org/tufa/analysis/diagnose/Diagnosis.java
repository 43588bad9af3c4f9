package org.tufa.analysis.diagnose;

import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import org.tufa.analysis.labels.SampleLabels;

/**
 * The cause classifier of the labelled samples: one random forest per operating mode ({@link CauseForest}) on the
 * samples' shifts from their unit's normal, the diagnosed cause of a period of a unit, and the leave-one-unit-out
 * check (each reviewed unit's confirmed findings diagnosed by a forest that never saw that unit). Pure.
 *
 * <p>Training samples: a person's labels (source review), the detection's normal reference (source detection) and
 * spread labels at or above {@code minSpreadConfidence}. Each unit's mode gives at most {@code perClass} samples of
 * each class, evenly spaced in time, so that long normal periods and long faults do not drown short ones. A period is
 * diagnosed by averaging its samples' class probabilities: the diagnosed cause is the fault class with most of the
 * fault probability, weighted by how often each cause was confirmed for findings of the same kind (a naive-Bayes
 * style product of the two, common practice); its probability is its share of the weighted total. The normal share
 * says how normal the period's samples look.
 */
public final class Diagnosis {

    /**
     * @param forest              the forests' settings
     * @param perClass            most training samples per unit, mode and class
     * @param minSpreadConfidence spread labels below this confidence are not trained on
     */
    public record Settings(CauseForest.Options forest, int perClass, double minSpreadConfidence) {
        public static final Settings DEFAULT = new Settings(CauseForest.Options.DEFAULT, 300, 0.8);
    }

    /**
     * A forest per mode (absent: no training sample of that mode) and, per finding kind, the confirmed causes of
     * the training verdicts of that kind with their counts.
     */
    public record Model(Map<String, CauseForest> forests, Map<String, Map<String, Integer>> kinds) {
        public Model {
            forests = java.util.Collections.unmodifiableMap(new TreeMap<>(forests));
            Map<String, Map<String, Integer>> k = new TreeMap<>();
            kinds.forEach((kind, c) -> k.put(kind, java.util.Collections.unmodifiableMap(new TreeMap<>(c))));
            kinds = java.util.Collections.unmodifiableMap(k);
        }

        /** Every class any forest or verdict knows, normal first. */
        public List<String> classes() {
            TreeSet<String> causes = new TreeSet<>();
            forests.values().forEach(f -> causes.addAll(f.classes()));
            kinds.values().forEach(c -> causes.addAll(c.keySet()));
            causes.remove(SampleLabels.NORMAL);
            List<String> out = new ArrayList<>();
            out.add(SampleLabels.NORMAL);
            out.addAll(causes);
            return out;
        }
    }

    /**
     * A diagnosed period.
     *
     * @param cause       the diagnosed cause, empty when none (see {@code why})
     * @param probability its share of the period's fault probability (NaN when none)
     * @param normalShare the period's mean probability of normal operation
     * @param samples     the samples it rests on
     * @param why         why there is no cause (empty when there is one)
     */
    public record Diagnosed(String cause, double probability, double normalShare, int samples, String why) {
        static Diagnosed none(String why, int samples, double normalShare) {
            return new Diagnosed("", Double.NaN, normalShare, samples, why);
        }
    }

    /** A reviewed unit's confirmed finding, diagnosed by a forest trained without that unit. */
    public record HeldOut(LabelledData.Reviewed verdict, Diagnosed diagnosed, boolean correct) {
    }

    private Diagnosis() {
    }

    /** Forests per mode from the parts' labelled samples; cause counts per kind from the confirmed verdicts. */
    public static Model train(List<Samples.Part> parts, List<LabelledData.Reviewed> verdicts, Settings settings) {
        Map<String, Map<String, Integer>> kinds = new TreeMap<>();
        java.util.Set<String> ids = new java.util.HashSet<>();
        for (LabelledData.Reviewed v : verdicts) {
            if (v.verdict().equals("confirmed") && (v.findingId().isEmpty() || ids.add(v.findingId()))) {
                kinds.computeIfAbsent(v.kind(), k -> new TreeMap<>()).merge(cause(v), 1, Integer::sum);
            }
        }
        Map<String, List<Samples.Part>> byMode = new TreeMap<>();
        parts.forEach(p -> byMode.computeIfAbsent(p.mode(), k -> new ArrayList<>()).add(p));
        Map<String, CauseForest> forests = new LinkedHashMap<>();
        for (Map.Entry<String, List<Samples.Part>> e : byMode.entrySet()) {
            CauseForest f = trainMode(e.getValue(), settings);
            if (f != null) {
                forests.put(e.getKey(), f);
            }
        }
        return new Model(forests, kinds);
    }

    private static String cause(LabelledData.Reviewed v) {
        return v.cause().isEmpty() ? SampleLabels.NO_CAUSE : v.cause();
    }

    private static CauseForest trainMode(List<Samples.Part> parts, Settings settings) {
        LinkedHashSet<String> common = new LinkedHashSet<>(parts.get(0).features());
        parts.forEach(p -> common.retainAll(p.features()));
        List<String> features = List.copyOf(common);
        if (features.isEmpty()) {
            return null;
        }
        List<double[]> x = new ArrayList<>();
        List<String> y = new ArrayList<>();
        for (Samples.Part p : parts) {
            double[][] shifts = p.shifts(features);
            if (shifts == null) {
                continue;
            }
            Map<String, List<Integer>> byClass = new TreeMap<>();
            for (int i = 0; i < p.size(); i++) {
                String c = trainingClass(p, i, settings.minSpreadConfidence());
                if (c != null && finite(shifts[i])) {
                    byClass.computeIfAbsent(c, k -> new ArrayList<>()).add(i);
                }
            }
            for (Map.Entry<String, List<Integer>> c : byClass.entrySet()) {
                List<Integer> rows = c.getValue();
                int take = Math.min(settings.perClass(), rows.size());
                for (int k = 0; k < take; k++) {
                    x.add(shifts[rows.get((int) ((long) k * rows.size() / take))]);
                    y.add(c.getKey());
                }
            }
        }
        if (x.size() < 2) {
            return null;
        }
        TreeSet<String> causes = new TreeSet<>(y);
        causes.remove(SampleLabels.NORMAL);
        List<String> classes = new ArrayList<>();
        if (y.contains(SampleLabels.NORMAL)) {
            classes.add(SampleLabels.NORMAL);
        }
        classes.addAll(causes);
        int[] yi = y.stream().mapToInt(classes::indexOf).toArray();
        return CauseForest.fit(x.toArray(double[][]::new), yi, classes, features, settings.forest());
    }

    /** The class a sample trains as, or null when it does not train. */
    private static String trainingClass(Samples.Part p, int i, double minSpreadConfidence) {
        String source = p.source()[i];
        boolean trusted = source.equals(SampleLabels.REVIEW) || source.equals(SampleLabels.DETECTION)
                || source.equals(SampleLabels.SPREADING) && p.confidence()[i] >= minSpreadConfidence;
        if (!trusted) {
            return null;
        }
        return switch (p.label()[i]) {
            case SampleLabels.NORMAL -> SampleLabels.NORMAL;
            case SampleLabels.FAULT -> p.cause()[i];
            default -> null;
        };
    }

    private static boolean finite(double[] row) {
        for (double v : row) {
            if (!Double.isFinite(v)) {
                return false;
            }
        }
        return true;
    }

    /**
     * The diagnosed cause of a unit's period in a mode ("any": every mode of the unit).
     *
     * @param unitParts the unit's samples, one part per mode
     */
    public static Diagnosed diagnose(Model model, List<Samples.Part> unitParts, String mode, String kind,
                                     Instant start, Instant end) {
        Map<String, Double> mass = new TreeMap<>();
        int samples = 0;
        double normal = 0;
        boolean anyModel = false;
        for (Samples.Part p : unitParts) {
            if (!(mode.equals("any") || p.mode().equals(mode))) {
                continue;
            }
            CauseForest f = model.forests().get(p.mode());
            if (f == null) {
                continue;
            }
            anyModel = true;
            double[][] shifts = p.shifts(f.features());
            if (shifts == null) {
                continue;
            }
            List<double[]> rows = new ArrayList<>();
            for (int i = 0; i < p.size(); i++) {
                Instant t = p.times()[i];
                if (!t.isBefore(start) && t.isBefore(end) && finite(shifts[i])) {
                    rows.add(shifts[i]);
                }
            }
            double[][] prob = f.probabilities(rows.toArray(double[][]::new));
            for (double[] pr : prob) {
                for (int c = 0; c < pr.length; c++) {
                    if (f.classes().get(c).equals(SampleLabels.NORMAL)) {
                        normal += pr[c];
                    } else {
                        mass.merge(f.classes().get(c), pr[c], Double::sum);
                    }
                }
            }
            samples += rows.size();
        }
        // The forest's share of the fault probability per cause (uniform over the known causes without samples),
        // times the share of that cause among the confirmed findings of this kind (add-one smoothing, Laplace's
        // rule of succession): a mode-hunting finding is diagnosed mostly by its kind, a cluster by its samples.
        List<String> causes = new ArrayList<>(model.classes());
        causes.remove(SampleLabels.NORMAL);
        double total = mass.values().stream().mapToDouble(Double::doubleValue).sum();
        boolean fromSamples = samples > 0 && total > 0;
        Map<String, Integer> ofKind = model.kinds().getOrDefault(kind, Map.of());
        int kindTotal = ofKind.values().stream().mapToInt(Integer::intValue).sum();
        if (!fromSamples && kindTotal == 0) {
            String why = !anyModel ? "no classifier for mode " + mode + " (no labelled samples of it)"
                    : samples == 0 ? "no sample of the mode in the period with the classifier's features"
                    : "every sample looks like normal operation to the classifier";
            return Diagnosed.none(why + ", and no confirmed finding of kind " + kind + " to learn from", samples,
                    samples == 0 ? Double.NaN : normal / samples);
        }
        Map<String, Double> score = new TreeMap<>();
        double sum = 0;
        for (String c : causes) {
            double forest = fromSamples ? mass.getOrDefault(c, 0.0) / total : 1.0 / causes.size();
            double prior = (ofKind.getOrDefault(c, 0) + 1.0) / (kindTotal + causes.size());
            score.put(c, forest * prior);
            sum += forest * prior;
        }
        String best = null;
        for (Map.Entry<String, Double> e : score.entrySet()) {
            if (best == null || e.getValue() > score.get(best)) {
                best = e.getKey();
            }
        }
        if (best == null || !(sum > 0)) {
            return Diagnosed.none("no cause known to the classifier", samples, samples == 0 ? Double.NaN
                    : normal / samples);
        }
        return new Diagnosed(best, score.get(best) / sum, samples == 0 ? Double.NaN : normal / samples, samples,
                fromSamples ? "" : "from the finding's kind only (no sample the forest could read)");
    }

    /**
     * Each reviewed unit's confirmed findings (one per finding id) diagnosed by forests trained on the other
     * reviewed units only. Correct when the diagnosed cause is the confirmed one.
     */
    public static List<HeldOut> leaveOneUnitOut(List<Samples.Part> parts, List<LabelledData.Reviewed> verdicts,
                                                Settings settings) {
        Map<String, List<LabelledData.Reviewed>> confirmed = new TreeMap<>();
        java.util.Set<String> ids = new java.util.HashSet<>();
        for (LabelledData.Reviewed v : verdicts) {
            if (v.verdict().equals("confirmed") && (v.findingId().isEmpty() || ids.add(v.findingId()))) {
                confirmed.computeIfAbsent(v.unit(), k -> new ArrayList<>()).add(v);
            }
        }
        List<HeldOut> out = new ArrayList<>();
        for (Map.Entry<String, List<LabelledData.Reviewed>> e : confirmed.entrySet()) {
            String unit = e.getKey();
            List<Samples.Part> training = parts.stream().filter(p -> !p.unit().equals(unit)).toList();
            List<Samples.Part> own = parts.stream().filter(p -> p.unit().equals(unit)).toList();
            List<LabelledData.Reviewed> others = verdicts.stream().filter(v -> !v.unit().equals(unit)).toList();
            Model m = train(training, others, settings);
            for (LabelledData.Reviewed v : e.getValue()) {
                Diagnosed d = diagnose(m, own, v.mode(), v.kind(), v.start(), v.end());
                String truth = v.cause().isEmpty() ? SampleLabels.NO_CAUSE : v.cause();
                out.add(new HeldOut(v, d, d.cause().equals(truth)));
            }
        }
        return out;
    }
}
