package org.voteworth.store;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.InputStream;
import java.nio.channels.FileChannel;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import org.voteworth.tally.StarCounts;

/**
 * {@code manifest.json}: what a store holds and where it came from (layout version {@value #VERSION}).
 *
 * @param created when the store was written (last appended to)
 * @param mapping the explicit field → header entries the dump was read with
 * @param categoryFromName the file-name pattern categories were taken from
 * @param files the dump files tallied, in store file-number order
 * @param rowsRead rows read over all files
 * @param accepted rows accepted (= reviews in the store)
 * @param rejected rows rejected (in {@code rejects.tsv})
 * @param reviewers rows of {@code reviewers.parquet}
 * @param reviewParts the N of {@code reviews/part-NNNNN.parquet}
 * @param categories per category: reviews and their star histogram (for profiles)
 */
public record StoreManifest(Instant created, Map<String, String> mapping, String categoryFromName, List<StoreFile> files,
                            long rowsRead, long accepted, long rejected, long reviewers, int reviewParts,
                            Map<String, CategoryStats> categories) {
    public static final String FORMAT = "voteworth-store";
    public static final int VERSION = 1;
    /** Bytes hashed at each end of a file for {@link StoreFile#sha256HeadTail()}. */
    static final int HEAD_TAIL = 64 << 10;
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    public StoreManifest {
        Objects.requireNonNull(created, "created");
        mapping = Map.copyOf(mapping);
        files = List.copyOf(files);
        categories = new TreeMap<>(categories);
    }

    /**
     * One dump file of the store.
     *
     * @param path absolute path when tallied
     * @param size bytes on disk
     * @param modified last modification time
     * @param sha256HeadTail SHA-256 over the first 64 KiB and the last 64 KiB (the whole file when shorter than 128 KiB)
     * @param rejectsByReason rejected rows by reason code
     */
    public record StoreFile(String path, long size, Instant modified, String sha256HeadTail, long rowsRead, long accepted,
                            long rejected, String category, Map<String, Long> rejectsByReason) {
        public StoreFile {
            Objects.requireNonNull(path, "path");
            rejectsByReason = new TreeMap<>(rejectsByReason);
        }

        /** Whether {@code other} is this file again: the same path, or the same size and head-and-tail checksum. */
        public boolean sameAs(StoreFile other) {
            return path.equals(other.path) || size == other.size && sha256HeadTail.equals(other.sha256HeadTail);
        }
    }

    /**
     * @param reviews reviews in the category
     * @param stars their star histogram
     */
    public record CategoryStats(long reviews, StarCounts stars) {
        CategoryStats plus(CategoryStats o) {
            return new CategoryStats(reviews + o.reviews, stars.plus(o.stars));
        }
    }

    /** The partitioning entry of the manifest. */
    public String partitioning() {
        return ReviewerHash.NAME + " mod " + reviewParts;
    }

    /** Size, time and head-and-tail checksum of {@code file}, with no counts yet. */
    static StoreFile fingerprint(Path file, String category) throws IOException {
        Path abs = file.toAbsolutePath().normalize();
        long size = Files.size(abs);
        MessageDigest sha;
        try {
            sha = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is not available in this JVM", e);
        }
        try (FileChannel ch = FileChannel.open(abs, StandardOpenOption.READ)) {
            ByteBuffer head = ByteBuffer.allocate((int) Math.min(HEAD_TAIL, size));
            readFully(ch, head, 0);
            sha.update(head.flip());
            long tailStart = Math.max(HEAD_TAIL, size - HEAD_TAIL);
            if (tailStart < size) {
                ByteBuffer tail = ByteBuffer.allocate((int) (size - tailStart));
                readFully(ch, tail, tailStart);
                sha.update(tail.flip());
            }
        }
        return new StoreFile(abs.toString(), size, Files.getLastModifiedTime(abs).toInstant(),
                HexFormat.of().formatHex(sha.digest()), 0, 0, 0, category, Map.of());
    }

    private static void readFully(FileChannel ch, ByteBuffer b, long at) throws IOException {
        while (b.hasRemaining()) {
            if (ch.read(b, at + b.position()) < 0) {
                throw new IOException("file shrank while being read");
            }
        }
    }

    void write(Path file) throws IOException {
        ObjectNode m = JSON.createObjectNode();
        m.put("format", FORMAT);
        m.put("version", VERSION);
        m.put("created", created.toString());
        ObjectNode map = m.putObject("mapping");
        new TreeMap<>(mapping).forEach(map::put);
        m.put("categoryFromName", categoryFromName);
        ArrayNode fs = m.putArray("files");
        for (StoreFile f : files) {
            ObjectNode o = fs.addObject();
            o.put("path", f.path());
            o.put("size", f.size());
            o.put("modified", f.modified().toString());
            o.put("sha256HeadTail", f.sha256HeadTail());
            o.put("rowsRead", f.rowsRead());
            o.put("accepted", f.accepted());
            o.put("rejected", f.rejected());
            o.put("category", f.category());
            ObjectNode why = o.putObject("rejectsByReason");
            f.rejectsByReason().forEach(why::put);
        }
        ObjectNode rows = m.putObject("rows");
        rows.put("read", rowsRead);
        rows.put("accepted", accepted);
        rows.put("rejected", rejected);
        m.put("reviewers", reviewers);
        m.put("reviewParts", reviewParts);
        m.put("partitioning", partitioning());
        ObjectNode cats = m.putObject("categories");
        categories.forEach((name, c) -> {
            ObjectNode o = cats.putObject(name);
            o.put("reviews", c.reviews());
            ArrayNode st = o.putArray("stars");
            for (int s = 1; s <= 5; s++) {
                st.add(c.stars().of(s));
            }
        });
        Path partial = file.resolveSibling("." + file.getFileName() + ".partial");
        JSON.writeValue(partial.toFile(), m);
        Files.move(partial, file, java.nio.file.StandardCopyOption.REPLACE_EXISTING, java.nio.file.StandardCopyOption.ATOMIC_MOVE);
    }

    static StoreManifest read(Path file) throws IOException {
        JsonNode m;
        try (InputStream in = Files.newInputStream(file)) {
            m = JSON.readTree(in);
        } catch (IOException e) {
            throw new IOException(file + ": not a readable store manifest (" + e.getMessage() + ")", e);
        }
        try {
            if (!FORMAT.equals(text(m, "format")) || m.path("version").asInt(-1) != VERSION) {
                throw new IllegalArgumentException("expected format " + FORMAT + " version " + VERSION + ", found "
                        + m.path("format").asText("none") + " version " + m.path("version").asText("none"));
            }
            Map<String, String> mapping = new LinkedHashMap<>();
            for (Iterator<Map.Entry<String, JsonNode>> it = m.path("mapping").fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                mapping.put(e.getKey(), e.getValue().asText());
            }
            List<StoreFile> files = new ArrayList<>();
            for (JsonNode f : m.path("files")) {
                Map<String, Long> why = new TreeMap<>();
                for (Iterator<Map.Entry<String, JsonNode>> it = f.path("rejectsByReason").fields(); it.hasNext(); ) {
                    Map.Entry<String, JsonNode> e = it.next();
                    why.put(e.getKey(), e.getValue().asLong());
                }
                files.add(new StoreFile(text(f, "path"), number(f, "size"), Instant.parse(text(f, "modified")),
                        text(f, "sha256HeadTail"), number(f, "rowsRead"), number(f, "accepted"), number(f, "rejected"),
                        text(f, "category"), why));
            }
            Map<String, CategoryStats> cats = new TreeMap<>();
            for (Iterator<Map.Entry<String, JsonNode>> it = m.path("categories").fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                JsonNode st = e.getValue().path("stars");
                cats.put(e.getKey(), new CategoryStats(number(e.getValue(), "reviews"), new StarCounts(st.path(0).asLong(),
                        st.path(1).asLong(), st.path(2).asLong(), st.path(3).asLong(), st.path(4).asLong())));
            }
            JsonNode rows = m.path("rows");
            StoreManifest s = new StoreManifest(Instant.parse(text(m, "created")), mapping, text(m, "categoryFromName"), files,
                    number(rows, "read"), number(rows, "accepted"), number(rows, "rejected"), number(m, "reviewers"),
                    (int) number(m, "reviewParts"), cats);
            if (!s.partitioning().equals(text(m, "partitioning"))) {
                throw new IllegalArgumentException("partitioning '" + text(m, "partitioning") + "' is not " + s.partitioning());
            }
            return s;
        } catch (RuntimeException e) {
            throw new IOException(file + ": not a valid store manifest: " + e.getMessage(), e);
        }
    }

    private static String text(JsonNode n, String field) {
        JsonNode v = n.get(field);
        if (v == null || v.isNull()) {
            throw new IllegalArgumentException("field '" + field + "' is missing");
        }
        return v.asText();
    }

    private static long number(JsonNode n, String field) {
        JsonNode v = n.get(field);
        if (v == null || !v.canConvertToLong()) {
            throw new IllegalArgumentException("field '" + field + "' is missing or not a whole number");
        }
        return v.asLong();
    }
}
