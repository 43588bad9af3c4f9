package org.tufa.analysis.simulate;

import java.nio.charset.StandardCharsets;

/**
 * A small seeded generator whose output is fixed by its algorithm, so simulated data are identical on every JDK:
 * SplitMix64 (Steele, Lea, Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014). Gaussian
 * deviates by the Box-Muller transform (Box and Muller, Ann. Math. Stat. 29(2), 1958). One instance per unit or
 * per process; never shared between threads.
 */
public final class SeededRandom {
    private long state;
    private double spareGaussian = Double.NaN;

    public SeededRandom(long seed) {
        this.state = seed;
    }

    /** A generator for one named stream (a unit IRI, "weather", ...) under a run seed. */
    public static SeededRandom forStream(long seed, String stream) {
        return new SeededRandom(mix(seed ^ mix(fnv1a(stream))));
    }

    /** 64-bit FNV-1a hash of the UTF-8 bytes (Fowler, Noll, Vo); stable, unlike String.hashCode's 32 bits. */
    static long fnv1a(String s) {
        long h = 0xcbf29ce484222325L;
        for (byte b : s.getBytes(StandardCharsets.UTF_8)) {
            h ^= b & 0xff;
            h *= 0x100000001b3L;
        }
        return h;
    }

    private static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    public long nextLong() {
        state += 0x9e3779b97f4a7c15L;
        return mix(state);
    }

    /** Uniform in [0, 1). */
    public double nextDouble() {
        return (nextLong() >>> 11) * 0x1.0p-53;
    }

    /** Uniform in [lo, hi). */
    public double uniform(double lo, double hi) {
        return lo + (hi - lo) * nextDouble();
    }

    /** Uniform integer in [0, bound). */
    public int nextInt(int bound) {
        return (int) Math.floorMod(nextLong(), (long) bound);
    }

    /** Standard normal deviate. */
    public double gaussian() {
        if (!Double.isNaN(spareGaussian)) {
            double g = spareGaussian;
            spareGaussian = Double.NaN;
            return g;
        }
        double u1 = 1.0 - nextDouble(); // in (0, 1], so log is finite
        double u2 = nextDouble();
        double r = Math.sqrt(-2.0 * Math.log(u1));
        spareGaussian = r * Math.sin(2 * Math.PI * u2);
        return r * Math.cos(2 * Math.PI * u2);
    }
}
