package org.voteworth.spark;

import java.util.Iterator;
import java.util.NoSuchElementException;
import org.apache.spark.api.java.function.MapPartitionsFunction;
import org.apache.spark.sql.Row;
import org.voteworth.tally.ReviewerTally;

/**
 * Reduces a partition of partial tallies sorted by reviewer id to one tally per reviewer with
 * {@link ReviewerTally#merge}, streaming: it holds one reviewer at a time, so a reduce task needs
 * no more memory for a large partition than for a small one.
 */
final class TallyMerge implements MapPartitionsFunction<Row, Row> {
    private static final long serialVersionUID = 1L;

    @Override
    public Iterator<Row> call(Iterator<Row> sorted) {
        return new Iterator<>() {
            private ReviewerTally pending = sorted.hasNext() ? TallyRows.tally(sorted.next()) : null;

            @Override
            public boolean hasNext() {
                return pending != null;
            }

            @Override
            public Row next() {
                if (pending == null) {
                    throw new NoSuchElementException();
                }
                ReviewerTally t = pending;
                pending = null;
                while (sorted.hasNext()) {
                    ReviewerTally n = TallyRows.tally(sorted.next());
                    if (!n.id().equals(t.id())) {
                        pending = n;
                        break;
                    }
                    t = t.merge(n);
                }
                return TallyRows.row(t);
            }
        };
    }
}
