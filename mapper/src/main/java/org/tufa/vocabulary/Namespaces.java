package org.tufa.vocabulary;

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
    /** tufa's own terms (roles, requirement profiles, nominal airflow): ontology-extensions/. */
    public static final String TUFA = "https://tufa.example.org/ns#";

    /** Classpath location of the Brick subset tufa ships. */
    public static final String BRICK_SUBSET_RESOURCE = "org/tufa/ontology/brick-subset.ttl";
    /** Classpath location of tufa's own terms. */
    public static final String TUFA_TERMS_RESOURCE = "org/tufa/ontology/tufa.ttl";

    private Namespaces() {
    }
}
