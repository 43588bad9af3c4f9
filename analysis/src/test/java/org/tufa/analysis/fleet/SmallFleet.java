package org.tufa.analysis.fleet;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.ModelFactory;
import org.apache.jena.rdf.model.Resource;
import org.apache.jena.riot.RDFDataMgr;
import org.apache.jena.riot.RDFFormat;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;
import org.tufa.vocabulary.Namespaces;

/**
 * A small invented fleet for end-to-end tests ("Fernlea Depot", fictional): n four-pipe fan coil units with
 * zone, discharge, both valve commands and fan status, fed by a chilled- and a hot-water loop with supply
 * temperatures, and an outdoor air sensor. Written in plain Brick, as another tool might write it.
 */
final class SmallFleet {

    static final String BASE = "urn:example:fernlea#";

    private SmallFleet() {
    }

    static Model model(int units, boolean fahrenheitOnOddUnits) {
        Model m = ModelFactory.createDefaultModel();
        m.setNsPrefix("brick", Namespaces.BRICK);
        m.setNsPrefix("ref", Namespaces.REF);
        m.setNsPrefix("unit", Namespaces.UNIT);
        Resource building = m.createResource(BASE + "building").addProperty(RDF.type, brick(m, "Building"));
        Resource chw = m.createResource(BASE + "CHW").addProperty(RDF.type, brick(m, "Chilled_Water_Loop"));
        Resource hw = m.createResource(BASE + "HW").addProperty(RDF.type, brick(m, "Hot_Water_Loop"));
        point(m, chw, "CHW-ST", "Leaving_Chilled_Water_Temperature_Sensor", "DEG_C");
        point(m, hw, "HW-ST", "Leaving_Hot_Water_Temperature_Sensor", "DEG_C");
        Resource weather = m.createResource(BASE + "weather").addProperty(RDF.type, brick(m, "Building"));
        point(m, building, "OAT", "Outside_Air_Temperature_Sensor", "DEG_C");
        weather.removeProperties();
        for (int u = 1; u <= units; u++) {
            String id = String.format("FCU-%02d", u);
            Resource fcu = m.createResource(BASE + id).addProperty(RDF.type, brick(m, "Fan_Coil_Unit"))
                    .addProperty(RDFS.label, id);
            fcu.addProperty(m.createProperty(Namespaces.BRICK, "isFedBy"), chw);
            fcu.addProperty(m.createProperty(Namespaces.BRICK, "isFedBy"), hw);
            String t = fahrenheitOnOddUnits && u % 2 == 1 ? "DEG_F" : "DEG_C";
            point(m, fcu, id + ".ZN-T", "Zone_Air_Temperature_Sensor", t);
            point(m, fcu, id + ".DA-T", "Discharge_Air_Temperature_Sensor", t);
            point(m, fcu, id + ".FAN-S", "Fan_Status", null);
            Resource cv = m.createResource(BASE + id + "-CHWV").addProperty(RDF.type, brick(m, "Chilled_Water_Valve"));
            Resource hv = m.createResource(BASE + id + "-HWV").addProperty(RDF.type, brick(m, "Hot_Water_Valve"));
            fcu.addProperty(m.createProperty(Namespaces.BRICK, "hasPart"), cv);
            fcu.addProperty(m.createProperty(Namespaces.BRICK, "hasPart"), hv);
            point(m, cv, id + ".CLG-VLV", "Valve_Position_Command", "PERCENT");
            point(m, hv, id + ".HTG-VLV", "Valve_Position_Command", "PERCENT");
        }
        return m;
    }

    static Path write(Model m, Path dir) throws IOException {
        Path file = dir.resolve("model.ttl");
        try (OutputStream out = Files.newOutputStream(file)) {
            RDFDataMgr.write(out, m, RDFFormat.TURTLE_PRETTY);
        }
        return file;
    }

    static List<String> unitIris(int units) {
        return java.util.stream.IntStream.rangeClosed(1, units).mapToObj(u -> BASE + String.format("FCU-%02d", u))
                .toList();
    }

    private static Resource brick(Model m, String local) {
        return m.createResource(Namespaces.BRICK + local);
    }

    private static void point(Model m, Resource owner, String id, String cls, String unit) {
        Resource p = m.createResource(BASE + "point/" + id).addProperty(RDF.type, brick(m, cls))
                .addProperty(RDFS.label, id);
        owner.addProperty(m.createProperty(Namespaces.BRICK, "hasPoint"), p);
        p.addProperty(m.createProperty(Namespaces.BRICK, "isPointOf"), owner);
        if (unit != null) {
            p.addProperty(m.createProperty(Namespaces.BRICK, "hasUnit"), m.createResource(Namespaces.UNIT + unit));
        }
        Resource ref = m.createResource(BASE + "ref/" + id)
                .addProperty(RDF.type, m.createResource(Namespaces.REF + "TimeseriesReference"))
                .addProperty(m.createProperty(Namespaces.REF, "hasTimeseriesId"), id);
        p.addProperty(m.createProperty(Namespaces.REF, "hasExternalReference"), ref);
    }
}
