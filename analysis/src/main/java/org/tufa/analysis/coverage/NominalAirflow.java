package org.tufa.analysis.coverage;

/**
 * A unit's design air volume flow ({@code tufa:nominalAirflow [ brick:value V ; brick:hasUnit U ]}).
 *
 * @param value the value as written in the model
 * @param unitIri the QUDT unit as written
 * @param cubicMetresPerSecond the value converted to m3/s
 */
public record NominalAirflow(double value, String unitIri, double cubicMetresPerSecond) {
}
