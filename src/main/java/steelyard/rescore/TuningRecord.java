package steelyard.rescore;

import java.util.List;
import java.util.Objects;
import steelyard.io.FileDigest;

/**
 * Where a weights file's weights came from when weight tuning wrote it (weights file version 3): the dev data
 * they were tuned on, which weights the tuning moved, and the dev figures it reported. Rates are errors /
 * reference tokens in the file's unit (WER or CER); NaN is written as {@code null}.
 *
 * @param hypotheses      the dev hypotheses file
 * @param references      the dev references file
 * @param utterances      dev utterances tuned on (with hypotheses and a reference)
 * @param referenceTokens reference tokens of those (optional tokens excluded): N of the rates
 * @param changed         names of the weights whose tuned value differs from the starting value, in the order
 *                        {@code tune --tune} names them
 * @param devErrorRate    the tuned weights' error rate on the dev set (in-sample)
 * @param cvErrorRate     the k-fold cross-validated error rate; NaN without cross-validation
 * @param folds           cross-validation folds (0: none)
 * @param seed            the tuning run's seed
 */
public record TuningRecord(
    DataFile hypotheses, DataFile references, int utterances, long referenceTokens, List<String> changed,
    double devErrorRate, double cvErrorRate, int folds, long seed) {

  public TuningRecord {
    Objects.requireNonNull(hypotheses, "hypotheses");
    Objects.requireNonNull(references, "references");
    changed = List.copyOf(changed);
  }

  /**
   * One input file by name and content.
   *
   * @param file   the file's name without its folder (informational; identity is size + digest)
   * @param bytes  its size in bytes
   * @param sha256 lower-case hex SHA-256 of its bytes
   */
  public record DataFile(String file, long bytes, String sha256) {
    public DataFile {
      Objects.requireNonNull(file, "file");
      Objects.requireNonNull(sha256, "sha256");
    }

    /** Reads {@code path} once for its size and digest; an unreadable file is an {@link steelyard.io.InputException}. */
    public static DataFile of(java.nio.file.Path path) {
      FileDigest d = FileDigest.of(path);
      return new DataFile(path.getFileName().toString(), d.bytes(), d.sha256());
    }

    /** Same bytes (the name may differ). */
    public boolean sameData(DataFile o) {
      return o != null && bytes == o.bytes && sha256.equals(o.sha256);
    }
  }
}
