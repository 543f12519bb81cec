package steelyard.io;

import java.nio.file.Path;

/**
 * The lenient-mode budget of one file: a malformed row fails the import when the budget is 0 (strict),
 * otherwise it is reported through {@link ImportOptions#skipped()} until more than
 * {@link ImportOptions#maxBadRows()} rows were bad.
 */
final class BadRows {
  private final Path file;
  private final ImportOptions options;
  private int count;

  BadRows(Path file, ImportOptions options) {
    this.file = file;
    this.options = options;
  }

  /** Skips (and reports) or fails on a malformed row. */
  void reject(long line, String problem, String expected) {
    int max = options.maxBadRows();
    if (max == 0) throw InputException.at(file, line, problem, expected);
    count++;
    if (count > max) {
      throw InputException.at(file, line,
          problem + " (bad row " + count + ", more than the " + max + " allowed by --max-bad-rows)", expected);
    }
    options.skipped().accept(new SkippedRow(file.toString(), line, expected == null ? problem : problem + "; expected " + expected));
  }

  /** Rows skipped so far. */
  int count() {
    return count;
  }

  /** Thrown inside a row check to abandon the row; caught by the reader, which calls {@link #reject}. */
  static final class RowProblem extends Exception {
    private static final long serialVersionUID = 1L;
    final String expected;

    RowProblem(String problem, String expected) {
      super(problem, null, false, false);
      this.expected = expected;
    }
  }
}
