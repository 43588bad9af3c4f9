package org.tufa.mapper.model;

import java.util.List;
import org.apache.jena.rdf.model.Model;

/** A Brick model of a building and the warnings met while building it (e.g. one id given two classes). */
public record BuiltModel(Model model, List<String> warnings) {
    public BuiltModel {
        warnings = List.copyOf(warnings);
    }
}
