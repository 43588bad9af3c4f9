package org.tufa.analysis.tables;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.parquet.bytes.BytesInput;
import org.apache.parquet.column.ColumnDescriptor;
import org.apache.parquet.column.page.DataPage;
import org.apache.parquet.column.page.DataPageV1;
import org.apache.parquet.column.page.DataPageV2;
import org.apache.parquet.column.page.DictionaryPage;
import org.apache.parquet.column.page.PageReadStore;
import org.apache.parquet.column.page.PageReader;
import org.apache.parquet.compression.CompressionCodecFactory;
import org.apache.parquet.example.data.Group;
import org.apache.parquet.example.data.simple.convert.GroupRecordConverter;
import org.apache.parquet.format.PageHeader;
import org.apache.parquet.format.Util;
import org.apache.parquet.format.converter.ParquetMetadataConverter;
import org.apache.parquet.hadoop.metadata.BlockMetaData;
import org.apache.parquet.hadoop.metadata.ColumnChunkMetaData;
import org.apache.parquet.hadoop.metadata.ParquetMetadata;
import org.apache.parquet.io.ColumnIOFactory;
import org.apache.parquet.io.MessageColumnIO;
import org.apache.parquet.io.RecordReader;
import org.apache.parquet.schema.MessageType;
import org.tufa.common.InputException;

/**
 * Reads columns of a per-sample Parquet table tufa wrote: the time and one text column ({@code tufa evaluate} on a
 * unit's {@code modes.parquet}), or the time and number columns ({@code tufa labels} on {@code features.parquet} and
 * {@code reachability.parquet}).
 *
 * <p>parquet-java's file reader cannot be built without Hadoop on the class path (its read options load Hadoop's
 * input-format classes), so this reads the footer and the two column chunks itself: the footer with parquet-java's
 * metadata converter, the page headers with parquet-format's Thrift reader, the pages with {@link GzipCodecs}; the
 * values are then decoded by parquet-column's record reader, as in any Parquet reader. Only what tufa writes is
 * supported: data pages of format version 1 or 2, GZIP or no compression.
 */
public final class SampleTableReader {

    /** Times and texts of a table, in row order. */
    public record TimedTexts(List<Instant> times, List<String> texts) {
        public TimedTexts {
            times = List.copyOf(times);
            texts = List.copyOf(texts);
        }
    }

    private static final byte[] MAGIC = {'P', 'A', 'R', '1'};

    private SampleTableReader() {
    }

    /**
     * @param file a {@code .parquet} table
     * @throws InputException when the file is missing, unreadable or lacks the columns
     */
    public static TimedTexts read(Path file, String timeColumn, String textColumn) {
        synchronized (org.apache.parquet.hadoop.metadata.ColumnPath.class) { // see ParquetSampleTable
            return readLocked(file, timeColumn, textColumn);
        }
    }

    /** A time column, number columns and text columns of a table, in row order (integers read as doubles). */
    public record TimedColumns(Instant[] times, double[][] numbers, String[][] texts) {
        public int size() {
            return times.length;
        }
    }

