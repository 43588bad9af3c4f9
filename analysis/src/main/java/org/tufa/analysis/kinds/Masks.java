package org.tufa.analysis.kinds;

/** Per-sample masks (one boolean per grid sample), as the kinds and the per-unit detection combine them. */
public final class Masks {

    private Masks() {
    }

    /** The indices where the mask is true, ascending. */
    public static int[] indices(boolean[] mask) {
        int count = 0;
        for (boolean b : mask) {
            count += b ? 1 : 0;
        }
        int[] idx = new int[count];
        int k = 0;
        for (int i = 0; i < mask.length; i++) {
            if (mask[i]) {
                idx[k++] = i;
            }
        }
        return idx;
    }

    /** Samples true in both masks. */
    public static boolean[] and(boolean[] a, boolean[] b) {
        if (a.length != b.length) {
            throw new IllegalArgumentException("masks differ in length: " + a.length + " vs " + b.length);
        }
        boolean[] out = new boolean[a.length];
        for (int i = 0; i < a.length; i++) {
            out[i] = a[i] && b[i];
        }
        return out;
    }
}
