package org.tufa.analysis.cluster;

import java.util.SplittableRandom;

/**
 * Seeded test data in the shapes the pipeline clusters (PCA scores of smoothed health features): written for these
 * tests, no outside source; the outside reference is the pass they are fed to (ReferenceOptics, scikit-learn).
 */
final class Shapes {

    private Shapes() {
    }

    /**
     * @param shape blobs (dense normal blobs, 5 % uniform noise), trajectory (a slow random walk that holds still
     *     a third of the time), rounded (the trajectory rounded to a coarse step: long runs of duplicates), lattice
     *     (integer grid points, many duplicates and exact distance ties), line (evenly spaced on one axis), clumps
     *     (a few tight clumps of near-duplicates around exact duplicates)
     */
    static double[][] of(String shape, int n, int dim, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        double[][] x = new double[n][dim];
        switch (shape) {
            case "blobs" -> {
                for (double[] row : x) {
                    double u = random.nextDouble();
                    double centre = u < 0.6 ? 0 : u < 0.8 ? 4 : u < 0.95 ? -3 : Double.NaN;
                    for (int d = 0; d < dim; d++) {
                        row[d] = Double.isNaN(centre) ? random.nextDouble(-8, 8) : centre + gaussian(random);
                    }
                }
            }
            case "trajectory", "rounded" -> {
                double[] position = new double[dim];
                double[] velocity = new double[dim];
                for (double[] row : x) {
                    boolean hold = random.nextDouble() < 0.3;
                    for (int d = 0; d < dim; d++) {
                        if (!hold) {
                            velocity[d] = 0.9 * velocity[d] + 0.1 * gaussian(random);
                            position[d] = 0.995 * position[d] + 0.1 * velocity[d];
                        }
                        row[d] = shape.equals("rounded") ? Math.round(position[d] * 4) / 4.0 : position[d];
                    }
                }
            }
            case "lattice" -> {
                int side = Math.max(2, (int) Math.round(Math.pow(n / 3.0, 1.0 / dim)));
                for (double[] row : x) {
                    for (int d = 0; d < dim; d++) {
                        row[d] = random.nextInt(side) * 0.5;
                    }
                }
            }
            case "line" -> {
                for (int i = 0; i < n; i++) {
                    x[i][0] = i * 0.25;
                }
            }
            case "clumps" -> {
                double[][] centres = new double[4][dim];
                for (double[] c : centres) {
                    for (int d = 0; d < dim; d++) {
                        c[d] = random.nextDouble(-5, 5);
                    }
                }
                for (double[] row : x) {
                    double[] c = centres[random.nextInt(centres.length)];
                    boolean exact = random.nextDouble() < 0.5;
                    for (int d = 0; d < dim; d++) {
                        row[d] = exact ? c[d] : c[d] + 1e-9 * random.nextInt(-3, 4);
                    }
                }
            }
            default -> throw new IllegalArgumentException(shape);
        }
        return x;
    }

    private static double gaussian(SplittableRandom random) {
        double u1 = 1.0 - random.nextDouble();
        double u2 = random.nextDouble();
        return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
    }
}