    /**
     * @param file a {@code .parquet} table
     * @param numberColumns columns of kind REAL, SINGLE or INTEGER
     * @param textColumns columns of kind TEXT
     * @throws InputException when the file is missing, unreadable or lacks the columns
     */
    public static TimedColumns readColumns(Path file, String timeColumn, List<String> numberColumns,
                                           List<String> textColumns) {
        List<String> names = new ArrayList<>();
        names.add(timeColumn);
        names.addAll(numberColumns);
        names.addAll(textColumns);
        int numbers = numberColumns.size();
        List<Instant> times = new ArrayList<>();
        List<double[]> rows = new ArrayList<>();
        List<String[]> texts = new ArrayList<>();
        synchronized (org.apache.parquet.hadoop.metadata.ColumnPath.class) { // see ParquetSampleTable
            readLocked(file, names, (g, schema) -> {
                times.add(Instant.ofEpochMilli(g.getLong(0, 0)));
                double[] v = new double[numbers];
                for (int j = 0; j < numbers; j++) {
                    v[j] = switch (schema.getType(j + 1).asPrimitiveType().getPrimitiveTypeName()) {
                        case INT32 -> g.getInteger(j + 1, 0);
                        case FLOAT -> g.getFloat(j + 1, 0);
                        default -> g.getDouble(j + 1, 0);
                    };
                }
                rows.add(v);
                String[] t = new String[textColumns.size()];
                for (int j = 0; j < t.length; j++) {
                    t[j] = g.getString(1 + numbers + j, 0);
                }
                texts.add(t);
            });
        }
        int n = rows.size();
        double[][] numberColumnsOut = new double[numbers][n];
        String[][] textColumnsOut = new String[textColumns.size()][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < numbers; j++) {
                numberColumnsOut[j][i] = rows.get(i)[j];
            }
            for (int j = 0; j < textColumnsOut.length; j++) {
                textColumnsOut[j][i] = texts.get(i)[j];
            }
        }
        return new TimedColumns(times.toArray(Instant[]::new), numberColumnsOut, textColumnsOut);
    }

    /** A time column and number columns of a table, in row order (integers read as doubles). */
    public record TimedNumbers(Instant[] times, double[][] columns) {
        public int size() {
            return times.length;
        }
    }

    /**
     * @param file a {@code .parquet} table
     * @param numberColumns columns of kind REAL or INTEGER
     * @throws InputException when the file is missing, unreadable or lacks the columns
     */
    public static TimedNumbers readNumbers(Path file, String timeColumn, List<String> numberColumns) {
        TimedColumns c = readColumns(file, timeColumn, numberColumns, List.of());
        return new TimedNumbers(c.times(), c.numbers());
    }

    private interface RowHandler {
        /** One row of the projection, its columns in the order asked for. */
        void accept(Group row, MessageType projection);
    }

    private static TimedTexts readLocked(Path file, String timeColumn, String textColumn) {
        List<Instant> times = new ArrayList<>();
        List<String> texts = new ArrayList<>();
        readLocked(file, List.of(timeColumn, textColumn), (g, schema) -> {
            times.add(Instant.ofEpochMilli(g.getLong(0, 0)));
            texts.add(g.getString(1, 0));
        });
        return new TimedTexts(times, texts);
    }

    private static void readLocked(Path file, List<String> columns, RowHandler handler) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "file not found; pass the directory the analysis wrote");
        }
        try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
            ParquetMetadata footer = footer(channel, file);
            MessageType schema = footer.getFileMetaData().getSchema();
            List<String> missing = columns.stream().filter(c -> !schema.containsField(c)).toList();
            if (!missing.isEmpty()) {
                throw InputException.in(file, "lacks column(s) " + String.join(", ", missing)
                        + "; is it a table tufa analyze wrote?");
            }
            MessageType projection = new MessageType(schema.getName(), columns.stream().map(schema::getType)
                    .toList());
            MessageColumnIO io = new ColumnIOFactory().getColumnIO(projection, schema);
            GzipCodecs codecs = new GzipCodecs();
            for (BlockMetaData block : footer.getBlocks()) {
                Pages pages = new Pages(block.getRowCount());
                for (ColumnChunkMetaData chunk : block.getColumns()) {
                    String name = chunk.getPath().toDotString();
                    if (columns.contains(name)) {
                        pages.add(projection.getColumnDescription(new String[] {name}),
                                chunkPages(channel, chunk, codecs));
                    }
                }
                RecordReader<Group> records = io.getRecordReader(pages, new GroupRecordConverter(projection));
                for (long i = 0; i < block.getRowCount(); i++) {
                    handler.accept(records.read(), projection);
                }
            }
            codecs.release();
        } catch (IOException | RuntimeException e) {
            if (e instanceof InputException ie) {
                throw ie;
            }
            throw InputException.in(file, "is not a readable Parquet table (" + e.getClass().getSimpleName()
                    + (e.getMessage() == null ? "" : ": " + e.getMessage().lines().findFirst().orElse(""))
                    + "); rerun tufa analyze to write it again");
        }
    }

    /** The footer: the file ends with the metadata, its length (4 bytes, little-endian) and "PAR1". */
    private static ParquetMetadata footer(FileChannel channel, Path file) throws IOException {
        long size = channel.size();
        if (size < 12) {
            throw InputException.in(file, "is too short to be a Parquet file; rerun tufa analyze to write it again");
        }
        ByteBuffer tail = read(channel, size - 8, 8).order(ByteOrder.LITTLE_ENDIAN);
        int length = tail.getInt();
        byte[] magic = new byte[4];
        tail.get(magic);
        if (!java.util.Arrays.equals(magic, MAGIC) || length <= 0 || length > size - 12) {
            throw InputException.in(file, "does not end like a Parquet file; rerun tufa analyze to write it again");
        }
        ByteBuffer meta = read(channel, size - 8 - length, length);
        return new ParquetMetadataConverter().fromParquetMetadata(
                Util.readFileMetaData(new ByteArrayInputStream(meta.array())));
    }

    private static ByteBuffer read(FileChannel channel, long position, int length) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(length);
        while (b.hasRemaining()) {
            if (channel.read(b, position + b.position()) < 0) {
                throw new IOException("unexpected end of file");
            }
        }
        return b.flip();
    }

    /** The pages of one column chunk, decompressed. */
    private static ChunkPages chunkPages(FileChannel channel, ColumnChunkMetaData chunk, GzipCodecs codecs)
            throws IOException {
        ByteBuffer bytes = read(channel, chunk.getStartingPos(), Math.toIntExact(chunk.getTotalSize()));
        InputStream in = new ByteArrayInputStream(bytes.array());
        CompressionCodecFactory.BytesInputDecompressor decompressor = codecs.getDecompressor(chunk.getCodec());
        ParquetMetadataConverter converter = new ParquetMetadataConverter();
        DictionaryPage dictionary = null;
        ArrayDeque<DataPage> data = new ArrayDeque<>();
        long values = 0;
        while (values < chunk.getValueCount()) {
            PageHeader header = Util.readPageHeader(in);
            switch (header.getType()) {
                case DICTIONARY_PAGE -> dictionary = new DictionaryPage(whole(in, header, decompressor),
                        header.getDictionary_page_header().getNum_values(),
                        converter.getEncoding(header.getDictionary_page_header().getEncoding()));
                case DATA_PAGE -> {
                    BytesInput page = whole(in, header, decompressor);
                    var h = header.getData_page_header();
                    data.add(new DataPageV1(page, h.getNum_values(), header.getUncompressed_page_size(), null,
                            converter.getEncoding(h.getRepetition_level_encoding()),
                            converter.getEncoding(h.getDefinition_level_encoding()),
                            converter.getEncoding(h.getEncoding())));
                    values += h.getNum_values();
                }
                case DATA_PAGE_V2 -> {
                    // Version 2: repetition and definition levels stored first and never compressed; then the values.
                    var h = header.getData_page_header_v2();
                    byte[] raw = in.readNBytes(header.getCompressed_page_size());
                    int levels = h.getRepetition_levels_byte_length() + h.getDefinition_levels_byte_length();
                    BytesInput valuesPart = BytesInput.from(raw, levels, raw.length - levels);
                    if (h.isIs_compressed()) {
                        valuesPart = decompressor.decompress(valuesPart, header.getUncompressed_page_size() - levels);
                    }
                    data.add(DataPageV2.uncompressed(h.getNum_rows(), h.getNum_nulls(), h.getNum_values(),
                            BytesInput.from(raw, 0, h.getRepetition_levels_byte_length()),
                            BytesInput.from(raw, h.getRepetition_levels_byte_length(),
                                    h.getDefinition_levels_byte_length()),
                            converter.getEncoding(h.getEncoding()), valuesPart, null));
                    values += h.getNum_values();
                }
                default -> throw new IOException("page type " + header.getType() + " is not one tufa writes");
            }
        }
        return new ChunkPages(dictionary, data, chunk.getValueCount());
    }

    /** A page compressed as a whole (dictionary and version 1 data pages), decompressed. */
    private static BytesInput whole(InputStream in, PageHeader header,
                                    CompressionCodecFactory.BytesInputDecompressor decompressor) throws IOException {
        return decompressor.decompress(BytesInput.from(in.readNBytes(header.getCompressed_page_size())),
                header.getUncompressed_page_size());
    }

    private record ChunkPages(DictionaryPage dictionary, ArrayDeque<DataPage> data, long valueCount)
            implements PageReader {
        @Override
        public DictionaryPage readDictionaryPage() {
            return dictionary;
        }

        @Override
        public long getTotalValueCount() {
            return valueCount;
        }

        @Override
        public DataPage readPage() {
            return data.poll();
        }
    }

    /** The pages of one row group, by column. */
    private static final class Pages implements PageReadStore {
        private final long rows;
        private final Map<ColumnDescriptor, PageReader> readers = new HashMap<>();

        Pages(long rows) {
            this.rows = rows;
        }

        void add(ColumnDescriptor column, PageReader reader) {
            readers.put(column, reader);
        }

        @Override
        public PageReader getPageReader(ColumnDescriptor column) {
            return readers.get(column);
        }

        @Override
        public long getRowCount() {
            return rows;
        }
    }
}
