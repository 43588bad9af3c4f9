package org.tufa.cli;

import java.io.PrintWriter;
import java.time.Duration;

/**
 * A one-line progress bar on stderr (units done / total, elapsed, remaining), drawn only when stderr is a
 * terminal, so logs and CI output stay clean. Thread-safe: workers report from their own threads.
 */
final class ProgressBar {

    private final PrintWriter err;
    private final boolean enabled;
    private final long start = System.nanoTime();
    private final String what;
    private long lastDraw;

    ProgressBar(PrintWriter err, String what) {
        this.err = err;
        this.what = what;
        this.enabled = System.console() != null && !"true".equals(System.getenv("CI"));
    }

    synchronized void update(int done, int total) {
        if (!enabled) {
            return;
        }
        long now = System.nanoTime();
        if (done < total && now - lastDraw < 100_000_000L) {
            return; // at most ten redraws a second
        }
        lastDraw = now;
        double elapsed = (now - start) / 1e9;
        double remaining = done == 0 ? Double.NaN : elapsed / done * (total - done);
        int width = 30;
        int filled = total == 0 ? width : (int) Math.round(width * (double) done / total);
        err.print("\r" + what + " [" + "#".repeat(filled) + " ".repeat(width - filled) + "] " + done + "/" + total
                + "  " + format(elapsed) + " elapsed, " + (Double.isNaN(remaining) ? "--" : format(remaining))
                + " left ");
        if (done == total) {
            err.println();
        }
        err.flush();
    }

    private static String format(double seconds) {
        Duration d = Duration.ofMillis((long) (seconds * 1000));
        return d.toMinutes() > 0 ? d.toMinutes() + "m" + (d.toSecondsPart()) + "s" : d.toSecondsPart() + "s";
    }
}
