package org.voteworth.source;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;

/** The bytes {@code [start, end)} of a file, read with positional reads so ranges share no state. */
final class RangeStream extends InputStream {
    private final FileChannel channel;
    private long pos;
    private final long end;

    RangeStream(FileChannel channel, long start, long end) {
        this.channel = channel;
        this.pos = start;
        this.end = end;
    }

    @Override
    public int read() throws IOException {
        byte[] one = new byte[1];
        return read(one, 0, 1) < 0 ? -1 : one[0] & 0xff;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
        if (pos >= end) {
            return -1;
        }
        int want = (int) Math.min(len, end - pos);
        int n = channel.read(ByteBuffer.wrap(b, off, want), pos);
        if (n < 0) {
            return -1;
        }
        pos += n;
        return n;
    }

    /**
     * Where a range that should start near {@code at} starts: the first offset {@code p >= at}
     * that begins a line (p is 0 or the byte before p is LF); {@code size} when none does.
     */
    static long lineStartFrom(FileChannel channel, long at, long size) throws IOException {
        if (at <= 0) {
            return 0;
        }
        ByteBuffer b = ByteBuffer.allocate(1 << 16);
        long p = at - 1;
        while (p < size) {
            b.clear();
            int n = channel.read(b, p);
            if (n <= 0) {
                return size;
            }
            for (int i = 0; i < n; i++) {
                if (b.get(i) == '\n') {
                    return p + i + 1;
                }
            }
            p += n;
        }
        return size;
    }
}
