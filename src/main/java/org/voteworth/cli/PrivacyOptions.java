package org.voteworth.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.function.UnaryOperator;
import org.voteworth.report.IdMask;
import picocli.CommandLine.Option;

/** Whether outputs show reviewer ids or keyed pseudonyms. */
final class PrivacyOptions {
    static final String KEY_VARIABLE = "VOTEWORTH_PSEUDONYM_KEY";

    @Option(names = "--pseudonymize",
            description = "Replace reviewer ids in every output by a keyed hash (HMAC-SHA-256). The key comes from "
                    + "--key-file or the environment variable " + KEY_VARIABLE + ".")
    boolean pseudonymize;

    @Option(names = "--key-file", paramLabel = "FILE", description = "File whose first line is the pseudonymisation key.")
    Path keyFile;

    UnaryOperator<String> ids() throws IOException {
        if (!pseudonymize) {
            return IdMask.none();
        }
        String key = keyFile != null ? Files.readAllLines(keyFile, StandardCharsets.UTF_8).stream().findFirst().orElse("")
                : System.getenv(KEY_VARIABLE);
        if (key == null || key.isBlank()) {
            throw new IllegalArgumentException("--pseudonymize needs a key: give --key-file FILE or set " + KEY_VARIABLE);
        }
        return IdMask.withKey(key.strip());
    }
}
