package org.voteworth.store;

import java.util.List;
import org.apache.parquet.hadoop.api.ReadSupport;
import org.apache.parquet.io.api.Binary;
import org.apache.parquet.io.api.Converter;
import org.apache.parquet.io.api.GroupConverter;
import org.apache.parquet.io.api.PrimitiveConverter;
import org.apache.parquet.io.api.RecordMaterializer;
import org.apache.parquet.schema.MessageType;
import org.apache.parquet.schema.MessageTypeParser;
import org.voteworth.source.ReviewRow;

/** The columns of {@code reviews/part-NNNNN.parquet}: how a {@link ReviewRecord} is written and a {@link StoredReview} read. */
final class ReviewColumns {
    static final MessageType SCHEMA = MessageTypeParser.parseMessageType("""
            message review {
              required binary reviewer_id (STRING);
              optional binary review_id (STRING);
              optional binary item_id (STRING);
              required binary category (STRING);
              optional int32 stars;
              required int64 helpful_votes;
              required int64 total_votes;
              optional boolean verified;
              optional boolean incentivised;
              optional int32 review_date (DATE);
              required binary file (STRING);
              required int64 line;
            }""");

    private ReviewColumns() {
    }

    /** Where a record to write sits. */
    static final class Cursor {
        byte[] b;
        int at;
    }

    /** Writes records; category and file numbers become names, piece lines become file lines. */
    static final class Writing extends ParquetFiles.Writing<Cursor> {
        private final List<String> categories;
        private final List<String> files;
        private final LineBases lines;

        Writing(List<String> categories, List<String> files, LineBases lines) {
            super(SCHEMA);
            this.categories = categories;
            this.files = files;
            this.lines = lines;
        }

        @Override
        public void write(Cursor c) {
            byte[] b = c.b;
            int at = c.at;
            rc.startMessage();
            int id = ReviewRecord.reviewerAt(at);
            bytes(0, "reviewer_id", b, id);
            id = ReviewRecord.next(b, id);
            bytes(1, "review_id", b, id);
            id = ReviewRecord.next(b, id);
            bytes(2, "item_id", b, id);
            int tail = ReviewRecord.next(b, id);
            rc.startField("category", 3);
            rc.addBinary(Binary.fromString(categories.get(ReviewRecord.category(b, tail))));
            rc.endField("category", 3);
            int stars = ReviewRecord.stars(b, tail);
            if (stars != ReviewRow.ABSENT) {
                rc.startField("stars", 4);
                rc.addInteger(stars);
                rc.endField("stars", 4);
            }
            number(5, "helpful_votes", ReviewRecord.helpful(b, tail));
            number(6, "total_votes", ReviewRecord.total(b, tail));
            flag(7, "verified", ReviewRecord.verified(b, tail));
            flag(8, "incentivised", ReviewRecord.incentivised(b, tail));
            int day = ReviewRecord.day(b, at);
            if (day != ReviewRow.NO_DATE) {
                rc.startField("review_date", 9);
                rc.addInteger(day);
                rc.endField("review_date", 9);
            }
            int file = ReviewRecord.file(b, at);
            rc.startField("file", 10);
            rc.addBinary(Binary.fromString(files.get(file)));
            rc.endField("file", 10);
            number(11, "line", lines.base(file, ReviewRecord.piece(b, at)) + ReviewRecord.line(b, at));
            rc.endMessage();
        }

        private void bytes(int index, String name, byte[] b, int idAt) {
            int len = ReviewRecord.idLength(b, idAt);
            if (len == 0 && index > 0) {
                return;
            }
            rc.startField(name, index);
            rc.addBinary(Binary.fromReusedByteArray(b, idAt + 2, len));
            rc.endField(name, index);
        }

        private void number(int index, String name, long v) {
            rc.startField(name, index);
            rc.addLong(v);
            rc.endField(name, index);
        }

        private void flag(int index, String name, int v) {
            if (v == ReviewRow.ABSENT) {
                return;
            }
            rc.startField(name, index);
            rc.addBoolean(v == 1);
            rc.endField(name, index);
        }
    }

    /** What {@link #reading} gives for a row of another reviewer than the one wanted (it does not decode the rest). */
    static final StoredReview SKIPPED = new StoredReview("", "", "", "", ReviewRow.ABSENT, 0, 0, ReviewRow.ABSENT,
            ReviewRow.ABSENT, ReviewRow.NO_DATE, "", 0);

    /** Reads rows back as {@link StoredReview} values: all of them, or those of reviewer {@code wanted} (UTF-8) and the others as {@link #SKIPPED}. */
    static ReadSupport<StoredReview> reading(Binary wanted) {
        return new ParquetFiles.Reading<>(SCHEMA, () -> new Materializer(wanted));
    }

    private static final class Materializer extends RecordMaterializer<StoredReview> {
        private final String[] text = new String[12];
        private final long[] num = new long[12];
        private final Converter[] columns = new Converter[12];
        private final Binary wanted;
        private boolean match;
        private StoredReview current;
        private final GroupConverter root = new GroupConverter() {
            @Override
            public Converter getConverter(int fieldIndex) {
                return columns[fieldIndex];
            }

            @Override
            public void start() {
                java.util.Arrays.fill(text, "");
                num[4] = ReviewRow.ABSENT;
                num[7] = ReviewRow.ABSENT;
                num[8] = ReviewRow.ABSENT;
                num[9] = ReviewRow.NO_DATE;
            }

            @Override
            public void end() {
                current = !match ? SKIPPED : new StoredReview(text[0], text[1], text[2], text[3], (int) num[4], num[5], num[6], (int) num[7],
                        (int) num[8], (int) num[9], text[10], num[11]);
            }
        };

        Materializer(Binary wanted) {
            this.wanted = wanted;
            // reviewer_id comes first in every row: the rest of another reviewer's row is not decoded.
            for (int i = 0; i < columns.length; i++) {
                int k = i;
                columns[i] = new PrimitiveConverter() {
                    @Override
                    public void addBinary(Binary value) {
                        if (k == 0) {
                            match = Materializer.this.wanted == null || Materializer.this.wanted.equals(value);
                        }
                        if (match) {
                            text[k] = value.toStringUsingUTF8();
                        }
                    }

                    @Override
                    public void addLong(long value) {
                        num[k] = value;
                    }

                    @Override
                    public void addInt(int value) {
                        num[k] = value;
                    }

                    @Override
                    public void addBoolean(boolean value) {
                        num[k] = value ? 1 : 0;
                    }
                };
            }
        }

        @Override
        public StoredReview getCurrentRecord() {
            return current;
        }

        @Override
        public GroupConverter getRootConverter() {
            return root;
        }
    }
}
