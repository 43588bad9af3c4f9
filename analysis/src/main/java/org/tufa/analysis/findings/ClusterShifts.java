package org.tufa.analysis.findings;

import java.util.ArrayList;
import java.util.List;
import org.tufa.analysis.features.FeatureMatrix;

/** Per-feature shift of one cluster from the normal cluster, on medians (robust to stray border points). */
public final class ClusterShifts {

    private ClusterShifts() {
    }

    public static List<Shift> of(FeatureMatrix features, int[] labels, int normal, int cluster) {
        List<Shift> out = new ArrayList<>(features.width());
        for (int j = 0; j < features.width(); j++) {
            double d = median(features.rows(), labels, cluster, j) - median(features.rows(), labels, normal, j);
            out.add(new Shift(features.names().get(j), features.units().get(j), d));
        }
        return out;
    }

    /** Per-feature shift of the rows in {@code group} from the rows in {@code normal}, on medians. */
    public static List<Shift> of(FeatureMatrix features, boolean[] group, boolean[] normal) {
        List<Shift> out = new ArrayList<>(features.width());
        for (int j = 0; j < features.width(); j++) {
            double d = median(features.rows(), group, j) - median(features.rows(), normal, j);
            out.add(new Shift(features.names().get(j), features.units().get(j), d));
        }
        return out;
    }

    /** Median of one column over the masked rows, NaN when none. */
    public static double median(double[][] rows, boolean[] mask, int column) {
        double[] v = new double[rows.length];
        int n = 0;
        for (int i = 0; i < rows.length; i++) {
            if (mask[i]) {
                v[n++] = rows[i][column];
            }
        }
        return median(v, n);
    }

    private static double median(double[] v, int n) {
        return org.tufa.analysis.band.Quantiles.medianInPlace(v, n);
    }

    static double median(double[][] rows, int[] labels, int label, int column) {
        double[] v = new double[rows.length];
        int n = 0;
        for (int i = 0; i < rows.length; i++) {
            if (labels[i] == label) {
                v[n++] = rows[i][column];
            }
        }
        return median(v, n);
    }
}
