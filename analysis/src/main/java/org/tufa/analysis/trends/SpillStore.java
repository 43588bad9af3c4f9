package org.tufa.analysis.trends;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Arrays;

/**
 * Parsed samples of many series, kept on disk so that memory grows with one series, not with the fleet.
 *
 * <p>Layout: ONE temp file of chunks. Each series has a small in-memory buffer of {@code chunkSamples} samples;
 * when it fills, it is appended to the file as a chunk (the times as int seconds relative to a base, then the
 * values as doubles, 12 bytes a sample) and the chunk's offset and length are added to that series' index. Reading
 * a series back reads only its own chunks with positional reads, which are safe from several threads at once
 * ({@link FileChannel} positional reads do not move a shared position). Writing happens on one thread, during
 * ingest, before any read.
 */
final class SpillStore implements AutoCloseable {

    /** Samples of one series in file order (not necessarily sorted by time). */
    record Samples(long[] epochSeconds, double[] values) {
    }

    private final Path file;
    private final FileChannel channel;
    /** Deletes the file if the JVM stops before {@link #close} (SIGTERM, Ctrl-C); null once the file is unlinked. */
    private final Thread cleanup;
    private final int chunkSamples;
    private final long baseEpochSecond;
    private final int[][] bufferTimes;
    private final double[][] bufferValues;
    private final int[] bufferFill;
    private final long[][] chunkOffsets;
    private final int[][] chunkLengths;
    private final int[] chunkCount;
    private final long[] sampleCount;
    private ByteBuffer writeBuffer;
    private long fileEnd;

    SpillStore(Path directory, int seriesCount, int chunkSamples, long baseEpochSecond) {
        this.chunkSamples = chunkSamples;
        this.baseEpochSecond = baseEpochSecond;
        this.bufferTimes = new int[seriesCount][];
        this.bufferValues = new double[seriesCount][];
        this.bufferFill = new int[seriesCount];
        this.chunkOffsets = new long[seriesCount][];
        this.chunkLengths = new int[seriesCount][];
        this.chunkCount = new int[seriesCount];
        this.sampleCount = new long[seriesCount];
        try {
            this.file = Files.createTempFile(directory, "tufa-trends-", ".spill");
            this.channel = FileChannel.open(file, StandardOpenOption.READ, StandardOpenOption.WRITE,
                    StandardOpenOption.TRUNCATE_EXISTING);
        } catch (IOException e) {
            throw new org.tufa.common.InputException(directory + ": cannot create the trend spill file ("
                    + org.tufa.common.OutputFiles.reason(e) + "); point java.io.tmpdir to a writable folder with space");
        }
        // On POSIX systems an open file can be unlinked and still used: then no exit, not even SIGKILL, leaves it
        // behind. Where that fails (Windows), a shutdown hook deletes it on a normal exit, Ctrl-C or SIGTERM.
        Thread hook = null;
        try {
            Files.delete(file);
        } catch (IOException e) {
            hook = new Thread(() -> {
                try {
                    channel.close();
                    Files.deleteIfExists(file);
                } catch (IOException ignored) {
                    // the JVM is stopping; nothing more can be done
                }
            }, "tufa-spill-cleanup");
            Runtime.getRuntime().addShutdownHook(hook);
        }
        this.cleanup = hook;
    }

    long baseEpochSecond() {
        return baseEpochSecond;
    }

    long sampleCount(int series) {
        return sampleCount[series];
    }

    /** Whether {@code epochSecond} can be stored (within about 68 years of the base). */
    boolean fits(long epochSecond) {
        long relative = epochSecond - baseEpochSecond;
        return relative >= Integer.MIN_VALUE && relative <= Integer.MAX_VALUE;
    }

