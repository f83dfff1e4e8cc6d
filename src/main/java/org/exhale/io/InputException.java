package org.exhale.io;

/**
 * Bad input: one line naming the file, the place in it (key path or CSV row and column), the
 * line where known, what was found and what was expected. The command line prints
 * {@link #getMessage()} and exits with code 2.
 */
public final class InputException extends RuntimeException {
    private final ErrorKind kind;
    private final String file;
    private final String where;
    private final int line;
    /** Longest description kept in a message [characters]. */
    static final int MAX_WHAT = 400;

    public InputException(ErrorKind kind, String file, String where, int line, String what) {
        super(format(file, where, line, what));
        this.kind = kind;
        this.file = file;
        this.where = where;
        this.line = line;
    }

    public InputException(ErrorKind kind, String file, String where, int line, String what, Throwable cause) {
        this(kind, file, where, line, what);
        initCause(cause);
    }

    private static String format(String file, String where, int line, String what) {
        StringBuilder sb = new StringBuilder();
        sb.append(file == null ? "<input>" : file);
        if (line > 0) {
            sb.append(':').append(line);
        }
        if (where != null && !where.isEmpty()) {
            sb.append(": ").append(where);
        }
        String w = what.replace('\n', ' ').replace('\r', ' ');
        if (w.length() > MAX_WHAT) {
            // A hostile value quoted in full would make a message of a megabyte.
            w = w.substring(0, MAX_WHAT) + "... (" + (w.length() - MAX_WHAT) + " more characters)";
        }
        sb.append(": ").append(w);
        return sb.toString();
    }

    public ErrorKind kind() {
        return kind;
    }

    public String file() {
        return file;
    }

    public String where() {
        return where;
    }

    /** 1-based line, or 0 where unknown. */
    public int line() {
        return line;
    }
}
