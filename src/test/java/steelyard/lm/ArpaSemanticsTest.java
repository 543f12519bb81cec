package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import steelyard.text.Unit;

/**
 * ARPA back-off arithmetic through the file reader and both query engines, on the hand-written file
 * {@code lm/warehouse.arpa}. Expected values are worked by hand from the back-off rule of the ARPA format
 * (Katz 1987 back-off, as the ARPA format stores it): P(w|h) = P*(h w) when listed, else bow(h)·P(w|h′),
 * with bow(h) = 1 when h is not listed; in log10 the product is a sum.
 */
class ArpaSemanticsTest {
  static final Path WAREHOUSE = TestFiles.resource("lm/warehouse.arpa");
  static final Path CLOSED = TestFiles.resource("lm/closed.arpa");

  static Stream<Arguments> engines() {
    return Stream.of(
        Arguments.of("exact", (Function<Path, LanguageModel>) p -> ModelFiles.loadExact(p, quiet())),
        Arguments.of("compact", (Function<Path, LanguageModel>) p -> ModelFiles.load(p, quiet())));
  }

  static ModelFiles.LoadOptions quiet() {
    return new ModelFiles.LoadOptions(-7, w -> { }, null);
  }

  /** log10 P(last | the others), fed through the state API from an empty history. */
  static double log10(LanguageModel lm, String... ngram) {
    LmState s = lm.newState();
    LmState t = lm.newState();
    for (int i = 0; i < ngram.length - 1; i++) {
      lm.score(s, lm.wordId(ngram[i]), t);
      s.copyFrom(t);
    }
    return lm.score(s, lm.wordId(ngram[ngram.length - 1]), t) / Math.log(10);
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void seenTrigramUsesItsOwnProbability(String name, Function<Path, LanguageModel> load) {
    assertThat(log10(load.apply(WAREHOUSE), "<s>", "crates", "apples")).isCloseTo(-0.10, within(1e-6));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void unseenTrigramBacksOffToTheBigram(String name, Function<Path, LanguageModel> load) {
    LanguageModel lm = load.apply(WAREHOUSE);
    // P(apples | bay crates)? listed: -0.05. P(</s> | crates apples): not listed → bow(crates apples) -0.15
    // + P(</s> | apples): not listed → bow(apples) -0.20 + P(</s>) -0.70 = -1.05
    assertThat(log10(lm, "crates", "apples", "</s>")).isCloseTo(-0.15 + -0.20 + -0.70, within(1e-6));
    // P(apples | <s> crates)... the bigram level: P(apples | x crates) with x unseen context: (x crates) has
    // no entry, so the history shortens to (crates): P(apples | crates) = -0.35
    assertThat(log10(lm, "apples", "crates", "apples")).isCloseTo(-0.35, within(1e-6));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void unseenBigramBacksOffToTheUnigram(String name, Function<Path, LanguageModel> load) {
    // P(crates | apples) = bow(apples) -0.20 + P(crates) -0.90
    assertThat(log10(load.apply(WAREHOUSE), "apples", "crates")).isCloseTo(-1.10, within(1e-6));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void outOfVocabularyWordScoresAsUnk(String name, Function<Path, LanguageModel> load) {
    LanguageModel lm = load.apply(WAREHOUSE);
    // P(pumpkins | <s> crates): <unk> not under (<s> crates) nor (crates) → bow(<s> crates) -0.25 + bow(crates) -0.10 + P(<unk>) -2.00
    assertThat(log10(lm, "<s>", "crates", "pumpkins")).isCloseTo(-0.25 + -0.10 + -2.00, within(1e-6));
    assertThat(lm.wordId("pumpkins")).isEqualTo(lm.unknownId());
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void prunedContextBacksOffWithWeightOne(String name, Function<Path, LanguageModel> load) {
    LanguageModel lm = load.apply(WAREHOUSE);
    // (bay crates) is not listed, only needed as the context of (bay crates apples): bow = 1 (log10 0).
    assertThat(log10(lm, "bay", "crates", "apples")).isCloseTo(-0.05, within(1e-6));
    // P(bay | bay crates) → 0 + P(bay | crates) = bow(crates) -0.10 + P(bay) -1.2
    assertThat(log10(lm, "bay", "crates", "bay")).isCloseTo(-1.30, within(1e-6));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("engines")
  void closedVocabularyModelGetsTheFloorAndAWarning(String name, Function<Path, LanguageModel> unused) {
    List<String> warnings = new ArrayList<>();
    ModelFiles.LoadOptions opts = new ModelFiles.LoadOptions(-6.5, warnings::add, null);
    LanguageModel lm = name.equals("exact") ? ModelFiles.loadExact(CLOSED, opts) : ModelFiles.load(CLOSED, opts);
    // P(pumpkins | apples): no <unk> anywhere → bow(apples) -0.20 + floor -6.5
    assertThat(log10(lm, "apples", "pumpkins")).isCloseTo(-6.70, within(1e-6));
    assertThat(warnings).singleElement().asString().contains("closed.arpa").contains("no <unk> unigram").contains("-6.5");
  }

  @Test
  void metadataLinesBeforeDataSetUnitAndNormalisation() {
    BackoffModel lm = ModelFiles.loadExact(WAREHOUSE, quiet());
    assertThat(lm.unit()).isEqualTo(Unit.WORD);
    assertThat(lm.normalisation().foldCase()).isTrue();
    assertThat(lm.normalisation().stripPunctuation()).isFalse();
    assertThat(lm.metadata()).contains("steelyard.origin=hand-written");
    assertThat(lm.ngramCount(1)).isEqualTo(6);
    assertThat(lm.ngramCount(3)).isEqualTo(2);
    assertThat(lm.hasUnknownUnigram()).isTrue();
  }
}
