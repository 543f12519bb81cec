package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SortedMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.demo.DemoData;

class DemoDataCommandTest {
  @Test
  void writesExactlyTheGeneratorsFilesForTheGivenSeed(@TempDir Path dir) throws IOException {
    Path out = dir.resolve("data");
    assertThat(Main.run("demo-data", "--out", out.toString(), "--seed", "17")).isEqualTo(Main.OK);
    SortedMap<String, byte[]> expected = DemoData.generate(17L, DemoData.Sizes.DEFAULT);
    for (var e : expected.entrySet()) assertThat(Files.readAllBytes(out.resolve(e.getKey()))).as(e.getKey()).isEqualTo(e.getValue());
    assertThat(Files.readString(out.resolve("manifest.txt"))).contains("seed: 17");
  }

  @Test
  void usesTheProjectsDefaultSeed() {
    assertThat(DemoData.DEFAULT_SEED).isEqualTo(RunInput.DEFAULT_SEED);
  }

  @Test
  void exitsWithBadInputWhenOutIsMissing() {
    assertThat(Main.run("demo-data")).isEqualTo(Main.BAD_INPUT);
  }

  @Test
  void exitsWithBadInputWhenOutIsAFile(@TempDir Path dir) throws IOException {
    Path file = Files.writeString(dir.resolve("taken"), "x");
    assertThat(Main.run("demo-data", "--out", file.toString())).isEqualTo(Main.BAD_INPUT);
    assertThat(Files.readString(file)).isEqualTo("x");
  }
}
