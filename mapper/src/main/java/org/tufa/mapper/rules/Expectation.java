package org.tufa.mapper.rules;

import java.util.Optional;
import org.tufa.mapper.points.PointRecord;

/**
 * An inline test in a rule file: this sample point must map to this class (and equipment, part).
 *
 * @param label "file:line"
 * @param sample the point to map (name plus optional description, units, type, device)
 * @param expectedClass the Brick class (an owl:equivalentClass partner also passes)
 * @param expectedEquipment the equipment id, when given
 * @param expectedPart the part id (without the equipment prefix), when given
 */
public record Expectation(String label, PointRecord sample, String expectedClass, Optional<String> expectedEquipment,
        Optional<String> expectedPart) {
}
