package org.voteworth.store;

import java.io.EOFException;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.MappedByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.apache.parquet.io.InputFile;
import org.apache.parquet.io.LocalInputFile;
import org.apache.parquet.io.SeekableInputStream;

/**
 * A store file read through a memory map: Parquet parses footers and page headers a byte at a
 * time, which through {@link LocalInputFile} is one system call per byte. Files of 2 GiB and
 * more (beyond one map) are read through {@link LocalInputFile}.
 */
final class MappedInputFile implements InputFile {
    private final Path path;
    private final long length;

    private MappedInputFile(Path path, long length) {
        this.path = path;
        this.length = length;
    }

    static InputFile of(Path path) throws IOException {
        long size = java.nio.file.Files.size(path);
        return size < Integer.MAX_VALUE ? new MappedInputFile(path, size) : new LocalInputFile(path);
    }

    @Override
    public long getLength() {
        return length;
    }

    @Override
    public SeekableInputStream newStream() throws IOException {
        MappedByteBuffer map;
        try (FileChannel ch = FileChannel.open(path, StandardOpenOption.READ)) {
            map = ch.map(FileChannel.MapMode.READ_ONLY, 0, length);
        }
        return new Stream(map);
    }

    private static final class Stream extends SeekableInputStream {
        private final ByteBuffer b;

        Stream(ByteBuffer b) {
            this.b = b;
        }

        @Override
        public long getPos() {
            return b.position();
        }

        @Override
        public void seek(long pos) throws IOException {
            if (pos < 0 || pos > b.limit()) {
                throw new EOFException("seek to " + pos + " in a file of " + b.limit() + " bytes");
            }
            b.position((int) pos);
        }

        @Override
        public int read() {
            return b.hasRemaining() ? b.get() & 0xFF : -1;
        }

        @Override
        public int read(byte[] dst, int off, int len) {
            if (len == 0) {
                return 0;
            }
            if (!b.hasRemaining()) {
                return -1;
            }
            int n = Math.min(len, b.remaining());
            b.get(dst, off, n);
            return n;
        }

        @Override
        public void readFully(byte[] dst) throws IOException {
            readFully(dst, 0, dst.length);
        }

        @Override
        public void readFully(byte[] dst, int off, int len) throws IOException {
            if (len > b.remaining()) {
                throw new EOFException("needed " + len + " bytes at " + b.position() + ", the file has " + b.remaining() + " more");
            }
            b.get(dst, off, len);
        }

        @Override
        public int read(ByteBuffer dst) {
            if (!b.hasRemaining()) {
                return -1;
            }
            int n = Math.min(dst.remaining(), b.remaining());
            dst.put(b.slice(b.position(), n));
            b.position(b.position() + n);
            return n;
        }

        @Override
        public void readFully(ByteBuffer dst) throws IOException {
            if (dst.remaining() > b.remaining()) {
                throw new EOFException("needed " + dst.remaining() + " bytes at " + b.position() + ", the file has "
                        + b.remaining() + " more");
            }
            read(dst);
        }

        @Override
        public int available() {
            return b.remaining();
        }
    }
}
