package steelyard.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import steelyard.audit.DecisiveNgrams.Contribution;
import steelyard.lm.BackoffModel;
import steelyard.lm.CompactModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.MixtureModel;
import steelyard.lm.ModelFiles;
import steelyard.lm.RandomModels;
import steelyard.lm.TestFiles;

/**
 * Decisive n-grams. Hand-worked on the hand-written 3-gram {@code lm/warehouse.arpa} with the ARPA back-off rule
 * (Katz 1987, as the format stores it); the sum identity (listed differences = Δ ln P) on random sentence pairs.
 */
class NgramDiffTest {
  static final double L = Math.log(10);

  @Test
  void contextChangesAreListedUntilBothSidesShareTheModelContext() {
    LanguageModel lm = ModelFiles.loadExact(TestFiles.resource("lm/warehouse.arpa"), new ModelFiles.LoadOptions(-7, w -> { }, null));
    DecisiveNgrams d = new NgramDiff().compare(lm, "model", List.of("crates", "apples"), List.of("bay", "crates", "apples"));
    // rank 1: bay | <s> = bow(<s>) -0.30 + P(bay) -1.2 (order 1); crates | <s> bay = P(crates) -0.90 ("bay crates" is a
    // context only); apples | bay crates = -0.05 (order 3); </s> | crates apples = -0.15 - 0.20 - 0.70.
    // pick: crates | <s> = -0.40 (order 2); apples | <s> crates = -0.10 (order 3); </s> as above.
    // "bay" is deleted; crates and apples match but follow different contexts; </s> follows "crates apples" on both.
    assertThat(d.delta()).isCloseTo(1.95 * L, within(1e-9));
    assertThat(d.regions()).isEqualTo(1);
    List<Contribution> c = d.contributions();
    assertThat(c).hasSize(3);
    assertThat(c.get(0).pick()).isNull();
    assertThat(c.get(0).first().ngram()).containsExactly("bay");
    assertThat(c.get(0).difference()).isCloseTo(1.5 * L, within(1e-9));
    assertThat(c.get(1).pick().ngram()).containsExactly("<s>", "crates");
    assertThat(c.get(1).pick().order()).isEqualTo(2);
    assertThat(c.get(1).first().ngram()).containsExactly("crates");
    assertThat(c.get(1).difference()).isCloseTo(0.5 * L, within(1e-9));
    assertThat(c.get(2).pick().ngram()).containsExactly("<s>", "crates", "apples");
    assertThat(c.get(2).first().ngram()).containsExactly("bay", "crates", "apples");
    assertThat(c.get(2).difference()).isCloseTo(-0.05 * L, within(1e-9));
    assertThat(d.listedSum()).isCloseTo(d.delta(), within(1e-12));
  }

  @Test
  void anUnknownWordIsFlaggedAndTwoDifferentUnknownWordsStayDifferent() {
    LanguageModel lm = ModelFiles.load(TestFiles.resource("lm/warehouse.arpa"), new ModelFiles.LoadOptions(-7, w -> { }, null));
    DecisiveNgrams d = new NgramDiff().compare(lm, "model", List.of("crates", "pumpkins"), List.of("crates", "marrows"));
    // both unknown words score as <unk> in the same context: listed (the words differ), difference 0
    assertThat(d.contributions()).hasSize(1);
    assertThat(d.contributions().get(0).pick().unknown()).isTrue();
    assertThat(d.contributions().get(0).pick().ngram()).containsExactly("pumpkins");
    assertThat(d.contributions().get(0).difference()).isZero();
  }

  @Test
  void identicalSentencesHaveNothingDecisive() {
    LanguageModel lm = ModelFiles.load(TestFiles.resource("lm/warehouse.arpa"), new ModelFiles.LoadOptions(-7, w -> { }, null));
    DecisiveNgrams d = new NgramDiff().compare(lm, "model", List.of("bay", "crates"), List.of("bay", "crates"));
    assertThat(d.contributions()).isEmpty();
    assertThat(d.regions()).isZero();
  }

  /** Random models (suffix-closed or not, exact, compact and a mixture) and random sentence pairs. */
  @Test
  void listedDifferencesAddUpToTheSentenceDifference() {
    long seed = 20261207L;
    SplittableRandom rnd = new SplittableRandom(seed);
    NgramDiff diff = new NgramDiff();
    for (int m = 0; m < 30; m++) {
      BackoffModel a = RandomModels.model(rnd, 2 + rnd.nextInt(4), 8, 60, true, rnd.nextBoolean());
      LanguageModel lm = switch (m % 3) {
        case 0 -> a;
        case 1 -> CompactModel.of(a);
        default -> new MixtureModel(List.of(a, RandomModels.model(rnd, 2, 8, 30, true, true)), new double[] {0.6, 0.4});
      };
      for (int p = 0; p < 50; p++) {
        List<String> x = Arrays.asList(RandomModels.sentence(rnd, 8, rnd.nextInt(15)));
        List<String> y = rnd.nextBoolean() ? Arrays.asList(RandomModels.sentence(rnd, 8, rnd.nextInt(15))) : edit(rnd, x);
        DecisiveNgrams d = diff.compare(lm, "model", x, y);
        assertThat(d.delta()).isEqualTo(lm.sentenceLogProb(x) - lm.sentenceLogProb(y));
        assertThat(d.listedSum()).as("seed %d, %s vs %s", seed, x, y).isCloseTo(d.delta(), within(1e-9));
        for (int k = 1; k < d.contributions().size(); k++)
          assertThat(Math.abs(d.contributions().get(k).difference())).isLessThanOrEqualTo(Math.abs(d.contributions().get(k - 1).difference()));
      }
    }
  }

  /** {@code x} with one token changed, dropped or added. */
  private static List<String> edit(SplittableRandom rnd, List<String> x) {
    List<String> y = new java.util.ArrayList<>(x);
    int at = rnd.nextInt(y.size() + 1);
    int kind = rnd.nextInt(3);
    if (kind == 0 || y.isEmpty() || at == y.size()) y.add(at, "w" + rnd.nextInt(8));
    else if (kind == 1) y.remove(at);
    else y.set(at, "w" + rnd.nextInt(8));
    return y;
  }
}
