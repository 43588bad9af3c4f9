package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.evaluate.EvaluationFiles;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.findings.IndexRange;
import org.tufa.analysis.findings.Shift;

class FleetOutputsTest {

    /** A label with a comma and a quote: RFC 4180 says quote the field and double the quote. */
    static final String AWKWARD_LABEL = "Room \"Kestrel\", east wing";
    static final String AWKWARD_CAUSE = "valve \"B\" passing, or sensor high";

    @Test
    void headersAreTheDocumentedOnesAndFieldsQuotePerRfc4180(@TempDir Path dir) throws Exception {
        double[] load = new double[16];
        java.util.Arrays.fill(load, 1.0);
        Finding f = new Finding("cooling", "fault_cluster", 2, new IndexRange(4, 12),
                UnitOutcomeTest.START.plus(UnitOutcomeTest.STEP.multipliedBy(4)),
                UnitOutcomeTest.START.plus(UnitOutcomeTest.STEP.multipliedBy(12)), 2.0, 2.0,
                List.of(new Shift("coil_residual", "K", -3.04), new Shift("zone_air_temperature", "degC", 0.5)),
                List.of(AWKWARD_CAUSE, "second cause"));
        Finding decided = f.decided("coil_residual -3.0 K from the unit's normal days", 1e-6, 0.9876);
        UnitOutcome analysed = new UnitOutcome("urn:example:fernlea#FCU-01", AWKWARD_LABEL, "FCU-01",
                UnitOutcome.ANALYZED, "", List.of(), UnitOutcomeTest.result(load, List.of(f))).withoutDetail()
                .decided(List.of(decided), 3, List.of(), load);
        UnitOutcome skipped = new UnitOutcome("urn:example:fernlea#FCU-02", "FCU-02", "FCU-02", UnitOutcome.SKIPPED,
                "missing zone_air_temperature, discharge_air_temperature", List.of(), null);
        // The ingest report is not read by FleetOutputs.write.
        FleetAnalysis.Result result = new FleetAnalysis.Result(List.of(analysed, skipped), List.of(), List.of(), 7,
                0, null, new StageTimes());
        FleetOutputs.write(dir, result, ZoneId.of("UTC"), Map.of(), List.of());

        // Headers: the documented column lists (FleetOutputs javadoc constants, and the columns the evaluation
        // reader expects), spelled out here so a renamed column fails the test.
        List<String> fleetLines = Files.readAllLines(dir.resolve("fleet.csv"), StandardCharsets.UTF_8);
        assertEquals("unit,label,folder,status,reason,modes,samples_used,clusters,fault_clusters,fault_hours,"
                + "energy_kwh,findings,below_confidence,top_confidence", fleetLines.get(0));
        assertEquals(FleetOutputs.FLEET_HEADER, fleetLines.get(0));
        assertTrue(fleetLines.get(0).startsWith(String.join(",", EvaluationFiles.FLEET_HEADER)));
        List<String> findingLines = Files.readAllLines(dir.resolve("findings.csv"), StandardCharsets.UTF_8);
        assertEquals("unit,mode,kind,cluster,start,end,hours,energy_kwh,shift,candidate_causes,confidence,p_value,"
                + "evidence,finding_id,review,review_cause,review_overlaps", findingLines.get(0));
        assertEquals(FleetOutputs.FINDINGS_HEADER, findingLines.get(0));
        assertTrue(findingLines.get(0).startsWith(String.join(",", EvaluationFiles.FINDINGS_HEADER)));

        // RFC 4180 (Shafranovich, 2005): the quoted form of the label, checked literally and by parsing back with
        // Apache Commons CSV.
        assertTrue(fleetLines.get(1).startsWith(
                "urn:example:fernlea#FCU-01,\"Room \"\"Kestrel\"\", east wing\",FCU-01,analyzed,"), fleetLines.get(1));
        List<CSVRecord> fleet = parse(dir.resolve("fleet.csv"));
        assertEquals(2, fleet.size());
        assertEquals(AWKWARD_LABEL, fleet.get(0).get("label"));
        assertEquals("analyzed", fleet.get(0).get("status"));
        assertEquals("2.00", fleet.get(0).get("fault_hours"));
        assertEquals("missing zone_air_temperature, discharge_air_temperature", fleet.get(1).get("reason"));
        for (CSVRecord r : fleet) {
            assertEquals(14, r.size(), "every row has the header's columns");
        }

        List<CSVRecord> findings = parse(dir.resolve("findings.csv"));
        assertEquals(1, findings.size());
        CSVRecord row = findings.get(0);
        assertEquals(17, row.size());
        assertEquals(org.tufa.analysis.review.FindingIds.of(fleet.get(0).get("unit"), f), row.get("finding_id"));
        assertEquals("", row.get("review"), "no review given");
        assertEquals("fault_cluster", row.get("kind"));
        assertEquals("0.9876", row.get("confidence"));
        assertEquals("1.0E-6", row.get("p_value"));
        assertEquals("coil_residual -3.0 K from the unit's normal days", row.get("evidence"));
        assertEquals("1", fleet.get(0).get("findings"));
        assertEquals("3", fleet.get(0).get("below_confidence"));
        assertEquals("0.9876", fleet.get(0).get("top_confidence"));
        assertEquals("2", row.get("cluster"));
        assertEquals("2031-06-02T01:00:00Z", row.get("start"));
        assertEquals("coil_residual -3.0 K; zone_air_temperature +0.5 K", row.get("shift"));
        assertEquals(AWKWARD_CAUSE + " | second cause", row.get("candidate_causes"));
    }

    private static List<CSVRecord> parse(Path file) throws Exception {
        CSVFormat format = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get();
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser p = CSVParser.parse(r, format)) {
            return p.getRecords();
        }
    }
}
