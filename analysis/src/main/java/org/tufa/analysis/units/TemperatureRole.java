package org.tufa.analysis.units;

/** What a temperature measures; decides which plausibility check applies. */
public enum TemperatureRole {
    /** Zone (room) air: occupied zones sit near 16-28 C, i.e. 64-80 F (notes section 9, common practice). */
    ZONE_AIR,
    /** Any other temperature (discharge air, water, outdoor): no range check, their ranges overlap too much. */
    OTHER
}
