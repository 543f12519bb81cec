package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * ARPA back-off arithmetic on a tiny hand-written model. The expected values are worked by hand from the
 * back-off rule of the ARPA format: P(w|h) = P*(h w) if listed, else bow(h)·P(w|h′) (log10: a sum).
 */
class BackoffModelTest {
  private BackoffModel lm;
  private int bos, eos, apples, crates, bay;

  @BeforeEach
  void build() {
    BackoffModel.Builder b = new BackoffModel.Builder(3, Unit.WORD, NormalisationOptions.EXACT);
    bos = b.tokenId("<s>");
    eos = b.tokenId("</s>");
    int unk = b.tokenId("<unk>");
    apples = b.tokenId("apples");
    crates = b.tokenId("crates");
    bay = b.tokenId("bay");
    b.add(new int[] {bos}, -99, -0.30);
    b.add(new int[] {eos}, -0.70, 0);
    b.add(new int[] {unk}, -2.00, 0);
    b.add(new int[] {apples}, -1.00, -0.20);
    b.add(new int[] {crates}, -0.90, -0.10);
    b.add(new int[] {bay}, -1.20, 0);
    b.add(new int[] {bos, crates}, -0.40, -0.25);
    b.add(new int[] {crates, apples}, -0.35, -0.15);
    b.add(new int[] {bos, crates, apples}, -0.10, 0);
    // pruned: (apples, bay) is not listed, but (crates, apples, bay)... prefix (crates, apples) exists;
    // (bay, crates, apples) hangs on the unlisted context (bay, crates): a context-only entry.
    b.add(new int[] {bay, crates, apples}, -0.05, 0);
    lm = b.build();
  }

  private double log10(int... ngram) {
    int[] ctx = java.util.Arrays.copyOf(ngram, ngram.length - 1);
    return lm.log10Prob(ctx, ngram[ngram.length - 1]);
  }

  @Test
  void seenTrigramUsesItsOwnProbability() {
    assertThat(log10(bos, crates, apples)).isCloseTo(-0.10, within(1e-12));
  }

  @Test
  void unseenTrigramBacksOffToBigramWithTheContextWeight() {
    // P(bay | crates apples): trigram not listed → bow(crates apples) + P(bay | apples);
    // (apples bay) not listed → bow(apples) + P(bay) = -0.15 + -0.20 + -1.20
    assertThat(log10(crates, apples, bay)).isCloseTo(-0.15 + -0.20 + -1.20, within(1e-12));
    // P(crates | apples) = bow(apples) + P(crates) = -0.20 + -0.90
    assertThat(log10(apples, crates)).isCloseTo(-0.20 + -0.90, within(1e-12));
  }

  @Test
  void unknownWordScoresAsUnk() {
    assertThat(lm.log10Prob(new int[] {crates}, lm.wordId("pumpkins"))).isCloseTo(-0.10 + -2.00, within(1e-12));
  }

  @Test
  void contextOnlyEntryBacksOffWithWeightOne() {
    // (bay crates) is not listed: bow = 0; P(bay | bay crates) → P(bay | crates) = bow(crates) + P(bay) = -0.10 + -1.20
    assertThat(log10(bay, crates, bay)).isCloseTo(-0.10 + -1.20, within(1e-12));
    assertThat(log10(bay, crates, apples)).isCloseTo(-0.05, within(1e-12));
  }

  @Test
  void sentenceLogProbSumsTheStateChainInNaturalLog() {
    // <s> crates apples </s>: -0.40 + -0.10 + P(</s> | crates apples) = bow(crates apples) + P(</s>|apples) = -0.15 + (-0.20 + -0.70)
    double expectedLog10 = -0.40 + -0.10 + -0.15 + -0.20 + -0.70;
    assertThat(lm.sentenceLogProb(java.util.List.of("crates", "apples"))).isCloseTo(expectedLog10 * Math.log(10), within(1e-9));
  }

  @Test
  void equalHistoriesGiveEqualStates() {
    LmState a = lm.newState(), b = lm.newState();
    lm.beginSentence(a);
    lm.score(a, crates, a);
    lm.score(a, apples, a);
    b.length = 0;
    lm.score(b, bos, b);
    lm.score(b, crates, b);
    lm.score(b, apples, b);
    assertThat(a).isEqualTo(b);
    assertThat(a.length()).isEqualTo(2);
  }
}
