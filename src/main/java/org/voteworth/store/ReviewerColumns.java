package org.voteworth.store;

import java.util.TreeMap;
import org.apache.parquet.hadoop.api.ReadSupport;
import org.apache.parquet.io.api.Binary;
import org.apache.parquet.io.api.Converter;
import org.apache.parquet.io.api.GroupConverter;
import org.apache.parquet.io.api.PrimitiveConverter;
import org.apache.parquet.io.api.RecordMaterializer;
import org.apache.parquet.schema.MessageType;
import org.apache.parquet.schema.MessageTypeParser;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.StarCounts;

/**
 * The columns of {@code reviewers.parquet}: the reviewer table CSV's columns without the derived
 * shares, categories as a standard three-level list of (category, reviews).
 */
final class ReviewerColumns {
    /** The whole-number columns after reviewer_id, in order. */
    private static final String[] COUNTS = {"reviews", "helpful_votes", "total_votes", "voted_reviews", "majority_reviews",
            "max_review_votes", "sum_squared_votes", "verified", "incentivised", "stars_1", "stars_2", "stars_3", "stars_4",
            "stars_5"};
    private static final int FIRST_DATE = 1 + COUNTS.length;
    private static final int CATEGORIES = FIRST_DATE + 2;

    static final MessageType SCHEMA;

    static {
        StringBuilder s = new StringBuilder("message reviewer {\n  required binary reviewer_id (STRING);\n");
        for (String c : COUNTS) {
            s.append("  required int64 ").append(c).append(";\n");
        }
        s.append("""
                  optional int32 first_date (DATE);
                  optional int32 last_date (DATE);
                  required group categories (LIST) {
                    repeated group list {
                      required group element {
                        required binary category (STRING);
                        required int64 reviews;
                      }
                    }
                  }
                }""");
        SCHEMA = MessageTypeParser.parseMessageType(s.toString());
    }

    private ReviewerColumns() {
    }

    private static long[] counts(ReviewerTally t) {
        StarCounts st = t.stars();
        return new long[] {t.reviews(), t.helpfulVotes(), t.totalVotes(), t.votedReviews(), t.majorityReviews(),
                t.maxReviewVotes(), t.sumSquaredVotes(), t.verified(), t.incentivised(), st.one(), st.two(), st.three(),
                st.four(), st.five()};
    }

    static final class Writing extends ParquetFiles.Writing<ReviewerTally> {
        Writing() {
            super(SCHEMA);
        }

        @Override
        public void write(ReviewerTally t) {
            rc.startMessage();
            rc.startField("reviewer_id", 0);
            rc.addBinary(Binary.fromString(t.id()));
            rc.endField("reviewer_id", 0);
            long[] c = counts(t);
            for (int i = 0; i < c.length; i++) {
                rc.startField(COUNTS[i], i + 1);
                rc.addLong(c[i]);
                rc.endField(COUNTS[i], i + 1);
            }
            day("first_date", FIRST_DATE, t.firstDay());
            day("last_date", FIRST_DATE + 1, t.lastDay());
            rc.startField("categories", CATEGORIES);
            rc.startGroup();
            if (!t.reviewsByCategory().isEmpty()) {
                rc.startField("list", 0);
                t.reviewsByCategory().forEach((name, n) -> {
                    rc.startGroup();
                    rc.startField("element", 0);
                    rc.startGroup();
                    rc.startField("category", 0);
                    rc.addBinary(Binary.fromString(name));
                    rc.endField("category", 0);
                    rc.startField("reviews", 1);
                    rc.addLong(n);
                    rc.endField("reviews", 1);
                    rc.endGroup();
                    rc.endField("element", 0);
                    rc.endGroup();
                });
                rc.endField("list", 0);
            }
            rc.endGroup();
            rc.endField("categories", CATEGORIES);
            rc.endMessage();
        }

        private void day(String name, int index, int day) {
            if (day == ReviewerTally.NO_DATE) {
                return;
            }
            rc.startField(name, index);
            rc.addInteger(day);
            rc.endField(name, index);
        }
    }

    static ReadSupport<ReviewerTally> reading() {
        return new ParquetFiles.Reading<>(SCHEMA, Materializer::new);
    }

    private static final class Materializer extends RecordMaterializer<ReviewerTally> {
        private String id;
        private final long[] n = new long[COUNTS.length];
        private int first;
        private int last;
        private TreeMap<String, Long> cats;
        private String catName;
        private long catReviews;
        private ReviewerTally current;
        private final Converter[] fields = new Converter[CATEGORIES + 1];
        private final GroupConverter root = new GroupConverter() {
            @Override
            public Converter getConverter(int fieldIndex) {
                return fields[fieldIndex];
            }

            @Override
            public void start() {
                first = ReviewerTally.NO_DATE;
                last = ReviewerTally.NO_DATE;
                cats = new TreeMap<>();
            }

            @Override
            public void end() {
                current = new ReviewerTally(id, n[0], n[1], n[2], n[3], n[4], n[5], n[6], n[7], n[8],
                        new StarCounts(n[9], n[10], n[11], n[12], n[13]), cats, first, last);
            }
        };

        Materializer() {
            fields[0] = new PrimitiveConverter() {
                @Override
                public void addBinary(Binary value) {
                    id = value.toStringUsingUTF8();
                }
            };
            for (int i = 0; i < COUNTS.length; i++) {
                int k = i;
                fields[i + 1] = new PrimitiveConverter() {
                    @Override
                    public void addLong(long value) {
                        n[k] = value;
                    }
                };
            }
            fields[FIRST_DATE] = new PrimitiveConverter() {
                @Override
                public void addInt(int value) {
                    first = value;
                }
            };
            fields[FIRST_DATE + 1] = new PrimitiveConverter() {
                @Override
                public void addInt(int value) {
                    last = value;
                }
            };
            PrimitiveConverter name = new PrimitiveConverter() {
                @Override
                public void addBinary(Binary value) {
                    catName = value.toStringUsingUTF8();
                }
            };
            PrimitiveConverter reviews = new PrimitiveConverter() {
                @Override
                public void addLong(long value) {
                    catReviews = value;
                }
            };
            GroupConverter element = new Group(i -> i == 0 ? name : reviews) {
                @Override
                public void end() {
                    cats.merge(catName, catReviews, Long::sum);
                }
            };
            GroupConverter list = new Group(i -> element);
            fields[CATEGORIES] = new Group(i -> list);
        }

        @Override
        public ReviewerTally getCurrentRecord() {
            return current;
        }

        @Override
        public GroupConverter getRootConverter() {
            return root;
        }
    }

    private static class Group extends GroupConverter {
        private final java.util.function.IntFunction<Converter> children;

        Group(java.util.function.IntFunction<Converter> children) {
            this.children = children;
        }

        @Override
        public Converter getConverter(int fieldIndex) {
            return children.apply(fieldIndex);
        }

        @Override
        public void start() {
        }

        @Override
        public void end() {
        }
    }
}
