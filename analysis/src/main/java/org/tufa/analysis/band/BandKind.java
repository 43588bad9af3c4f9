package org.tufa.analysis.band;

import java.util.Locale;

/** Which samples count as "in band" for the load band of a mode. Names are the ones used in option values. */
public enum BandKind {
    /** Keep Q1..Q3: the most concentrated half of the operation. */
    IQR("iqr"),
    /** Keep Q1 - 1.5 IQR .. Q3 + 1.5 IQR: Tukey's fences (Tukey, Exploratory Data Analysis, 1977). */
    TUKEY("tukey"),
    /** Keep every finite sample. */
    NONE("none");

    private final String label;

    BandKind(String label) {
        this.label = label;
    }

    public String label() {
        return label;
    }

    /** The kind with this label (case-insensitive); IllegalArgumentException naming the choices otherwise. */
    public static BandKind fromLabel(String label) {
        for (BandKind kind : values()) {
            if (kind.label.equals(label.toLowerCase(Locale.ROOT))) {
                return kind;
            }
        }
        throw new IllegalArgumentException("unknown band '" + label + "'; choose iqr, tukey or none");
    }
}
