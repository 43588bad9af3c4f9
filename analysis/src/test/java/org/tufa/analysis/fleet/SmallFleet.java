package org.tufa.analysis.fleet;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.jena.rdf.model.Model;
import org.apache.jena.riot.RDFDataMgr;
import org.apache.jena.riot.RDFFormat;
import org.tufa.analysis.fleet.bench.FanCoilFleetModel;

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
        List<FanCoilFleetModel.Unit> list = new java.util.ArrayList<>();
        for (int u = 1; u <= units; u++) {
            String id = String.format("FCU-%02d", u);
            list.add(new FanCoilFleetModel.Unit(id, id, fahrenheitOnOddUnits && u % 2 == 1 ? "DEG_F" : "DEG_C",
                    false));
        }
        return FanCoilFleetModel.build(BASE, "Fernlea Depot", "", list);
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
}
