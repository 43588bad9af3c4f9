package org.tufa.analysis.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.fleet.FleetReport;
import org.tufa.analysis.fleet.UnitOutcome;

/**
 * Renders the report of a small simulated fleet twice and checks what a reader relies on: every page and image
 * exists, every image is a readable PNG of the size the page says, labels with HTML specials are escaped, the
 * caution is on every page, and the second render is byte-identical. The first render stays in
 * target/report-fixture for analysis/src/test/report-check.sh (the headless-browser check).
 */
class ReportTest {

    private static SyntheticFleet.Fleet fleet;
    private static Path fixture;

    @BeforeAll
    static void render() throws IOException {
        fleet = SyntheticFleet.build(8, LocalDate.of(2031, 7, 1), LocalDate.of(2031, 7, 31));
        fixture = Path.of("target", "report-fixture");
        deleteTree(fixture);
        render(fixture);
    }

    static void render(Path out) {
        UnitPages pages = new UnitPages(out, SyntheticFleet.ZONE);
        List<UnitOutcome> units = fleet.result().units();
        for (int i = 0; i < units.size(); i++) {
            pages.analysed(fleet.analysed().get(i), fleet.signals().get(i));
            pages.decided(units.get(i), units.get(i).findings().isEmpty() ? null : fleet.signals().get(i),
                    fleet.loads().get(i));
        }
        FleetPage.write(FleetPage.reportDir(out), fleet.result(), fleet.coverage(), SyntheticFleet.ZONE);
        // The files the fleet page points readers without JavaScript to.
        org.tufa.analysis.fleet.FleetOutputs.write(out, fleet.result(), SyntheticFleet.ZONE, java.util.Map.of(),
                List.of());
        org.tufa.analysis.coverage.CoverageFiles.write(fleet.coverage(), out);
    }

    /** The fleet page's data tables by id: their JSON, as the page's script reads it. */
    static java.util.Map<String, com.google.gson.JsonObject> tables(String html) {
        java.util.Map<String, com.google.gson.JsonObject> out = new java.util.TreeMap<>();
        Matcher m = Pattern.compile("<script type=\"application/json\" id=\"([^\"]+)-data\">(.*?)</script>",
                Pattern.DOTALL).matcher(html);
        while (m.find()) {
            if (!html.contains("<div class=\"datatable\" id=\"" + m.group(1) + "\"")) {
                continue; // the review controls' state (review-data) is data of another kind
            }
            out.put(m.group(1), com.google.gson.JsonParser.parseString(m.group(2)).getAsJsonObject());
        }
        return out;
    }

    /**
     * Every cell of a table as its JSON: a string (a number stands for a string of the table's string list), or an
     * object with t, h, s, c, ti.
     */
    static List<com.google.gson.JsonElement> cells(com.google.gson.JsonObject table) {
        List<com.google.gson.JsonElement> out = new java.util.ArrayList<>();
        var strings = table.getAsJsonArray("strings");
        table.getAsJsonArray("rows").forEach(r -> r.getAsJsonArray().forEach(c -> out.add(
                c.isJsonPrimitive() && c.getAsJsonPrimitive().isNumber() ? strings.get(c.getAsInt()) : c)));
        return out;
    }

    private static List<Path> pages() throws IOException {
        try (Stream<Path> s = Files.walk(FleetPage.reportDir(fixture))) {
            return s.filter(p -> p.toString().endsWith(".html")).sorted().toList();
        }
    }

