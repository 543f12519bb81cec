package steelyard.history;

import java.nio.file.Path;
import java.util.Objects;
import steelyard.io.FileDigest;

/**
 * One input file of a recorded run.
 *
 * @param role   what the file was to the run: {@link #HYPOTHESES}, {@link #REFERENCES}, {@link #RULES},
 *               {@link #WEIGHTS} or another name a command chooses
 * @param path   the path as given on the command line
 * @param bytes  the file's size in bytes when recorded
 * @param sha256 lower-case hex SHA-256 of the file's bytes when recorded
 * @param rows   data rows read from it (hypothesis rows, references), or {@link #UNKNOWN_ROWS}
 */
public record InputFile(String role, String path, long bytes, String sha256, long rows) {
  public static final String HYPOTHESES = "hypotheses";
  public static final String REFERENCES = "references";
  public static final String RULES = "rules";
  public static final String WEIGHTS = "weights";
  /** Row count of a file that is not a table (a rules file) or whose rows were not counted. */
  public static final long UNKNOWN_ROWS = -1;

  public InputFile {
    Objects.requireNonNull(role, "role");
    Objects.requireNonNull(path, "path");
    Objects.requireNonNull(sha256, "sha256");
    if (rows < UNKNOWN_ROWS) throw new IllegalArgumentException("rows must be -1 (unknown) or more: " + rows);
  }

  /** Hashes {@code file} now (reading it once); an unreadable file is an {@code InputException}. */
  public static InputFile of(String role, Path file, long rows) {
    FileDigest d = FileDigest.of(file);
    return new InputFile(role, file.toString(), d.bytes(), d.sha256(), rows);
  }
}
