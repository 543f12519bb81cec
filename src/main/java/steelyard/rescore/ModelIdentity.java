package steelyard.rescore;

import java.nio.file.Path;
import steelyard.io.FileDigest;

/**
 * Which language model a set of weights was tuned with, so that applying them with another model can be
 * reported.
 *
 * @param file   the model file's name as given (informational only; identity is size + digest)
 * @param order  n-gram order
 * @param bytes  size of the model file in bytes
 * @param sha256 lower-case hex SHA-256 of the model file's bytes
 */
public record ModelIdentity(String file, int order, long bytes, String sha256) {

  /** Reads the model file once to compute its size and digest. */
  public static ModelIdentity of(Path file, int order) {
    FileDigest d = FileDigest.of(file);
    return new ModelIdentity(file.getFileName().toString(), order, d.bytes(), d.sha256());
  }

  /** Same model bytes (the file name may differ). */
  public boolean sameModel(ModelIdentity o) {
    return o != null && bytes == o.bytes && sha256.equals(o.sha256);
  }
}
