package org.tufa.analysis.diagnose;

import java.time.Instant;
import java.util.Arrays;
import java.util.List;
import org.tufa.analysis.labels.SampleLabels;

/** Labelled samples of one unit's mode, and their shift from the unit's normal operation. */
public final class Samples {

    private Samples() {
    }

    /**
     * @param values     samples x features, engineering units, in {@code features} order
     * @param label      normal, fault or unlabelled ({@link SampleLabels})
     * @param cause      the fault's cause (empty unless fault)
     * @param source     review, detection, spreading, not_sure or none
     * @param confidence the label's confidence (1, the spread share, or NaN)
     */
    public record Part(String unit, String mode, List<String> features, Instant[] times, double[][] values,
                       String[] label, String[] cause, String[] source, double[] confidence) {
        public Part {
            features = List.copyOf(features);
        }

        public int size() {
            return times.length;
        }

        /**
         * Each sample's shift from the unit's normal operation in the named features: its value minus the median
         * of the samples labelled normal (null when the part has no normal sample or lacks a feature). Comparing
         * units by their shift from their own normal, not by raw values, is what lets one unit's confirmed faults
         * teach about another's (the same idea as the clusters' shift from the normal reference).
         */
        public double[][] shifts(List<String> names) {
            int[] column = new int[names.size()];
            for (int k = 0; k < column.length; k++) {
                column[k] = features.indexOf(names.get(k));
                if (column[k] < 0) {
                    return null;
                }
            }
            double[] median = new double[column.length];
            for (int k = 0; k < column.length; k++) {
                double[] normal = new double[size()];
                int n = 0;
                for (int i = 0; i < size(); i++) {
                    double v = values[i][column[k]];
                    if (SampleLabels.NORMAL.equals(label[i]) && Double.isFinite(v)) {
                        normal[n++] = v;
                    }
                }
                if (n == 0) {
                    return null;
                }
                median[k] = median(Arrays.copyOf(normal, n));
            }
            double[][] out = new double[size()][column.length];
            for (int i = 0; i < size(); i++) {
                for (int k = 0; k < column.length; k++) {
                    out[i][k] = values[i][column[k]] - median[k];
                }
            }
            return out;
        }
    }

    static double median(double[] v) {
        Arrays.sort(v);
        int n = v.length;
        return n % 2 == 1 ? v[n / 2] : (v[n / 2 - 1] + v[n / 2]) / 2;
    }
}
