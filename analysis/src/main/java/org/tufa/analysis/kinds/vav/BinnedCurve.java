package org.tufa.analysis.kinds.vav;

import java.util.Arrays;

/**
 * A unit's own response curve y(x) as the median of y in bins of x: a damper's opening against the airflow it
 * passes, a reheat coil's discharge rise against its valve command. No shape is assumed (damper and valve
 * characteristics are neither linear nor known), and the median keeps a minority of faulty samples from bending
 * the curve (Tukey, Exploratory Data Analysis, 1977, resistant smoothing by medians of groups). Fitted by groups
 * (days), each bin's value is the median of its days' medians: a fault that holds a unit at some x for hours a
 * day during two weeks then weighs two weeks of days there, not all of its samples, against the normal days.
 *
 * @param lower     lower edge of bin 0
 * @param width     bin width
 * @param medians   per bin, the median of y; NaN for a bin with fewer than the minimum count
 */
public record BinnedCurve(double lower, double width, double[] medians) {

    public BinnedCurve {
        medians = medians.clone();
    }

    /**
     * The curve of the finite (x, y) pairs.
     *
     * @param minCount fewest pairs a bin needs for a median of its own
     */
    public static BinnedCurve fit(double[] x, double[] y, double lower, double upper, double width, int minCount) {
        return fit(x, y, null, lower, upper, width, minCount);
    }

    /**
     * The curve of the finite (x, y) pairs by groups: per bin, the median over the groups of each group's median.
     *
     * @param group    per pair its group (a day), non-decreasing; null for one group per pair
     * @param minCount fewest pairs a bin needs for a median of its own (counted over all groups)
     */
    public static BinnedCurve fit(double[] x, double[] y, int[] group, double lower, double upper, double width,
                                  int minCount) {
        if (group != null) {
            return byGroups(x, y, group, lower, upper, width, minCount);
        }
        if (x.length != y.length) {
            throw new IllegalArgumentException("x and y differ in length");
        }
        if (!(width > 0) || !(upper > lower)) {
            throw new IllegalArgumentException("bins need upper > lower and a positive width");
        }
        int bins = (int) Math.ceil((upper - lower) / width);
        double[][] values = new double[bins][];
        int[] count = new int[bins];
        for (int pass = 0; pass < 2; pass++) {
            Arrays.fill(count, 0);
            for (int i = 0; i < x.length; i++) {
                if (Double.isNaN(x[i]) || Double.isNaN(y[i])) {
                    continue;
                }
                int b = bin(x[i], lower, width, bins);
                if (pass == 1) {
                    values[b][count[b]] = y[i];
                }
                count[b]++;
            }
            if (pass == 0) {
                for (int b = 0; b < bins; b++) {
                    values[b] = new double[count[b]];
                }
            }
        }
        double[] medians = new double[bins];
        for (int b = 0; b < bins; b++) {
            if (count[b] < Math.max(1, minCount)) {
                medians[b] = Double.NaN;
                continue;
            }
            double[] v = values[b];
            Arrays.sort(v);
            int n = v.length;
            medians[b] = n % 2 == 1 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
        }
        return new BinnedCurve(lower, width, medians);
    }

    private static BinnedCurve byGroups(double[] x, double[] y, int[] group, double lower, double upper,
                                        double width, int minCount) {
        if (x.length != y.length || x.length != group.length) {
            throw new IllegalArgumentException("x, y and groups differ in length");
        }
        BinnedCurve counts = fit(x, y, lower, upper, width, minCount);
        int bins = counts.medians.length;
        java.util.List<java.util.List<Double>> dayMedians = new java.util.ArrayList<>();
        for (int b = 0; b < bins; b++) {
            dayMedians.add(new java.util.ArrayList<>());
        }
        int i = 0;
        while (i < x.length) {
            int j = i;
            while (j < x.length && group[j] == group[i]) {
                j++;
            }
            BinnedCurve day = fit(java.util.Arrays.copyOfRange(x, i, j), java.util.Arrays.copyOfRange(y, i, j),
                    lower, upper, width, 1);
            for (int b = 0; b < bins; b++) {
                if (!Double.isNaN(day.medians[b])) {
                    dayMedians.get(b).add(day.medians[b]);
                }
            }
            i = j;
        }
        double[] medians = new double[bins];
        for (int b = 0; b < bins; b++) {
            double[] v = dayMedians.get(b).stream().mapToDouble(Double::doubleValue).sorted().toArray();
            int n = v.length;
            medians[b] = Double.isNaN(counts.medians[b]) || n == 0 ? Double.NaN
                    : n % 2 == 1 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
        }
        return new BinnedCurve(lower, width, medians);
    }

    private static int bin(double x, double lower, double width, int bins) {
        return (int) Math.max(0, Math.min(bins - 1, Math.floor((x - lower) / width)));
    }

    /** The curve at x: its bin's median, else the nearest bin's that has one (NaN for an empty curve or NaN x). */
    public double at(double x) {
        if (Double.isNaN(x)) {
            return Double.NaN;
        }
        int b = bin(x, lower, width, medians.length);
        for (int d = 0; d < medians.length; d++) {
            if (b - d >= 0 && !Double.isNaN(medians[b - d])) {
                return medians[b - d];
            }
            if (b + d < medians.length && !Double.isNaN(medians[b + d])) {
                return medians[b + d];
            }
        }
        return Double.NaN;
    }

    @Override
    public double[] medians() {
        return medians.clone();
    }
}
