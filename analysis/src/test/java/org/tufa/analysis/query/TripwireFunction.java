package org.tufa.analysis.query;

import org.apache.jena.sparql.expr.NodeValue;
import org.apache.jena.sparql.function.FunctionBase0;

/**
 * A SPARQL function a hostile query could name as {@code <java:org.tufa.analysis.query.TripwireFunction>}. Loading
 * the class sets a system property, so a test can tell whether any query made the JVM load it. No test refers to
 * this class directly (that would load it).
 */
public final class TripwireFunction extends FunctionBase0 {
    /** The system property set when this class is loaded. */
    static final String LOADED = "tufa.test.tripwire.loaded";

    static {
        System.setProperty(LOADED, "true");
    }

    @Override
    public NodeValue exec() {
        return NodeValue.makeString("tripped");
    }
}
