package org.tufa.analysis.diagnose;

import java.util.List;
import java.util.stream.LongStream;
import smile.base.cart.SplitRule;
import smile.classification.RandomForest;
import smile.data.DataFrame;
import smile.data.formula.Formula;
import smile.data.vector.IntVector;

/**
 * A random forest (Breiman 2001) of classification trees on samples x features, as Smile fits it, with the class
 * probabilities of new samples. Deterministic: every tree gets its own seed from {@code seed}, so the same samples
 * give the same forest whatever the number of threads Smile grows the trees on.
 *
 * @param classes  the class names, index = the forest's class label
 * @param features the feature names, in column order
 */
public record CauseForest(RandomForest forest, List<String> classes, List<String> features) {

    /** The response column's name inside the data frames (not a feature name tufa writes). */
    private static final String RESPONSE = "__class";

    /**
     * Forest settings: Smile's defaults for classification except a minimum leaf size of 5 (fewer, noisier leaves
     * on neighbouring samples of one day, which are not independent; common practice, no source).
     *
     * @param trees    number of trees
     * @param nodeSize fewest samples in a leaf
     * @param seed     seed of the first tree (tree t gets seed + t)
     */
    public record Options(int trees, int nodeSize, long seed) {
        public static final Options DEFAULT = new Options(100, 5, 2031);

        public Options {
            if (trees < 1 || nodeSize < 1) {
                throw new IllegalArgumentException("trees and node size must be >= 1, got " + trees + ", "
                        + nodeSize);
            }
        }
    }

    public CauseForest {
        classes = List.copyOf(classes);
        features = List.copyOf(features);
    }

    /**
     * @param x        samples x features (no NaN: the caller leaves such samples out)
     * @param y        each sample's class, 0 .. classes.size()-1; every class must occur
     * @param classes  class names
     * @param features feature names
     */
    public static CauseForest fit(double[][] x, int[] y, List<String> classes, List<String> features,
                                  Options options) {
        if (x.length != y.length || x.length < 2) {
            throw new IllegalArgumentException("need at least 2 samples with one class each, got " + x.length + " and "
                    + y.length);
        }
        boolean[] seen = new boolean[classes.size()];
        for (int c : y) {
            seen[c] = true;
        }
        for (int c = 0; c < seen.length; c++) {
            if (!seen[c]) {
                throw new IllegalArgumentException("class " + classes.get(c) + " has no sample");
            }
        }
        if (classes.size() < 2) {
            return new CauseForest(null, classes, features);
        }
        DataFrame frame = frame(x, y, features);
        int p = features.size();
        int mtry = Math.max(1, (int) Math.floor(Math.sqrt(p)));
        RandomForest forest = RandomForest.fit(Formula.lhs(RESPONSE), frame, options.trees(), mtry, SplitRule.GINI,
                20, Math.max(2, x.length / options.nodeSize()), options.nodeSize(), 1.0, null,
                LongStream.range(options.seed(), options.seed() + options.trees()));
        return new CauseForest(forest, classes, features);
    }

    /** Class probabilities of each sample (samples x classes), the trees' averaged leaf shares. */
    public double[][] probabilities(double[][] x) {
        double[][] out = new double[x.length][classes.size()];
        if (x.length == 0) {
            return out;
        }
        if (forest == null) {
            for (double[] row : out) {
                row[0] = 1;
            }
            return out;
        }
        DataFrame frame = frame(x, new int[x.length], features);
        for (int i = 0; i < x.length; i++) {
            forest.predict(frame.get(i), out[i]);
        }
        return out;
    }

    private static DataFrame frame(double[][] x, int[] y, List<String> features) {
        return DataFrame.of(x, features.toArray(String[]::new)).merge(IntVector.of(RESPONSE, y));
    }
}
