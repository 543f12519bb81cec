package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Ctrl-C during {@code tune} leaves no weights file, partial or whole: the outputs are rendered after the run and
 * only then written (each atomically). A child JVM tunes the voice dev set with its progress bar on; once the bar
 * shows the tuning under way, the child gets SIGTERM, which runs the same shutdown as Ctrl-C's SIGINT.
 */
class InterruptedTuneTest {
  @Test
  void interruptingTheTuningWritesNoOutput(@TempDir Path dir) throws Exception {
    Path weights = dir.resolve("tuned.weights.json");
    Path err = dir.resolve("err.txt");
    Process p = Cli.start(List.of(), dir.resolve("out.txt"), err, "tune", "--hyps", "sample-hypotheses/voice-dev.nbest.csv",
        "--refs", "sample-hypotheses/voice-dev.refs.csv", "--lm", "models/voice-3gram.arpa.gz", "--features", "acoustic,lm",
        "--rules", "sample-hypotheses/voice.rules", "--method", "nbest,lattice", "--threads", "1", "--progress",
        "--out", weights.toString(), "--json", dir.resolve("tune.json").toString());
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
    while (p.isAlive() && !Files.readString(err).contains("tuning ") && System.nanoTime() < deadline) Thread.sleep(20);
    assertThat(p.isAlive()).as("the tuning was still running when interrupted; stderr:\n" + Files.readString(err)).isTrue();
    p.destroy();
    assertThat(p.waitFor(60, TimeUnit.SECONDS)).isTrue();
    assertThat(weights).doesNotExist();
    assertThat(dir.resolve("tune.json")).doesNotExist();
    try (Stream<Path> files = Files.list(dir)) {
      assertThat(files.map(f -> f.getFileName().toString())).noneMatch(n -> n.contains(".steelyard-tmp-"));
    }
  }
}
