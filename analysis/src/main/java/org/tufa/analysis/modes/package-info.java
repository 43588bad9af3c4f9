/** Operating modes of a terminal unit per sample (off, ventilation, cooling, heating, simultaneous, ...). */
package org.tufa.analysis.modes;
