package org.tufa.analysis.fleet.bench;

import java.util.List;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.rdf.model.ModelFactory;
import org.apache.jena.rdf.model.Resource;
import org.apache.jena.vocabulary.RDF;
import org.apache.jena.vocabulary.RDFS;
import org.tufa.vocabulary.Namespaces;

/**
 * A plain Brick model of a fan coil fleet, written through Jena's API the way another tool might write one (not
 * by tufa's mapper): per unit zone and discharge air temperature sensors, fan status, optionally a zone setpoint,
 * and the valve commands of its chilled- and hot-water valves (parts of the unit); a chilled- and a hot-water loop
 * with their supply temperatures feeding every unit; the outdoor air sensor on the building. Every point has a
 * ref:hasTimeseriesId equal to its label. Used by the fleet benchmark and by end-to-end tests.
 */
public final class FanCoilFleetModel {

    /**
     * One unit.
     *
     * @param id              equipment id and label, e.g. FCU-03-07
     * @param seriesPrefix    prefix of the unit's point labels and series ids
     * @param temperatureUnit QUDT local name of its temperatures (DEG_C or DEG_F)
     * @param setpoint        whether it has a zone setpoint point
     */
    public record Unit(String id, String seriesPrefix, String temperatureUnit, boolean setpoint) {
    }

    private FanCoilFleetModel() {
    }

    /**
     * @param base        namespace of the building's IRIs
     * @param building    the building's name
     * @param plantPrefix prefix of the plant and weather point labels
     */
    public static Model build(String base, String building, String plantPrefix, List<Unit> units) {
        Model m = ModelFactory.createDefaultModel();
        m.setNsPrefix("brick", Namespaces.BRICK);
        m.setNsPrefix("ref", Namespaces.REF);
        m.setNsPrefix("unit", Namespaces.UNIT);
        m.setNsPrefix("rdfs", RDFS.getURI());
        Resource site = m.createResource(base + "building").addProperty(RDF.type, brick(m, "Building"))
                .addProperty(RDFS.label, building);
        Resource chw = m.createResource(base + "CHW").addProperty(RDF.type, brick(m, "Chilled_Water_Loop"));
        Resource hw = m.createResource(base + "HW").addProperty(RDF.type, brick(m, "Hot_Water_Loop"));
        point(m, base, chw, plantPrefix + "CHWS-T", "Leaving_Chilled_Water_Temperature_Sensor", "DEG_C");
        point(m, base, hw, plantPrefix + "HWS-T", "Leaving_Hot_Water_Temperature_Sensor", "DEG_C");
        point(m, base, site, plantPrefix + "OA-T", "Outside_Air_Temperature_Sensor", "DEG_C");
        for (Unit u : units) {
            Resource fcu = m.createResource(base + u.id()).addProperty(RDF.type, brick(m, "Fan_Coil_Unit"))
                    .addProperty(RDFS.label, u.id());
            fcu.addProperty(m.createProperty(Namespaces.BRICK, "isFedBy"), chw);
            fcu.addProperty(m.createProperty(Namespaces.BRICK, "isFedBy"), hw);
            String p = u.seriesPrefix();
            point(m, base, fcu, p + ".ZN-T", "Zone_Air_Temperature_Sensor", u.temperatureUnit());
            point(m, base, fcu, p + ".DA-T", "Discharge_Air_Temperature_Sensor", u.temperatureUnit());
            if (u.setpoint()) {
                point(m, base, fcu, p + ".ZN-SP", "Zone_Air_Temperature_Setpoint", u.temperatureUnit());
            }
            point(m, base, fcu, p + ".FAN-S", "Fan_Status", null);
            Resource cv = m.createResource(base + u.id() + "-CHWV").addProperty(RDF.type, brick(m, "Chilled_Water_Valve"));
            Resource hv = m.createResource(base + u.id() + "-HWV").addProperty(RDF.type, brick(m, "Hot_Water_Valve"));
            fcu.addProperty(m.createProperty(Namespaces.BRICK, "hasPart"), cv);
            fcu.addProperty(m.createProperty(Namespaces.BRICK, "hasPart"), hv);
            point(m, base, cv, p + ".CLG-VLV", "Valve_Position_Command", "PERCENT");
            point(m, base, hv, p + ".HTG-VLV", "Valve_Position_Command", "PERCENT");
        }
        return m;
    }

    private static Resource brick(Model m, String local) {
        return m.createResource(Namespaces.BRICK + local);
    }

    private static void point(Model m, String base, Resource owner, String id, String cls, String unit) {
        Resource p = m.createResource(base + "point/" + id).addProperty(RDF.type, brick(m, cls))
                .addProperty(RDFS.label, id);
        owner.addProperty(m.createProperty(Namespaces.BRICK, "hasPoint"), p);
        p.addProperty(m.createProperty(Namespaces.BRICK, "isPointOf"), owner);
        if (unit != null) {
            p.addProperty(m.createProperty(Namespaces.BRICK, "hasUnit"), m.createResource(Namespaces.UNIT + unit));
        }
        Resource ref = m.createResource(base + "ref/" + id)
                .addProperty(RDF.type, m.createResource(Namespaces.REF + "TimeseriesReference"))
                .addProperty(m.createProperty(Namespaces.REF, "hasTimeseriesId"), id);
        p.addProperty(m.createProperty(Namespaces.REF, "hasExternalReference"), ref);
    }
}
