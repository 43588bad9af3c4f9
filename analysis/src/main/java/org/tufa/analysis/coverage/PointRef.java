package org.tufa.analysis.coverage;

/**
 * A point found for a role, with what the trend stage needs to fetch its data.
 *
 * @param iri the point's IRI
 * @param label its rdfs:label, or null
 * @param timeseriesId {@code ref:hasExternalReference/ref:hasTimeseriesId}, else the label, else null
 * @param unitOfMeasureIri its brick:hasUnit (a QUDT unit IRI), or null
 * @param brickClass the asserted class through which it qualified (the smallest IRI when several did)
 * @param database the {@code ref:storedAt} of that time-series reference (a {@code ref:Database} IRI), or null when
 *     the model does not say where the series is stored
 */
public record PointRef(String iri, String label, String timeseriesId, String unitOfMeasureIri, String brickClass,
                       String database) implements java.io.Serializable {

    /** A point whose model does not say where its series is stored. */
    public PointRef(String iri, String label, String timeseriesId, String unitOfMeasureIri, String brickClass) {
        this(iri, label, timeseriesId, unitOfMeasureIri, brickClass, null);
    }
}
