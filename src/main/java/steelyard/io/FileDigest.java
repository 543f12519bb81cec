package steelyard.io;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * The size and SHA-256 (FIPS 180-4) of a file's bytes, read once in 64 KiB blocks: what identifies an input file
 * whatever its name. The bytes are hashed as stored, so a gzipped file and its plain text differ.
 *
 * @param bytes  file size in bytes
 * @param sha256 lower-case hex SHA-256 of the bytes (64 characters)
 */
public record FileDigest(long bytes, String sha256) {
  private static final int BLOCK = 1 << 16;

  /**
   * Reads {@code file} to the end; an unreadable or missing file is an {@link InputException} naming it, and so
   * is a pipe or other stream ({@link InputFiles#isStream}): it was read once already, so hashing it again would
   * hash nothing (or, for a FIFO, wait for a writer that never comes).
   */
  public static FileDigest of(Path file) {
    InputFiles.requireRereadable(file, "its size and SHA-256 take a second read");
    try (InputStream in = Files.newInputStream(file)) {
      MessageDigest md = MessageDigest.getInstance("SHA-256");
      byte[] buf = new byte[BLOCK];
      long total = 0;
      for (int n; (n = in.read(buf)) > 0; ) {
        md.update(buf, 0, n);
        total += n;
      }
      return new FileDigest(total, HexFormat.of().formatHex(md.digest()));
    } catch (NoSuchFileException e) {
      throw InputException.inFile(file, "file not found", "an existing file").withCause(e);
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot read the file (" + e.getMessage() + ")", "a readable file").withCause(e);
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is required by every Java platform", e);
    }
  }
}
