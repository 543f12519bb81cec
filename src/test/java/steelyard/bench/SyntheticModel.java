package steelyard.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import steelyard.cli.Main;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.SyntheticHypotheses;

/** The benchmarks' word model: a 3-gram of the invented grammar behind {@link SyntheticHypotheses}. */
final class SyntheticModel {
  private SyntheticModel() {}

  /**
   * Trains {@code lm train --order 3} on the rank-1 sentences of 50 000 utterances of another seed (7) of the same
   * generator (its rank 1 is the clean sentence) and writes it to {@code model}; the corpus is left in {@code dir}
   * as {@code corpus.txt}.
   */
  static void train(Path dir, Path model) throws IOException {
    Path corpus = dir.resolve("corpus.txt");
    Path source = dir.resolve("corpus-source.csv");
    SyntheticHypotheses.write(source, 50_000, 1, 7L);
    try (BufferedWriter w = Files.newBufferedWriter(corpus);
        HypothesesReader r = HypothesesReader.open(source, ImportOptions.strict(List.of()))) {
      while (r.hasNext()) w.write(r.next().first().text() + "\n");
    }
    Files.delete(source);
    int code = Main.run("lm", "train", "--corpus", corpus.toString(), "--order", "3", "--out", model.toString());
    if (code != 0) throw new IllegalStateException("lm train failed: " + code);
  }
}