    @Test
    void everyUnitHasAPageAndTheFleetPageLinksThem() throws IOException {
        Path report = FleetPage.reportDir(fixture);
        assertTrue(Files.isRegularFile(report.resolve("index.html")));
        String index = Files.readString(report.resolve("index.html"));
        var tables = tables(index);
        assertEquals(java.util.Set.of("coverage", "findings", "ranking", "units"), tables.keySet());
        List<String> links = cells(tables.get("units")).stream().filter(c -> c.isJsonObject()
                && c.getAsJsonObject().has("h")).map(c -> c.getAsJsonObject().get("h").getAsString()).toList();
        for (UnitOutcome u : fleet.result().units()) {
            assertTrue(Files.isRegularFile(report.resolve("units").resolve(u.folder()).resolve("index.html")),
                    u.folder());
            assertTrue(links.contains("units/" + u.folder() + "/index.html"), u.folder());
        }
        for (String link : links) {
            assertTrue(Files.isRegularFile(report.resolve(link)), link);
        }
        assertEquals(fleet.result().units().size(), tables.get("units").getAsJsonArray("rows").size());
        assertEquals(fleet.result().units().size() + 1, pages().size());
        List<String> coverageCells = cells(tables.get("coverage")).stream().filter(c -> c.isJsonObject()
                && c.getAsJsonObject().has("c")).map(c -> c.getAsJsonObject().get("c").getAsString() + ":"
                + c.getAsJsonObject().get("t").getAsString()).toList();
        assertTrue(coverageCells.contains("missing:missing"), "a missing role is spelled out");
        assertTrue(coverageCells.contains("ambiguous:ambiguous (2)"), "an ambiguous role is marked");
        // Long texts are stored once: every candidate-cause text of findings.csv is in the table's cells.
        java.util.Set<String> texts = new java.util.TreeSet<>();
        cells(tables.get("findings")).forEach(c -> texts.add(c.isJsonObject() ? c.getAsJsonObject().get("t")
                .getAsString() : c.getAsString()));
        for (UnitOutcome u : fleet.result().units()) {
            u.findings().forEach(f -> assertTrue(texts.contains(String.join(" | ", f.causes())), f.toString()));
        }
        assertTrue(index.contains("<th class=\"num\">units found</th>"));
    }

    @Test
    void everyImageAndLinkResolves() throws IOException {
        Pattern src = Pattern.compile("<img src=\"([^\"]+)\" width=\"(\\d+)\" height=\"(\\d+)\"");
        Pattern href = Pattern.compile("href=\"([^\"#:]+)\"");
        int images = 0;
        for (Path page : pages()) {
            String html = Files.readString(page);
            Matcher m = src.matcher(html);
            while (m.find()) {
                Path img = page.getParent().resolve(m.group(1));
                assertTrue(Files.isRegularFile(img), page + " -> " + m.group(1));
                BufferedImage read = ImageIO.read(img.toFile());
                assertNotNull(read, img + " is not a readable PNG");
                assertEquals(Integer.parseInt(m.group(2)), read.getWidth(), img.toString());
                assertEquals(Integer.parseInt(m.group(3)), read.getHeight(), img.toString());
                images++;
            }
            Matcher h = href.matcher(html);
            while (h.find()) {
                assertTrue(Files.isRegularFile(page.getParent().resolve(h.group(1))), page + " -> " + h.group(1));
            }
            assertFalse(html.contains("http://") || html.contains("https://") && html.contains("src=\"http"),
                    "no network resources: " + page);
        }
        // Eight analysed units with signals: one strip each, and a reachability plot and biplot per clustered mode.
        assertTrue(images >= 8 * 3, "images: " + images);
    }

    @Test
    void labelsWithHtmlSpecialsAreEscapedEverywhere() throws IOException {
        String escaped = "FCU &lt;1&gt; &amp; &quot;A&quot; &#39;b&#39;";
        String index = Files.readString(FleetPage.reportDir(fixture).resolve("index.html"));
        // The fleet page's tables hold the label as data (the script inserts it as text, never as HTML), with <, >,
        // & and ' escaped in the JSON so that it cannot end the script element.
        assertTrue(cells(tables(index).get("units")).stream().anyMatch(c -> c.isJsonObject()
                && c.getAsJsonObject().get("t").getAsString().equals("FCU <1> & \"A\" 'b'")), "label kept as data");
        assertTrue(index.contains("FCU \\u003c1\\u003e \\u0026 \\\"A\\\" \\u0027b\\u0027"),
                "label escaped in the page");
        String unit = Files.readString(FleetPage.reportDir(fixture).resolve("units/FCU-1/index.html"));
        assertTrue(unit.contains("<title>" + escaped + " - tufa unit report</title>"));
        String note = Files.readString(FleetPage.reportDir(fixture).resolve("units/FCU-2/index.html"));
        assertTrue(note.contains("on/off &lt;ok&gt;"));
        for (Path page : pages()) {
            String html = Files.readString(page);
            assertFalse(html.contains("FCU <1>"), "raw label in " + page);
            assertFalse(html.contains("<ok>"), "raw note in " + page);
            assertEquals(count(html, "<table"), count(html, "</table>"), page.toString());
            assertEquals(count(html, "<tr>") + count(html, "<tr "), count(html, "</tr>"), page.toString());
        }
    }

