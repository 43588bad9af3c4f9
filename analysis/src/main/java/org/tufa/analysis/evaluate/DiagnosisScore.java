package org.tufa.analysis.evaluate;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.tufa.common.CsvCells;
import org.tufa.common.InputException;

/**
 * Diagnosed causes scored against the ground truth: each diagnosed period of a unit is matched to the injected
 * episode of that unit it overlaps most; it is right when the diagnosed cause is that episode's fault. Periods that
 * overlap no episode are counted apart (they have no true cause to name). An episode counts once, however many
 * findings cover it: it is named when its right periods hold more hours than its wrong ones (a fault found in
 * pieces would otherwise count once per piece, and a classifier that names long faults right and short ones wrong
 * would look better than it is).
 */
public final class DiagnosisScore {

    /** A diagnosed period read from diagnosis.csv or held_out.csv. */
    public record Diagnosed(String unit, Instant start, Instant end, String cause) {
    }

    /**
     * @param onFaults      periods that overlap an injected episode
     * @param right         of those, diagnosed with the injected fault
     * @param offFaults     periods that overlap none
     * @param byFault       per injected fault: {right periods, periods, named episodes, episodes}
     * @param episodes      injected episodes with at least one diagnosed period
     * @param namedEpisodes of those, named (right periods hold more hours than wrong ones)
     */
    public record Score(int onFaults, int right, int offFaults, Map<String, int[]> byFault, int episodes,
                        int namedEpisodes) {
        public String share() {
            return onFaults == 0 ? "n/a" : String.format(Locale.ROOT, "%.1f %%", 100.0 * right / onFaults);
        }

        public String episodeShare() {
            return episodes == 0 ? "n/a" : String.format(Locale.ROOT, "%.1f %%", 100.0 * namedEpisodes / episodes);
        }

        /** Whether at least {@code share} of the episodes are named (false without any). */
        public boolean episodesNamedAtLeast(double share) {
            return episodes > 0 && namedEpisodes >= share * episodes;
        }
    }

    private DiagnosisScore() {
    }

    public static Score fit(List<Diagnosed> rows, List<TruthEpisode> truth) {
        int on = 0;
        int right = 0;
        int off = 0;
        Map<String, int[]> byFault = new TreeMap<>();
        // Per episode: seconds of right and of wrong periods, in first-matched order.
        Map<TruthEpisode, long[]> byEpisode = new java.util.LinkedHashMap<>();
        for (Diagnosed d : rows) {
            TruthEpisode best = TruthReview.mostOverlapping(d.unit(), d.start(), d.end(), truth);
            if (best == null) {
                off++;
                continue;
            }
            on++;
            int[] c = byFault.computeIfAbsent(best.fault(), k -> new int[4]);
            c[1]++;
            boolean ok = best.fault().equals(d.cause());
            if (ok) {
                right++;
                c[0]++;
            }
            long seconds = Math.max(0, d.end().getEpochSecond() - d.start().getEpochSecond());
            byEpisode.computeIfAbsent(best, k -> new long[2])[ok ? 0 : 1] += seconds;
        }
        int named = 0;
        for (Map.Entry<TruthEpisode, long[]> e : byEpisode.entrySet()) {
            int[] c = byFault.get(e.getKey().fault());
            c[3]++;
            if (e.getValue()[0] > e.getValue()[1]) {
                named++;
                c[2]++;
            }
        }
        return new Score(on, right, off, byFault, byEpisode.size(), named);
    }

    /** The rows of a diagnosis.csv or held_out.csv that tufa diagnose wrote (columns unit, start, end, diagnosed_cause). */
    public static List<Diagnosed> read(Path file) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "file not found; pass the diagnosis.csv or held_out.csv tufa diagnose wrote");
        }
        List<Diagnosed> out = new ArrayList<>();
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get();
        try (Reader reader = Files.newBufferedReader(file, StandardCharsets.UTF_8);
                CSVParser parser = CSVParser.builder().setReader(reader).setFormat(format).get()) {
            for (String h : List.of("unit", "start", "end", "diagnosed_cause")) {
                if (!parser.getHeaderNames().contains(h)) {
                    throw InputException.at(file, 1, "header lacks column " + h + "; pass a file tufa diagnose wrote");
                }
            }
            for (CSVRecord r : parser) {
                try {
                    out.add(new Diagnosed(CsvCells.restore(r.get("unit")),
                            OffsetDateTime.parse(r.get("start")).toInstant(),
                            OffsetDateTime.parse(r.get("end")).toInstant(), CsvCells.restore(r.get("diagnosed_cause"))));
                } catch (DateTimeParseException | IllegalArgumentException e) {
                    throw InputException.at(file, r.getRecordNumber() + 1, "start or end is not an ISO-8601 date-time "
                            + "with offset, or the row is short");
                }
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw InputException.in(file, "cannot read: " + e.getMessage());
        }
        return out;
    }

    /** Console lines. */
    public static List<String> lines(String what, Score s) {
        List<String> lines = new ArrayList<>();
        lines.add(String.format(Locale.ROOT, "%s: %d of %d injected episode(s) named (%s); %d of %d period(s) on "
                + "injected faults name the injected fault (%s); %d period(s) on no injected fault", what,
                s.namedEpisodes(), s.episodes(), s.episodeShare(), s.right(), s.onFaults(), s.share(), s.offFaults()));
        s.byFault().forEach((fault, c) -> lines.add(String.format(Locale.ROOT,
                "  %-30s episodes %d/%d, periods %d/%d", fault, c[2], c[3], c[0], c[1])));
        return lines;
    }
}
