package org.voteworth.tally;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/** Dictionary of category names seen in one tally; a dump has tens of them, not millions. */
final class Categories {
    private final List<byte[]> names = new ArrayList<>();
    private final List<String> strings = new ArrayList<>();
    private int lastHit = -1;

    int idOf(byte[] b, int off, int len) {
        if (lastHit >= 0 && Arrays.equals(names.get(lastHit), 0, names.get(lastHit).length, b, off, off + len)) {
            return lastHit;
        }
        for (int i = 0; i < names.size(); i++) {
            byte[] n = names.get(i);
            if (Arrays.equals(n, 0, n.length, b, off, off + len)) {
                lastHit = i;
                return i;
            }
        }
        names.add(Arrays.copyOfRange(b, off, off + len));
        strings.add(new String(b, off, len, StandardCharsets.UTF_8));
        lastHit = names.size() - 1;
        return lastHit;
    }

    int idOf(String name) {
        byte[] b = name.getBytes(StandardCharsets.UTF_8);
        return idOf(b, 0, b.length);
    }

    String name(int id) {
        return strings.get(id);
    }

    int size() {
        return names.size();
    }

    List<String> all() {
        return List.copyOf(strings);
    }
}
