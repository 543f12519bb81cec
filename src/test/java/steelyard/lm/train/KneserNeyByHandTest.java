package steelyard.lm.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import steelyard.lm.BackoffModel;

/**
 * Interpolated modified Kneser-Ney worked out by hand on a tiny corpus (Chen &amp; Goodman 1998, TR-10-98,
 * eq. 26 for the discounts, section 3 for the interpolated form; Kneser &amp; Ney 1995 for continuation counts).
 *
 * <pre>
 * corpus (order 2):  "a b" ×2, "c" ×3, "a a" ×3, "b c" ×1          (9 sentences)
 *
 * bigram counts (highest order: raw):
 *   &lt;s&gt; a 5   &lt;s&gt; c 3   &lt;s&gt; b 1   a b 2   b &lt;/s&gt; 2   c &lt;/s&gt; 4   a a 3   a &lt;/s&gt; 3   b c 1
 *   count-of-counts: n1 = 2 (&lt;s&gt; b, b c), n2 = 2 (a b, b &lt;/s&gt;), n3 = 3 (&lt;s&gt; c, a a, a &lt;/s&gt;), n4 = 1 (c &lt;/s&gt;)
 *   Y   = n1 / (n1 + 2 n2)      = 2 / 6                 = 1/3
 *   D1  = 1 − 2 Y n2/n1         = 1 − 2·(1/3)·(2/2)     = 1/3
 *   D2  = 2 − 3 Y n3/n2         = 2 − 3·(1/3)·(3/2)     = 1/2
 *   D3+ = 3 − 4 Y n4/n3         = 3 − 4·(1/3)·(1/3)     = 23/9
 *
 * unigram continuation counts N1+(• w) (distinct left neighbours):
 *   a: {&lt;s&gt;, a} = 2   b: {&lt;s&gt;, a} = 2   c: {&lt;s&gt;, b} = 2   &lt;/s&gt;: {a, b, c} = 3   &lt;unk&gt;: 0
 *   count-of-counts: n1 = 0, n2 = 3, n3 = 1, n4 = 0 → Y undefined → defaults D1 = 0.5, D2 = 1.0, D3+ = 1.5
 *   total = 9;  γ(ε) = (D2·3 + D3+·1) / 9 = 4.5 / 9 = 1/2;  |V| = 5 (a b c &lt;/s&gt; &lt;unk&gt;)
 *   P(a) = P(b) = P(c) = (2 − 1)/9 + (1/2)/5 = 1/9 + 1/10 = 19/90
 *   P(&lt;/s&gt;) = (3 − 1.5)/9 + 1/10 = 1/6 + 1/10 = 4/15;   P(&lt;unk&gt;) = 1/10     (sum: 57/90 + 24/90 + 9/90 = 1)
 *
 * history "a": children a a 3, a b 2, a &lt;/s&gt; 3, total 8
 *   γ(a) = (D3+·2 + D2·1) / 8 = (46/9 + 1/2) / 8 = 101/144
 *   P(b | a) = (2 − 1/2)/8 + (101/144)(19/90) = 3/16 + 1919/12960 = 4349/12960
 *   P(c | a) = 0 + (101/144)(19/90) = 1919/12960            (unseen: backed off)
 * history "&lt;s&gt;": children &lt;s&gt; a 5, &lt;s&gt; c 3, &lt;s&gt; b 1, total 9
 *   γ(&lt;s&gt;) = (D3+·2 + D1·1) / 9 = (46/9 + 3/9) / 9 = 49/81
 *   P(a | &lt;s&gt;) = (5 − 23/9)/9 + (49/81)(19/90) = 22/81 + 931/7290 = 2911/7290
 *   P(&lt;unk&gt; | &lt;s&gt;) = (49/81)(1/10) = 49/810
 * </pre>
 */
class KneserNeyByHandTest {
  static TrainedModel trained;
  static BackoffModel lm;

  @BeforeAll
  static void train() {
    List<List<String>> corpus = TrainTestSupport.corpus(
        "a b", "a b", "c", "c", "c", "a a", "a a", "a a", "b c");
    trained = new Trainer(TrainingOptions.of(2, Smoothing.MKN)).train(SentenceSource.of(corpus));
    lm = trained.backoffModel();
  }

  @Test
  void bigramDiscountsComeFromTheRawCountOfCounts() {
    Discounts d = trained.report().discounts().get(1);
    assertThat(d.countOfCounts()).containsExactly(2, 2, 3, 1);
    assertThat(d.values()[0]).isCloseTo(1.0 / 3, within(1e-12));
    assertThat(d.values()[1]).isCloseTo(0.5, within(1e-12));
    assertThat(d.values()[2]).isCloseTo(23.0 / 9, within(1e-12));
    assertThat(d.replaced()).containsExactly(false, false, false);
  }

  @Test
  void unigramLevelUsesContinuationCountsAndReplacesDiscountsTheyCannotGive() {
    Discounts d = trained.report().discounts().get(0);
    assertThat(d.countOfCounts()).containsExactly(0, 3, 1, 0);
    assertThat(d.values()).containsExactly(Discounts.defaultModifiedKneserNey());
    assertThat(d.replaced()).containsExactly(true, true, true);
    assertThat(trained.report().warnings()).hasSize(3).allMatch(w -> w.startsWith("order 1: discount"));
  }

  @Test
  void unigramProbabilitiesInterpolateWithTheUniformFloor() {
    assertThat(p(List.of(), "a")).isCloseTo(19.0 / 90, within(1e-12));
    assertThat(p(List.of(), "</s>")).isCloseTo(4.0 / 15, within(1e-12));
    assertThat(p(List.of(), "<unk>")).isCloseTo(1.0 / 10, within(1e-12));
    assertThat(p(List.of(), "never-seen")).as("an OOV word scores as <unk>").isCloseTo(1.0 / 10, within(1e-12));
  }

  @Test
  void bigramProbabilitiesMatchTheHandArithmetic() {
    assertThat(p(List.of("a"), "b")).isCloseTo(4349.0 / 12960, within(1e-12));
    assertThat(p(List.of("a"), "c")).isCloseTo(1919.0 / 12960, within(1e-12));
    assertThat(p(List.of("<s>"), "a")).isCloseTo(2911.0 / 7290, within(1e-12));
    assertThat(p(List.of("<s>"), "<unk>")).isCloseTo(49.0 / 810, within(1e-12));
  }

  @Test
  void backoffWeightIsTheInterpolationWeight() {
    int a = lm.entryIndex(new int[] {lm.wordId("a")});
    assertThat(Math.pow(10, lm.log10Backoff(1, a))).isCloseTo(101.0 / 144, within(1e-12));
    int bos = lm.entryIndex(new int[] {lm.sentenceStartId()});
    assertThat(Math.pow(10, lm.log10Backoff(1, bos))).isCloseTo(49.0 / 81, within(1e-12));
  }

  @Test
  void recordsTheDiscountsAsMetadata() {
    assertThat(lm.metadata()).contains("steelyard.smoothing=mkn", "steelyard.order=2", "steelyard.unit=word",
        "steelyard.discounts.2=0.333333,0.500000,2.555556", "steelyard.discounts.1=0.500000,1.000000,1.500000");
  }

  private static double p(List<String> context, String w) {
    return TrainTestSupport.prob(lm, context, w);
  }
}
