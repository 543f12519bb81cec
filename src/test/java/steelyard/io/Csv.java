package steelyard.io;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.GZIPOutputStream;

/** Test helpers: write small input files and read them back whole. */
final class Csv {
  private Csv() {}

  static Path write(Path dir, String name, String content) {
    return writeBytes(dir, name, content.getBytes(StandardCharsets.UTF_8));
  }

  static Path writeBytes(Path dir, String name, byte[] content) {
    try {
      Path p = dir.resolve(name);
      if (name.endsWith(".gz")) {
        try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(p))) {
          out.write(content);
        }
      } else {
        Files.write(p, content);
      }
      return p;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Collects warnings and skipped rows of one import. */
  static final class Log {
    final List<String> warnings = new ArrayList<>();
    final List<SkippedRow> skipped = new ArrayList<>();

    ImportOptions options(String features, String primary, int maxBadRows) {
      return new ImportOptions(FeatureSpec.parseList(features), primary, maxBadRows, warnings::add, skipped::add);
    }
  }

  static List<UtteranceHypotheses> readHyps(Path file, ImportOptions options) {
    List<UtteranceHypotheses> out = new ArrayList<>();
    try (HypothesesReader r = HypothesesReader.open(file, options)) {
      while (r.hasNext()) out.add(r.next());
    }
    return out;
  }

  static List<UtteranceHypotheses> readHyps(Path file, String features) {
    return readHyps(file, new Log().options(features, null, 0));
  }
}
