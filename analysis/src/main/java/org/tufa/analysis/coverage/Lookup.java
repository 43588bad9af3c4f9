package org.tufa.analysis.coverage;

import java.util.List;

/**
 * One way of finding a role's point (a tufa:Lookup node of tufa.ttl).
 *
 * @param place where to look, relative to the unit
 * @param pointClasses qualifying point classes (their subclasses and owl:equivalentClass partners too)
 * @param excludedPointClasses classes (and subclasses) that do not qualify even when under a point class
 * @param anyTags when not empty, a point qualifies only with one of these tags (on the point or its class)
 * @param partClasses for {@link Place#ON_PART}: the classes of the parts to look on
 * @param preferredHostClasses for {@link Place#BUILDING_WIDE}: hosts whose points win over the others
 */
public record Lookup(Place place, List<String> pointClasses, List<String> excludedPointClasses, List<String> anyTags,
        List<String> partClasses, List<String> preferredHostClasses) {
    public Lookup {
        pointClasses = List.copyOf(pointClasses);
        excludedPointClasses = List.copyOf(excludedPointClasses);
        anyTags = List.copyOf(anyTags);
        partClasses = List.copyOf(partClasses);
        preferredHostClasses = List.copyOf(preferredHostClasses);
    }
}
