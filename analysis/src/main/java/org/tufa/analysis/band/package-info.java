/** Quantiles, the load band of a mode, and sustained out-of-band runs. */
package org.tufa.analysis.band;
