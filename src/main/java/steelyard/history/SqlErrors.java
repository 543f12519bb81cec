package steelyard.history;

import java.nio.file.Path;
import java.sql.SQLException;
import steelyard.io.InputException;

/**
 * Turns SQLite's failures into the project's errors: what a user can act on (a file that is not a database, a
 * damaged one, a read-only file, a full disk, a lock held too long) becomes an {@link InputException} naming the
 * history file; anything else is an internal failure.
 */
final class SqlErrors {
  // Primary SQLite result codes (https://www.sqlite.org/rescode.html); extended codes keep these in the low byte.
  private static final int PERM = 3;
  private static final int BUSY = 5;
  private static final int LOCKED = 6;
  private static final int READONLY = 8;
  private static final int IOERR = 10;
  private static final int CORRUPT = 11;
  private static final int FULL = 13;
  private static final int CANTOPEN = 14;
  private static final int NOTADB = 26;
  private static final int PRIMARY_MASK = 0xff;

  private SqlErrors() {}

  /** The error to throw for {@code e}, met while working on the history {@code file}. */
  static RuntimeException map(Path file, SQLException e) {
    String detail = detail(e);
    switch (e.getErrorCode() & PRIMARY_MASK) {
      case NOTADB:
        return damaged(file, "is not an SQLite database (" + detail + ")", e);
      case CORRUPT:
        return damaged(file, "is damaged (" + detail + "); it was left as it is", e);
      case BUSY:
      case LOCKED:
        return InputException.inFile(file, "stayed locked by another process for longer than "
            + RunHistory.BUSY_TIMEOUT_MS / 1000 + " s (" + detail + ")", "the other run to finish; try again").withCause(e);
      case READONLY:
      case PERM:
        return InputException.inFile(file, "cannot be written (" + detail + ")", "a history file and folder this user may write").withCause(e);
      case CANTOPEN:
        return InputException.inFile(file, "cannot be opened (" + detail + ")", "a path in an existing folder this user may write").withCause(e);
      case IOERR:
      case FULL:
        return InputException.inFile(file, "could not be read or written (" + detail + ")", "a readable file on a disk with free space").withCause(e);
      default:
        return new IllegalStateException("run history " + file + ": " + e.getMessage(), e);
    }
  }

  /** A file that is not a usable history: never written to, never repaired. */
  static InputException damaged(Path file, String problem, Throwable cause) {
    InputException x = InputException.inFile(file, problem,
        "a run history written by steelyard, or the name of a file that does not exist yet");
    return cause == null ? x : x.withCause(cause);
  }

  // SQLite's own words without the driver's bracketed code prefix: "file is not a database".
  private static String detail(SQLException e) {
    String m = e.getMessage() == null ? "" : e.getMessage();
    int open = m.lastIndexOf('(');
    int close = m.lastIndexOf(')');
    return open >= 0 && close > open ? m.substring(open + 1, close) : m;
  }
}
