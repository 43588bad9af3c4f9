package org.tufa.analysis.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URISyntaxException;
import java.nio.file.Path;
import org.apache.jena.rdf.model.Model;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.tufa.analysis.coverage.ModelLoader;
import org.tufa.analysis.coverage.Vocabulary;
import org.tufa.common.InputException;

/** tufa query on Quillmoor Hall: the vocabulary beside the model, predeclared prefixes, one-line parse errors. */
class SparqlQueriesTest {
    private static Model all;

    @BeforeAll
    static void load() throws URISyntaxException {
        Path model = Path.of(SparqlQueriesTest.class.getResource("/org/tufa/analysis/coverage/quillmoor-hall.ttl").toURI());
        all = Vocabulary.standard().unionWith(ModelLoader.load(model));
    }

    @Test
    void subclassPathsReachTheVocabularyWithoutPrefixDeclarations() {
        String q = "SELECT ?u WHERE { ?u rdf:type/rdfs:subClassOf* brick:Terminal_Unit } ORDER BY ?u";
        String csv = SparqlQueries.run(all, org.tufa.analysis.coverage.StandardPrefixes.mapping(), SparqlQueries.parse(q, "-e"), SparqlQueries.Format.CSV);
        // FCU-102 is typed brick:FCU, VAV-201 a reheat box: both reach Terminal_Unit only through the vocabulary.
        assertEquals(String.join("\r\n", "u",
                "https://quillmoor.example.org/building#FCU_101",
                "https://quillmoor.example.org/building#FCU_102",
                "https://quillmoor.example.org/building#FCU_103",
                "https://quillmoor.example.org/building#FCU_104",
                "https://quillmoor.example.org/building#FCU_105",
                "https://quillmoor.example.org/building#VAV_201") + "\r\n", csv);
    }

    @Test
    void askAndTableAndJson() {
        String ask = "ASK { ?p a brick:Chilled_Water_Supply_Temperature_Sensor }";
        assertEquals("true" + System.lineSeparator(),
                SparqlQueries.run(all, org.tufa.analysis.coverage.StandardPrefixes.mapping(), SparqlQueries.parse(ask, "-e"), SparqlQueries.Format.TABLE));
        String select = "SELECT ?l WHERE { ?u a brick:Variable_Air_Volume_Box_With_Reheat ; rdfs:label ?l }";
        String table = SparqlQueries.run(all, org.tufa.analysis.coverage.StandardPrefixes.mapping(), SparqlQueries.parse(select, "-e"), SparqlQueries.Format.TABLE);
        assertTrue(table.contains("| \"VAV-201\" |"), table);
        String json = SparqlQueries.run(all, org.tufa.analysis.coverage.StandardPrefixes.mapping(), SparqlQueries.parse(select, "-e"), SparqlQueries.Format.JSON);
        assertTrue(json.contains("\"value\" : \"VAV-201\"") || json.contains("\"value\": \"VAV-201\""), json);
    }

    @Test
    void constructPrintsTurtle() {
        String q = "CONSTRUCT { ?u a brick:Terminal_Unit } WHERE { ?u a brick:Variable_Air_Volume_Box_With_Reheat }";
        String ttl = SparqlQueries.run(all, org.tufa.analysis.coverage.StandardPrefixes.mapping(), SparqlQueries.parse(q, "-e"), SparqlQueries.Format.TABLE);
        assertTrue(ttl.contains("brick:Terminal_Unit"), ttl);
        assertTrue(ttl.contains("VAV_201"), ttl);
    }

    @Test
    void syntaxErrorNamesLineAndColumnOfTheUsersText() {
        String q = "SELECT ?u WHERE {\n  ?u a brick:Fan_Coil_Unit\n  ?u rdfs:label ?l }";
        InputException e = assertThrows(InputException.class, () -> SparqlQueries.parse(q, "units.rq"));
        assertTrue(e.getMessage().startsWith("units.rq:3: column 3: "), e.getMessage());
        assertTrue(!e.getMessage().contains("\n"), e.getMessage());
    }
}
