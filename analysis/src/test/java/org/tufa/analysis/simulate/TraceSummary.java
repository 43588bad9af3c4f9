package org.tufa.analysis.simulate;

import java.util.Locale;

/** Test helper: mode shares and in-band share of a unit, inside or outside its fault episode. */
record TraceSummary(String unit, String fault, double offShare, double coolingShare, double heatingShare,
        double ventilationShare, double simultaneousShare, double occupiedInBandShare, double minDischargeMinusChw) {

    /** Mode of one sample (field notes section 4 definitions, h = 5 %). */
    static String mode(UnitTrace u, int s) {
        if (u.fanStatus()[s] < 0.5) {
            return "off";
        }
        boolean c = u.coolingCommandPct()[s] > 5;
        boolean h = u.heatingCommandPct()[s] > 5;
        return c && h ? "simultaneous" : c ? "cooling" : h ? "heating" : "ventilation";
    }

    static TraceSummary of(UnitTrace u, SimulationResult r) {
        int n = r.timestamps().size();
        double off = 0, clg = 0, htg = 0, ven = 0, sim = 0, occ = 0, inBand = 0;
        double minGap = Double.POSITIVE_INFINITY;
        for (int s = 0; s < n; s++) {
            switch (mode(u, s)) {
                case "off" -> off++;
                case "cooling" -> clg++;
                case "heating" -> htg++;
                case "ventilation" -> ven++;
                default -> sim++;
            }
            if (u.occupancy()[s] > 0.5) {
                occ++;
                double shift = u.parameters().setpointShiftK();
                double z = u.dischargeTrueC().length > 0 ? u.zoneC()[s] : 0;
                if (z >= 21 + shift - 1 && z <= 24 + shift + 1) {
                    inBand++;
                }
            }
            if (u.airflowLps()[s] > 0) {
                minGap = Math.min(minGap, u.dischargeTrueC()[s] - r.chilledWaterSupplyC()[s]);
            }
        }
        return new TraceSummary(u.unitIri(), u.fault().map(f -> f.fault().id()).orElse("-"), off / n, clg / n,
                htg / n, ven / n, sim / n, inBand / occ, minGap);
    }

    String line() {
        return String.format(Locale.ROOT,
                "%-32s %-22s off %.2f clg %.2f htg %.2f ven %.2f sim %.3f inBand %.3f minDAT-CHW %.2f",
                unit.substring(unit.indexOf('#') + 1), fault, offShare, coolingShare, heatingShare, ventilationShare,
                simultaneousShare, occupiedInBandShare, minDischargeMinusChw);
    }
}
