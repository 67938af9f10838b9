package org.voteworth.report;

import java.nio.charset.StandardCharsets;
import java.security.GeneralSecurityException;
import java.util.HexFormat;
import java.util.function.UnaryOperator;
import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;

/**
 * How reviewer ids appear in outputs: as they are, or pseudonymised by a keyed hash
 * (HMAC-SHA-256 under a user key, first 16 hex digits, prefixed {@code p-}). The same key gives the
 * same pseudonym in every output of a run and across runs; without the key the mapping cannot be
 * recomputed from a guessed id.
 */
public final class IdMask implements UnaryOperator<String> {
    private final Mac mac;

    private IdMask(Mac mac) {
        this.mac = mac;
    }

    /** Ids unchanged. */
    public static UnaryOperator<String> none() {
        return UnaryOperator.identity();
    }

    public static IdMask withKey(String key) {
        if (key == null || key.isBlank()) {
            throw new IllegalArgumentException("a pseudonymisation key must not be empty");
        }
        try {
            Mac m = Mac.getInstance("HmacSHA256");
            m.init(new SecretKeySpec(key.getBytes(StandardCharsets.UTF_8), "HmacSHA256"));
            return new IdMask(m);
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("HMAC-SHA-256 is not available in this JVM", e);
        }
    }

    @Override
    public synchronized String apply(String id) {
        byte[] h = mac.doFinal(id.getBytes(StandardCharsets.UTF_8));
        return "p-" + HexFormat.of().formatHex(h, 0, 8);
    }
}
