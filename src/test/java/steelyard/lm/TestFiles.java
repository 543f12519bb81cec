package steelyard.lm;

import java.nio.file.Files;
import java.nio.file.Path;

/** Test resources as paths (the tests run from the project root). */
public final class TestFiles {
  private TestFiles() {}

  public static Path resource(String name) {
    Path p = Path.of("src/test/resources").resolve(name);
    if (!Files.exists(p)) throw new IllegalStateException("missing test resource " + p);
    return p;
  }
}
