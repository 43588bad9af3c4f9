package org.tufa.analysis.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.tufa.analysis.fleet.UnitOutcome;
import org.tufa.analysis.review.KnownUnits;
import org.tufa.analysis.review.ReviewFile;
import org.tufa.analysis.review.Verdict;

/**
 * The review in the report, clicked through in headless Chromium (skipped without /usr/bin/chromium; CI installs
 * it): verdicts, a typed cause, a note with characters a spreadsheet would run as a formula, a verdict taken back;
 * the saved review.csv is read by tufa's own reader and holds exactly what was clicked. A second round on a report
 * that applied the file shows the verdicts again, and saving it unchanged loses none (the rejected finding, no
 * longer listed, is carried over).
 */
class ReviewBrowserTest {

    @Test
    void clickThroughAReviewSaveItAndReviewAgain(@TempDir Path dir) throws Exception {
        assumeTrue(HeadlessBrowser.available(), "no chromium at " + HeadlessBrowser.CHROMIUM
                + " (apt-get install chromium): the browser check of the review controls is skipped");
        SyntheticFleet.Fleet fleet = SyntheticFleet.build(8, LocalDate.of(2031, 7, 1), LocalDate.of(2031, 7, 31));
        Map<String, String> labels = new TreeMap<>();
        fleet.coverage().units().forEach(u -> labels.put(u.unit(), u.label()));
        KnownUnits units = new KnownUnits(labels);
        Path first = dir.resolve("first");
        Path page = FleetPage.write(FleetPage.reportDir(first), fleet.result(), fleet.coverage(), SyntheticFleet.ZONE);
        Path downloads = Files.createDirectories(dir.resolve("downloads"));
        List<Verdict> saved;
        JsonArray findings;
        try (HeadlessBrowser browser = new HeadlessBrowser(downloads)) {
            browser.open(page);
            findings = JsonParser.parseString(browser.evaluate("document.getElementById('review-data').textContent")
                    .getAsString()).getAsJsonObject().getAsJsonArray("findings");
            int listed = fleet.result().units().stream().mapToInt(u -> u.findings().size()).sum();
            assertTrue(listed >= 4, "the test fleet needs four findings, has " + listed);
            assertEquals(listed, findings.size());
            assertEquals(4 * listed, browser.evaluate("document.querySelectorAll('td.review input.review-verdict')"
                    .concat(".length")).getAsInt(), "four verdict choices beside every finding");
            String[] id = new String[4];
            for (int i = 0; i < 4; i++) {
                id[i] = findings.get(i).getAsJsonObject().get("id").getAsString();
            }
            String firstCause = findings.get(3).getAsJsonObject().getAsJsonArray("causes").get(0).getAsString();
            browser.type("#review-reviewer", "R. Tester");
            browser.click(radio(id[0], "confirmed"));
            browser.type(cell(id[0]) + " input.review-cause", "stuck valve, seen on site");
            browser.click(radio(id[1], "rejected"));
            browser.type(cell(id[1]) + " input.review-note", "=design: -2 K offset \"as built\"");
            browser.click(radio(id[2], "not_sure"));
            browser.click(radio(id[2], ""));
            browser.click(radio(id[3], "confirmed"));
            browser.type(cell(id[3]) + " input.review-cause", firstCause);
            assertTrue(browser.evaluate("document.getElementById('review-status').textContent").getAsString()
                    .startsWith("3 of " + listed + " finding(s) with a verdict"));
            browser.click("#review-save");
            saved = ReviewFile.read(HeadlessBrowser.awaitDownload(downloads, "review.csv"), units);
            assertEquals(3, saved.size(), saved.toString());
            check(saved.get(0), findings.get(0).getAsJsonObject(), Verdict.Decision.CONFIRMED,
                    "stuck valve, seen on site", "");
            check(saved.get(1), findings.get(1).getAsJsonObject(), Verdict.Decision.REJECTED, "",
                    "=design: -2 K offset \"as built\"");
            check(saved.get(2), findings.get(3).getAsJsonObject(), Verdict.Decision.CONFIRMED, firstCause, "");
            String raw = Files.readString(downloads.resolve("review.csv"));
            assertTrue(raw.startsWith(ReviewFile.HEADER + "\n"), raw);
            assertTrue(raw.contains("\"'=design: -2 K offset \"\"as built\"\"\""), "neutralised and quoted: " + raw);
        }

        // Second round: the report of a run that applied the file.
        var reviewed = SyntheticFleet.reviewed(fleet, saved);
        assertEquals(1, reviewed.review().suppressedCount(), "the rejected finding is not listed again");
        assertEquals(3, reviewed.review().applied().size());
        Path second = dir.resolve("second");
        Path page2 = FleetPage.write(FleetPage.reportDir(second), reviewed, fleet.coverage(), SyntheticFleet.ZONE);
        Path downloads2 = Files.createDirectories(dir.resolve("downloads2"));
        try (HeadlessBrowser browser = new HeadlessBrowser(downloads2)) {
            browser.open(page2);
            String confirmed = findings.get(0).getAsJsonObject().get("id").getAsString();
            assertTrue(browser.evaluate("document.querySelector(" + js(radio(confirmed, "confirmed")) + ").checked")
                    .getAsBoolean(), "the applied verdict is shown again");
            assertEquals("stuck valve, seen on site", browser.evaluate("document.querySelector("
                    + js(cell(confirmed) + " input.review-cause") + ").value").getAsString());
            assertTrue(browser.evaluate("document.getElementById('review-status').textContent").getAsString()
                    .contains("1 earlier verdict(s) kept as they are"));
            browser.click("#review-save");
            List<Verdict> again = ReviewFile.read(HeadlessBrowser.awaitDownload(downloads2, "review.csv"), units);
            assertEquals(withoutLines(saved), withoutLines(again), "saving unchanged keeps every verdict as it was");
        }
        for (UnitOutcome u : reviewed.units()) {
            u.findings().forEach(f -> assertTrue(!u.mark(f).status().equals("rejected")));
        }
    }

    private static String js(String text) {
        return new com.google.gson.Gson().toJson(text);
    }

    private static String cell(String id) {
        return "td.review[data-finding='" + id + "']";
    }

    private static String radio(String id, String verdict) {
        return cell(id) + " input.review-verdict[value='" + verdict + "']";
    }

    private static void check(Verdict v, JsonObject f, Verdict.Decision d, String cause, String note) {
        assertEquals(f.get("unit").getAsString(), v.unit());
        assertEquals(f.get("mode").getAsString(), v.mode());
        assertEquals(f.get("kind").getAsString(), v.kind());
        assertEquals(OffsetDateTime.parse(f.get("start").getAsString()).toInstant(), v.start());
        assertEquals(OffsetDateTime.parse(f.get("end").getAsString()).toInstant(), v.end());
        assertEquals(f.get("id").getAsString(), v.findingId());
        assertEquals(d, v.decision());
        assertEquals(cause, v.cause());
        assertEquals(note, v.note());
        assertEquals("R. Tester", v.reviewer());
        LocalDate today = LocalDate.now();
        assertTrue(v.date().equals(today) || v.date().equals(today.minusDays(1)), "dated today: " + v.date());
    }

    private static List<String> withoutLines(List<Verdict> verdicts) {
        List<String> out = new ArrayList<>();
        for (Verdict v : verdicts) {
            out.add(new Verdict(0, v.unit(), v.mode(), v.kind(), v.start(), v.end(), v.findingId(), v.decision(),
                    v.cause(), v.note(), v.reviewer(), v.date()).toString());
        }
        java.util.Collections.sort(out);
        return out;
    }
}
