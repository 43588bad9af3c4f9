package org.tufa.analysis.coverage;

import org.apache.jena.shared.PrefixMapping;
import org.apache.jena.vocabulary.OWL;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;
import org.apache.jena.vocabulary.XSD;
import org.tufa.vocabulary.Namespaces;

/** The prefixes tufa declares for users: in queries, unit-class options and report output. */
public final class StandardPrefixes {
    /** The RealEstateCore namespace Brick 1.4 moved Building, Room and others to. */
    public static final String REC = "https://w3id.org/rec#";

    private StandardPrefixes() {
    }

    /** A fresh, unlocked mapping of brick, tag, ref, rdf, rdfs, owl, xsd, unit, rec and tufa. */
    public static PrefixMapping mapping() {
        PrefixMapping pm = PrefixMapping.Factory.create();
        pm.setNsPrefix("brick", Namespaces.BRICK);
        pm.setNsPrefix("tag", Namespaces.TAG);
        pm.setNsPrefix("ref", Namespaces.REF);
        pm.setNsPrefix("rdf", RDF.getURI());
        pm.setNsPrefix("rdfs", RDFS.getURI());
        pm.setNsPrefix("owl", OWL.getURI());
        pm.setNsPrefix("xsd", XSD.getURI());
        pm.setNsPrefix("unit", Namespaces.UNIT);
        pm.setNsPrefix("rec", REC);
        pm.setNsPrefix("tufa", Namespaces.TUFA);
        return pm;
    }
}
