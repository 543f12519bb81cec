package steelyard.io;

import java.nio.file.Path;
import java.util.Objects;

/**
 * The one error type for input a user can fix: a malformed file, a bad option value, a missing column.
 *
 * <p>Its message always has the form {@code file:line[:column]: problem; expected …} (line and column
 * omitted when the file has none, e.g. an empty file or one that is not gzip). The command line prints
 * the message alone, with no stack trace, and exits with code 2. Every reader in the project throws only
 * this type for bad input; anything else escaping a reader is a bug.
 *
 * <pre>{@code
 * throw InputException.at(path, 17, "score column 'acoustic' is 'NaN'", "a finite number");
 * }</pre>
 */
public final class InputException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  /** Marks "no line number": the problem concerns the file as a whole. */
  public static final long NO_LINE = 0;

  private final String file;
  private final long line;
  private final int column;
  private final String problem;
  private final String expected;

  private InputException(String file, long line, int column, String problem, String expected, Throwable cause) {
    super(format(file, line, column, problem, expected), cause);
    this.file = Objects.requireNonNull(file, "file");
    this.line = line;
    this.column = column;
    this.problem = Objects.requireNonNull(problem, "problem");
    this.expected = expected;
  }

  /** A problem on a given 1-based line of a file. */
  public static InputException at(Path file, long line, String problem, String expected) {
    return new InputException(name(file), line, 0, problem, expected, null);
  }

  /** A problem at a 1-based line and 1-based column of a file. */
  public static InputException at(Path file, long line, int column, String problem, String expected) {
    return new InputException(name(file), line, column, problem, expected, null);
  }

  /** A problem with a file as a whole (no line: empty, unreadable, not gzip, …). */
  public static InputException inFile(Path file, String problem, String expected) {
    return new InputException(name(file), NO_LINE, 0, problem, expected, null);
  }

  /**
   * A problem with a command-line option rather than a file; {@code option} stands where the file name
   * would, e.g. {@code --features: unknown convention 'log2'; expected ln, log10, cost or linear}.
   */
  public static InputException option(String option, String problem, String expected) {
    return new InputException(option, NO_LINE, 0, problem, expected, null);
  }

  /** The same error with an underlying cause kept for debugging (never printed to users). */
  public InputException withCause(Throwable cause) {
    return new InputException(file, line, column, problem, expected, cause);
  }

  public String file() { return file; }
  /** 1-based line, or {@link #NO_LINE}. */
  public long line() { return line; }
  /** 1-based column, or 0 when unknown. */
  public int column() { return column; }
  public String problem() { return problem; }
  /** What would have been accepted; may be null when nothing sensible can be said. */
  public String expected() { return expected; }

  private static String name(Path file) {
    return file == null ? "<input>" : file.toString();
  }

  private static String format(String file, long line, int column, String problem, String expected) {
    StringBuilder sb = new StringBuilder(file);
    if (line > 0) {
      sb.append(':').append(line);
      if (column > 0) sb.append(':').append(column);
    }
    sb.append(": ").append(problem);
    if (expected != null && !expected.isEmpty()) sb.append("; expected ").append(expected);
    return sb.toString();
  }
}
