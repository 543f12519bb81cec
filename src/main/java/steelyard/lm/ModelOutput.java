package steelyard.lm;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import steelyard.io.InputException;

/** Atomic binary output for model files: a temporary file beside the target, then a move into place. */
public final class ModelOutput {
  private ModelOutput() {}

  /** Body of a write. */
  @FunctionalInterface
  public interface Body {
    void write(OutputStream out) throws IOException;
  }

  private static void keepPermissions(Path target, Path tmp) throws IOException {
    if (!tmp.getFileSystem().supportedFileAttributeViews().contains("posix")) return;
    java.util.Set<java.nio.file.attribute.PosixFilePermission> perms = Files.exists(target)
        ? Files.getPosixFilePermissions(target)
        : java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--");
    Files.setPosixFilePermissions(tmp, perms);
  }

  /** Writes {@code file} through {@code body}; on failure the old file (if any) is left untouched. */
  public static void writeBytes(Path file, Body body) {
    Path abs = file.toAbsolutePath().normalize();
    Path dir = abs.getParent();
    if (dir == null || !Files.isDirectory(dir)) throw InputException.inFile(file, "directory " + dir + " does not exist", "an output path in an existing directory");
    Path tmp = null;
    try {
      tmp = Files.createTempFile(dir, "." + abs.getFileName() + ".", ".tmp");
      keepPermissions(abs, tmp);
      try (OutputStream os = new BufferedOutputStream(Files.newOutputStream(tmp), 1 << 16)) {
        body.write(os);
      }
      Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
      tmp = null;
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot write (" + e + ")", "a writable output path with free space").withCause(e);
    } finally {
      if (tmp != null) {
        try {
          Files.deleteIfExists(tmp);
        } catch (IOException ignored) {
          // the original error is the one to report
        }
      }
    }
  }
}
