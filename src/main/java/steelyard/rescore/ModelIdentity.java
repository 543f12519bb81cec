package steelyard.rescore;

import java.nio.file.Path;
import steelyard.io.FileDigest;
import steelyard.io.InputFiles;

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

  /** Reads the model file once to compute its size and digest; a pipe is refused (it was read already). */
  public static ModelIdentity of(Path file, int order) {
    InputFiles.requireRereadable(file, "the weights name the model by its size and SHA-256, which takes a second read");
    FileDigest d = FileDigest.of(file);
    return new ModelIdentity(file.getFileName().toString(), order, d.bytes(), d.sha256());
  }

  /** The file name with its size and digest, e.g. {@code dock.arpa (812345 bytes, SHA-256 9f2c…)}. */
  public String describe() {
    return file + " (" + bytes + " bytes, SHA-256 " + sha256 + ")";
  }

  /** Same model bytes (the file name may differ). */
  public boolean sameModel(ModelIdentity o) {
    return o != null && bytes == o.bytes && sha256.equals(o.sha256);
  }
}
