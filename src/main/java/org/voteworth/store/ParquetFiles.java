package org.voteworth.store;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;
import org.apache.parquet.conf.PlainParquetConfiguration;
import org.apache.parquet.filter2.compat.FilterCompat;
import org.apache.parquet.hadoop.ParquetFileWriter;
import org.apache.parquet.hadoop.ParquetReader;
import org.apache.parquet.hadoop.ParquetWriter;
import org.apache.parquet.hadoop.api.InitContext;
import org.apache.parquet.hadoop.api.ReadSupport;
import org.apache.parquet.hadoop.api.WriteSupport;
import org.apache.parquet.hadoop.metadata.CompressionCodecName;
import org.apache.parquet.io.LocalOutputFile;
import org.apache.parquet.io.api.RecordConsumer;
import org.apache.parquet.io.api.RecordMaterializer;
import org.apache.parquet.schema.MessageType;

/** Opens the store's Parquet files on the local file system, without a Hadoop configuration. */
final class ParquetFiles {
    /**
     * Row groups of about this many buffered bytes: some 64k reviews, so that a reviewer's rows lie
     * in one or two groups and the min/max statistics of reviewer_id let a lookup skip the rest.
     */
    static final long ROW_GROUP_BYTES = 4L << 20;
    /** Pages of at most this many rows: the column index then skips most of a row group as well. */
    private static final int PAGE_ROWS = 2048;
    private static final ZstdCodecs CODECS = new ZstdCodecs();

    private ParquetFiles() {
    }

    static <T> ParquetWriter<T> writer(Path file, WriteSupport<T> support) throws IOException {
        WriterBuilder<T> b = new WriterBuilder<>(file, support);
        // Ids are nearly all distinct: a dictionary would only be built to be dropped. Categories and files keep theirs.
        for (String column : List.of("reviewer_id", "review_id", "item_id")) {
            b.withDictionaryEncoding(column, false);
        }
        return b.withConf(new PlainParquetConfiguration()).withCodecFactory(CODECS)
                .withCompressionCodec(CompressionCodecName.ZSTD).withWriteMode(ParquetFileWriter.Mode.OVERWRITE)
                .withRowGroupSize(ROW_GROUP_BYTES).withPageRowCountLimit(PAGE_ROWS).withPageWriteChecksumEnabled(true).build();
    }

    static <T> ParquetReader<T> reader(Path file, ReadSupport<T> support, FilterCompat.Filter filter) throws IOException {
        return new ReaderBuilder<>(file, support).withCodecFactory(CODECS).withFilter(filter).usePageChecksumVerification(true)
                // Row groups and pages are skipped by statistics; rows of other reviewers are skipped by the read support.
                .useRecordFilter(false).build();
    }

    /** Writes rows of one schema; a subclass emits each record through {@link #rc}. */
    abstract static class Writing<T> extends WriteSupport<T> {
        private final MessageType schema;
        RecordConsumer rc;

        Writing(MessageType schema) {
            this.schema = schema;
        }

        @Override
        public WriteContext init(org.apache.hadoop.conf.Configuration configuration) {
            return new WriteContext(schema, Map.of());
        }

        @Override
        public WriteContext init(org.apache.parquet.conf.ParquetConfiguration configuration) {
            return new WriteContext(schema, Map.of());
        }

        @Override
        public void prepareForWrite(RecordConsumer recordConsumer) {
            rc = recordConsumer;
        }
    }

    /** Reads rows of one schema into what a fresh materializer from {@code materializer} builds. */
    static final class Reading<T> extends ReadSupport<T> {
        private final MessageType schema;
        private final Supplier<RecordMaterializer<T>> materializer;

        Reading(MessageType schema, Supplier<RecordMaterializer<T>> materializer) {
            this.schema = schema;
            this.materializer = materializer;
        }

        @Override
        public ReadContext init(InitContext context) {
            return new ReadContext(schema);
        }

        @Override
        public RecordMaterializer<T> prepareForRead(org.apache.hadoop.conf.Configuration configuration,
                                                    Map<String, String> keyValueMetaData, MessageType fileSchema,
                                                    ReadContext readContext) {
            return materializer.get();
        }

        @Override
        public RecordMaterializer<T> prepareForRead(org.apache.parquet.conf.ParquetConfiguration configuration,
                                                    Map<String, String> keyValueMetaData, MessageType fileSchema,
                                                    ReadContext readContext) {
            return materializer.get();
        }
    }

    private static final class WriterBuilder<T> extends ParquetWriter.Builder<T, WriterBuilder<T>> {
        private final WriteSupport<T> support;

        WriterBuilder(Path file, WriteSupport<T> support) {
            super(new LocalOutputFile(file));
            this.support = support;
        }

        @Override
        protected WriterBuilder<T> self() {
            return this;
        }

        @Override
        protected WriteSupport<T> getWriteSupport(org.apache.hadoop.conf.Configuration conf) {
            return support;
        }

        @Override
        protected WriteSupport<T> getWriteSupport(org.apache.parquet.conf.ParquetConfiguration conf) {
            return support;
        }
    }

    private static final class ReaderBuilder<T> extends ParquetReader.Builder<T> {
        private final ReadSupport<T> support;

        ReaderBuilder(Path file, ReadSupport<T> support) throws IOException {
            super(MappedInputFile.of(file), new PlainParquetConfiguration());
            this.support = support;
        }

        @Override
        protected ReadSupport<T> getReadSupport() {
            return support;
        }
    }
}
