package org.tufa.analysis.evaluate;

/** One row of {@code fleet.csv}, the columns evaluation needs. */
public record FleetUnit(String unit, String label, String folder, String status) {
    public boolean analyzed() {
        return status.equals("analyzed");
    }
}