    @Test
    void cautionOnEveryPage() throws IOException {
        String caution = Html.esc(FleetReport.CAUTION);
        for (Path page : pages()) {
            String html = Files.readString(page);
            assertTrue(html.contains(caution), page.toString());
            assertTrue(html.contains("Okabe and Ito"), page.toString());
        }
    }

    @Test
    void faultClustersShowActualAndExpectedArrowsInTheCaption() throws IOException {
        boolean anyFault = false;
        for (UnitOutcome u : fleet.analysed()) {
            if (u.result() == null) {
                continue;
            }
            String html = Files.readString(FleetPage.reportDir(fixture).resolve("units").resolve(u.folder())
                    .resolve("index.html"));
            for (var m : u.result().modeResults()) {
                if (!m.analyzed()) {
                    assertTrue(html.contains(Html.esc(m.reason())), u.folder() + " " + m.mode());
                    continue;
                }
                assertTrue(html.contains("src=\"" + m.mode() + "-biplot.png\""));
                boolean fault = m.faultClusterCount() > 0;
                if (fault && !m.mode().equals("ventilation")) {
                    anyFault = true;
                    assertTrue(html.contains("Dashed black arrow"), u.folder());
                    assertTrue(html.contains("cosine between actual and expected shift"), u.folder());
                }
            }
        }
        assertTrue(anyFault, "the simulated fleet should hold a coil-mode fault cluster");
    }

    @Test
    void secondRenderIsByteIdentical(@TempDir Path again) throws IOException {
        render(again);
        List<Path> first = files(FleetPage.reportDir(fixture));
        List<Path> second = files(FleetPage.reportDir(again));
        assertEquals(first.stream().map(p -> FleetPage.reportDir(fixture).relativize(p).toString()).toList(),
                second.stream().map(p -> FleetPage.reportDir(again).relativize(p).toString()).toList());
        for (int i = 0; i < first.size(); i++) {
            assertArrayEquals(Files.readAllBytes(first.get(i)), Files.readAllBytes(second.get(i)),
                    first.get(i).toString());
        }
    }

    @Test
    void pagesAreUtf8AndSelfContained() throws IOException {
        for (Path page : pages()) {
            String html = new String(Files.readAllBytes(page), StandardCharsets.UTF_8);
            assertTrue(html.startsWith("<!DOCTYPE html>"));
            assertTrue(html.contains("<meta charset=\"utf-8\">"));
            assertFalse(html.contains("<link"), "no external style sheets");
            assertFalse(html.contains("<script src"), "no external scripts");
        }
    }

    private static int count(String s, String needle) {
        int n = 0;
        for (int i = s.indexOf(needle); i >= 0; i = s.indexOf(needle, i + 1)) {
            n++;
        }
        return n;
    }

    private static List<Path> files(Path dir) throws IOException {
        try (Stream<Path> s = Files.walk(dir)) {
            return s.filter(Files::isRegularFile).sorted().toList();
        }
    }

    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        List<Path> all = new ArrayList<>();
        try (Stream<Path> s = Files.walk(dir)) {
            s.forEach(all::add);
        }
        for (int i = all.size() - 1; i >= 0; i--) {
            Files.delete(all.get(i));
        }
    }
}
