package org.voteworth.source;

import java.nio.file.Path;
import java.util.Objects;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.regex.PatternSyntaxException;

/**
 * How a file's category is taken from its name (option {@code --category-pattern}): a regular
 * expression searched in the file name (not the folders), whose first capture group is the
 * category. Used for rows whose dump has no category column, or leaves it empty.
 *
 * <p>The {@link #defaults() default} drops the extensions ({@code .gz}, {@code .tsv},
 * {@code .csv}, {@code .txt}) and a trailing part suffix such as {@code .part-01},
 * {@code _part3} or {@code -0002}, so {@code garden.part-01.tsv.gz} and
 * {@code garden.part-02.tsv.gz} both belong to {@code garden}.
 *
 * @param pattern the expression; group 1 is the category
 */
public record CategoryFromName(Pattern pattern) {
    /** The default expression, see the class comment. */
    public static final String DEFAULT_PATTERN =
            "(?i)^(.+?)(?:[._-]part[._-]?\\d+|[._-]\\d+)?(?:\\.(?:tsv|csv|txt))?(?:\\.gz)?$";

    public CategoryFromName {
        Objects.requireNonNull(pattern, "pattern");
        if (pattern.matcher("").groupCount() < 1) {
            throw new IllegalArgumentException("--category-pattern " + pattern.pattern()
                    + " has no capture group: put the category part in parentheses, e.g. ^([a-z]+)_reviews");
        }
    }

    public static CategoryFromName defaults() {
        return new CategoryFromName(Pattern.compile(DEFAULT_PATTERN));
    }

    /**
     * A user's {@code --category-pattern}.
     *
     * @throws IllegalArgumentException if it does not compile or has no capture group
     */
    public static CategoryFromName of(String regex) {
        try {
            return new CategoryFromName(Pattern.compile(regex));
        } catch (PatternSyntaxException e) {
            throw new IllegalArgumentException("--category-pattern " + regex + " is not a valid regular expression: "
                    + e.getDescription() + " near position " + e.getIndex(), e);
        }
    }

    /**
     * The category of {@code file}.
     *
     * @throws DumpFormatException if the pattern does not match the file name or group 1 is empty
     */
    public String categoryOf(Path file) {
        Path name = file.getFileName();
        String n = name == null ? file.toString() : name.toString();
        Matcher m = pattern.matcher(n);
        if (!m.find() || m.group(1) == null || m.group(1).isEmpty()) {
            throw new DumpFormatException(file.toString(), 0, "the file name " + n + " does not match --category-pattern "
                    + pattern.pattern() + " (its first group must capture the category); fix the pattern or rename the file");
        }
        return m.group(1);
    }
}
