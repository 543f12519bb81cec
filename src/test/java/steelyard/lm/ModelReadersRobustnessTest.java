package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.io.InputException;

class ModelReadersRobustnessTest {
  @TempDir Path dir;

  @Test
  void mutatedModelFilesOnlyEverFailWithAnInputError() throws Exception {
    long seed = 424242L;
    SplittableRandom rnd = new SplittableRandom(seed);
    byte[] arpa = Files.readAllBytes(TestFiles.resource("lm/warehouse.arpa"));
    Path bin = dir.resolve("w.bin");
    ModelFiles.save(ModelFiles.loadExact(TestFiles.resource("lm/warehouse.arpa")), bin);
    byte[] binary = Files.readAllBytes(bin);
    ModelFiles.LoadOptions quiet = new ModelFiles.LoadOptions(-7, w -> { }, null);
    for (int i = 0; i < 1500; i++) {
      boolean text = i % 2 == 0;
      byte[] b = mutate(rnd, text ? arpa : binary);
      Path f = dir.resolve(text ? "m" + i + ".arpa" : "m" + i + ".bin");
      Files.write(f, b);
      try {
        LanguageModel lm = ModelFiles.load(f, quiet);
        lm.sentenceLogProb(List.of("crates", "apples", "bay"));
      } catch (InputException expected) {
        assertThat(expected.getMessage()).as("seed %d case %d", seed, i).startsWith(f.toString());
      } catch (RuntimeException e) {
        throw new AssertionError("seed " + seed + " case " + i + ": " + e, e);
      }
      Files.delete(f);
    }
  }

  private static byte[] mutate(SplittableRandom rnd, byte[] in) {
    byte[] b = in.clone();
    switch (rnd.nextInt(4)) {
      case 0:
        for (int n = 1 + rnd.nextInt(4); n > 0; n--) b[rnd.nextInt(b.length)] = (byte) rnd.nextInt(256);
        return b;
      case 1:
        return java.util.Arrays.copyOf(b, rnd.nextInt(b.length));
      case 2: {
        int at = rnd.nextInt(b.length);
        byte[] out = new byte[b.length + 1];
        System.arraycopy(b, 0, out, 0, at);
        out[at] = (byte) "0123456789.-e \t\n\\".charAt(rnd.nextInt(17));
        System.arraycopy(b, at, out, at + 1, b.length - at);
        return out;
      }
      default: {
        int at = rnd.nextInt(b.length);
        byte[] out = new byte[b.length - 1];
        System.arraycopy(b, 0, out, 0, at);
        System.arraycopy(b, at + 1, out, at, b.length - at - 1);
        return out;
      }
    }
  }

  @Test
  void concurrentReadersOfOneModelGetTheSameScores() throws Exception {
    CompactModel lm = CompactModel.of(RandomModels.model(new SplittableRandom(3), 4, 50, 2000, true, true));
    List<List<String>> sentences = new ArrayList<>();
    SplittableRandom rnd = new SplittableRandom(4);
    for (int i = 0; i < 500; i++) sentences.add(List.of(RandomModels.sentence(rnd, 50, 1 + rnd.nextInt(20))));
    double[] expected = sentences.stream().mapToDouble(lm::sentenceLogProb).toArray();
    ExecutorService pool = Executors.newFixedThreadPool(4);
    try {
      List<Future<double[]>> results = new ArrayList<>();
      for (int t = 0; t < 4; t++) results.add(pool.submit(() -> sentences.stream().mapToDouble(lm::sentenceLogProb).toArray()));
      for (Future<double[]> f : results) assertThat(f.get()).containsExactly(expected);
    } finally {
      pool.shutdownNow();
    }
  }
}
