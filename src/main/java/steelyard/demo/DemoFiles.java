package steelyard.demo;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;

/** Where the bundled demo data lives: the project folder holding {@code sample-hypotheses/} and {@code models/} (for {@code demo} and the window). */
public final class DemoFiles {
  private DemoFiles() {}

  /** The folder above {@code target/} when running from the built jar or classes, else the current folder. */
  public static Path root() {
    try {
      Path code = Path.of(DemoFiles.class.getProtectionDomain().getCodeSource().getLocation().toURI());
      Path candidate = code.getParent() == null ? null : code.getParent().getParent();
      if (candidate != null && Files.isDirectory(candidate.resolve("sample-hypotheses"))) return candidate;
    } catch (URISyntaxException | SecurityException | NullPointerException e) {
      // fall through to the current folder
    }
    return Path.of("").toAbsolutePath();
  }
}
