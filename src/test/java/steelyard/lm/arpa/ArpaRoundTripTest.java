package steelyard.lm.arpa;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.lm.BackoffModel;
import steelyard.lm.ModelFiles;
import steelyard.lm.RandomModels;

class ArpaRoundTripTest {
  @TempDir Path dir;

  static ModelFiles.LoadOptions quiet() {
    return new ModelFiles.LoadOptions(-7, w -> { }, null);
  }

  @Test
  void writtenFileReadsBackToTheSameScoresWithinSevenDigits() {
    long seed = 20261202L;
    SplittableRandom rnd = new SplittableRandom(seed);
    BackoffModel model = RandomModels.model(rnd, 4, 60, 300, true);
    for (String name : List.of("m.arpa", "m.arpa.gz")) {
      Path file = dir.resolve(name);
      ModelFiles.save(model, file);
      BackoffModel back = ModelFiles.loadExact(file, quiet());
      for (int k = 1; k <= 4; k++) assertThat(back.ngramCount(k)).as("order %d, seed %d", k, seed).isEqualTo(model.ngramCount(k));
      for (int i = 0; i < 200; i++) {
        String[] s = RandomModels.sentence(rnd, 60, 1 + rnd.nextInt(12));
        // 7 significant digits on disk (common practice for ARPA files): relative error 5e-7 per value
        assertThat(back.sentenceLogProb(List.of(s))).as("seed %d, %s", seed, String.join(" ", s))
            .isCloseTo(model.sentenceLogProb(List.of(s)), within(1e-4));
      }
    }
  }

  @Test
  void sameModelGivesByteIdenticalFiles() throws Exception {
    BackoffModel model = RandomModels.model(new SplittableRandom(7), 3, 30, 100, true);
    ModelFiles.save(model, dir.resolve("a.arpa"));
    ModelFiles.save(ModelFiles.loadExact(dir.resolve("a.arpa"), quiet()), dir.resolve("b.arpa"));
    ModelFiles.save(model, dir.resolve("c.arpa"));
    assertThat(Files.readAllBytes(dir.resolve("c.arpa"))).isEqualTo(Files.readAllBytes(dir.resolve("a.arpa")));
    assertThat(Files.readString(dir.resolve("b.arpa"))).isEqualTo(Files.readString(dir.resolve("a.arpa")));
  }

  @Test
  void numbersUseSevenSignificantDigitsWithoutTrailingZeros() {
    assertThat(fmt(-99)).isEqualTo("-99");
    assertThat(fmt(-0.3)).isEqualTo("-0.3");
    assertThat(fmt(0)).isEqualTo("0");
    assertThat(fmt(-1.23456789)).isEqualTo("-1.234568");
    assertThat(fmt(-0.000123456789)).isEqualTo("-0.0001234568");
    assertThat(fmt(-1.5e-9)).isEqualTo("-1.5e-9");
    assertThat(fmt(12.5)).isEqualTo("12.5");
    assertThat(fmt(-9.9999999)).isEqualTo("-10");
    assertThat(ArpaText.parseNumber("-1.234568", 0, 9)).isEqualTo(-1.234568);
    assertThat(ArpaText.parseNumber("-5e-2", 0, 5)).isEqualTo(-0.05);
    assertThat(ArpaText.parseNumber("abc", 0, 3)).isNaN();
    assertThat(ArpaText.parseNumber("1e999", 0, 5)).isNaN();
  }

  @Test
  void fastNumberParserAgreesWithTheJdkOnRandomDecimals() {
    // Double.parseDouble (JDK) is the reference: correctly rounded decimal conversion.
    SplittableRandom rnd = new SplittableRandom(99);
    for (int i = 0; i < 20_000; i++) {
      double v = -rnd.nextDouble() * Math.pow(10, rnd.nextInt(-8, 3));
      StringBuilder sb = new StringBuilder();
      ArpaText.appendNumber(sb, v);
      String s = sb.toString();
      assertThat(ArpaText.parseNumber(s, 0, s.length())).as(s).isEqualTo(Double.parseDouble(s));
      assertThat(Double.parseDouble(s)).as(s).isCloseTo(v, within(Math.abs(v) * 6e-7));
    }
  }

  private static String fmt(double v) {
    StringBuilder sb = new StringBuilder();
    ArpaText.appendNumber(sb, v);
    return sb.toString();
  }
}
