package org.tufa.analysis.trends;

import java.io.IOException;
import java.io.InputStream;
import java.util.Arrays;

/**
 * Lines of a byte stream, without copying: after {@link #next()}, the line is {@code buffer()[start(), end())},
 * without its {@code \n} or {@code \r\n}. Valid until the next call. Not thread-safe.
 */
final class LineSource {

    private final InputStream in;
    private byte[] buffer = new byte[1 << 20];
    private int position;
    private int limit;
    private int scanFrom;
    private boolean endOfStream;
    private int start;
    private int end;
    private long lineNumber;

    LineSource(InputStream in) {
        this.in = in;
    }

    boolean next() throws IOException {
        while (true) {
            for (int i = Math.max(scanFrom, position); i < limit; i++) {
                if (buffer[i] == '\n') {
                    setLine(position, i);
                    position = i + 1;
                    scanFrom = position;
                    return true;
                }
            }
            scanFrom = limit;
            if (endOfStream) {
                if (position < limit) {
                    setLine(position, limit);
                    position = limit;
                    return true;
                }
                return false;
            }
            if (position > 0) {
                System.arraycopy(buffer, position, buffer, 0, limit - position);
                limit -= position;
                scanFrom -= position;
                position = 0;
            } else if (limit == buffer.length) {
                buffer = Arrays.copyOf(buffer, buffer.length * 2);
            }
            int read = in.read(buffer, limit, buffer.length - limit);
            if (read < 0) {
                endOfStream = true;
            } else {
                limit += read;
            }
        }
    }

    private void setLine(int from, int to) {
        start = from;
        end = to > from && buffer[to - 1] == '\r' ? to - 1 : to;
        lineNumber++;
    }

    byte[] buffer() {
        return buffer;
    }

    int start() {
        return start;
    }

    int end() {
        return end;
    }

    /** 1-based number of the current line. */
    long lineNumber() {
        return lineNumber;
    }
}
