package org.voteworth.store;

import java.nio.charset.StandardCharsets;

/**
 * Which review part file holds a reviewer's rows: partitioning {@value #NAME} of the store layout.
 *
 * <p>The hash is 32-bit FNV-1a over the UTF-8 bytes of the reviewer id (offset basis 2166136261,
 * prime 16777619, as published by Fowler, Noll and Vo), and the part is the hash, read as an
 * unsigned number, modulo the number of parts. Every engine that writes or reads a store (the
 * Spark job included) calls this class, so a reviewer's rows are always in one part.
 */
public final class ReviewerHash {
    /** The partitioning's name in the manifest ({@code "reviewer-hash-v1 mod N"}). */
    public static final String NAME = "reviewer-hash-v1";

    private ReviewerHash() {
    }

    /** The 32-bit FNV-1a hash of {@code b[off, off + len)}. */
    public static int hash(byte[] b, int off, int len) {
        int h = 0x811C9DC5;
        for (int i = off; i < off + len; i++) {
            h ^= b[i] & 0xFF;
            h *= 0x01000193;
        }
        return h;
    }

    /** The part, in {@code [0, parts)}, of the reviewer whose id is the UTF-8 bytes {@code b[off, off + len)}. */
    public static int part(byte[] b, int off, int len, int parts) {
        if (parts < 1) {
            throw new IllegalArgumentException("a store needs at least one review part, not " + parts);
        }
        return (int) (Integer.toUnsignedLong(hash(b, off, len)) % parts);
    }

    /** The part of reviewer {@code id}. */
    public static int part(String id, int parts) {
        byte[] b = id.getBytes(StandardCharsets.UTF_8);
        return part(b, 0, b.length, parts);
    }
}
