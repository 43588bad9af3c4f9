package org.tufa.analysis.findings;

/** How far a cluster sits from normal on one feature: median(cluster) - median(normal), in engineering units. */
public record Shift(String feature, String unit, double value) implements java.io.Serializable {

    /** Compact text for reports, e.g. {@code coil_residual -2.4 K}. */
    public String describe() {
        String u = unit.equals("degC") ? "K" : unit; // a difference of temperatures is in kelvin
        return feature + " " + (value >= 0 ? "+" : "") + String.format(java.util.Locale.ROOT, "%.1f", value) + " " + u;
    }
}
