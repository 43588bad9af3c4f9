package org.tufa.vocabulary;

import java.util.Map;
import java.util.Optional;

/** IRIs of the vocabularies tufa reads and writes. */
public final class Namespaces {
    /** The open Brick schema. */
    public static final String BRICK = "https://brickschema.org/schema/Brick#";
    /** Brick tags. */
    public static final String TAG = "https://brickschema.org/schema/BrickTag#";
    /** Brick external references (time-series ids). */
    public static final String REF = "https://brickschema.org/schema/Brick/ref#";
    /** QUDT units. */
    public static final String UNIT = "http://qudt.org/vocab/unit/";
    /** The QUDT schema (qudt:applicableUnit). */
    public static final String QUDT = "http://qudt.org/schema/qudt/";
    /** RealEstateCore: Brick 1.4 names its classes as replacements of Brick's location classes. */
    public static final String REC = "https://w3id.org/rec#";
    /** SKOS (skos:definition). */
    public static final String SKOS = "http://www.w3.org/2004/02/skos/core#";
    /** tufa's own terms (roles, requirement profiles, nominal airflow): ontology-extensions/. */
    public static final String TUFA = "https://tufa.example.org/ns#";

    /** Classpath location of the Brick vocabulary tufa ships (a compact index, see {@link VocabularyIndex}). */
    public static final String BRICK_INDEX_RESOURCE = "org/tufa/ontology/brick.index";
    /** Classpath location of tufa's own terms. */
    public static final String TUFA_TERMS_RESOURCE = "org/tufa/ontology/tufa.ttl";

    /** Prefixes a class name may carry in a rule file ("rec:Level"). */
    private static final Map<String, String> PREFIXES = Map.of("brick", BRICK, "rec", REC);

    private Namespaces() {
    }

    /** The namespace of a prefix tufa knows ("brick", "rec"). */
    public static Optional<String> expand(String prefix) {
        return Optional.ofNullable(PREFIXES.get(prefix));
    }

    /** "rec:Level" for https://w3id.org/rec#Level; a compact name stays as it is; empty for other namespaces. */
    public static Optional<String> compact(String iriOrName) {
        for (Map.Entry<String, String> e : PREFIXES.entrySet()) {
            if (iriOrName.startsWith(e.getValue())) {
                return Optional.of(e.getKey() + ":" + iriOrName.substring(e.getValue().length()));
            }
            if (iriOrName.startsWith(e.getKey() + ":")) {
                return Optional.of(iriOrName);
            }
        }
        return Optional.empty();
    }
}
