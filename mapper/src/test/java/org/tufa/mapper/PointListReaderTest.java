package org.tufa.mapper;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.common.InputException;
import org.tufa.mapper.points.ExportUnits;
import org.tufa.mapper.points.ObjectTypes;
import org.tufa.mapper.points.PointList;
import org.tufa.mapper.points.PointListReader;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.points.ReadOptions;

class PointListReaderTest {

    @TempDir
    Path dir;

    private Path file(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text, StandardCharsets.UTF_8);
        return p;
    }

    private static InputException fails(Path p) {
        return assertThrows(InputException.class, () -> PointListReader.read(p, ReadOptions.detect()));
    }

    @Test
    void readsCommaSemicolonAndTabExportsByHeaderName() throws IOException {
        String[] delims = {",", ";", "\t"};
        for (String d : delims) {
            Path p = file("p.csv", String.join(d, "Object Type", "Point Name", "Engineering Units", "Description",
                    "Controller", "Trend ID", "Panel") + "\n"
                    + String.join(d, "analog-input", "FCU-1.ZN-T", "°F", "zone temp", "DEV7", "TL1", "P3") + "\n\n");
            PointList list = PointListReader.read(p, ReadOptions.detect());
            assertEquals(d.charAt(0), list.delimiter());
            assertEquals(1, list.points().size());
            PointRecord r = list.points().get(0);
            assertEquals("FCU-1.ZN-T", r.name());
            assertEquals("AI", r.objectType());
            assertEquals("°F", r.units());
            assertEquals("zone temp", r.description());
            assertEquals("DEV7", r.device());
            assertEquals("TL1", r.seriesId());
            assertEquals("P3", r.extras().get("Panel"), "extra columns are kept");
            assertEquals(2, r.line());
        }
    }

    @Test
    void bomQuotedFieldsEmbeddedNewlinesAndBlankLines() throws IOException {
        Path p = dir.resolve("bom.csv");
        try (OutputStream o = Files.newOutputStream(p)) {
            o.write(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF});
            o.write(("Name,Description\r\n\"A,1\",\"two\nlines\"\r\n\r\n\"B \"\"quoted\"\"\",x\r\n\r\n\r\n")
                    .getBytes(StandardCharsets.UTF_8));
        }
        PointList list = PointListReader.read(p, ReadOptions.detect());
        assertEquals(2, list.points().size());
        assertEquals("A,1", list.points().get(0).name());
        assertEquals("two\nlines", list.points().get(0).description());
        assertEquals("B \"quoted\"", list.points().get(1).name());
        assertEquals(2, list.points().get(0).line());
        assertEquals(5, list.points().get(1).line(), "line numbers count the embedded newline and blank line");
        assertEquals("Name", list.headers().get(0), "BOM stripped from the first header");
    }

    @Test
    void explicitDelimiterAndColumnOverride() throws IOException {
        Path p = file("o.csv", "Tag|Where\nX1|roof\n");
        InputException e = fails(p);
        assertTrue(e.getMessage().contains("no point-name column") && e.getMessage().contains("[Tag|Where]"),
                e.getMessage());
        ReadOptions o = new ReadOptions(Optional.of('|'), Optional.of("where"), Optional.empty(), Optional.empty(),
                Optional.empty(), Optional.empty(), Optional.empty());
        assertEquals("roof", PointListReader.read(p, o).points().get(0).name());
    }

    @Test
    void missingEmptyAndHeaderOnlyFiles() throws IOException {
        Path missing = dir.resolve("missing.csv");
        InputException e = fails(missing);
        assertTrue(e.getMessage().startsWith(missing + ":") && e.getMessage().contains("not found"), e.getMessage());
        assertTrue(fails(file("empty.csv", "")).getMessage().contains("is empty"));
        assertTrue(fails(file("blank.csv", "\n\n  \n")).getMessage().contains("is empty"));
        assertTrue(fails(file("header.csv", "Name,Units\n")).getMessage().contains("no point rows"));
        assertTrue(fails(dir).getMessage().contains("directory"));
    }

    @Test
    void headerWithoutANameColumnListsTheHeadersFound() throws IOException {
        InputException e = fails(file("h.csv", "Units,Type\n%,AO\n"));
        assertTrue(e.getMessage().contains(":1: ") && e.getMessage().contains("[Units, Type]")
                && e.getMessage().contains("--name-column"), e.getMessage());
    }

    @Test
    void nonUtf8BytesNameTheLineAndSayReExport() throws IOException {
        Path p = dir.resolve("latin1.csv");
        // "Zone température" in Windows-1252: é = 0xE9, not valid UTF-8
        byte[] head = "Name,Description\nA,ok\nB,Zone temp".getBytes(StandardCharsets.US_ASCII);
        byte[] tail = "rature\n".getBytes(StandardCharsets.US_ASCII);
        byte[] all = new byte[head.length + 1 + tail.length];
        System.arraycopy(head, 0, all, 0, head.length);
        all[head.length] = (byte) 0xE9;
        System.arraycopy(tail, 0, all, head.length + 1, tail.length);
        Files.write(p, all);
        InputException e = fails(p);
        assertTrue(e.getMessage().startsWith(p + ":3: ") && e.getMessage().contains("0xE9")
                && e.getMessage().contains("UTF-8"), e.getMessage());
    }

    @Test
    void tenMegabyteSingleLineIsRejectedQuickly() throws IOException {
        Path p = dir.resolve("oneline.csv");
        byte[] line = new byte[10 * 1024 * 1024];
        java.util.Arrays.fill(line, (byte) 'a');
        for (int i = 0; i < line.length; i += 100) {
            line[i] = ',';
        }
        Files.write(p, line);
        InputException e = fails(p);
        assertTrue(e.getMessage().startsWith(p + ":1: ") && e.getMessage().contains("longer than"), e.getMessage());
        assertFalse(e.getMessage().length() > 400, "one short line");
    }

    @Test
    void brokenQuotingNamesTheLine() throws IOException {
        InputException e = fails(file("q.csv", "Name,Units\nA,%\n\"B,%\nC,%\n"));
        assertTrue(e.getMessage().contains("quot"), e.getMessage());
    }

    @Test
    void objectTypeAndUnitSpellings() {
        // BACnet object-type names (ASHRAE 135 clause 12, from memory) and their usual abbreviations
        assertEquals(Optional.of("AI"), ObjectTypes.normalise("analog-input"));
        assertEquals(Optional.of("AO"), ObjectTypes.normalise("Analog Output"));
        assertEquals(Optional.of("MSV"), ObjectTypes.normalise("multi-state-value"));
        assertEquals(Optional.of("BV"), ObjectTypes.normalise("binaryValue"));
        assertEquals(Optional.of("AI"), ObjectTypes.normalise("analog-input,3"));
        assertEquals(Optional.of("BI"), ObjectTypes.normalise("BI:12"));
        assertEquals(Optional.empty(), ObjectTypes.normalise("trend-log"));
        // QUDT local names; BACnet engineering-unit codes 64 = degrees-Fahrenheit, 62 = degrees-Celsius,
        // 98 = percent (notes section 9, ASHRAE 135)
        for (String f : new String[] {"°F", "degF", "F", "deg F", "64", "Fahrenheit"}) {
            assertEquals(Optional.of("DEG_F"), ExportUnits.toQudt(f), f);
        }
        for (String c : new String[] {"°C", "degC", "C", "62"}) {
            assertEquals(Optional.of("DEG_C"), ExportUnits.toQudt(c), c);
        }
        for (String pc : new String[] {"%", "percent", "PERCENT", "98"}) {
            assertEquals(Optional.of("PERCENT"), ExportUnits.toQudt(pc), pc);
        }
        assertEquals(Optional.of("FT3-PER-MIN"), ExportUnits.toQudt("cfm"));
        assertEquals(Optional.of("L-PER-SEC"), ExportUnits.toQudt("l/s"));
        assertTrue(ExportUnits.isNone("no-units"));
        assertEquals(Optional.empty(), ExportUnits.toQudt("furlongs"));
    }
}
