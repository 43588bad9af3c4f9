package org.tufa.analysis.tables;

import java.io.IOException;
import java.util.HashMap;
import java.util.List;
import org.apache.hadoop.conf.Configuration;
import org.apache.parquet.column.ParquetProperties;
import org.apache.parquet.hadoop.metadata.ColumnPath;
import org.apache.parquet.conf.ParquetConfiguration;
import org.apache.parquet.conf.PlainParquetConfiguration;
import org.apache.parquet.hadoop.ParquetFileWriter;
import org.apache.parquet.hadoop.ParquetWriter;
import org.apache.parquet.hadoop.api.WriteSupport;
import org.apache.parquet.hadoop.metadata.CompressionCodecName;
import org.apache.parquet.io.OutputFile;
import org.apache.parquet.io.api.Binary;
import org.apache.parquet.io.api.RecordConsumer;
import org.apache.parquet.schema.LogicalTypeAnnotation;
import org.apache.parquet.schema.MessageType;
import org.apache.parquet.schema.PrimitiveType.PrimitiveTypeName;
import org.apache.parquet.schema.Types;

/**
 * A per-sample table as an Apache Parquet file: one row group, typed columns (see {@link SampleColumn.Kind}),
 * dictionary encoding where it pays (mode names, cluster labels), gzip-compressed pages. Data pages of format
 * version 2, for their delta encoding of whole numbers: a time column on a 15-minute grid takes 0.01 byte a row
 * instead of 3.4 with version 1 pages and gzip (demo summer); pyarrow (pandas), DuckDB and Spark (3.3 and later)
 * read them. Written with parquet-java's record writer on a plain stream ({@link StreamOutputFile}): no Hadoop.
 */
final class ParquetSampleTable implements SampleTable {

    private final List<SampleColumn> columns;
    private final ParquetWriter<Row> writer;
    private final Row row;

    /** The values of the row being written, by column position. */
    static final class Row {
        final long[] longs;
        final double[] doubles;
        final Object[] objects;
        final boolean[] present;
        int next;

        Row(int n) {
            longs = new long[n];
            doubles = new double[n];
            objects = new Object[n];
            present = new boolean[n];
        }
    }

    ParquetSampleTable(OutputFile file, List<SampleColumn> columns) throws IOException {
        this.columns = List.copyOf(columns);
        this.row = new Row(columns.size());
        // parquet-java interns column paths in a static map that is not thread-safe, and looks the per-column
        // settings up by those paths: two writers built at once on two threads could lose the dictionary settings
        // and write other (equally valid) bytes. Building writers one at a time keeps the files the same bytes
        // whatever the thread count.
        ParquetWriter<Row> writer;
        synchronized (ColumnPath.class) {
            MessageType schema = schema(columns);
            Builder builder = new Builder(file, schema, this.columns)
                    .withConf(new PlainParquetConfiguration())
                    .withCodecFactory(new GzipCodecs())
                    .withCompressionCodec(CompressionCodecName.GZIP)
                    .withWriterVersion(ParquetProperties.WriterVersion.PARQUET_2_0)
                    .withWriteMode(ParquetFileWriter.Mode.OVERWRITE);
            // A dictionary pays for mode names and cluster labels. Times and measured doubles are nearly all
            // distinct: on the demo summer a dictionary for the doubles gave the same 24 MB and only cost time,
            // and on the 500-unit year's features 117 MB against 112. BYTE_STREAM_SPLIT for the doubles made
            // those features 197 MB (gzip at level 1 finds fewer repeats in the split byte streams).
            // Min/max statistics are kept for the time column (readers skip pages by time with them), not for the
            // others: they cost writing time and no reader of these tables filters on a feature's range.
            builder.withPageWriteChecksumEnabled(false).withSizeStatisticsEnabled(false).withStatisticsEnabled(false);
            for (SampleColumn c : columns) {
                builder.withDictionaryEncoding(c.name(), c.kind() == SampleColumn.Kind.TEXT
                        || c.kind() == SampleColumn.Kind.INTEGER);
                if (c.kind() == SampleColumn.Kind.TIME) {
                    builder.withStatisticsEnabled(c.name(), true);
                }
            }
            writer = builder.build();
        }
        this.writer = writer;
    }

