package org.tufa.analysis.features;

import java.util.List;

/**
 * The samples of one unit in one operating mode, as rows of features in engineering units.
 *
 * @param names       feature names (column headers of features.csv)
 * @param units       engineering unit of each feature, as printed in findings (e.g. "K", "%", "degC")
 * @param health      per feature: true for the health features that are clustered, whose shift means the unit
 *                    behaves differently at the same operating point (a residual, an offset, an activity);
 *                    false for role values that describe the operating point (load level, weather)
 * @param rows        n x p values, no NaN
 * @param sampleIndex grid index of each row
 */
public record FeatureMatrix(List<String> names, List<String> units, boolean[] health, double[][] rows,
                            int[] sampleIndex) {

    public FeatureMatrix {
        names = List.copyOf(names);
        units = List.copyOf(units);
        if (names.size() != units.size() || names.size() != health.length) {
            throw new IllegalArgumentException("names, units and health flags differ in length");
        }
        if (rows.length != sampleIndex.length) {
            throw new IllegalArgumentException("rows and sample indices differ in length");
        }
    }

    public int size() {
        return rows.length;
    }

    public int width() {
        return names.size();
    }

    /** Column {@code j} as an array. */
    public double[] column(int j) {
        double[] c = new double[rows.length];
        for (int i = 0; i < rows.length; i++) {
            c[i] = rows[i][j];
        }
        return c;
    }

    /** The health columns of every row: what is standardised, reduced by PCA and clustered. */
    public double[][] healthRows() {
        int[] cols = java.util.stream.IntStream.range(0, health.length).filter(j -> health[j]).toArray();
        double[][] out = new double[rows.length][cols.length];
        for (int i = 0; i < rows.length; i++) {
            for (int k = 0; k < cols.length; k++) {
                out[i][k] = rows[i][cols[k]];
            }
        }
        return out;
    }

    /** Names of the health columns, in order. */
    public List<String> healthNames() {
        return java.util.stream.IntStream.range(0, health.length).filter(j -> health[j]).mapToObj(names::get).toList();
    }

    /** The rows whose grid sample is flagged in {@code gridMask}, in order. */
    public FeatureMatrix onlySamples(boolean[] gridMask) {
        int m = 0;
        for (int i : sampleIndex) {
            m += gridMask[i] ? 1 : 0;
        }
        double[][] kept = new double[m][];
        int[] index = new int[m];
        int k = 0;
        for (int r = 0; r < rows.length; r++) {
            if (gridMask[sampleIndex[r]]) {
                kept[k] = rows[r];
                index[k++] = sampleIndex[r];
            }
        }
        return new FeatureMatrix(names, units, health, kept, index);
    }

    /**
     * This matrix's rows and {@code other}'s (same columns) in one, ordered by grid sample; {@code fromOther[r]}
     * of the result says where row r came from.
     */
    public Merged mergedWith(FeatureMatrix other) {
        if (!other.names.equals(names)) {
            throw new IllegalArgumentException("different columns: " + names + " and " + other.names);
        }
        int n = rows.length + other.rows.length;
        double[][] merged = new double[n][];
        int[] index = new int[n];
        boolean[] fromOther = new boolean[n];
        int a = 0;
        int b = 0;
        for (int r = 0; r < n; r++) {
            boolean takeOther = a == rows.length
                    || (b < other.rows.length && other.sampleIndex[b] < sampleIndex[a]);
            merged[r] = takeOther ? other.rows[b] : rows[a];
            index[r] = takeOther ? other.sampleIndex[b++] : sampleIndex[a++];
            fromOther[r] = takeOther;
        }
        return new Merged(new FeatureMatrix(names, units, health, merged, index), fromOther);
    }

    /** Two matrices' rows in one, and which came from the second. */
    public record Merged(FeatureMatrix matrix, boolean[] fromOther) {
    }

    /** Index of a feature by name, or -1. */
    public int indexOf(String name) {
        return names.indexOf(name);
    }
}
