/** Air-side sensible load estimate of a terminal unit. */
package org.tufa.analysis.load;
