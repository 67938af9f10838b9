package org.voteworth.source;

/**
 * A dump cannot be read as asked: a file that is not there, a header without the required
 * columns, a truncated gzip file, too many rejected rows. The message is meant for the person
 * running the tool: it names the file (and line when there is one), what was wrong and what to
 * do about it. The command line prints it and exits with status 1.
 */
public class DumpFormatException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final String file;
    private final long line;

    /**
     * @param file the file (or the input as the user typed it)
     * @param line 1-based line number, or 0 when the problem is not tied to one line
     * @param message what was wrong and what to do, without the file and line (added here)
     */
    public DumpFormatException(String file, long line, String message) {
        super(line > 0 ? file + ": line " + line + ": " + message : file + ": " + message);
        this.file = file;
        this.line = line;
    }

    public DumpFormatException(String file, long line, String message, Throwable cause) {
        this(file, line, message);
        initCause(cause);
    }

    /** The file, or the input as typed, the problem is in. */
    public String file() {
        return file;
    }

    /** The 1-based line, or 0 when the problem is about the whole file. */
    public long line() {
        return line;
    }
}
