package org.tufa.vocabulary;

/**
 * A deprecated Brick class: what replaces it and why, as the Brick file states it.
 *
 * @param replacementIri the full IRI of the replacement (brick:isReplacedBy), or empty when none is given; the
 *     replacement may live outside the Brick namespace (Brick 1.4 moves location classes to RealEstateCore)
 * @param version the Brick version that deprecated the class (brick:deprecatedInVersion), or empty
 * @param message the mitigation message (brick:deprecationMitigationMessage), or empty
 */
public record Deprecation(String replacementIri, String version, String message) {

    /** The replacement's local name when it is a Brick class, else its full IRI; empty when there is none. */
    public String replacementName() {
        return replacementIri.startsWith(Namespaces.BRICK)
                ? replacementIri.substring(Namespaces.BRICK.length()) : replacementIri;
    }

    /** One human sentence: "deprecated in Brick 1.3.0, use Target_Zone_Air_Temperature_Setpoint". */
    public String describe() {
        StringBuilder s = new StringBuilder("deprecated");
        if (!version.isEmpty()) {
            s.append(" in Brick ").append(version);
        }
        if (!replacementIri.isEmpty()) {
            s.append(", use ").append(replacementName());
        }
        if (!message.isEmpty()) {
            s.append(" (").append(message).append(')');
        }
        return s.toString();
    }
}
