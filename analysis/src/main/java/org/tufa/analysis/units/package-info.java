/** Units of measure: QUDT unit IRIs, temperature and temperature-difference conversion, plausibility notes. */
package org.tufa.analysis.units;