    static MessageType schema(List<SampleColumn> columns) {
        Types.MessageTypeBuilder b = Types.buildMessage();
        for (SampleColumn c : columns) {
            switch (c.kind()) {
                case TIME -> b.required(PrimitiveTypeName.INT64)
                        .as(LogicalTypeAnnotation.timestampType(true, LogicalTypeAnnotation.TimeUnit.MILLIS))
                        .named(c.name());
                case TEXT -> b.required(PrimitiveTypeName.BINARY).as(LogicalTypeAnnotation.stringType())
                        .named(c.name());
                case FLAG -> b.optional(PrimitiveTypeName.BOOLEAN).named(c.name());
                case REAL -> b.required(PrimitiveTypeName.DOUBLE).named(c.name());
                case SINGLE -> b.required(PrimitiveTypeName.FLOAT).named(c.name());
                case INTEGER -> b.required(PrimitiveTypeName.INT32).named(c.name());
                default -> throw new IllegalStateException(c.kind().toString());
            }
        }
        return b.named("tufa_samples");
    }

    @Override
    public void time(long epochSecond, String text) {
        row.longs[row.next] = epochSecond * 1000;
        row.present[row.next++] = true;
    }

    @Override
    public void text(String value) {
        row.objects[row.next] = value;
        row.present[row.next++] = true;
    }

    @Override
    public void flag(Boolean value) {
        row.objects[row.next] = value;
        row.present[row.next++] = value != null;
    }

    @Override
    public void real(double value) {
        row.doubles[row.next] = value;
        row.present[row.next++] = true;
    }

    @Override
    public void single(double value) {
        row.doubles[row.next] = (float) value;
        row.present[row.next++] = true;
    }

    @Override
    public void integer(int value) {
        row.longs[row.next] = value;
        row.present[row.next++] = true;
    }

    @Override
    public void endRow() throws IOException {
        if (row.next != columns.size()) {
            throw new IllegalStateException("row has " + row.next + " values for " + columns.size() + " columns");
        }
        writer.write(row);
        row.next = 0;
    }

    @Override
    public void close() throws IOException {
        synchronized (ColumnPath.class) { // the footer's column paths go through the same static map
            writer.close();
        }
    }

    /** Hands rows to parquet-java's record consumer, column by column. */
    private static final class RowWriteSupport extends WriteSupport<Row> {
        private final MessageType schema;
        private final List<SampleColumn> columns;
        private RecordConsumer consumer;
        /** Encoded text values: a per-sample text column holds a handful of mode names. */
        private final java.util.Map<String, Binary> texts = new HashMap<>();

        RowWriteSupport(MessageType schema, List<SampleColumn> columns) {
            this.schema = schema;
            this.columns = columns;
        }

        @Override
        public WriteContext init(Configuration configuration) {
            return new WriteContext(schema, new HashMap<>());
        }

        @Override
        public WriteContext init(ParquetConfiguration configuration) {
            return new WriteContext(schema, new HashMap<>());
        }

        @Override
        public void prepareForWrite(RecordConsumer recordConsumer) {
            this.consumer = recordConsumer;
        }

        @Override
        public void write(Row r) {
            consumer.startMessage();
            for (int i = 0; i < columns.size(); i++) {
                if (!r.present[i]) {
                    continue;
                }
                SampleColumn c = columns.get(i);
                consumer.startField(c.name(), i);
                switch (c.kind()) {
                    case TIME -> consumer.addLong(r.longs[i]);
                    case TEXT -> consumer.addBinary(texts.computeIfAbsent((String) r.objects[i], Binary::fromString));
                    case FLAG -> consumer.addBoolean((Boolean) r.objects[i]);
                    case REAL -> consumer.addDouble(r.doubles[i]);
                    case SINGLE -> consumer.addFloat((float) r.doubles[i]);
                    case INTEGER -> consumer.addInteger((int) r.longs[i]);
                    default -> throw new IllegalStateException(c.kind().toString());
                }
                consumer.endField(c.name(), i);
            }
            consumer.endMessage();
        }
    }

    /** The writer builder for a local file and our write support. */
    private static final class Builder extends ParquetWriter.Builder<Row, Builder> {
        private final MessageType schema;
        private final List<SampleColumn> columns;

        Builder(OutputFile file, MessageType schema, List<SampleColumn> columns) {
            super(file);
            this.schema = schema;
            this.columns = columns;
        }

        @Override
        protected Builder self() {
            return this;
        }

        @Override
        protected WriteSupport<Row> getWriteSupport(Configuration configuration) {
            return new RowWriteSupport(schema, columns);
        }

        @Override
        protected WriteSupport<Row> getWriteSupport(ParquetConfiguration configuration) {
            return new RowWriteSupport(schema, columns);
        }
    }
}
