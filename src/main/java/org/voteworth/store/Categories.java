package org.voteworth.store;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The store's category numbering, shared by the scanning workers: a dump has tens of categories,
 * so each worker keeps a {@link Cache} and asks the shared list only for a name it has not seen.
 */
final class Categories {
    private final List<byte[]> names = new ArrayList<>();

    /** Numbers {@code known} 0, 1, ... (an append keeps the store's numbering). */
    Categories(List<String> known) {
        for (String k : known) {
            names.add(k.getBytes(StandardCharsets.UTF_8));
        }
    }

    synchronized int id(byte[] b, int off, int len) {
        for (int i = 0; i < names.size(); i++) {
            if (Arrays.equals(names.get(i), 0, names.get(i).length, b, off, off + len)) {
                return i;
            }
        }
        names.add(Arrays.copyOfRange(b, off, off + len));
        return names.size() - 1;
    }

    synchronized int size() {
        return names.size();
    }

    synchronized List<String> names() {
        return names.stream().map(n -> new String(n, StandardCharsets.UTF_8)).toList();
    }

    Cache cache() {
        return new Cache();
    }

    /** One worker's view: the categories it has met, tried before the shared list. */
    final class Cache {
        private byte[][] seen = new byte[0][];
        private int[] ids = new int[0];
        private int last = -1;

        int id(byte[] b, int off, int len) {
            if (last >= 0 && Arrays.equals(seen[last], 0, seen[last].length, b, off, off + len)) {
                return ids[last];
            }
            for (int i = 0; i < seen.length; i++) {
                if (Arrays.equals(seen[i], 0, seen[i].length, b, off, off + len)) {
                    last = i;
                    return ids[i];
                }
            }
            int id = Categories.this.id(b, off, len);
            seen = Arrays.copyOf(seen, seen.length + 1);
            ids = Arrays.copyOf(ids, ids.length + 1);
            seen[seen.length - 1] = Arrays.copyOfRange(b, off, off + len);
            ids[ids.length - 1] = id;
            last = seen.length - 1;
            return id;
        }
    }
}
