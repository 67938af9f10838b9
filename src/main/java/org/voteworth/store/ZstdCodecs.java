package org.voteworth.store;

import com.github.luben.zstd.Zstd;
import java.io.IOException;
import java.nio.ByteBuffer;
import org.apache.parquet.bytes.BytesInput;
import org.apache.parquet.compression.CompressionCodecFactory;
import org.apache.parquet.hadoop.metadata.CompressionCodecName;

/**
 * Page compression for the store through zstd-jni, which the project already uses for .zst dumps.
 * Parquet's own codec factory builds a Hadoop configuration (and so needs the Hadoop runtime);
 * this one does not. It writes ZSTD and reads ZSTD and uncompressed pages.
 */
final class ZstdCodecs implements CompressionCodecFactory {
    /** zstd's default level: a good ratio at several hundred MB/s. */
    private static final int LEVEL = 3;

    @Override
    public BytesInputCompressor getCompressor(CompressionCodecName codec) {
        if (codec != CompressionCodecName.ZSTD) {
            throw new IllegalArgumentException("the store writes ZSTD pages, not " + codec);
        }
        return new BytesInputCompressor() {
            @Override
            public BytesInput compress(BytesInput bytes) throws IOException {
                return BytesInput.from(Zstd.compress(bytes.toByteArray(), LEVEL));
            }

            @Override
            public CompressionCodecName getCodecName() {
                return CompressionCodecName.ZSTD;
            }

            @Override
            public void release() {
            }
        };
    }

    @Override
    public BytesInputDecompressor getDecompressor(CompressionCodecName codec) {
        if (codec != CompressionCodecName.ZSTD && codec != CompressionCodecName.UNCOMPRESSED) {
            throw new IllegalArgumentException("a store file has " + codec + " pages; voteworth writes ZSTD (rewrite the store)");
        }
        boolean plain = codec == CompressionCodecName.UNCOMPRESSED;
        return new BytesInputDecompressor() {
            @Override
            public BytesInput decompress(BytesInput bytes, int uncompressedSize) throws IOException {
                return plain ? bytes : BytesInput.from(unpack(bytes.toByteArray(), uncompressedSize));
            }

            @Override
            public void decompress(ByteBuffer input, int compressedSize, ByteBuffer output, int uncompressedSize)
                    throws IOException {
                byte[] in = new byte[compressedSize];
                input.get(in);
                output.put(plain ? in : unpack(in, uncompressedSize));
            }

            @Override
            public void release() {
            }
        };
    }

    private static byte[] unpack(byte[] in, int size) throws IOException {
        try {
            byte[] out = Zstd.decompress(in, size);
            if (out.length != size) {
                throw new IOException("a ZSTD page gave " + out.length + " bytes, its header says " + size);
            }
            return out;
        } catch (RuntimeException e) {
            throw new IOException("a ZSTD page does not decompress (" + e.getMessage() + ")", e);
        }
    }

    @Override
    public void release() {
    }
}
