package org.voteworth.source;

import java.util.Arrays;
import java.util.EnumMap;
import java.util.Map;

/**
 * Where each {@link Field} sits in the rows of one file: a 0-based column index, or -1 when the
 * file has no such column, plus how many columns a row must have. Made by
 * {@link HeaderMapping#resolve}; immutable.
 */
public final class ColumnMapping {
    /** {@link #column(Field)} of a field the file does not have. */
    public static final int UNMAPPED = -1;

    private final int columnCount;
    private final int[] columns;

    private ColumnMapping(int columnCount, int[] columns) {
        this.columnCount = columnCount;
        this.columns = columns;
    }

    /**
     * A mapping from explicit indices, for callers that know the layout (tests, a cluster job that
     * resolved the header elsewhere). Fields not in {@code columns} are unmapped.
     *
     * @throws IllegalArgumentException if an index is outside [0, columnCount) or two fields share one
     */
    public static ColumnMapping of(int columnCount, Map<Field, Integer> columns) {
        if (columnCount < 1) {
            throw new IllegalArgumentException("a row has at least one column, got " + columnCount);
        }
        int[] c = new int[Field.values().length];
        Arrays.fill(c, UNMAPPED);
        Map<Integer, Field> seen = new java.util.HashMap<>();
        for (Map.Entry<Field, Integer> e : new EnumMap<>(columns).entrySet()) {
            int i = e.getValue();
            if (i < 0 || i >= columnCount) {
                throw new IllegalArgumentException("column " + i + " for " + e.getKey().key()
                        + " is outside 0.." + (columnCount - 1));
            }
            Field other = seen.put(i, e.getKey());
            if (other != null) {
                throw new IllegalArgumentException("fields " + other.key() + " and " + e.getKey().key()
                        + " both map to column " + i);
            }
            c[e.getKey().ordinal()] = i;
        }
        return new ColumnMapping(columnCount, c);
    }

    /** How many fields every row must have. */
    public int columnCount() {
        return columnCount;
    }

    /** The 0-based column of {@code f}, or {@link #UNMAPPED}. */
    public int column(Field f) {
        return columns[f.ordinal()];
    }

    public boolean isMapped(Field f) {
        return columns[f.ordinal()] != UNMAPPED;
    }

    /** The field each column holds (null for an unmapped column), for the parser's hot loop. */
    Field[] fieldOfColumn() {
        Field[] byColumn = new Field[columnCount];
        for (Field f : Field.values()) {
            if (isMapped(f)) {
                byColumn[column(f)] = f;
            }
        }
        return byColumn;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ColumnMapping m && m.columnCount == columnCount && Arrays.equals(m.columns, columns);
    }

    @Override
    public int hashCode() {
        return 31 * columnCount + Arrays.hashCode(columns);
    }

    @Override
    public String toString() {
        StringBuilder b = new StringBuilder("ColumnMapping[columns=").append(columnCount);
        for (Field f : Field.values()) {
            if (isMapped(f)) {
                b.append(", ").append(f.key()).append('=').append(column(f));
            }
        }
        return b.append(']').toString();
    }
}
