package org.voteworth.source;

import java.nio.file.Path;

/**
 * The run stopped because too many of a file's rows were rejected ({@link RejectRateLimit}). The
 * rows rejected until then are the user's evidence of what went wrong, so the caller keeps the
 * rejects file and names it with {@link #keptIn}.
 */
public final class RejectRateExceeded extends DumpFormatException {
    private static final long serialVersionUID = 1L;

    private final String explanation;

    RejectRateExceeded(String file, String explanation) {
        super(file, 0, explanation);
        this.explanation = explanation;
    }

    /** The same stop, its message ending with where the rows rejected so far are kept. */
    public RejectRateExceeded keptIn(Path rejectsFile) {
        RejectRateExceeded e = new RejectRateExceeded(file(), explanation + System.lineSeparator()
                + "  The rows rejected so far, with file, line, field and reason, are kept in " + rejectsFile + ".");
        e.initCause(this);
        return e;
    }
}
