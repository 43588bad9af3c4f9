package org.tufa.readers;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.atomic.AtomicLongArray;
import java.util.function.Supplier;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.EdgeCasesMode;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.ShrinkingMode;
import net.jqwik.api.Tag;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.tufa.common.InputException;

/**
 * The fuzz campaign: 100,000 generated inputs per reader (mutated seeds, random bytes, random syntax; see
 * {@link Mutations}). A crash is any exception or error other than an {@link InputException} with a one-line
 * message. Crashes are collected rather than stopping the run, and the totals are printed at the end:
 *
 * <pre>mvn -B test -Pfuzz -pl analysis -am -Dsurefire.failIfNoSpecifiedTests=false</pre>
 *
 * Tagged "fuzz": not part of the default test run (see the parent pom).
 */
@Tag("fuzz")
class ReaderFuzzTest {

    static final int TRIES = 100_000;
    private static final String[] READERS = {"point list", "rule file", "trends (long and wide)", "truth file"};
    /** Per reader: inputs, results, input errors, crashes. */
    private static final AtomicLongArray COUNTS = new AtomicLongArray(READERS.length * 4);
    private static final Map<String, String> FIRST_CRASHES = Collections.synchronizedMap(new TreeMap<>());
    private static Path dir;
    private static Path findings;

    @BeforeContainer
    static void folders() throws IOException {
        dir = Files.createTempDirectory("tufa-fuzz");
        findings = Readers.findingsFolder(Files.createDirectories(dir.resolve("findings")));
    }

    @AfterContainer
    static void report() throws IOException {
        long crashes = 0;
        for (int r = 0; r < READERS.length; r++) {
            System.out.printf(java.util.Locale.ROOT, "fuzz %-24s %7d inputs: %7d read, %7d refused (InputException), "
                    + "%d crashes%n", READERS[r], COUNTS.get(4 * r), COUNTS.get(4 * r + 1), COUNTS.get(4 * r + 2),
                    COUNTS.get(4 * r + 3));
            crashes += COUNTS.get(4 * r + 3);
        }
        FIRST_CRASHES.forEach((k, v) -> System.out.println("fuzz crash " + k + ": " + v));
        try (var walk = Files.walk(dir)) {
            walk.sorted(Collections.reverseOrder()).forEach(p -> p.toFile().delete());
        }
        if (crashes > 0) {
            throw new AssertionError(crashes + " crashes; first ones: " + FIRST_CRASHES);
        }
    }

    private static void fuzz(int reader, byte[] input, Supplier<Object> read) {
        COUNTS.incrementAndGet(4 * reader);
        try {
            read.get();
            COUNTS.incrementAndGet(4 * reader + 1);
        } catch (InputException e) {
            if (e.getMessage() != null && e.getMessage().lines().count() == 1) {
                COUNTS.incrementAndGet(4 * reader + 2);
            } else {
                crash(reader, input, e);
            }
        } catch (Throwable e) {
            crash(reader, input, e);
        }
    }

    private static void crash(int reader, byte[] input, Throwable e) {
        COUNTS.incrementAndGet(4 * reader + 3);
        if (FIRST_CRASHES.size() < 10) {
            List<String> where = new ArrayList<>();
            for (StackTraceElement s : e.getStackTrace()) {
                if (s.getClassName().startsWith("org.tufa")) {
                    where.add(s.getClassName() + ":" + s.getLineNumber());
                    if (where.size() == 2) {
                        break;
                    }
                }
            }
            FIRST_CRASHES.putIfAbsent(READERS[reader] + " #" + COUNTS.get(4 * reader), e + " at " + where
                    + " on input " + java.util.HexFormat.of().formatHex(input, 0, Math.min(input.length, 120)));
        }
    }

    @Provide
    Arbitrary<byte[]> pointLists() {
        return Mutations.pointLists();
    }

    @Provide
    Arbitrary<byte[]> ruleFiles() {
        return Mutations.ruleFiles();
    }

    @Provide
    Arbitrary<byte[]> trendFiles() {
        return Mutations.trendFiles();
    }

    @Provide
    Arbitrary<byte[]> truthFiles() {
        return Mutations.truthFiles();
    }

    @Property(tries = TRIES, shrinking = ShrinkingMode.OFF, edgeCases = EdgeCasesMode.NONE)
    void pointList(@ForAll("pointLists") byte[] input) {
        fuzz(0, input, () -> Readers.pointList(input));
    }

    @Property(tries = TRIES, shrinking = ShrinkingMode.OFF, edgeCases = EdgeCasesMode.NONE)
    void ruleFile(@ForAll("ruleFiles") byte[] input) {
        fuzz(1, input, () -> Readers.ruleFile(input));
    }

    @Property(tries = TRIES, shrinking = ShrinkingMode.OFF, edgeCases = EdgeCasesMode.NONE)
    void trends(@ForAll("trendFiles") byte[] input, @ForAll boolean strict, @ForAll boolean naive) {
        fuzz(2, input, () -> Readers.trends(dir, input, strict, naive));
    }

    @Property(tries = TRIES, shrinking = ShrinkingMode.OFF, edgeCases = EdgeCasesMode.NONE)
    void truth(@ForAll("truthFiles") byte[] input) {
        fuzz(3, input, () -> Readers.truth(findings, input));
    }
}
