package steelyard.lm.eval;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

class PerplexityTest {
  @TempDir Path dir;

  /** A model giving every one of V outcomes (V−1 words and {@code </s>}) probability 1/V in every context. */
  static BackoffModel uniform(int order, int v) {
    BackoffModel.Builder b = new BackoffModel.Builder(order, Unit.WORD, NormalisationOptions.EXACT);
    double p = -Math.log10(v);
    b.add(new int[] {b.tokenId("<s>")}, -99, 0);
    b.add(new int[] {b.tokenId("</s>")}, p, 0);
    for (int i = 0; i < v - 1; i++) b.add(new int[] {b.tokenId("crate" + i)}, p, 0);
    return b.build();
  }

  @ParameterizedTest(name = "[{index}] V = {0}")
  @ValueSource(ints = {2, 7, 50, 1000})
  void uniformModelOverVOutcomesHasPerplexityV(int v) {
    // Perplexity = 2^H; for a uniform distribution over V outcomes H = log2 V, so the perplexity is V
    // (definition, e.g. Jurafsky & Martin, Speech and Language Processing, ch. 3).
    ModelFiles.save(uniform(2, v), dir.resolve("u.arpa"));
    for (LanguageModel lm : List.of(ModelFiles.load(dir.resolve("u.arpa"), new ModelFiles.LoadOptions(-7, w -> { }, null)), uniform(1, v))) {
      Perplexity ppl = new Perplexity(lm);
      ppl.add(1, List.of("crate0", "crate" + (v - 2), "crate0"));
      ppl.add(2, List.of());
      ppl.add(3, List.of("crate" + (v / 2)));
      assertThat(ppl.result().perplexity()).isCloseTo(v, within(v * 1e-5));
      assertThat(ppl.result().tokens()).isEqualTo(4 + 3);
    }
  }

  @Test
  void outOfVocabularyWordsAreCountedAndLeftOutOfThePerplexity() {
    BackoffModel lm = uniform(1, 10); // closed vocabulary: OOV words get the floor, -7
    Perplexity ppl = new Perplexity(lm);
    SentenceScore s = ppl.add(4, List.of("crate1", "kumquat", "crate2"));
    assertThat(s.oov()).isEqualTo(1);
    assertThat(s.words()).isEqualTo(3);
    assertThat(s.log10ProbInVocabulary()).isCloseTo(3 * -1.0, within(1e-9));
    assertThat(s.log10Prob()).isCloseTo(3 * -1.0 + -7.0, within(1e-9));
    PerplexityResult r = ppl.result();
    assertThat(r.scoredTokens()).isEqualTo(3);
    assertThat(r.perplexity()).isCloseTo(10, within(1e-9));
    assertThat(r.oovRate()).isCloseTo(1.0 / 3, within(1e-12));
    assertThat(r.lnProb()).isCloseTo(-3 * Math.log(10), within(1e-9));
  }
}