    /** Adds one sample; {@link #fits} must hold. */
    void add(int series, long epochSecond, double value) {
        int[] times = bufferTimes[series];
        if (times == null) {
            times = bufferTimes[series] = new int[chunkSamples];
            bufferValues[series] = new double[chunkSamples];
        }
        int n = bufferFill[series];
        times[n] = (int) (epochSecond - baseEpochSecond);
        bufferValues[series][n] = value;
        bufferFill[series] = n + 1;
        sampleCount[series]++;
        if (n + 1 == chunkSamples) {
            flush(series);
        }
    }

    /** Writes every partly filled buffer and frees the buffers; call once, after the last {@link #add}. */
    void finish() {
        for (int s = 0; s < bufferFill.length; s++) {
            if (bufferFill[s] > 0) {
                flush(s);
            }
            bufferTimes[s] = null;
            bufferValues[s] = null;
        }
        writeBuffer = null;
    }

    private void flush(int series) {
        int n = bufferFill[series];
        if (writeBuffer == null) {
            writeBuffer = ByteBuffer.allocateDirect(chunkSamples * 12).order(ByteOrder.LITTLE_ENDIAN);
        }
        writeBuffer.clear();
        writeBuffer.asIntBuffer().put(bufferTimes[series], 0, n);
        writeBuffer.position(n * 4);
        writeBuffer.asDoubleBuffer().put(bufferValues[series], 0, n);
        writeBuffer.position(0).limit(n * 12);
        try {
            long position = fileEnd;
            while (writeBuffer.hasRemaining()) {
                position += channel.write(writeBuffer, position);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write trend spill file " + file, e);
        }
        int c = chunkCount[series];
        if (chunkOffsets[series] == null) {
            chunkOffsets[series] = new long[8];
            chunkLengths[series] = new int[8];
        } else if (c == chunkOffsets[series].length) {
            chunkOffsets[series] = Arrays.copyOf(chunkOffsets[series], c * 2);
            chunkLengths[series] = Arrays.copyOf(chunkLengths[series], c * 2);
        }
        chunkOffsets[series][c] = fileEnd;
        chunkLengths[series][c] = n;
        chunkCount[series] = c + 1;
        fileEnd += n * 12L;
        bufferFill[series] = 0;
    }

    /** Reads one series back; thread-safe after {@link #finish}. */
    Samples read(int series) {
        long total = sampleCount[series];
        if (total > Integer.MAX_VALUE - 8) {
            throw new IllegalStateException("series too long to load: " + total + " samples");
        }
        long[] times = new long[(int) total];
        double[] values = new double[(int) total];
        int filled = 0;
        ByteBuffer buffer = ByteBuffer.allocate(chunkSamples * 12).order(ByteOrder.LITTLE_ENDIAN);
        int[] relative = new int[chunkSamples];
        for (int c = 0; c < chunkCount[series]; c++) {
            int n = chunkLengths[series][c];
            buffer.clear().limit(n * 12);
            long position = chunkOffsets[series][c];
            try {
                while (buffer.hasRemaining()) {
                    int read = channel.read(buffer, position);
                    if (read < 0) {
                        throw new IOException("unexpected end of spill file");
                    }
                    position += read;
                }
            } catch (IOException e) {
                throw new UncheckedIOException("cannot read trend spill file " + file, e);
            }
            buffer.flip();
            buffer.asIntBuffer().get(relative, 0, n);
            buffer.position(n * 4);
            buffer.asDoubleBuffer().get(values, filled, n);
            for (int i = 0; i < n; i++) {
                times[filled + i] = baseEpochSecond + relative[i];
            }
            filled += n;
        }
        return new Samples(times, values);
    }

    @Override
    public void close() {
        try {
            if (cleanup != null) {
                try {
                    Runtime.getRuntime().removeShutdownHook(cleanup);
                } catch (IllegalStateException stopping) {
                    // the hook is running or about to: it deletes the file
                }
            }
            channel.close();
            Files.deleteIfExists(file);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot delete trend spill file " + file, e);
        }
    }
}
