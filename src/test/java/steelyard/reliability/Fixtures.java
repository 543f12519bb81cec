package steelyard.reliability;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;

/** Paths of the committed test inputs and a snapshot of a directory's files for "nothing changed" checks. */
final class Fixtures {
  private Fixtures() {}

  /** The bad-input corpus directory (as copied to the test class path). */
  static Path badDir() {
    try {
      return Path.of(Fixtures.class.getResource("/bad/cases.csv").toURI()).getParent();
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  /** Valid companion inputs used beside a broken one. */
  static Path validDir() {
    return badDir().resolve("valid");
  }

  static Path valid(String name) {
    return validDir().resolve(name);
  }

  /**
   * Every regular file under {@code dir} (relative name → size, mtime and SHA-256), so a before/after
   * comparison catches created, deleted, changed and left-over temporary files.
   */
  static Map<String, String> snapshot(Path dir) {
    Map<String, String> out = new TreeMap<>();
    if (!Files.isDirectory(dir)) return out;
    try (Stream<Path> s = Files.walk(dir)) {
      for (Path p : (Iterable<Path>) s::iterator) {
        if (!Files.isRegularFile(p)) continue;
        out.put(dir.relativize(p).toString(),
            Files.size(p) + " " + Files.getLastModifiedTime(p).toMillis() + " " + sha256(Files.readAllBytes(p)));
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out;
  }

  /** Names and modification times of the entries directly in {@code dir} (not their contents). */
  static Map<String, Long> listing(Path dir) {
    Map<String, Long> out = new TreeMap<>();
    try (Stream<Path> s = Files.list(dir)) {
      for (Path p : (Iterable<Path>) s::iterator) out.put(p.getFileName().toString(), Files.getLastModifiedTime(p).toMillis());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out;
  }

  static String sha256(byte[] bytes) {
    try {
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }
}
